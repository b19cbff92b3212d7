'use client';

import Link from 'next/link';
import { useTranslations } from 'next-intl';
import { useEffect, useState } from 'react';
import { apiFetch } from '@/lib/client/api';
import { CookerForm, cookerToForm } from './cooker-form';
import { PredictionChart } from './prediction-chart';
import { CookerApiKeys } from './cooker-api-keys';

type Cooker = Parameters<typeof cookerToForm>[0] & { id: string; name: string; kind: string; mediumName: string; pots: { id: string; name: string }[] };

/** A cooker: its predicted day first (what people come for), then its definition for leads to edit. */
export function CookerDetail({ kitchenId, cookerId, canEdit }: { kitchenId: string; cookerId: string; canEdit: boolean }) {
  const t = useTranslations('cookers');
  const tc = useTranslations('common');
  const [c, setC] = useState<Cooker | null>(null);
  const [error, setError] = useState<string | null>(null);
  useEffect(() => {
    apiFetch<Cooker>(`/api/v1/kitchens/${kitchenId}/cookers/${cookerId}`).then((r) => (r.ok ? setC(r.data) : setError(r.error.status === 0 ? tc('offline') : r.error.message)));
  }, [kitchenId, cookerId, tc]);
  if (error) return <p role="alert" className="card text-ember-800">{error}</p>;
  if (!c) return <p aria-busy="true">{tc('loading')}</p>;
  return (
    <div className="flex flex-col gap-6">
      <div>
        <Link href={`/kitchens/${kitchenId}/cookers`} className="text-sm text-tide-700 underline">{t('title')}</Link>
        <h1 className="text-2xl font-bold">{c.name}</h1>
        <p className="text-clay-700">
          {t(`kinds.${c.kind}` as 'kinds.dish')} · {c.mediumName}
        </p>
      </div>
      <PredictionChart kitchenId={kitchenId} cookerId={cookerId} potNames={Object.fromEntries(c.pots.map((p) => [p.id, p.name]))} />
      {canEdit && <CookerApiKeys kitchenId={kitchenId} cookerId={cookerId} />}
      {canEdit && <CookerForm kitchenId={kitchenId} cookerId={cookerId} initial={cookerToForm(c)} />}
    </div>
  );
}
