import type { Metadata } from 'next';
import { getTranslations } from 'next-intl/server';
import { TodayView } from '@/components/today/today-view';
import { getKitchenPageAccess } from '@/lib/auth/kitchen-page';

export async function generateMetadata(): Promise<Metadata> {
  return { title: (await getTranslations('today'))('title') };
}

/** The cooks' page (their landing page): today's slots on a phone, working offline. Data comes from the today route. */
export default async function TodayPage({ params }: { params: Promise<{ kitchenId: string }> }) {
  const { kitchenId } = await params;
  const access = await getKitchenPageAccess(kitchenId);
  return <TodayView kitchenId={kitchenId} userId={access.user.id} timeZone={access.kitchen.timeZone} />;
}
