import { getTranslations } from 'next-intl/server';
import { notFound } from 'next/navigation';
import { getEnv } from '@/lib/env';
import { PushDeliveries } from '@/components/push-deliveries';

export default async function DevPushPage() {
  if (!getEnv().devTools) notFound();
  const t = await getTranslations('devPush');
  return (
    <>
      <h1 className="text-2xl font-bold">{t('title')}</h1>
      <p className="mb-4 text-clay-700">{t('intro')}</p>
      <PushDeliveries />
    </>
  );
}
