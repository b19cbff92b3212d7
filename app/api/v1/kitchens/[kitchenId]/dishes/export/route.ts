import { route } from '@/lib/http/handler';
import { requireKitchen } from '@/lib/auth/guard';
import { dishesToCsv, listDishes } from '@/lib/dishes';

/** The dish library as CSV (the same columns the import takes). */
export const GET = route<{ kitchenId: string }>(async (_req, { params }) => {
  const access = await requireKitchen((await params).kitchenId, 'read');
  const csv = dishesToCsv(await listDishes(access.em, access.kitchen.organisation.id));
  return new Response(csv, { headers: { 'content-type': 'text/csv; charset=utf-8', 'content-disposition': 'attachment; filename="dishes.csv"' } });
});
