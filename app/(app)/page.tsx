import { getTranslations } from 'next-intl/server';
import { KitchenList } from '@/components/kitchen-list';

export default async function HomePage() {
  const t = await getTranslations('home');
  return (
    <>
      <h1 className="mb-4 text-2xl font-bold">{t('title')}</h1>
      <KitchenList />
    </>
  );
}
