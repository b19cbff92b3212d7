import { getTranslations } from 'next-intl/server';
import { PublicFrame } from '@/components/public-frame';
import { AcceptInviteForm } from '@/components/auth-forms';

export default async function InvitePage({ params }: { params: Promise<{ token: string }> }) {
  const { token } = await params;
  const t = await getTranslations();
  return (
    <PublicFrame title={t('invite.title')} tagline={t('common.tagline')}>
      <AcceptInviteForm token={token} />
    </PublicFrame>
  );
}
