import { getTranslations } from 'next-intl/server';
import { CookerForm } from '@/components/cooker-form';
import { getKitchenPageAccess } from '@/lib/auth/kitchen-page';
import { asJson } from '@/lib/client/as-json';
import { listStorageMedia } from '@/lib/cookers';

export default async function NewCookerPage({ params }: { params: Promise<{ kitchenId: string }> }) {
  const { kitchenId } = await params;
  const access = await getKitchenPageAccess(kitchenId, 'plan');
  const [t, media] = await Promise.all([getTranslations('cookers'), listStorageMedia(access, access.kitchen.organisation.id)]);
  return (
    <>
      <p className="text-clay-700">{access.kitchen.name}</p>
      <h1 className="mb-4 text-2xl font-bold">{t('register')}</h1>
      <CookerForm kitchenId={kitchenId} media={asJson(media)} />
    </>
  );
}
