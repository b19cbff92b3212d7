import { getTranslations } from 'next-intl/server';
import { notFound, redirect } from 'next/navigation';
import { getPageViewer } from '@/lib/auth/page';
import { OrganisationKitchens } from '@/components/organisation-kitchens';
import { asJson } from '@/lib/client/as-json';
import { listKitchensForUser } from '@/lib/kitchens';

export default async function OrganisationPage() {
  const viewer = await getPageViewer();
  const coord = viewer.memberships.find((m) => m.role === 'coordinator');
  if (!coord) notFound();
  // The same answer as GET /api/v1/kitchens.
  const [t, kitchens] = await Promise.all([getTranslations('organisation'), listKitchensForUser(viewer.user.id, viewer.user.sessionVersion)]);
  if (!kitchens) redirect('/sign-in');
  return (
    <div className="flex flex-col gap-6">
      <h1 className="text-2xl font-bold">
        {t('title')}: {coord.organisation.name}
      </h1>
      <OrganisationKitchens heading={t('kitchens')} kitchens={asJson(kitchens)} />
    </div>
  );
}
