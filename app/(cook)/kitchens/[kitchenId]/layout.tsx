import Link from 'next/link';
import { getLocale, getMessages, getTranslations } from 'next-intl/server';
import { getKitchenPageAccess } from '@/lib/auth/kitchen-page';
import { MiniIntlProvider } from '@/components/mini-intl';
import { PrefsProvider } from '@/components/prefs';
import { SignOutButton } from '@/components/sign-out-button';
import { Brand } from '@/components/brand';
import { SkipLink } from '@/components/skip-link';

export const dynamic = 'force-dynamic';

/**
 * The cook's phone pages: a plain header and only the messages these pages use, without the app
 * shell or next-intl's client runtime (cooks are on cheap phones and weak links; see DEVELOPERS.md).
 */
export default async function CookLayout({ children, params }: { children: React.ReactNode; params: Promise<{ kitchenId: string }> }) {
  const { kitchenId } = await params;
  const access = await getKitchenPageAccess(kitchenId);
  const [locale, messages, t] = await Promise.all([getLocale(), getMessages(), getTranslations()]);
  const plan = messages.plan as { reasons: unknown };
  const picked = { today: messages.today, safety: messages.safety, plan: { reasons: plan.reasons } } as never;
  return (
    <div className="min-h-screen">
      <SkipLink label={t('common.skipToContent')} />
      <header className="bg-clay-900 text-clay-50">
        <div className="mx-auto flex max-w-3xl flex-wrap items-center gap-3 px-4 py-3">
          <Link href="/" className="flex items-center gap-2 text-lg font-bold">
            <Brand name={t('common.appName')} />
          </Link>
          <Link href={`/kitchens/${kitchenId}`} className="min-h-12 content-center text-sm font-semibold underline underline-offset-4">
            {access.kitchen.name}
          </Link>
          <span className="ml-auto" />
          <Link href="/settings" className="min-h-12 content-center text-sm font-semibold">
            {t('nav.settings')}
          </Link>
          <SignOutButton label={t('nav.signOut')} />
        </div>
      </header>
      <main id="main" className="mx-auto max-w-3xl px-4 py-4">
        <MiniIntlProvider locale={locale} messages={picked}>
          <PrefsProvider value={{ temperatureUnit: access.user.temperatureUnit, locale }}>{children}</PrefsProvider>
        </MiniIntlProvider>
      </main>
    </div>
  );
}
