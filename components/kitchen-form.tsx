'use client';

import { useTranslations } from 'next-intl';
import { useState } from 'react';
import { apiFetch } from '@/lib/client/api';
import { Field, Status } from './field';
import type { KitchenSummary } from './kitchen-list';

type Values = { name: string; latitude: string; longitude: string; altitudeM: string; timeZone: string; locale: 'en' | 'fr' };

/** Create (POST) or edit (PATCH) a kitchen; errors from the API appear next to their fields. */
export function KitchenForm({ kitchen, onSaved }: { kitchen?: KitchenSummary & { locale?: string }; onSaved?: (k: KitchenSummary) => void }) {
  const t = useTranslations('kitchen');
  const tc = useTranslations('common');
  const [v, setV] = useState<Values>({
    name: kitchen?.name ?? '',
    latitude: kitchen ? String(kitchen.latitude) : '',
    longitude: kitchen ? String(kitchen.longitude) : '',
    altitudeM: kitchen ? String(kitchen.altitudeM) : '0',
    timeZone: kitchen?.timeZone ?? 'UTC',
    locale: kitchen?.locale === 'fr' ? 'fr' : 'en',
  });
  const [fields, setFields] = useState<Record<string, string>>({});
  const [status, setStatus] = useState<{ msg: string; tone: 'info' | 'error' } | null>(null);
  const [busy, setBusy] = useState(false);
  const set = (k: keyof Values) => (e: React.ChangeEvent<HTMLInputElement | HTMLSelectElement>) => setV({ ...v, [k]: e.target.value });

  async function submit(e: React.FormEvent) {
    e.preventDefault();
    setBusy(true);
    const body = { ...v, latitude: Number(v.latitude), longitude: Number(v.longitude), altitudeM: Number(v.altitudeM) };
    const r = await apiFetch<KitchenSummary>(kitchen ? `/api/v1/kitchens/${kitchen.id}` : '/api/v1/kitchens', { method: kitchen ? 'PATCH' : 'POST', body });
    setBusy(false);
    if (r.ok) {
      setFields({});
      setStatus({ msg: kitchen ? tc('saved') : t('created'), tone: 'info' });
      onSaved?.(r.data);
    } else {
      setFields(r.error.fields ?? {});
      setStatus({ msg: r.error.status === 0 ? tc('offline') : r.error.message, tone: 'error' });
    }
  }

  return (
    <form onSubmit={submit} noValidate className="card max-w-xl">
      <h2 className="mb-3 text-lg font-bold">{kitchen ? t('edit') : t('create')}</h2>
      <Field label={t('name')} value={v.name} onChange={set('name')} error={fields.name} required />
      <div className="grid gap-x-4 sm:grid-cols-3">
        <Field label={t('latitude')} inputMode="decimal" value={v.latitude} onChange={set('latitude')} error={fields.latitude} required />
        <Field label={t('longitude')} inputMode="decimal" value={v.longitude} onChange={set('longitude')} error={fields.longitude} required />
        <Field label={t('altitude')} inputMode="decimal" value={v.altitudeM} onChange={set('altitudeM')} error={fields.altitudeM} required />
      </div>
      <Field label={t('timeZone')} value={v.timeZone} onChange={set('timeZone')} error={fields.timeZone} required />
      <div className="mb-4">
        <label className="label" htmlFor="kitchen-locale">
          {t('locale')}
        </label>
        <select id="kitchen-locale" className="field" value={v.locale} onChange={set('locale')}>
          <option value="en">English</option>
          <option value="fr">Français</option>
        </select>
      </div>
      <button className="btn-primary" disabled={busy}>
        {busy ? tc('loading') : tc('save')}
      </button>
      <Status message={status?.msg ?? null} tone={status?.tone} />
    </form>
  );
}
