import { getLocale, getTranslations } from 'next-intl/server';
import { getPageViewer } from '@/lib/auth/page';
import { getVisibleKitchens } from '@/lib/auth/guard';
import { AppShell, type NavItem } from '@/components/app-shell';
import { IntlProvider } from '@/components/intl-provider';
import { getEnv } from '@/lib/env';

export const dynamic = 'force-dynamic';

/** Signed-in pages: the shell shows only what the viewer's roles allow. */
export default async function AppLayout({ children }: { children: React.ReactNode }) {
  const viewer = await getPageViewer();
  const t = await getTranslations('common.roles');
  const kitchens = await getVisibleKitchens(viewer);
  const roles = new Set(viewer.memberships.map((m) => m.role));
  const top = roles.has('coordinator') ? 'coordinator' : roles.has('lead') ? 'lead' : 'cook';
  const nav: NavItem[] = [{ href: '/', key: 'home' }];
  if (roles.has('coordinator')) nav.push({ href: '/overview', key: 'overview' }, { href: '/organisation', key: 'organisation' });
  if (roles.has('coordinator') || roles.has('lead')) nav.push({ href: '/people', key: 'people' });
  nav.push({ href: '/settings', key: 'settings' });
  if (getEnv().devTools && roles.has('coordinator')) nav.push({ href: '/dev/mailbox', key: 'mailbox' }, { href: '/dev/push', key: 'push' });
  return (
    <IntlProvider>
    <AppShell
      user={{ name: viewer.user.name, role: t(top) }}
      nav={nav}
      kitchens={kitchens.map((k) => ({ id: k.id, name: k.name }))}
      prefs={{ temperatureUnit: viewer.user.temperatureUnit, locale: await getLocale() }}
    >
      {children}
    </AppShell>
    </IntlProvider>
  );
}
