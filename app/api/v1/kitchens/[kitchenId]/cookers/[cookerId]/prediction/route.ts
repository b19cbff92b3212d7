import type { NextRequest } from 'next/server';
import { json, parseQuery, route } from '@/lib/http/handler';
import { requireKitchen } from '@/lib/auth/guard';
import { defaultPredictionDate, getCooker } from '@/lib/cookers';
import { predictCookerDay } from '@/lib/plans/cooker-day';
import { predictionQuerySchema } from '@/lib/validations/cookers';

type P = { kitchenId: string; cookerId: string };

/** The cooker's predicted day (store and pot temperature, charge) for a local date, tomorrow by default. */
export const GET = route<P>(async (req: NextRequest, { params }) => {
  const { kitchenId, cookerId } = await params;
  const access = await requireKitchen(kitchenId, 'read');
  const q = parseQuery(req, predictionQuerySchema);
  const cooker = await getCooker(access, cookerId);
  const date = q.date ?? defaultPredictionDate(access.kitchen);
  const p = await predictCookerDay(access.em, access.kitchen, cooker, date, q.initialStoreTempC);
  return json({ cookerId: cooker.id, timeZone: access.kitchen.timeZone, minUsefulTempC: cooker.minUsefulTempC, maxSafeTempC: cooker.maxSafeTempC, ...p });
});
