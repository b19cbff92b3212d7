import { PlanningSettings } from '@/components/planning-settings';
import { getKitchenPageAccess } from '@/lib/auth/kitchen-page';

export default async function PlanningPage({ params }: { params: Promise<{ kitchenId: string }> }) {
  const { kitchenId } = await params;
  await getKitchenPageAccess(kitchenId, 'plan');
  return <PlanningSettings kitchenId={kitchenId} />;
}
