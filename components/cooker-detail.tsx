'use client';

import Link from 'next/link';
import { useTranslations } from 'next-intl';
import { CookerForm, cookerToForm, type Medium } from './cooker-form';
import { PredictionChart } from './prediction-chart';
import { CookerApiKeys, type ApiKey } from './cooker-api-keys';

type Cooker = Parameters<typeof cookerToForm>[0] & { id: string; name: string; kind: string; mediumName: string; pots: { id: string; name: string }[] };

/**
 * A cooker: its predicted day first (what people come for), then its definition for leads to edit. The page
 * renders it with the cooker (and, for leads, its media and sensor keys); a save refreshes the page.
 */
export function CookerDetail({ kitchenId, cooker: c, canEdit, media, apiKeys }: { kitchenId: string; cooker: Cooker; canEdit: boolean; media: Medium[]; apiKeys: ApiKey[] }) {
  const t = useTranslations('cookers');
  const cookerId = c.id;
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
      {canEdit && <CookerApiKeys kitchenId={kitchenId} cookerId={cookerId} initialKeys={apiKeys} />}
      {canEdit && <CookerForm kitchenId={kitchenId} cookerId={cookerId} initial={cookerToForm(c)} media={media} />}
    </div>
  );
}
