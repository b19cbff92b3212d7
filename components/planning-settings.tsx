'use client';

import { useTranslations } from 'next-intl';
import { useState } from 'react';
import { apiFetch } from '@/lib/client/api';
import { planningSettingsSchema } from '@/lib/validations/plans';
import { Field, Status } from './field';
import { useFormSubmit } from './use-form-submit';

interface Stove { id: string; name: string; fuelId: string; efficiency: number; tier: number }
interface Planning { shiftStart: string; shiftEnd: string; turnaroundMin: number; currency: string; fuels: { stoveId: string; efficiency?: number; price?: number }[] }
/** The answer of GET /api/v1/kitchens/{kitchenId}/planning-settings. */
export interface PlanningSettingsData { planning: Planning; stoves: Stove[] }
type Values = { shiftStart: string; shiftEnd: string; turnaroundMin: string; currency: string; fuels: { stoveId: string; efficiency: string; price: string }[] };

const toValues = (p: Planning): Values => ({
  shiftStart: p.shiftStart,
  shiftEnd: p.shiftEnd,
  turnaroundMin: String(p.turnaroundMin),
  currency: p.currency,
  fuels: p.fuels.map((f) => ({ stoveId: f.stoveId, efficiency: f.efficiency?.toString() ?? '', price: f.price?.toString() ?? '' })),
});
const num = (s: string) => (s.trim() === '' ? NaN : Number(s.replace(',', '.')));

/** Shift hours, turnaround, currency, and the backup stoves on hand with measured efficiency and local price. */
export function PlanningSettings({ kitchenId, initial }: { kitchenId: string; initial: PlanningSettingsData }) {
  const t = useTranslations('planning');
  const tc = useTranslations('common');
  const tv = useTranslations('validation');
  const [stoves, setStoves] = useState<Stove[]>(initial.stoves);
  const [v, setV] = useState<Values>(() => toValues(initial.planning));
  const { busy, fields, status, submit } = useFormSubmit();
  const path = `/api/v1/kitchens/${kitchenId}/planning-settings`;

  async function onSubmit(e: React.FormEvent) {
    e.preventDefault();
    const body = {
      shiftStart: v.shiftStart,
      shiftEnd: v.shiftEnd,
      turnaroundMin: num(v.turnaroundMin),
      currency: v.currency.trim().toUpperCase(),
      fuels: v.fuels.map((f) => ({ stoveId: f.stoveId, ...(f.efficiency.trim() ? { efficiency: num(f.efficiency) } : {}), ...(f.price.trim() ? { price: num(f.price) } : {}) })),
    };
    await submit<PlanningSettingsData>({
      schema: planningSettingsSchema,
      body,
      path,
      method: 'PUT',
      success: t('saved'),
      formats: { shiftStart: tv('time'), shiftEnd: tv('time'), currency: tv('currency') },
      describe: (p) => {
        const [k, i, f] = p;
        if (k === 'fuels' && typeof i === 'number') return `${tv('stove', { n: i + 1 })}, ${f === 'price' ? t('priceShort') : f === 'efficiency' ? t('efficiencyShort') : t('stove')}`;
        if (k === 'fuels') return t('stoves');
        return k === 'turnaroundMin' ? t('turnaround') : typeof k === 'string' && ['shiftStart', 'shiftEnd', 'currency'].includes(k) ? t(k as 'shiftStart') : null;
      },
      // The saved settings, read back (another lead may have changed the list of stoves).
      onOk: async () => {
        const r = await apiFetch<PlanningSettingsData>(path);
        if (r.ok) {
          setStoves(r.data.stoves);
          setV(toValues(r.data.planning));
        }
      },
    });
  }
  const setF = (i: number, k: 'stoveId' | 'efficiency' | 'price', value: string) => setV({ ...v, fuels: v.fuels.map((f, j) => (j === i ? { ...f, [k]: value } : f)) });

  return (
    <form onSubmit={onSubmit} noValidate className="card flex max-w-3xl flex-col gap-2">
      <h1 className="text-2xl font-bold">{t('title')}</h1>
      <div className="grid gap-x-4 sm:grid-cols-2">
        <Field label={t('shiftStart')} type="time" value={v.shiftStart} onChange={(e) => setV({ ...v, shiftStart: e.target.value })} error={fields.shiftStart} />
        <Field label={t('shiftEnd')} type="time" value={v.shiftEnd} onChange={(e) => setV({ ...v, shiftEnd: e.target.value })} error={fields.shiftEnd} />
        <Field label={t('turnaround')} inputMode="numeric" value={v.turnaroundMin} onChange={(e) => setV({ ...v, turnaroundMin: e.target.value })} error={fields.turnaroundMin} />
        <Field label={t('currency')} value={v.currency} maxLength={3} onChange={(e) => setV({ ...v, currency: e.target.value })} error={fields.currency} />
      </div>
      <fieldset>
        <legend className="label">{t('stoves')}</legend>
        {v.fuels.map((f, i) => {
          const stove = stoves.find((s) => s.id === f.stoveId);
          return (
            <div key={i} className="grid gap-x-3 border-b border-clay-100 py-2 sm:grid-cols-[2fr_1fr_1fr_auto] sm:items-end">
              <label className="mb-4 flex flex-col">
                <span className="label">{t('stove')}</span>
                <select className="field" value={f.stoveId} onChange={(e) => setF(i, 'stoveId', e.target.value)}>
                  {stoves.map((s) => <option key={s.id} value={s.id}>{s.name} (ISO 19867 tier {s.tier})</option>)}
                </select>
              </label>
              <Field label={t('efficiency', { def: stove?.efficiency ?? '' })} inputMode="decimal" value={f.efficiency} onChange={(e) => setF(i, 'efficiency', e.target.value)} error={fields[`fuels.${i}.efficiency`]} />
              <Field label={t('price', { unit: stove?.fuelId === 'electricity' ? 'kWh' : 'kg' })} inputMode="decimal" value={f.price} onChange={(e) => setF(i, 'price', e.target.value)} error={fields[`fuels.${i}.price`]} />
              <button type="button" className="btn-quiet mb-4" disabled={v.fuels.length < 2} onClick={() => setV({ ...v, fuels: v.fuels.filter((_, j) => j !== i) })}>{t('remove')}</button>
            </div>
          );
        })}
        {fields.fuels && <p className="field-error">{fields.fuels}</p>}
        <button type="button" className="btn-quiet mt-2" onClick={() => setV({ ...v, fuels: [...v.fuels, { stoveId: 'charcoal', efficiency: '', price: '' }] })}>{t('addStove')}</button>
      </fieldset>
      <button className="btn-primary w-fit" disabled={busy}>{busy ? tc('loading') : t('save')}</button>
      <Status message={status?.msg ?? null} tone={status?.tone} />
    </form>
  );
}
