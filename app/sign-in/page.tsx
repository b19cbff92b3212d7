import { getTranslations } from 'next-intl/server';
import { PublicFrame } from '@/components/public-frame';
import { SignInForm } from '@/components/auth-forms';

export default async function SignInPage() {
  const t = await getTranslations();
  return (
    <PublicFrame title={t('signIn.title')} tagline={t('common.tagline')}>
      <SignInForm />
    </PublicFrame>
  );
}
