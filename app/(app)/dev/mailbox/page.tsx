import { getTranslations } from 'next-intl/server';
import { notFound } from 'next/navigation';
import { getEnv } from '@/lib/env';
import { Mailbox } from '@/components/mailbox';

export default async function MailboxPage() {
  if (!getEnv().devTools) notFound();
  const t = await getTranslations('mailbox');
  return (
    <>
      <h1 className="text-2xl font-bold">{t('title')}</h1>
      <p className="mb-4 text-clay-700">{t('intro')}</p>
      <Mailbox />
    </>
  );
}
