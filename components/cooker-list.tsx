'use client';

import Link from 'next/link';
import { useFormatter, useTranslations } from 'next-intl';
import { usePrefs } from './prefs';

export interface CookerSummary {
  id: string;
  name: string;
  kind: 'dish' | 'trough' | 'box' | 'evacuated-tube';
  apertureM2: number;
  mediumName: string;
  storeMassKg: number;
  minUsefulTempC: number;
  maxSafeTempC: number;
  pots: { id: string; name: string; volumeL: number }[];
}

/** The kitchen's cookers (rendered with the page's data); leads get the link to register one. */
export function CookerList({ kitchenId, canEdit, cookers }: { kitchenId: string; canEdit: boolean; cookers: CookerSummary[] }) {
  const t = useTranslations('cookers');
  const format = useFormatter();
  const { fmtTemp } = usePrefs();

  return (
    <div className="flex flex-col gap-4">
      <div className="flex flex-wrap items-center justify-between gap-3">
        <h1 className="text-2xl font-bold">{t('title')}</h1>
        {canEdit && (
          <Link href={`/kitchens/${kitchenId}/cookers/new`} className="btn-primary">
            {t('register')}
          </Link>
        )}
      </div>
      {cookers.length === 0 && <p className="card">{t('empty')}</p>}
      {cookers.length > 0 && (
        <ul className="grid gap-4 sm:grid-cols-2">
          {cookers.map((c) => (
            <li key={c.id} className="card flex flex-col gap-1">
              <h2 className="text-lg font-bold">
                <Link href={`/kitchens/${kitchenId}/cookers/${c.id}`} className="hover:underline" aria-label={t('open', { name: c.name })}>
                  {c.name}
                </Link>
              </h2>
              <p className="text-sm text-clay-700">{t(`kinds.${c.kind}`)}</p>
              <dl className="grid grid-cols-[auto_1fr] gap-x-3 text-sm">
                <dt className="font-semibold">{t('aperture')}</dt>
                <dd>{format.number(c.apertureM2, { maximumFractionDigits: 2 })} m²</dd>
                <dt className="font-semibold">{t('medium')}</dt>
                <dd>
                  {c.mediumName}, {format.number(c.storeMassKg)} kg
                </dd>
                <dt className="font-semibold">°</dt>
                <dd>{t('safeRange', { min: fmtTemp(c.minUsefulTempC), max: fmtTemp(c.maxSafeTempC) })}</dd>
                <dt className="font-semibold">{t('pots')}</dt>
                <dd>{c.pots.map((p) => `${p.name}`).join(', ')}</dd>
              </dl>
            </li>
          ))}
        </ul>
      )}
    </div>
  );
}
