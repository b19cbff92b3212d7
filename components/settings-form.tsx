'use client';

import { useTranslations } from 'next-intl';
import { useRouter } from 'next/navigation';
import { useState } from 'react';
import { formatTemperature } from '@/lib/units';
import { updateMeSchema } from '@/lib/validations/users';
import { Field, Status } from './field';
import { useFormSubmit } from './use-form-submit';

/** The user's name, language and temperature unit. */
export function SettingsForm({ initial }: { initial: { name: string; locale: 'en' | 'fr'; temperatureUnit: 'C' | 'F' } }) {
  const t = useTranslations('settings');
  const tc = useTranslations('common');
  const router = useRouter();
  const [v, setV] = useState(initial);
  const { busy, fields, status, submit } = useFormSubmit();

  async function onSubmit(e: React.FormEvent) {
    e.preventDefault();
    await submit({
      schema: updateMeSchema,
      body: v,
      path: '/api/v1/me',
      method: 'PATCH',
      success: tc('saved'),
      describe: ([k]) => (k === 'name' ? t('name') : k === 'locale' ? tc('language') : k === 'temperatureUnit' ? t('temperatureUnit') : null),
      onOk: () => router.refresh(),
    });
  }

  return (
    <form onSubmit={onSubmit} noValidate className="card max-w-xl">
      <Field label={t('name')} value={v.name} onChange={(e) => setV({ ...v, name: e.target.value })} error={fields.name} />
      <div className="mb-4">
        <label htmlFor="settings-locale" className="label">{tc('language')}</label>
        <select id="settings-locale" className="field" value={v.locale} onChange={(e) => setV({ ...v, locale: e.target.value as 'en' | 'fr' })}>
          <option value="en">English</option>
          <option value="fr">Français</option>
        </select>
      </div>
      <fieldset className="mb-4">
        <legend className="label">{t('temperatureUnit')}</legend>
        {(['C', 'F'] as const).map((u) => (
          <label key={u} className="flex min-h-11 items-center gap-2">
            <input type="radio" name="unit" value={u} checked={v.temperatureUnit === u} onChange={() => setV({ ...v, temperatureUnit: u })} />
            {u === 'C' ? t('celsius') : t('fahrenheit')}
          </label>
        ))}
        <p className="text-sm text-clay-700">{t('sample', { value: formatTemperature(180, v.temperatureUnit, v.locale) })}</p>
      </fieldset>
      <button className="btn-primary" disabled={busy}>{busy ? tc('loading') : tc('save')}</button>
      <Status message={status?.msg ?? null} tone={status?.tone} />
    </form>
  );
}
