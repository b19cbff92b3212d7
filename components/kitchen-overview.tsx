'use client';

import Link from 'next/link';
import { useFormatter, useTranslations } from 'next-intl';
import { useEffect, useState } from 'react';
import { apiFetch } from '@/lib/client/api';
import type { KitchenSummary } from './kitchen-list';
import { KitchenForm } from './kitchen-form';

interface Member {
  id: string;
  role: string;
  user: { id: string; name: string; email: string };
}

/** One kitchen: where it is, who works there; coordinators can edit it. */
export function KitchenOverview({ kitchenId }: { kitchenId: string }) {
  const t = useTranslations('kitchen');
  const tc = useTranslations('common');
  const format = useFormatter();
  const [kitchen, setKitchen] = useState<(KitchenSummary & { locale: string }) | null>(null);
  const [members, setMembers] = useState<Member[]>([]);
  const [error, setError] = useState<string | null>(null);

  useEffect(() => {
    apiFetch<KitchenSummary & { locale: string }>(`/api/v1/kitchens/${kitchenId}`).then((r) => {
      if (r.ok) setKitchen(r.data);
      else setError(r.error.status === 404 ? t('notFound') : r.error.message || tc('offline'));
    });
    apiFetch<{ members: Member[] }>(`/api/v1/kitchens/${kitchenId}/members`).then((r) => r.ok && setMembers(r.data.members));
  }, [kitchenId, t, tc]);

  if (error) return <p role="alert" className="card text-ember-800">{error}</p>;
  if (!kitchen) return <p aria-busy="true">{tc('loading')}</p>;
  return (
    <div className="flex flex-col gap-6">
      <div>
        <h1 className="text-2xl font-bold">{kitchen.name}</h1>
        <p className="text-clay-700">{kitchen.organisation.name}</p>
        <div className="mt-3 flex flex-wrap gap-2">
          <Link href={`/kitchens/${kitchen.id}/cookers`} className="btn-primary">
            {t('cookers')}
          </Link>
          <Link href={`/kitchens/${kitchen.id}/forecast`} className="btn-quiet">
            {t('forecast')}
          </Link>
        </div>
      </div>
      <section aria-labelledby="details" className="card">
        <h2 id="details" className="mb-2 text-lg font-bold">{t('details')}</h2>
        <dl className="grid grid-cols-[auto_1fr] gap-x-4 gap-y-1 text-sm">
          <dt className="font-semibold">{t('latitude')}</dt>
          <dd>{format.number(kitchen.latitude, { maximumFractionDigits: 4 })}</dd>
          <dt className="font-semibold">{t('longitude')}</dt>
          <dd>{format.number(kitchen.longitude, { maximumFractionDigits: 4 })}</dd>
          <dt className="font-semibold">{t('altitude')}</dt>
          <dd>{format.number(kitchen.altitudeM)} m</dd>
          <dt className="font-semibold">{t('timeZone')}</dt>
          <dd>{kitchen.timeZone}</dd>
        </dl>
      </section>
      <section aria-labelledby="members" className="card">
        <h2 id="members" className="mb-2 text-lg font-bold">{t('members')}</h2>
        {members.length === 0 ? (
          <p>{tc('none')}</p>
        ) : (
          <ul className="divide-y divide-clay-100">
            {members.map((m) => (
              <li key={m.id} className="flex flex-wrap justify-between gap-2 py-2 text-sm">
                <span className="font-semibold">{m.user.name}</span>
                <span className="text-clay-700">{m.user.email}</span>
                <span>{tc(`roles.${m.role}` as 'roles.cook')}</span>
              </li>
            ))}
          </ul>
        )}
      </section>
      {kitchen.role === 'coordinator' && <KitchenForm kitchen={kitchen} onSaved={(k) => setKitchen({ ...kitchen, ...k })} />}
    </div>
  );
}
