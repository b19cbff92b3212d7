import { getTranslations } from 'next-intl/server';
import { notFound } from 'next/navigation';
import { getPageViewer } from '@/lib/auth/page';
import { OrganisationKitchens } from '@/components/organisation-kitchens';

export default async function OrganisationPage() {
  const viewer = await getPageViewer();
  const coord = viewer.memberships.find((m) => m.role === 'coordinator');
  if (!coord) notFound();
  const t = await getTranslations('organisation');
  return (
    <div className="flex flex-col gap-6">
      <h1 className="text-2xl font-bold">
        {t('title')}: {coord.organisation.name}
      </h1>
      <OrganisationKitchens heading={t('kitchens')} />
    </div>
  );
}
