import { KitchenOverview } from '@/components/kitchen-overview';

export default async function KitchenPage({ params }: { params: Promise<{ kitchenId: string }> }) {
  const { kitchenId } = await params;
  return <KitchenOverview kitchenId={kitchenId} />;
}
