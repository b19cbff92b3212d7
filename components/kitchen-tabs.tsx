'use client';

import Link from 'next/link';
import { usePathname } from 'next/navigation';
import { useTranslations } from 'next-intl';

export type KitchenTab = 'today' | 'kitchen' | 'plan' | 'menu' | 'dishes' | 'cookers' | 'forecast' | 'settings';

/** The kitchen's own sections, as a scrollable tab row that works on a phone. */
export function KitchenTabs({ kitchenId, kitchenName, tabs }: { kitchenId: string; kitchenName: string; tabs: KitchenTab[] }) {
  const t = useTranslations('nav');
  const pathname = usePathname();
  const base = `/kitchens/${kitchenId}`;
  const href = (tab: KitchenTab) => (tab === 'kitchen' ? base : tab === 'settings' ? `${base}/planning` : `${base}/${tab}`);
  // A whole path segment: /planning is the settings tab, not the plan's.
  const active = (tab: KitchenTab) => (tab === 'kitchen' ? pathname === base : pathname === href(tab) || pathname.startsWith(`${href(tab)}/`));
  const label = (tab: KitchenTab) => (tab === 'settings' ? t('settings') : t(tab));
  return (
    <nav aria-label={kitchenName} className="-mx-4 mb-6 overflow-x-auto border-b border-clay-200 px-4">
      <p className="mb-1 text-sm font-semibold text-clay-700">{kitchenName}</p>
      <ul className="flex gap-1">
        {tabs.map((tab) => (
          <li key={tab}>
            <Link
              href={href(tab)}
              aria-current={active(tab) ? 'page' : undefined}
              className={`inline-block min-h-11 whitespace-nowrap rounded-t-lg px-3 py-2 text-sm font-semibold ${active(tab) ? 'border-b-4 border-ember-600 text-clay-900' : 'text-clay-700 hover:bg-clay-100'}`}
            >
              {label(tab)}
            </Link>
          </li>
        ))}
      </ul>
    </nav>
  );
}
