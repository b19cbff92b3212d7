import type { NextRequest } from 'next/server';
import { json, parseJson, route } from '@/lib/http/handler';
import { requireKitchen, requireViewer } from '@/lib/auth/guard';
import { CookerSchema, StorageMediumSchema } from '@/entities';
import { notFound, unprocessable } from '@/lib/http/errors';
import { simulationSchema } from '@/lib/validations/simulations';
import { runSimulationRequest } from '@/lib/prediction/simulate-request';

/** Runs the cooker model for a stored cooker (by id) or an inline definition over a weather series. */
export const POST = route(async (req: NextRequest) => {
  const viewer = await requireViewer();
  const input = await parseJson(req, simulationSchema, 4 * 1024 * 1024);
  if (input.cookerId) {
    const cooker = await viewer.em.findOne(CookerSchema, { id: input.cookerId, archived: false }, { populate: ['kitchen', 'customMedium'] });
    if (!cooker) throw notFound('Cooker');
    const access = await requireKitchen(cooker.kitchen.id, 'read', viewer).catch(() => {
      throw notFound('Cooker');
    });
    return json(runSimulationRequest(input, { cooker, kitchen: access.kitchen }));
  }
  let custom = null;
  if (input.cooker?.mediumId === 'custom') {
    // Custom media are shared across an organisation: any organisation the viewer belongs to may lend one.
    const orgIds = [...new Set(viewer.memberships.map((m) => m.organisation.id))];
    const id = input.cooker.customMediumId!;
    custom = orgIds.length > 0 ? await viewer.em.findOne(StorageMediumSchema, { id, organisation: { $in: orgIds } }) : null;
    if (!custom) throw unprocessable('Choose a custom medium of your organisation.', { 'cooker.customMediumId': 'Unknown custom medium.' });
  }
  return json(runSimulationRequest(input, undefined, custom));
});
