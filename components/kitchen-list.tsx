'use client';

import Link from 'next/link';
import { useFormatter, useTranslations } from 'next-intl';
import { useEffect, useState } from 'react';

export interface KitchenSummary {
  id: string;
  name: string;
  organisation: { id: string; name: string };
  latitude: number;
  longitude: number;
  altitudeM: number;
  timeZone: string;
  /** Monthly clear-sky index of the clear-sky fallback, January … December. */
  clearness?: { values: number[]; isDefault: boolean };
  role?: string;
}

/** The caller's kitchens as cards (the page's data, as GET /api/v1/kitchens answers), with an empty state; local clocks tick each minute. */
export function KitchenList({ kitchens }: { kitchens: KitchenSummary[] }) {
  const t = useTranslations('home');
  const tc = useTranslations('common');
  const format = useFormatter();
  const [now, setNow] = useState(() => new Date());

  useEffect(() => {
    const timer = setInterval(() => setNow(new Date()), 60_000);
    return () => clearInterval(timer);
  }, []);

  if (!kitchens.length) return <p className="card">{t('empty')}</p>;
  return (
    <ul className="grid gap-4 sm:grid-cols-2 lg:grid-cols-3">
      {kitchens.map((k) => (
        <li key={k.id} className="card flex flex-col gap-2">
          <h2 className="text-lg font-bold">
            {/* Cooks land on today's slots; the others on the kitchen's overview. */}
            <Link href={k.role === 'cook' ? `/kitchens/${k.id}/today` : `/kitchens/${k.id}`} className="hover:underline" aria-label={t('open', { name: k.name })}>
              {k.name}
            </Link>
          </h2>
          <p className="text-sm text-clay-700">{k.organisation.name}</p>
          <p className="text-sm">
            {t('location', {
              lat: format.number(k.latitude, { maximumFractionDigits: 3 }),
              lon: format.number(k.longitude, { maximumFractionDigits: 3 }),
              alt: format.number(k.altitudeM, { maximumFractionDigits: 0 }),
            })}
          </p>
          <p className="text-sm">
            {tc('localTime')}: {format.dateTime(now, { timeZone: k.timeZone, hour: '2-digit', minute: '2-digit', weekday: 'short' })} ({k.timeZone})
          </p>
          <Link href={`/kitchens/${k.id}/today`} className="btn-quiet w-fit">
            {t('today')}
          </Link>
          {k.role && <p className="mt-auto w-fit rounded-full bg-tide-50 px-3 py-1 text-xs font-semibold text-tide-700">{tc(`roles.${k.role}` as 'roles.cook')}</p>}
        </li>
      ))}
    </ul>
  );
}
