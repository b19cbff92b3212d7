import { getTranslations } from 'next-intl/server';
import { notFound } from 'next/navigation';
import { getPageViewer } from '@/lib/auth/page';
import { InviteForm } from '@/components/invite-form';
import { KitchenList } from '@/components/kitchen-list';

export default async function PeoplePage() {
  const viewer = await getPageViewer();
  const roles = new Set(viewer.memberships.map((m) => m.role));
  if (!roles.has('coordinator') && !roles.has('lead')) notFound();
  const t = await getTranslations('people');
  return (
    <div className="flex flex-col gap-6">
      <h1 className="text-2xl font-bold">{t('title')}</h1>
      <InviteForm canInviteCoordinator={roles.has('coordinator')} />
      <KitchenList />
    </div>
  );
}
