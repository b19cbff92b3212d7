import type { NextRequest } from 'next/server';
import { json, parseQuery, route } from '@/lib/http/handler';
import { requireKitchen } from '@/lib/auth/guard';
import { getDayForecast } from '@/lib/forecast/view';
import { forecastQuerySchema } from '@/lib/validations/forecast';

type P = { kitchenId: string };

/** The hourly weather in use for a local day (today by default) with its source and age; any role of the kitchen. */
export const GET = route<P>(async (req: NextRequest, { params }) => {
  const access = await requireKitchen((await params).kitchenId, 'read');
  const q = parseQuery(req, forecastQuerySchema);
  return json(await getDayForecast(access.em, access.kitchen, q.date));
});
