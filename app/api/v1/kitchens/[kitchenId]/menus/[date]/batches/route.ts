import { json, route } from '@/lib/http/handler';
import { requireKitchen } from '@/lib/auth/guard';
import { getMenuLines, splitIntoBatches } from '@/lib/menus';
import { getActiveCookers } from '@/lib/cookers';
import { parsePathDate } from '@/lib/validations/menus';

/** The day's menu split into batches by recipe size and the kitchen's largest pot, before planning. */
export const GET = route<{ kitchenId: string; date: string }>(async (_req, { params }) => {
  const { kitchenId, date } = await params;
  const access = await requireKitchen(kitchenId, 'read');
  const d = parsePathDate(date);
  const [lines, cookers] = await Promise.all([getMenuLines(access.em, access.kitchen.id, d), getActiveCookers(access.em, access.kitchen.id)]);
  return json({ date: d, batches: splitIntoBatches(lines, cookers, access.kitchen, d) });
});
