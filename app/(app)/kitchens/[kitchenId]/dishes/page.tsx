import { DishLibrary } from '@/components/dish-library';
import { getKitchenPageAccess } from '@/lib/auth/kitchen-page';
import { asJson } from '@/lib/client/as-json';
import { listDishes } from '@/lib/dishes';

export default async function DishesPage({ params }: { params: Promise<{ kitchenId: string }> }) {
  const { kitchenId } = await params;
  const access = await getKitchenPageAccess(kitchenId);
  const dishes = await listDishes(access.em, access.kitchen.organisation.id);
  return <DishLibrary kitchenId={kitchenId} canEdit={access.canPlan} initialDishes={asJson(dishes)} />;
}
