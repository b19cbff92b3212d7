'use client';

import { useTranslations } from 'next-intl';
import { useEffect, useState } from 'react';
import { apiFetch } from '@/lib/client/api';
import { Field, Status } from './field';

interface Stove { id: string; name: string; fuelId: string; efficiency: number; tier: number }
interface Planning { shiftStart: string; shiftEnd: string; turnaroundMin: number; currency: string; fuels: { stoveId: string; efficiency?: number; price?: number }[] }

/** Shift hours, turnaround, currency, and the backup stoves on hand with measured efficiency and local price. */
export function PlanningSettings({ kitchenId }: { kitchenId: string }) {
  const t = useTranslations('planning');
  const tc = useTranslations('common');
  const [stoves, setStoves] = useState<Stove[]>([]);
  const [v, setV] = useState<{ shiftStart: string; shiftEnd: string; turnaroundMin: string; currency: string; fuels: { stoveId: string; efficiency: string; price: string }[] } | null>(null);
  const [fields, setFields] = useState<Record<string, string>>({});
  const [status, setStatus] = useState<{ msg: string; tone: 'info' | 'error' } | null>(null);

  useEffect(() => {
    apiFetch<{ planning: Planning; stoves: Stove[] }>(`/api/v1/kitchens/${kitchenId}/planning-settings`).then((r) => {
      if (!r.ok) return setStatus({ msg: r.error.message, tone: 'error' });
      setStoves(r.data.stoves);
      const p = r.data.planning;
      setV({ shiftStart: p.shiftStart, shiftEnd: p.shiftEnd, turnaroundMin: String(p.turnaroundMin), currency: p.currency, fuels: p.fuels.map((f) => ({ stoveId: f.stoveId, efficiency: f.efficiency?.toString() ?? '', price: f.price?.toString() ?? '' })) });
    });
  }, [kitchenId]);

  if (!v) return <p aria-busy="true">{tc('loading')}</p>;

  async function submit(e: React.FormEvent) {
    e.preventDefault();
    if (!v) return;
    const body = {
      shiftStart: v.shiftStart,
      shiftEnd: v.shiftEnd,
      turnaroundMin: Number(v.turnaroundMin),
      currency: v.currency.toUpperCase(),
      fuels: v.fuels.map((f) => ({ stoveId: f.stoveId, ...(f.efficiency ? { efficiency: Number(f.efficiency) } : {}), ...(f.price ? { price: Number(f.price) } : {}) })),
    };
    const r = await apiFetch(`/api/v1/kitchens/${kitchenId}/planning-settings`, { method: 'PUT', body });
    if (r.ok) {
      setFields({});
      setStatus({ msg: t('saved'), tone: 'info' });
    } else {
      setFields(r.error.fields ?? {});
      setStatus({ msg: r.error.status === 0 ? tc('offline') : r.error.message, tone: 'error' });
    }
  }
  const setF = (i: number, k: 'stoveId' | 'efficiency' | 'price', value: string) => setV({ ...v, fuels: v.fuels.map((f, j) => (j === i ? { ...f, [k]: value } : f)) });

  return (
    <form onSubmit={submit} noValidate className="card flex max-w-3xl flex-col gap-2">
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
      <button className="btn-primary w-fit">{t('save')}</button>
      <Status message={status?.msg ?? null} tone={status?.tone} />
    </form>
  );
}
