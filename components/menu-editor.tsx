'use client';

import Link from 'next/link';
import { useTranslations } from 'next-intl';
import { useCallback, useRef, useState } from 'react';
import { apiFetch } from '@/lib/client/api';
import { copyMenuSchema, putMenuSchema } from '@/lib/validations/menus';
import { Status } from './field';
import { useFormSubmit } from './use-form-submit';

interface Line { dishId: string; servings: string; serveBy: string; earliestStart: string }
interface Batch { id: string; dishName: string; index: number; of: number; servings: number; potVolumeNeededL: number }
type StoredLine = { dishId: string; servings: number; serveBy: string; earliestStart: string | null };

/** A day's menu as the page renders it first: the answers of the menu, batches and dishes routes. */
export interface MenuDay {
  date: string;
  lines: StoredLine[];
  batches: Batch[];
  dishes: { id: string; name: string }[];
}

const toLines = (lines: StoredLine[]): Line[] => lines.map((l) => ({ dishId: l.dishId, servings: String(l.servings), serveBy: l.serveBy, earliestStart: l.earliestStart ?? '' }));
const LINE_LABELS: Record<string, 'dish' | 'servings' | 'serveBy' | 'earliest'> = { dishId: 'dish', servings: 'servings', serveBy: 'serveBy', earliestStart: 'earliest' };

/** A day's menu: dish × servings × serve-by (and earliest start), copy a previous day, batches before planning. */
export function MenuEditor({ kitchenId, initial, canEdit }: { kitchenId: string; initial: MenuDay; canEdit: boolean }) {
  const t = useTranslations('menu');
  const tc = useTranslations('common');
  const tv = useTranslations('validation');
  const [date, setDate] = useState(initial.date);
  const dishes = initial.dishes;
  const [lines, setLines] = useState<Line[] | null>(() => toLines(initial.lines));
  const [batches, setBatches] = useState<Batch[]>(initial.batches);
  const { busy, fields, setFields, status, setStatus, submit } = useFormSubmit();
  const [copyFrom, setCopyFrom] = useState('');
  const shown = useRef(initial.date);

  /** Reads a day's menu and batches (another day chosen, or after a change); a late answer for a day no longer shown is dropped. */
  const load = useCallback(
    async (day: string) => {
      shown.current = day;
      const [m, b] = await Promise.all([
        apiFetch<{ lines: StoredLine[] }>(`/api/v1/kitchens/${kitchenId}/menus/${day}`),
        apiFetch<{ batches: Batch[] }>(`/api/v1/kitchens/${kitchenId}/menus/${day}/batches`),
      ]);
      if (shown.current !== day) return;
      if (m.ok) setLines(toLines(m.data.lines));
      else setStatus({ msg: m.error.status === 0 ? tc('offline') : m.error.message, tone: 'error' });
      if (b.ok) setBatches(b.data.batches);
    },
    [kitchenId, tc, setStatus],
  );

  function changeDate(day: string) {
    if (!day || day === date) return;
    setDate(day);
    setLines(null);
    setFields({});
    setStatus(null);
    void load(day);
  }

  async function save(e: React.FormEvent) {
    e.preventDefault();
    if (!lines) return;
    const body = {
      lines: lines.map((l) => ({ dishId: l.dishId, servings: l.servings.trim() === '' ? NaN : Number(l.servings), serveBy: l.serveBy, earliestStart: l.earliestStart || null })),
    };
    await submit({
      schema: putMenuSchema,
      body,
      path: `/api/v1/kitchens/${kitchenId}/menus/${date}`,
      method: 'PUT',
      success: t('saved'),
      describe: ([k, i, f]) => (k === 'lines' && typeof i === 'number' ? [tv('line', { n: i + 1 }), ...(typeof f === 'string' && LINE_LABELS[f] ? [t(LINE_LABELS[f])] : [])].join(', ') : null),
      onOk: () => load(date),
    });
  }

  async function copy() {
    await submit({
      schema: copyMenuSchema,
      body: { fromDate: copyFrom },
      path: `/api/v1/kitchens/${kitchenId}/menus/${date}/copy`,
      describe: () => t('copyFrom'),
      onOk: () => load(date),
    });
  }

  const setLine = (i: number, k: keyof Line, value: string) => setLines((ls) => ls && ls.map((l, j) => (j === i ? { ...l, [k]: value } : l)));

  return (
    <div className="flex flex-col gap-4">
      <div className="flex flex-wrap items-end justify-between gap-3">
        <h1 className="text-2xl font-bold">{t('title')}</h1>
        <label className="flex items-center gap-2">
          <span className="label mb-0">{t('date')}</span>
          <input type="date" className="field w-auto" value={date} onChange={(e) => changeDate(e.target.value)} />
        </label>
      </div>
      {canEdit && dishes.length === 0 && <p className="card">{t('noDishes')}</p>}
      <form onSubmit={save} noValidate className="card flex flex-col gap-3">
        {!lines && <p aria-busy="true">{tc('loading')}</p>}
        {lines && lines.length === 0 && <p>{t('empty')}</p>}
        {lines?.map((l, i) => (
          <fieldset key={i} className="grid gap-2 border-b border-clay-100 pb-3 sm:grid-cols-[2fr_1fr_1fr_1fr_auto] sm:items-end">
            <legend className="sr-only">{`${t('dish')} ${i + 1}`}</legend>
            <label className="flex flex-col">
              <span className="label">{t('dish')}</span>
              <select className="field" value={l.dishId} disabled={!canEdit} onChange={(e) => setLine(i, 'dishId', e.target.value)} aria-invalid={fields[`lines.${i}.dishId`] ? true : undefined}>
                {dishes.map((d) => <option key={d.id} value={d.id}>{d.name}</option>)}
              </select>
              {fields[`lines.${i}.dishId`] && <span className="field-error">{fields[`lines.${i}.dishId`]}</span>}
            </label>
            <label className="flex flex-col">
              <span className="label">{t('servings')}</span>
              <input className="field" inputMode="numeric" value={l.servings} disabled={!canEdit} onChange={(e) => setLine(i, 'servings', e.target.value)} aria-invalid={fields[`lines.${i}.servings`] ? true : undefined} />
              {fields[`lines.${i}.servings`] && <span className="field-error">{fields[`lines.${i}.servings`]}</span>}
            </label>
            <label className="flex flex-col">
              <span className="label">{t('serveBy')}</span>
              <input className="field" type="time" value={l.serveBy} disabled={!canEdit} onChange={(e) => setLine(i, 'serveBy', e.target.value)} aria-invalid={fields[`lines.${i}.serveBy`] ? true : undefined} />
              {fields[`lines.${i}.serveBy`] && <span className="field-error">{fields[`lines.${i}.serveBy`]}</span>}
            </label>
            <label className="flex flex-col">
              <span className="label">{t('earliest')}</span>
              <input className="field" type="time" value={l.earliestStart} disabled={!canEdit} onChange={(e) => setLine(i, 'earliestStart', e.target.value)} aria-invalid={fields[`lines.${i}.earliestStart`] ? true : undefined} />
              {fields[`lines.${i}.earliestStart`] && <span className="field-error">{fields[`lines.${i}.earliestStart`]}</span>}
            </label>
            {canEdit && (
              <button type="button" className="btn-quiet" onClick={() => setLines((ls) => ls && ls.filter((_, j) => j !== i))}>{t('remove')}</button>
            )}
          </fieldset>
        ))}
        {canEdit && (
          <div className="flex flex-wrap gap-2">
            <button type="button" className="btn-quiet" disabled={!dishes.length} onClick={() => setLines((ls) => [...(ls ?? []), { dishId: dishes[0]?.id ?? '', servings: '100', serveBy: '12:30', earliestStart: '' }])}>
              {t('addLine')}
            </button>
            <button className="btn-primary" disabled={busy || !lines}>{busy ? tc('loading') : t('save')}</button>
          </div>
        )}
        <Status message={status?.msg ?? null} tone={status?.tone} />
      </form>
      {canEdit && (
        <div className="card flex flex-wrap items-end gap-2">
          <label className="flex flex-col">
            <span className="label">{t('copyFrom')}</span>
            <input type="date" className="field" value={copyFrom} onChange={(e) => setCopyFrom(e.target.value)} aria-invalid={fields.fromDate ? true : undefined} />
            {fields.fromDate && <span className="field-error">{fields.fromDate}</span>}
          </label>
          <button type="button" className="btn-quiet" disabled={!copyFrom || busy} onClick={copy}>{t('copy')}</button>
        </div>
      )}
      <section aria-labelledby="batches" className="card">
        <h2 id="batches" className="text-lg font-bold">{t('batches')}</h2>
        <p className="mb-2 text-sm text-clay-700">{t('batchesIntro')}</p>
        <ul className="grid gap-1 text-sm sm:grid-cols-2">
          {batches.map((b) => (
            <li key={b.id}>{t('batch', { dish: b.dishName, index: b.index, of: b.of, servings: b.servings, litres: b.potVolumeNeededL })}</li>
          ))}
        </ul>
        {batches.length > 0 && (
          <Link className="btn-primary mt-3" href={`/kitchens/${kitchenId}/plan?date=${date}`}>{t('plan')}</Link>
        )}
      </section>
    </div>
  );
}
