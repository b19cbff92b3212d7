import { PlanView } from '@/components/plan-view';
import { getKitchenPageAccess } from '@/lib/auth/kitchen-page';
import { tomorrowIn } from '@/lib/time';

export default async function PlanPage({ params, searchParams }: { params: Promise<{ kitchenId: string }>; searchParams: Promise<{ date?: string }> }) {
  const { kitchenId } = await params;
  const { date } = await searchParams;
  const access = await getKitchenPageAccess(kitchenId);
  const tomorrow = tomorrowIn(access.kitchen.timeZone);
  return <PlanView kitchenId={kitchenId} initialDate={date && /^\d{4}-\d{2}-\d{2}$/.test(date) ? date : tomorrow} timeZone={access.kitchen.timeZone} canEdit={access.canPlan} />;
}
