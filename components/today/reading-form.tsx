'use client';

import { useTranslations } from '../mini-intl';
import { useId, useState } from 'react';
import { fToC } from '@/lib/units';
import { usePrefs } from '../prefs';

/** Thermometer limits the server accepts [°C] (lib/validations/cooks.ts). */
const MIN_C = -20;
const MAX_C = 400;

/** Store and pot temperature from a thermometer, typed in the user's unit and sent in °C. */
export function ReadingForm({ cookerId, pots, defaultPotId, onSubmit }: { cookerId: string; pots: { id: string; name: string }[]; defaultPotId: string | null; onSubmit: (body: { cookerId: string; at: string; storeC?: number; potC?: number; potId?: string }) => Promise<void> }) {
  const t = useTranslations('today');
  const { temperatureUnit, fmtTemp } = usePrefs();
  const id = useId();
  const [store, setStore] = useState('');
  const [pot, setPot] = useState('');
  const [potId, setPotId] = useState(defaultPotId ?? '');
  const [error, setError] = useState<string | null>(null);
  const toC = (v: string) => {
    const n = Number(v.replace(',', '.'));
    return v.trim() === '' || !Number.isFinite(n) ? null : temperatureUnit === 'F' ? fToC(n) : n;
  };

  async function submit(e: React.FormEvent) {
    e.preventDefault();
    const storeC = toC(store);
    const potC = toC(pot);
    if (storeC === null && potC === null) return setError(t('readingNeedsValue'));
    if ([storeC, potC].some((v) => v !== null && (v < MIN_C || v > MAX_C))) return setError(t('readingOutOfRange', { min: fmtTemp(MIN_C), max: fmtTemp(MAX_C) }));
    setError(null);
    await onSubmit({
      cookerId,
      at: new Date().toISOString(),
      ...(storeC !== null ? { storeC: Math.round(storeC * 10) / 10 } : {}),
      ...(potC !== null ? { potC: Math.round(potC * 10) / 10, ...(potId ? { potId } : {}) } : {}),
    });
    setStore('');
    setPot('');
  }

  const unit = `°${temperatureUnit}`;
  return (
    <form onSubmit={submit} noValidate className="mt-3 flex flex-col gap-3 rounded-lg bg-clay-100 p-3" aria-labelledby={`${id}-title`}>
      <h3 id={`${id}-title`} className="text-lg font-bold">{t('readingTitle')}</h3>
      <div className="grid grid-cols-2 gap-3">
        <label className="flex flex-col text-base font-semibold">
          {t('storeField', { unit })}
          <input className="field min-h-14 text-2xl" type="number" inputMode="decimal" step="any" value={store} onChange={(e) => setStore(e.target.value)} aria-invalid={error ? true : undefined} />
        </label>
        <label className="flex flex-col text-base font-semibold">
          {t('potField', { unit })}
          <input className="field min-h-14 text-2xl" type="number" inputMode="decimal" step="any" value={pot} onChange={(e) => setPot(e.target.value)} aria-invalid={error ? true : undefined} />
        </label>
      </div>
      {pots.length > 1 && (
        <label className="flex flex-col text-base font-semibold">
          {t('potChoice')}
          <select className="field min-h-12" value={potId} onChange={(e) => setPotId(e.target.value)}>
            <option value="">{t('noPot')}</option>
            {pots.map((p) => (
              <option key={p.id} value={p.id}>{p.name}</option>
            ))}
          </select>
        </label>
      )}
      {error && <p role="alert" className="font-semibold text-ember-800">{error}</p>}
      <button type="submit" className="btn-primary min-h-14 text-lg">{t('saveReading')}</button>
    </form>
  );
}
