import { getTranslations } from 'next-intl/server';
import { PublicFrame } from '@/components/public-frame';
import { ResetConfirmForm } from '@/components/auth-forms';

export default async function ResetConfirmPage({ params }: { params: Promise<{ token: string }> }) {
  const { token } = await params;
  const t = await getTranslations();
  return (
    <PublicFrame title={t('reset.newTitle')} tagline={t('common.tagline')}>
      <ResetConfirmForm token={token} />
    </PublicFrame>
  );
}
