import { CookerDetail } from '@/components/cooker-detail';
import { getKitchenPageAccess } from '@/lib/auth/kitchen-page';

export default async function CookerPage({ params }: { params: Promise<{ kitchenId: string; cookerId: string }> }) {
  const { kitchenId, cookerId } = await params;
  const access = await getKitchenPageAccess(kitchenId);
  return <CookerDetail kitchenId={kitchenId} cookerId={cookerId} canEdit={access.canPlan} />;
}
