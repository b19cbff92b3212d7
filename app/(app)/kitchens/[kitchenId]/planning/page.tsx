import { PlanningSettings } from '@/components/planning-settings';
import { getKitchenPageAccess } from '@/lib/auth/kitchen-page';
import { asJson } from '@/lib/client/as-json';
import { STOVES } from '@/lib/fuel';

export default async function PlanningPage({ params }: { params: Promise<{ kitchenId: string }> }) {
  const { kitchenId } = await params;
  const access = await getKitchenPageAccess(kitchenId, 'plan');
  // The same answer as GET /api/v1/kitchens/{kitchenId}/planning-settings.
  return <PlanningSettings kitchenId={kitchenId} initial={asJson({ planning: access.kitchen.planning, stoves: Object.values(STOVES) })} />;
}
