import type { NextRequest } from 'next/server';
import { json, parseJson, route } from '@/lib/http/handler';
import { requireKitchen } from '@/lib/auth/guard';
import { recordManualReading } from '@/lib/cooks/readings';
import { manualReadingSchema } from '@/lib/validations/cooks';

/** A thermometer reading typed by a cook; 201 the first time, 200 with the same answer when the idempotency key repeats. */
export const POST = route<{ kitchenId: string }>(async (req: NextRequest, { params }) => {
  const access = await requireKitchen((await params).kitchenId, 'log-cooking');
  const input = await parseJson(req, manualReadingSchema, 4 * 1024);
  const r = await recordManualReading(access, input);
  return json(r.body, { status: r.status });
});
