'use client';

import { useFormatter, useTranslations } from 'next-intl';
import { useEffect, useState } from 'react';
import { apiFetch } from '@/lib/client/api';

interface Delivery { id: string; subscriptionId: string; receivedAt: string; status: number; ttl: number | null; urgency: string | null; bytes: number; vapid: { sub: string } | null; error: string | null }

/** Dev tools: what the local push fake received, newest first. */
export function PushDeliveries() {
  const t = useTranslations('devPush');
  const tc = useTranslations('common');
  const format = useFormatter();
  const [list, setList] = useState<Delivery[] | null>(null);
  useEffect(() => {
    apiFetch<{ deliveries: Delivery[] }>('/api/v1/dev/push').then((r) => setList(r.ok ? r.data.deliveries : []));
  }, []);
  if (!list) return <p aria-busy="true">{tc('loading')}</p>;
  if (!list.length) return <p className="card">{t('empty')}</p>;
  return (
    <ul className="flex flex-col gap-3">
      {list.map((d) => (
        <li key={d.id} className="card text-sm">
          <p className="font-semibold">
            {format.dateTime(new Date(d.receivedAt), { dateStyle: 'medium', timeStyle: 'medium' })} · {t('answer')} {d.status}
          </p>
          <p className="break-all text-clay-700">
            {t('subscription')}: {d.subscriptionId}
          </p>
          <p>
            {t('bytes', { bytes: d.bytes })}
            {d.ttl !== null && ` · ${t('ttl', { ttl: d.ttl })}`}
            {d.urgency && ` · ${t('urgency', { urgency: d.urgency })}`}
            {d.vapid && ` · ${t('vapid', { sub: d.vapid.sub })}`}
          </p>
          {d.error && <p className="text-ember-800">{d.error}</p>}
        </li>
      ))}
    </ul>
  );
}
