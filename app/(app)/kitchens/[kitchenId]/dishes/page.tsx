import { DishLibrary } from '@/components/dish-library';
import { getKitchenPageAccess } from '@/lib/auth/kitchen-page';

export default async function DishesPage({ params }: { params: Promise<{ kitchenId: string }> }) {
  const { kitchenId } = await params;
  const access = await getKitchenPageAccess(kitchenId);
  return <DishLibrary kitchenId={kitchenId} canEdit={access.canPlan} />;
}
