'use client';

import { useTranslations } from 'next-intl';
import { useRouter } from 'next/navigation';
import { useId, useState } from 'react';
import { createCookerSchema, updateCookerSchema } from '@/lib/validations/cookers';
import { Field, Status } from './field';
import { useFormSubmit } from './use-form-submit';

/** A storage medium as GET /api/v1/kitchens/{kitchenId}/media lists it. */
export interface Medium {
  id: string;
  name: string;
  kind: string;
  smokePointC: number | null;
  recommendedMaxC: number | null;
}

type PotState = { id: string; name: string; volumeL: string; massKg: string; contactAreaM2: string; lidAreaM2: string; lidUWPerM2K: string };

export interface CookerFormValues {
  name: string;
  kind: string;
  apertureM2: string;
  tracking: string;
  tiltDeg: string;
  surfaceAzimuthDeg: string;
  collectorModel: 'iso9806' | 'lumped';
  eta0: string;
  a1: string;
  a2: string;
  uLossWPerK: string;
  mediumId: string;
  storeMassKg: string;
  storeUaWPerK: string;
  storeNodes: string;
  maxSafeTempC: string;
  minUsefulTempC: string;
  pots: PotState[];
}

const EMPTY: CookerFormValues = {
  name: '', kind: 'dish', apertureM2: '', tracking: 'two-axis', tiltDeg: '0', surfaceAzimuthDeg: '180', collectorModel: 'iso9806',
  eta0: '0.6', a1: '0.6', a2: '0.002', uLossWPerK: '0', mediumId: 'sunflower-oil', storeMassKg: '', storeUaWPerK: '1.5', storeNodes: '1',
  maxSafeTempC: '190', minUsefulTempC: '110',
  pots: [{ id: 'pot-1', name: 'Pot 1', volumeL: '40', massKg: '4.6', contactAreaM2: '0.28', lidAreaM2: '0.25', lidUWPerM2K: '6' }],
};

/** Turns a stored cooker into form values (all strings, so partial typing never loses input). */
export function cookerToForm(c: Record<string, unknown> & { pots: { id: string; name: string; volumeL: number; massKg: number; coupling: { kind: string; contactAreaM2?: number; uaWPerK?: number }; lidAreaM2: number; lidUWPerM2K: number }[] }): CookerFormValues {
  const s = (k: string) => String(c[k] ?? '');
  return {
    name: s('name'), kind: s('kind'), apertureM2: s('apertureM2'), tracking: s('tracking'), tiltDeg: s('tiltDeg'), surfaceAzimuthDeg: s('surfaceAzimuthDeg'),
    collectorModel: s('collectorModel') === 'lumped' ? 'lumped' : 'iso9806', eta0: s('eta0'), a1: s('a1'), a2: s('a2'), uLossWPerK: s('uLossWPerK'),
    mediumId: s('mediumId') === 'custom' ? s('customMediumId') : s('mediumId'), storeMassKg: s('storeMassKg'), storeUaWPerK: s('storeUaWPerK'), storeNodes: s('storeNodes'), maxSafeTempC: s('maxSafeTempC'), minUsefulTempC: s('minUsefulTempC'),
    pots: c.pots.map((p) => ({ id: p.id, name: p.name, volumeL: String(p.volumeL), massKg: String(p.massKg), contactAreaM2: String(p.coupling.contactAreaM2 ?? 0.25), lidAreaM2: String(p.lidAreaM2), lidUWPerM2K: String(p.lidUWPerM2K) })),
  };
}

const n = (v: string) => (v.trim() === '' ? NaN : Number(v.replace(',', '.')));

/** The label key (cookers.form.*, or cookers.* when prefixed with "cookers.") of each field the schema checks. */
const COOKER_LABELS: Record<string, string> = {
  name: 'name', kind: 'cookers.kind', apertureM2: 'cookers.aperture', tracking: 'tracking', tiltDeg: 'tilt', surfaceAzimuthDeg: 'azimuth', collectorModel: 'model',
  eta0: 'eta0', a1: 'a1', a2: 'a2', uLossWPerK: 'uLoss', mediumId: 'cookers.medium', customMediumId: 'cookers.medium', storeMassKg: 'cookers.storeMass',
  storeUaWPerK: 'storeUa', storeNodes: 'nodes', maxSafeTempC: 'maxSafe', minUsefulTempC: 'minUseful', pots: 'potsLegend',
};
const POT_LABELS: Record<string, string> = { name: 'potName', volumeL: 'volume', massKg: 'potMass', coupling: 'contact', lidAreaM2: 'lidArea', lidUWPerM2K: 'lidU' };

function Select({ label, hint, value, onChange, options, error }: { label: string; hint?: string; value: string; onChange: (v: string) => void; options: [string, string][]; error?: string }) {
  const id = useId();
  return (
    <div className="mb-4">
      <label htmlFor={id} className="label">{label}</label>
      <select id={id} className="field" value={value} onChange={(e) => onChange(e.target.value)} aria-describedby={hint ? `${id}-h` : undefined}>
        {options.map(([v, l]) => (
          <option key={v} value={v}>{l}</option>
        ))}
      </select>
      {hint && <p id={`${id}-h`} className="mt-1 text-sm text-clay-700">{hint}</p>}
      {error && <p className="field-error">{error}</p>}
    </div>
  );
}

/** Register or edit a cooker: collector, store and pots, each number with its unit and what it means. */
export function CookerForm({ kitchenId, cookerId, initial, media }: { kitchenId: string; cookerId?: string; initial?: CookerFormValues; media: Medium[] }) {
  const t = useTranslations('cookers');
  const tf = useTranslations('cookers.form');
  const tc = useTranslations('common');
  const tv = useTranslations('validation');
  const router = useRouter();
  const [v, setV] = useState<CookerFormValues>(initial ?? EMPTY);
  const { busy, fields, status, submit } = useFormSubmit();
  const label = (key: string | undefined) => (key === undefined ? null : key.startsWith('cookers.') ? t(key.slice('cookers.'.length) as 'kind') : tf(key as 'name'));

  const set = (k: keyof CookerFormValues) => (e: React.ChangeEvent<HTMLInputElement>) => setV({ ...v, [k]: e.target.value });
  const setPot = (i: number, k: keyof PotState, value: string) => setV({ ...v, pots: v.pots.map((p, j) => (j === i ? { ...p, [k]: value } : p)) });
  const medium = media.find((m) => m.id === v.mediumId);

  async function onSubmit(e: React.FormEvent) {
    e.preventDefault();
    const body = {
      name: v.name, kind: v.kind, apertureM2: n(v.apertureM2), tracking: v.tracking, tiltDeg: n(v.tiltDeg), surfaceAzimuthDeg: n(v.surfaceAzimuthDeg),
      collectorModel: v.collectorModel, eta0: n(v.eta0), a1: v.collectorModel === 'iso9806' ? n(v.a1) : 0, a2: v.collectorModel === 'iso9806' ? n(v.a2) : 0,
      uLossWPerK: v.collectorModel === 'lumped' ? n(v.uLossWPerK) : 0,
      ...(medium?.kind === 'custom' ? { mediumId: 'custom', customMediumId: v.mediumId } : { mediumId: v.mediumId }),
      storeMassKg: n(v.storeMassKg), storeUaWPerK: n(v.storeUaWPerK), storeNodes: n(v.storeNodes), maxSafeTempC: n(v.maxSafeTempC), minUsefulTempC: n(v.minUsefulTempC),
      pots: v.pots.map((p) => ({ id: p.id, name: p.name, volumeL: n(p.volumeL), massKg: n(p.massKg), cpJPerKgK: 900, coupling: { kind: 'natural-convection', contactAreaM2: n(p.contactAreaM2) }, lidAreaM2: n(p.lidAreaM2), lidUWPerM2K: n(p.lidUWPerM2K) })),
    };
    await submit<{ id: string }>({
      schema: cookerId ? updateCookerSchema : createCookerSchema,
      body,
      path: cookerId ? `/api/v1/kitchens/${kitchenId}/cookers/${cookerId}` : `/api/v1/kitchens/${kitchenId}/cookers`,
      method: cookerId ? 'PATCH' : 'POST',
      success: cookerId ? tf('saved') : tf('created'),
      describe: ([k, i, f]) => {
        if (k === 'pots' && typeof i === 'number') return [tv('pot', { n: i + 1 }), label(typeof f === 'string' ? POT_LABELS[f] : undefined)].filter(Boolean).join(', ');
        return label(typeof k === 'string' ? COOKER_LABELS[k] : undefined);
      },
      onOk: (data) => {
        if (!cookerId) router.push(`/kitchens/${kitchenId}/cookers/${data.id}`);
        else router.refresh();
      },
    });
  }

  const numField = (k: keyof CookerFormValues, label: string, hint?: string) => (
    <Field label={label} hint={hint} inputMode="decimal" value={v[k] as string} onChange={set(k)} error={fields[k]} />
  );

  return (
    <form onSubmit={onSubmit} noValidate className="flex max-w-3xl flex-col gap-4">
      <fieldset className="card">
        <legend className="px-1 text-lg font-bold">{tf('general')}</legend>
        <Field label={tf('name')} hint={tf('nameHint')} value={v.name} onChange={set('name')} error={fields.name} required />
        <Select label={t('kind')} value={v.kind} onChange={(kind) => setV({ ...v, kind })} options={(['dish', 'trough', 'box', 'evacuated-tube'] as const).map((k) => [k, t(`kinds.${k}`)])} error={fields.kind} />
      </fieldset>
      <fieldset className="card">
        <legend className="px-1 text-lg font-bold">{tf('collector')}</legend>
        {numField('apertureM2', `${t('aperture')} (m²)`, tf('apertureHint'))}
        <Select label={tf('tracking')} hint={tf('trackingHint')} value={v.tracking} onChange={(tracking) => setV({ ...v, tracking })} options={(['fixed', 'one-axis', 'two-axis'] as const).map((k) => [k, tf(`trackingModes.${k}`)])} />
        {v.tracking === 'fixed' && (
          <div className="grid gap-x-4 sm:grid-cols-2">
            {numField('tiltDeg', tf('tilt'), tf('tiltHint'))}
            {numField('surfaceAzimuthDeg', tf('azimuth'), tf('azimuthHint'))}
          </div>
        )}
        <Select label={tf('model')} value={v.collectorModel} onChange={(m) => setV({ ...v, collectorModel: m as 'iso9806' | 'lumped' })} options={[['iso9806', tf('models.iso9806')], ['lumped', tf('models.lumped')]]} />
        {numField('eta0', tf('eta0'), tf('eta0Hint'))}
        {v.collectorModel === 'iso9806' ? (
          <div className="grid gap-x-4 sm:grid-cols-2">
            {numField('a1', tf('a1'), tf('a1Hint'))}
            {numField('a2', tf('a2'), tf('a2Hint'))}
          </div>
        ) : (
          numField('uLossWPerK', tf('uLoss'), tf('uLossHint'))
        )}
      </fieldset>
      <fieldset className="card">
        <legend className="px-1 text-lg font-bold">{tf('store')}</legend>
        <Select
          label={t('medium')}
          hint={tf('mediumHint')}
          value={v.mediumId}
          onChange={(mediumId) => setV({ ...v, mediumId })}
          options={(media.length ? media : [{ id: v.mediumId, name: v.mediumId }]).map((m) => [m.id, m.name])}
          error={fields.mediumId ?? fields.customMediumId}
        />
        {medium?.recommendedMaxC != null && medium.smokePointC != null && (
          <p className="-mt-2 mb-4 text-sm text-ember-800">{tf('recommended', { max: medium.recommendedMaxC, smoke: medium.smokePointC })}</p>
        )}
        <div className="grid gap-x-4 sm:grid-cols-2">
          {numField('storeMassKg', `${t('storeMass')} (kg)`, tf('storeMassHint'))}
          {numField('storeUaWPerK', tf('storeUa'), tf('storeUaHint'))}
          {numField('maxSafeTempC', tf('maxSafe'), tf('maxSafeHint'))}
          {numField('minUsefulTempC', tf('minUseful'), tf('minUsefulHint'))}
        </div>
        {numField('storeNodes', tf('nodes'), tf('nodesHint'))}
      </fieldset>
      <fieldset className="card">
        <legend className="px-1 text-lg font-bold">{tf('potsLegend')}</legend>
        {v.pots.map((p, i) => (
          <div key={p.id} className="mb-4 border-b border-clay-100 pb-2">
            <div className="grid gap-x-4 sm:grid-cols-3">
              <Field label={tf('potName')} value={p.name} onChange={(e) => setPot(i, 'name', e.target.value)} error={fields[`pots.${i}.name`]} />
              <Field label={tf('volume')} inputMode="decimal" value={p.volumeL} onChange={(e) => setPot(i, 'volumeL', e.target.value)} error={fields[`pots.${i}.volumeL`]} />
              <Field label={tf('potMass')} inputMode="decimal" value={p.massKg} onChange={(e) => setPot(i, 'massKg', e.target.value)} error={fields[`pots.${i}.massKg`]} />
              <Field label={tf('contact')} inputMode="decimal" value={p.contactAreaM2} onChange={(e) => setPot(i, 'contactAreaM2', e.target.value)} error={fields[`pots.${i}.coupling.contactAreaM2`]} />
              <Field label={tf('lidArea')} inputMode="decimal" value={p.lidAreaM2} onChange={(e) => setPot(i, 'lidAreaM2', e.target.value)} error={fields[`pots.${i}.lidAreaM2`]} />
              <Field label={tf('lidU')} inputMode="decimal" value={p.lidUWPerM2K} onChange={(e) => setPot(i, 'lidUWPerM2K', e.target.value)} error={fields[`pots.${i}.lidUWPerM2K`]} />
            </div>
            {v.pots.length > 1 && (
              <button type="button" className="btn-quiet" onClick={() => setV({ ...v, pots: v.pots.filter((_, j) => j !== i) })}>
                {tf('removePot')}
              </button>
            )}
          </div>
        ))}
        {fields.pots && <p className="field-error">{fields.pots}</p>}
        <button
          type="button"
          className="btn-quiet"
          onClick={() => setV({ ...v, pots: [...v.pots, { id: `pot-${Date.now().toString(36)}`, name: `Pot ${v.pots.length + 1}`, volumeL: '40', massKg: '4.6', contactAreaM2: '0.28', lidAreaM2: '0.25', lidUWPerM2K: '6' }] })}
        >
          {tf('addPot')}
        </button>
      </fieldset>
      <div>
        <button className="btn-primary" disabled={busy}>{busy ? tc('loading') : tf('save')}</button>
        <Status message={status?.msg ?? null} tone={status?.tone} />
      </div>
    </form>
  );
}
