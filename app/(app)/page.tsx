import { getTranslations } from 'next-intl/server';
import { redirect } from 'next/navigation';
import { KitchenList } from '@/components/kitchen-list';
import { getPageViewer } from '@/lib/auth/page';
import { asJson } from '@/lib/client/as-json';
import { listKitchensForUser } from '@/lib/kitchens';

export default async function HomePage() {
  const { user } = await getPageViewer();
  // The same answer as GET /api/v1/kitchens.
  const [t, kitchens] = await Promise.all([getTranslations('home'), listKitchensForUser(user.id, user.sessionVersion)]);
  if (!kitchens) redirect('/sign-in');
  return (
    <>
      <h1 className="mb-4 text-2xl font-bold">{t('title')}</h1>
      <KitchenList kitchens={asJson(kitchens)} />
    </>
  );
}
