'use client';

import Link from 'next/link';
import { usePathname, useRouter } from 'next/navigation';
import { useTranslations } from 'next-intl';
import { useState } from 'react';
import { LanguagePicker } from './language-picker';
import { PrefsProvider, type Prefs } from './prefs';
import { Brand } from './brand';
import { SkipLink } from './skip-link';

export interface NavItem {
  href: string;
  key: 'home' | 'overview' | 'people' | 'organisation' | 'settings' | 'mailbox' | 'push';
}

export interface ShellProps {
  user: { name: string; role: string };
  nav: NavItem[];
  kitchens: { id: string; name: string }[];
  prefs: Prefs;
  children: React.ReactNode;
}

/** Header with role-based navigation, kitchen switcher, language picker and sign-out; collapses to a menu on phones. */
export function AppShell({ user, nav, kitchens, prefs, children }: ShellProps) {
  const t = useTranslations('nav');
  const tc = useTranslations('common');
  const pathname = usePathname();
  const router = useRouter();
  const [open, setOpen] = useState(false);
  const currentKitchen = /^\/kitchens\/([^/]+)/.exec(pathname)?.[1] ?? '';

  async function signOut() {
    await fetch('/api/v1/session', { method: 'DELETE' }).catch(() => undefined);
    router.push('/sign-in');
    router.refresh();
  }

  const isActive = (href: string) => (href === '/' ? pathname === '/' : pathname.startsWith(href));

  return (
    <div className="min-h-screen">
      <SkipLink label={tc('skipToContent')} />
      <header className="border-b border-clay-200 bg-clay-900 text-clay-50">
        <div className="mx-auto flex max-w-6xl flex-wrap items-center gap-3 px-4 py-3">
          <Link href="/" className="flex items-center gap-2 text-lg font-bold">
            <Brand name={tc('appName')} />
          </Link>
          <button
            type="button"
            className="ml-auto rounded-md border border-clay-700 px-3 py-2 text-sm md:hidden"
            aria-expanded={open}
            aria-controls="main-nav"
            onClick={() => setOpen((o) => !o)}
          >
            {t('menu')}
          </button>
          <nav
            id="main-nav"
            aria-label={t('main')}
            className={`${open ? 'flex' : 'hidden'} w-full flex-col gap-1 md:ml-4 md:flex md:w-auto md:flex-row md:items-center`}
          >
            {nav.map((item) => (
              <Link
                key={item.href}
                href={item.href}
                aria-current={isActive(item.href) ? 'page' : undefined}
                className={`rounded-md px-3 py-2 text-sm font-semibold hover:bg-clay-700 ${isActive(item.href) ? 'bg-clay-700 underline underline-offset-4' : ''}`}
                onClick={() => setOpen(false)}
              >
                {t(item.key)}
              </Link>
            ))}
          </nav>
          <div className={`${open ? 'flex' : 'hidden'} w-full flex-wrap items-center gap-3 md:ml-auto md:flex md:w-auto`}>
            {kitchens.length > 0 && (
              <label className="flex items-center gap-2 text-sm">
                <span>{t('switchKitchen')}</span>
                <select
                  className="max-w-48 rounded-md border border-clay-200 bg-white px-2 py-1 text-sm text-clay-900"
                  value={currentKitchen}
                  onChange={(e) => e.target.value && router.push(`/kitchens/${e.target.value}`)}
                >
                  <option value="">—</option>
                  {kitchens.map((k) => (
                    <option key={k.id} value={k.id}>
                      {k.name}
                    </option>
                  ))}
                </select>
              </label>
            )}
            <LanguagePicker signedIn />
            <span className="text-sm text-clay-200">{t('signedInAs', { name: user.name, role: user.role })}</span>
            <button type="button" onClick={signOut} className="rounded-md border border-clay-200 px-3 py-2 text-sm font-semibold hover:bg-clay-700">
              {t('signOut')}
            </button>
          </div>
        </div>
      </header>
      <main id="main" className="mx-auto max-w-6xl px-4 py-6">
        <PrefsProvider value={prefs}>{children}</PrefsProvider>
      </main>
    </div>
  );
}
