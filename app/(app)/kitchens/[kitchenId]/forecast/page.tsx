import { ForecastView } from '@/components/forecast-view';
import { getKitchenPageAccess } from '@/lib/auth/kitchen-page';

export default async function ForecastPage({ params }: { params: Promise<{ kitchenId: string }> }) {
  const { kitchenId } = await params;
  const access = await getKitchenPageAccess(kitchenId);
  return <ForecastView kitchenId={kitchenId} kitchenName={access.kitchen.name} canUpload={access.canPlan} />;
}
