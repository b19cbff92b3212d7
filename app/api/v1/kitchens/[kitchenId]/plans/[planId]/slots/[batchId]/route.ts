import type { NextRequest } from 'next/server';
import { json, parseJson, route } from '@/lib/http/handler';
import { requireKitchen } from '@/lib/auth/guard';
import { moveDraftSlot } from '@/lib/drafts';
import { patchSlotSchema } from '@/lib/validations/plans';

/** Moves a batch to another cooker, pot or start (drafts only); 409 with the reason when the store cannot do it. */
export const PATCH = route<{ kitchenId: string; planId: string; batchId: string }>(async (req: NextRequest, { params }) => {
  const { kitchenId, planId, batchId } = await params;
  const access = await requireKitchen(kitchenId, 'plan');
  const input = await parseJson(req, patchSlotSchema, 4 * 1024);
  return json(await moveDraftSlot({ em: access.em, kitchen: access.kitchen, actorId: access.user.id }, planId, { batchId, cookerId: input.cookerId, potId: input.potId, startMs: Date.parse(input.start) }));
});
