'use client';

import { useFormatter, useTranslations } from 'next-intl';
import { useCallback, useMemo, useRef, useState } from 'react';
import { apiFetch } from '@/lib/client/api';
import type { AsJson } from '@/lib/client/as-json';
import type { describeDish } from '@/lib/dishes';
import { createDishSchema, updateDishSchema } from '@/lib/validations/dishes';
import { Field, Status } from './field';
import { useFormSubmit } from './use-form-submit';

/** A dish as the API returns it (lib/dishes describeDish). */
export type DishRow = AsJson<ReturnType<typeof describeDish>>;

const METHODS = ['boil', 'simmer', 'steam', 'bake', 'fry'] as const;
const STOVES = ['lpg', 'three-stone-wood', 'improved-wood', 'charcoal', 'kerosene-pressure', 'electric-hotplate', 'induction'];
const CSV_COLUMNS = 'name,method,servings_per_batch,food_kg_per_serving,water_kg_per_serving,food_cp_j_per_kg_k,litres_per_serving,min_pot_temp_c,hold_min,safe_core_temp_c,lid_on,backup_stove,notes';
type SortKey = 'name' | 'method' | 'servingsPerBatch' | 'minPotTempC' | 'holdMin' | 'batchHeatKWh';

/** The organisation's dishes: searchable, sortable table; form; CSV import and export. The first list comes from the page. */
export function DishLibrary({ kitchenId, canEdit, initialDishes }: { kitchenId: string; canEdit: boolean; initialDishes: DishRow[] }) {
  const t = useTranslations('dishes');
  const tc = useTranslations('common');
  const format = useFormatter();
  const [dishes, setDishes] = useState<DishRow[]>(initialDishes);
  const [query, setQuery] = useState('');
  const [sort, setSort] = useState<{ key: SortKey; dir: 1 | -1 }>({ key: 'name', dir: 1 });
  const [editing, setEditing] = useState<DishRow | 'new' | null>(null);
  const { fields: importFields, status, setStatus, submit } = useFormSubmit();
  const fileRef = useRef<HTMLInputElement>(null);

  /** Reads the list again after a change (the page rendered the first one). */
  const load = useCallback(async () => {
    const r = await apiFetch<{ dishes: DishRow[] }>(`/api/v1/kitchens/${kitchenId}/dishes`);
    if (r.ok) setDishes(r.data.dishes);
    else setStatus({ msg: r.error.status === 0 ? tc('offline') : r.error.message, tone: 'error' });
  }, [kitchenId, tc, setStatus]);
  const importErrors = Object.entries(importFields);

  const rows = useMemo(() => {
    const q = query.trim().toLowerCase();
    return dishes
      .filter((d) => !q || d.name.toLowerCase().includes(q) || d.method.includes(q))
      .sort((a, b) => {
        const x = a[sort.key];
        const y = b[sort.key];
        return (typeof x === 'number' && typeof y === 'number' ? x - y : String(x).localeCompare(String(y))) * sort.dir;
      });
  }, [dishes, query, sort]);

  async function onImport(file: File) {
    const text = await file.text();
    await submit<{ created?: number; updated?: number }>({
      send: () => apiFetch(`/api/v1/kitchens/${kitchenId}/dishes/import`, { method: 'POST', raw: { body: text, contentType: 'text/csv' } }),
      onOk: async (body) => {
        setStatus({ msg: t('imported', { created: body.created ?? 0, updated: body.updated ?? 0 }), tone: 'info' });
        await load();
      },
    });
    if (fileRef.current) fileRef.current.value = '';
  }

  const header = (key: SortKey, label: string) => (
    <th scope="col" aria-sort={sort.key === key ? (sort.dir === 1 ? 'ascending' : 'descending') : 'none'} className="px-2 py-2">
      <button type="button" className="font-semibold underline-offset-2 hover:underline" onClick={() => setSort((s) => ({ key, dir: s.key === key ? (-s.dir as 1 | -1) : 1 }))} aria-label={t('sortBy', { column: label })}>
        {label} {sort.key === key ? (sort.dir === 1 ? '▲' : '▼') : ''}
      </button>
    </th>
  );

  return (
    <div className="flex flex-col gap-4">
      <div className="flex flex-wrap items-center justify-between gap-3">
        <div>
          <h1 className="text-2xl font-bold">{t('title')}</h1>
          <p className="text-sm text-clay-700">{t('intro')}</p>
        </div>
        <div className="flex flex-wrap gap-2">
          <a className="btn-quiet" href={`/api/v1/kitchens/${kitchenId}/dishes/export`} download="dishes.csv">{t('export')}</a>
          {canEdit && (
            <>
              <label className="btn-quiet cursor-pointer">
                {t('import')}
                <input ref={fileRef} type="file" accept=".csv,text/csv" className="sr-only" onChange={(e) => e.target.files?.[0] && onImport(e.target.files[0])} />
              </label>
              <button type="button" className="btn-primary" onClick={() => setEditing('new')}>{t('add')}</button>
            </>
          )}
        </div>
      </div>
      {canEdit && <p className="break-all text-xs text-clay-700">{t('importHint', { columns: CSV_COLUMNS })}</p>}
      <Status message={status?.msg ?? null} tone={status?.tone} />
      {importErrors.length > 0 && (
        <ul className="card list-disc pl-8 text-sm text-ember-800">
          {importErrors.map(([k, v]) => (
            <li key={k}><span className="font-semibold">{k}</span>: {v}</li>
          ))}
        </ul>
      )}
      {editing && (
        <DishForm
          key={editing === 'new' ? 'new' : editing.id}
          kitchenId={kitchenId}
          dish={editing === 'new' ? null : editing}
          onCancel={() => setEditing(null)}
          onSaved={async () => {
            setEditing(null);
            setStatus({ msg: t('saved'), tone: 'info' });
            await load();
          }}
        />
      )}
      <label className="flex max-w-md flex-col gap-1">
        <span className="label">{t('search')}</span>
        <input type="search" className="field" value={query} onChange={(e) => setQuery(e.target.value)} />
      </label>
      {dishes.length === 0 && <p className="card">{t('empty')}</p>}
      {dishes.length > 0 && rows.length === 0 && <p className="card">{t('noMatch')}</p>}
      {rows.length > 0 && (
        <div className="card relative overflow-x-auto p-0">
          <table className="w-full text-left text-sm">
            <thead className="bg-clay-100">
              <tr>
                {header('name', t('name'))}
                {header('method', t('method'))}
                {header('servingsPerBatch', t('servingsPerBatch'))}
                {header('minPotTempC', t('minPot'))}
                {header('holdMin', t('hold'))}
                <th scope="col" className="px-2 py-2">{t('core')}</th>
                {header('batchHeatKWh', t('heat'))}
                {canEdit && <th scope="col" className="px-2 py-2"><span className="sr-only">{t('edit')}</span></th>}
              </tr>
            </thead>
            <tbody>
              {rows.map((d) => (
                <tr key={d.id} className="border-t border-clay-100">
                  <th scope="row" className="px-2 py-2 font-semibold">{d.name}</th>
                  <td className="px-2 py-2">{t(`methods.${d.method}`)}</td>
                  <td className="px-2 py-2">{format.number(d.servingsPerBatch)}</td>
                  <td className="px-2 py-2">{format.number(d.minPotTempC)} °C</td>
                  <td className="px-2 py-2">{format.number(d.holdMin)} min</td>
                  <td className="px-2 py-2">{format.number(d.safeCoreTempC)} °C</td>
                  <td className="px-2 py-2" title={t('heatHint')}>
                    {format.number(d.heatUpKWh, { maximumFractionDigits: 1 })} / {format.number(d.batchHeatKWh, { maximumFractionDigits: 1 })} kWh
                  </td>
                  {canEdit && (
                    <td className="px-2 py-2">
                      <button type="button" className="text-tide-700 underline" onClick={() => setEditing(d)}>{t('edit')}</button>
                    </td>
                  )}
                </tr>
              ))}
            </tbody>
          </table>
        </div>
      )}
    </div>
  );
}

const DISH_LABELS: Record<string, string> = {
  name: 'name', method: 'method', servingsPerBatch: 'servingsPerBatch', foodKgPerServing: 'foodKg', waterKgPerServing: 'waterKg', foodCpJPerKgK: 'cp',
  litresPerServing: 'litres', minPotTempC: 'minPot', holdMin: 'hold', safeCoreTempC: 'core', lidOn: 'lid', backupStove: 'backupStove', notes: 'notes',
};

function DishForm({ kitchenId, dish, onSaved, onCancel }: { kitchenId: string; dish: DishRow | null; onSaved: () => void | Promise<void>; onCancel: () => void }) {
  const t = useTranslations('dishes');
  const tc = useTranslations('common');
  const init = dish ?? { name: '', method: 'boil', servingsPerBatch: 100, foodKgPerServing: 0.1, waterKgPerServing: 0.2, foodCpJPerKgK: 3500, litresPerServing: 0.35, minPotTempC: 90, holdMin: 20, safeCoreTempC: 74, lidOn: true, backupStove: 'lpg', notes: '' };
  const [v, setV] = useState<Record<string, string>>(Object.fromEntries(Object.entries(init).map(([k, x]) => [k, String(x ?? '')])));
  const { busy, fields, status, submit } = useFormSubmit();
  const num = (k: string) => {
    const s = (v[k] ?? '').trim();
    return s === '' ? NaN : Number(s.replace(',', '.'));
  };
  const set = (k: string) => (e: React.ChangeEvent<HTMLInputElement | HTMLSelectElement>) => setV({ ...v, [k]: e.target.value });

  async function onSubmit(e: React.FormEvent) {
    e.preventDefault();
    const body = {
      name: v.name, method: v.method, servingsPerBatch: num('servingsPerBatch'), foodKgPerServing: num('foodKgPerServing'), waterKgPerServing: num('waterKgPerServing'),
      foodCpJPerKgK: num('foodCpJPerKgK'), litresPerServing: num('litresPerServing'), minPotTempC: num('minPotTempC'), holdMin: num('holdMin'), safeCoreTempC: num('safeCoreTempC'),
      lidOn: v.lidOn === 'true', backupStove: v.backupStove, notes: v.notes || null,
    };
    await submit({
      schema: dish ? updateDishSchema : createDishSchema,
      body,
      path: dish ? `/api/v1/kitchens/${kitchenId}/dishes/${dish.id}` : `/api/v1/kitchens/${kitchenId}/dishes`,
      method: dish ? 'PATCH' : 'POST',
      describe: ([k]) => (typeof k === 'string' && DISH_LABELS[k] ? t(DISH_LABELS[k] as 'name') : null),
      onOk: onSaved,
    });
  }
  const f = (k: string, label: string, mode: 'decimal' | 'numeric' = 'decimal') => <Field label={label} inputMode={mode} value={v[k] ?? ''} onChange={set(k)} error={fields[k]} />;
  return (
    <form onSubmit={onSubmit} noValidate className="card">
      <h2 className="mb-3 text-lg font-bold">{dish ? dish.name : t('add')}</h2>
      <div className="grid gap-x-4 sm:grid-cols-3">
        <Field label={t('name')} value={v.name ?? ''} onChange={set('name')} error={fields.name} />
        <div className="mb-4">
          <label className="label" htmlFor="dish-method">{t('method')}</label>
          <select id="dish-method" className="field" value={v.method} onChange={set('method')}>
            {METHODS.map((m) => <option key={m} value={m}>{t(`methods.${m}`)}</option>)}
          </select>
        </div>
        {f('servingsPerBatch', t('servingsPerBatch'), 'numeric')}
        {f('foodKgPerServing', t('foodKg'))}
        {f('waterKgPerServing', t('waterKg'))}
        {f('foodCpJPerKgK', t('cp'))}
        {f('litresPerServing', t('litres'))}
        {f('minPotTempC', t('minPot'))}
        {f('holdMin', t('hold'))}
        {f('safeCoreTempC', t('core'))}
        <div className="mb-4">
          <label className="label" htmlFor="dish-lid">{t('lid')}</label>
          <select id="dish-lid" className="field" value={v.lidOn} onChange={set('lidOn')}>
            <option value="true">{t('yes')}</option>
            <option value="false">{t('no')}</option>
          </select>
        </div>
        <div className="mb-4">
          <label className="label" htmlFor="dish-stove">{t('backupStove')}</label>
          <select id="dish-stove" className="field" value={v.backupStove} onChange={set('backupStove')}>
            {STOVES.map((s) => <option key={s} value={s}>{s}</option>)}
          </select>
          {fields.backupStove && <p className="field-error">{fields.backupStove}</p>}
        </div>
      </div>
      <Field label={t('notes')} value={v.notes ?? ''} onChange={set('notes')} error={fields.notes} />
      <div className="flex gap-2">
        <button className="btn-primary" disabled={busy}>{busy ? tc('loading') : t('save')}</button>
        <button type="button" className="btn-quiet" onClick={onCancel}>{tc('cancel')}</button>
      </div>
      <Status message={status?.msg ?? null} tone={status?.tone} />
    </form>
  );
}
