import { getKitchenPageAccess } from '@/lib/auth/kitchen-page';
import { KitchenTabs, type KitchenTab } from '@/components/kitchen-tabs';

/** Every kitchen page: the guard (404 for a kitchen the viewer cannot see) and the kitchen's tabs. */
export default async function KitchenLayout({ children, params }: { children: React.ReactNode; params: Promise<{ kitchenId: string }> }) {
  const { kitchenId } = await params;
  const access = await getKitchenPageAccess(kitchenId);
  const tabs: KitchenTab[] = ['today', 'kitchen', 'plan', 'menu', 'dishes', 'cookers', 'forecast'];
  if (access.canPlan) tabs.push('settings');
  return (
    <>
      <KitchenTabs kitchenId={kitchenId} kitchenName={access.kitchen.name} tabs={tabs} />
      {children}
    </>
  );
}
