import { getTranslations } from 'next-intl/server';
import { notFound, redirect } from 'next/navigation';
import { getPageViewer } from '@/lib/auth/page';
import { InviteForm } from '@/components/invite-form';
import { KitchenList } from '@/components/kitchen-list';
import { asJson } from '@/lib/client/as-json';
import { listKitchensForUser } from '@/lib/kitchens';

export default async function PeoplePage() {
  const viewer = await getPageViewer();
  const roles = new Set(viewer.memberships.map((m) => m.role));
  if (!roles.has('coordinator') && !roles.has('lead')) notFound();
  // The same answer as GET /api/v1/kitchens.
  const [t, kitchens] = await Promise.all([getTranslations('people'), listKitchensForUser(viewer.user.id, viewer.user.sessionVersion)]);
  if (!kitchens) redirect('/sign-in');
  const plain = asJson(kitchens);
  return (
    <div className="flex flex-col gap-6">
      <h1 className="text-2xl font-bold">{t('title')}</h1>
      <InviteForm canInviteCoordinator={roles.has('coordinator')} kitchens={plain.filter((k) => k.role === 'coordinator' || k.role === 'lead')} />
      <KitchenList kitchens={plain} />
    </div>
  );
}
