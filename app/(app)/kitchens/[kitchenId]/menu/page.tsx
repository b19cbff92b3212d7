import { MenuEditor } from '@/components/menu-editor';
import { getKitchenPageAccess } from '@/lib/auth/kitchen-page';
import { asJson } from '@/lib/client/as-json';
import { getActiveCookers } from '@/lib/cookers';
import { listDishes } from '@/lib/dishes';
import { describeLine, getMenuLines, splitIntoBatches } from '@/lib/menus';
import { tomorrowIn } from '@/lib/time';
import { dateQuery } from '@/lib/validations/menus';

export default async function MenuPage({ params, searchParams }: { params: Promise<{ kitchenId: string }>; searchParams: Promise<{ date?: string }> }) {
  const { kitchenId } = await params;
  const { date } = await searchParams;
  const access = await getKitchenPageAccess(kitchenId);
  const asked = dateQuery.safeParse({ date });
  const day = asked.success ? asked.data.date : tomorrowIn(access.kitchen.timeZone);
  // The same data as GET …/menus/{date}, …/menus/{date}/batches and …/dishes.
  const [lines, cookers, dishes] = await Promise.all([
    getMenuLines(access.em, access.kitchen.id, day),
    getActiveCookers(access.em, access.kitchen.id),
    listDishes(access.em, access.kitchen.organisation.id),
  ]);
  const initial = {
    date: day,
    lines: lines.map(describeLine),
    batches: splitIntoBatches(lines, cookers, access.kitchen, day),
    dishes: dishes.map((d) => ({ id: d.id, name: d.name })),
  };
  return <MenuEditor kitchenId={kitchenId} initial={asJson(initial)} canEdit={access.canPlan} />;
}
