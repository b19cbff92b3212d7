import { getTranslations } from 'next-intl/server';
import { getPageViewer } from '@/lib/auth/page';
import { SettingsForm } from '@/components/settings-form';

export default async function SettingsPage() {
  const { user } = await getPageViewer();
  const t = await getTranslations('settings');
  return (
    <>
      <h1 className="mb-4 text-2xl font-bold">{t('title')}</h1>
      <SettingsForm initial={{ name: user.name, locale: user.locale, temperatureUnit: user.temperatureUnit }} />
    </>
  );
}
