'use client';

import { useTranslations } from 'next-intl';
import { useState } from 'react';
import { createKitchenSchema, updateKitchenSchema } from '@/lib/validations/kitchens';
import { Field, Status } from './field';
import type { KitchenSummary } from './kitchen-list';
import { useFormSubmit } from './use-form-submit';

type Values = { name: string; latitude: string; longitude: string; altitudeM: string; timeZone: string; locale: 'en' | 'fr'; clearness: string[] };

/** Create (POST) or edit (PATCH) a kitchen; errors from the API appear next to their fields. */
export function KitchenForm({ kitchen, onSaved }: { kitchen?: KitchenSummary & { locale?: string }; onSaved?: (k: KitchenSummary) => void }) {
  const t = useTranslations('kitchen');
  const tc = useTranslations('common');
  const tv = useTranslations('validation');
  const [v, setV] = useState<Values>({
    name: kitchen?.name ?? '',
    latitude: kitchen ? String(kitchen.latitude) : '',
    longitude: kitchen ? String(kitchen.longitude) : '',
    altitudeM: kitchen ? String(kitchen.altitudeM) : '0',
    timeZone: kitchen?.timeZone ?? 'UTC',
    locale: kitchen?.locale === 'fr' ? 'fr' : 'en',
    clearness: (kitchen?.clearness?.values ?? []).map(String),
  });
  const [clearnessDefault, setClearnessDefault] = useState(kitchen?.clearness?.isDefault ?? true);
  const { busy, fields, status, submit } = useFormSubmit();
  const set = (k: Exclude<keyof Values, 'clearness'>) => (e: React.ChangeEvent<HTMLInputElement | HTMLSelectElement>) => setV({ ...v, [k]: e.target.value });
  const setMonth = (m: number) => (e: React.ChangeEvent<HTMLInputElement>) => {
    setClearnessDefault(false);
    setV({ ...v, clearness: v.clearness.map((x, i) => (i === m ? e.target.value : x)) });
  };
  const months = t.raw('clearness.months') as string[];

  async function onSubmit(e: React.FormEvent) {
    e.preventDefault();
    const { clearness, ...rest } = v;
    const num = (s: string) => (s.trim() === '' ? NaN : Number(s.replace(',', '.')));
    const body = {
      ...rest,
      latitude: num(v.latitude),
      longitude: num(v.longitude),
      altitudeM: num(v.altitudeM),
      // Only an edit sends the monthly values; unchanged defaults stay defaults (null).
      ...(kitchen && clearness.length === 12 ? { clearness: clearnessDefault ? null : clearness.map(num) } : {}),
    };
    const labels: Record<string, string> = { name: t('name'), latitude: t('latitude'), longitude: t('longitude'), altitudeM: t('altitude'), timeZone: t('timeZone'), locale: t('locale'), clearness: t('clearness.title') };
    await submit<KitchenSummary>({
      schema: kitchen ? updateKitchenSchema : createKitchenSchema,
      body,
      path: kitchen ? `/api/v1/kitchens/${kitchen.id}` : '/api/v1/kitchens',
      method: kitchen ? 'PATCH' : 'POST',
      success: kitchen ? tc('saved') : t('created'),
      describe: ([k, m]) => (k === 'clearness' && typeof m === 'number' ? `${labels.clearness}, ${months[m] ?? tv('month', { n: m + 1 })}` : typeof k === 'string' ? (labels[k] ?? null) : null),
      onOk: (data) => {
        onSaved?.(data);
        if (data.clearness) {
          setV((cur) => ({ ...cur, clearness: data.clearness!.values.map(String) }));
          setClearnessDefault(data.clearness.isDefault);
        }
      },
    });
  }

  return (
    <form onSubmit={onSubmit} noValidate className="card max-w-xl">
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
      {kitchen && v.clearness.length === 12 && (
        <fieldset className="mb-4">
          <legend className="label">{t('clearness.title')}</legend>
          <p className="mb-2 text-sm text-clay-700">{t('clearness.intro')}</p>
          <div className="grid grid-cols-3 gap-x-3 sm:grid-cols-6">
            {v.clearness.map((x, m) => (
              <Field key={m} label={months[m] ?? String(m + 1)} inputMode="decimal" value={x} onChange={setMonth(m)} error={fields[`clearness.${m}`]} />
            ))}
          </div>
          {fields.clearness && <p className="field-error">{fields.clearness}</p>}
          <p className="text-sm text-clay-700">
            {t('clearness.default')}{' '}
            {!clearnessDefault && (
              <button type="button" className="underline" onClick={() => setClearnessDefault(true)}>
                {t('clearness.reset')}
              </button>
            )}
          </p>
        </fieldset>
      )}
      <button className="btn-primary" disabled={busy}>
        {busy ? tc('loading') : tc('save')}
      </button>
      <Status message={status?.msg ?? null} tone={status?.tone} />
    </form>
  );
}
