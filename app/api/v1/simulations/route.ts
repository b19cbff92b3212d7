import type { NextRequest } from 'next/server';
import { json, parseJson, route } from '@/lib/http/handler';
import { requireKitchen, requireViewer } from '@/lib/auth/guard';
import { CookerSchema } from '@/entities';
import { notFound } from '@/lib/http/errors';
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
  return json(runSimulationRequest(input));
});
