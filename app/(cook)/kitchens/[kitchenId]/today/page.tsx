import type { Metadata } from 'next';
import { getLocale, getTranslations } from 'next-intl/server';
import { TodayView } from '@/components/today/today-view';
import { getKitchenPageAccess } from '@/lib/auth/kitchen-page';
import { getTodayPage } from '@/lib/cooks/today';

export async function generateMetadata(): Promise<Metadata> {
  return { title: (await getTranslations('today'))('title') };
}

/**
 * The cooks' page (their landing page): today's slots on a phone, working offline. The first data is
 * rendered here on the server (the same lib function and guard as the today route); the page refreshes
 * it from that route.
 */
export default async function TodayPage({ params }: { params: Promise<{ kitchenId: string }> }) {
  const { kitchenId } = await params;
  const access = await getKitchenPageAccess(kitchenId);
  const [initial, locale] = await Promise.all([getTodayPage(access.em, access.kitchen, access.role), getLocale()]);
  return <TodayView kitchenId={kitchenId} userId={access.user.id} timeZone={access.kitchen.timeZone} initial={initial} locale={locale} />;
}
