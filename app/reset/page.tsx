import { getTranslations } from 'next-intl/server';
import { PublicFrame } from '@/components/public-frame';
import { ResetRequestForm } from '@/components/auth-forms';

export default async function ResetPage() {
  const t = await getTranslations();
  return (
    <PublicFrame title={t('reset.title')} tagline={t('common.tagline')}>
      <ResetRequestForm />
    </PublicFrame>
  );
}
