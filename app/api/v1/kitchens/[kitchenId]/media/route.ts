import type { NextRequest } from 'next/server';
import { json, parseJson, route } from '@/lib/http/handler';
import { requireKitchen } from '@/lib/auth/guard';
import { listStorageMedia } from '@/lib/cookers';
import { customMediumSchema } from '@/lib/validations/cookers';
import { createCustomMediumForKitchen } from '@/lib/cookers/media';

type P = { kitchenId: string };

/** Built-in storage media and the organisation's custom ones. */
export const GET = route<P>(async (_req, { params }) => {
  const access = await requireKitchen((await params).kitchenId, 'read');
  return json({ media: await listStorageMedia(access, access.kitchen.organisation.id) });
});

/** A lead defines a custom medium from a table of measured values (shared across the organisation). */
export const POST = route<P>(async (req: NextRequest, { params }) => {
  const access = await requireKitchen((await params).kitchenId, 'plan');
  const input = await parseJson(req, customMediumSchema, 128 * 1024);
  return json(await createCustomMediumForKitchen(access, input), { status: 201 });
});
