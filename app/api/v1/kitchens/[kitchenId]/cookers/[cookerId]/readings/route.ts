import type { NextRequest } from 'next/server';
import { json, parseQuery, route } from '@/lib/http/handler';
import { requireKitchen } from '@/lib/auth/guard';
import { listReadings } from '@/lib/cooks/readings';
import { readingsQuery } from '@/lib/validations/cooks';

/** A cooker's readings of a local day (today by default), oldest first. */
export const GET = route<{ kitchenId: string; cookerId: string }>(async (req: NextRequest, { params }) => {
  const { kitchenId, cookerId } = await params;
  const access = await requireKitchen(kitchenId, 'read');
  const q = parseQuery(req, readingsQuery);
  return json(await listReadings(access, cookerId, q.date));
});
