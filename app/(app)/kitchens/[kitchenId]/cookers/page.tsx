import { CookerList } from '@/components/cooker-list';
import { getKitchenPageAccess } from '@/lib/auth/kitchen-page';
import { asJson } from '@/lib/client/as-json';
import { listCookers } from '@/lib/cookers';

export default async function CookersPage({ params }: { params: Promise<{ kitchenId: string }> }) {
  const { kitchenId } = await params;
  const access = await getKitchenPageAccess(kitchenId);
  return <CookerList kitchenId={kitchenId} canEdit={access.canPlan} cookers={asJson(await listCookers(access))} />;
}
