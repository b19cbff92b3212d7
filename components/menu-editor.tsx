'use client';

import Link from 'next/link';
import { useTranslations } from 'next-intl';
import { useCallback, useEffect, useState } from 'react';
import { apiFetch } from '@/lib/client/api';
import { Status } from './field';

interface Line { dishId: string; servings: string; serveBy: string; earliestStart: string }
interface Batch { id: string; dishName: string; index: number; of: number; servings: number; potVolumeNeededL: number }

/** A day's menu: dish × servings × serve-by (and earliest start), copy a previous day, batches before planning. */
export function MenuEditor({ kitchenId, initialDate, canEdit }: { kitchenId: string; initialDate: string; canEdit: boolean }) {
  const t = useTranslations('menu');
  const tc = useTranslations('common');
  const [date, setDate] = useState(initialDate);
  const [dishes, setDishes] = useState<{ id: string; name: string }[]>([]);
  const [lines, setLines] = useState<Line[] | null>(null);
  const [batches, setBatches] = useState<Batch[]>([]);
  const [fields, setFields] = useState<Record<string, string>>({});
  const [status, setStatus] = useState<{ msg: string; tone: 'info' | 'error' } | null>(null);
  const [copyFrom, setCopyFrom] = useState('');

  const fetchDay = useCallback(
    () =>
      Promise.all([
        apiFetch<{ lines: { dishId: string; servings: number; serveBy: string; earliestStart: string | null }[] }>(`/api/v1/kitchens/${kitchenId}/menus/${date}`),
        apiFetch<{ batches: Batch[] }>(`/api/v1/kitchens/${kitchenId}/menus/${date}/batches`),
      ]),
    [kitchenId, date],
  );
  const apply = useCallback(
    ([m, b]: Awaited<ReturnType<typeof fetchDay>>) => {
      if (m.ok) setLines(m.data.lines.map((l) => ({ dishId: l.dishId, servings: String(l.servings), serveBy: l.serveBy, earliestStart: l.earliestStart ?? '' })));
      else setStatus({ msg: m.error.message || tc('offline'), tone: 'error' });
      if (b.ok) setBatches(b.data.batches);
    },
    [tc],
  );
  const load = useCallback(async () => apply(await fetchDay()), [apply, fetchDay]);

  useEffect(() => {
    apiFetch<{ dishes: { id: string; name: string }[] }>(`/api/v1/kitchens/${kitchenId}/dishes`).then((r) => r.ok && setDishes(r.data.dishes));
  }, [kitchenId]);
  useEffect(() => {
    let live = true;
    fetchDay().then((r) => live && apply(r));
    return () => {
      live = false;
    };
  }, [fetchDay, apply]);

  async function save(e: React.FormEvent) {
    e.preventDefault();
    if (!lines) return;
    const body = { lines: lines.map((l) => ({ dishId: l.dishId, servings: Number(l.servings), serveBy: l.serveBy, earliestStart: l.earliestStart || null })) };
    const r = await apiFetch(`/api/v1/kitchens/${kitchenId}/menus/${date}`, { method: 'PUT', body });
    if (r.ok) {
      setFields({});
      setStatus({ msg: t('saved'), tone: 'info' });
      void load();
    } else {
      setFields(r.error.fields ?? {});
      setStatus({ msg: r.error.status === 0 ? tc('offline') : r.error.message, tone: 'error' });
    }
  }

  async function copy() {
    const r = await apiFetch(`/api/v1/kitchens/${kitchenId}/menus/${date}/copy`, { method: 'POST', body: { fromDate: copyFrom } });
    if (r.ok) void load();
    else setStatus({ msg: r.error.message, tone: 'error' });
  }

  const setLine = (i: number, k: keyof Line, value: string) => setLines((ls) => ls && ls.map((l, j) => (j === i ? { ...l, [k]: value } : l)));

  return (
    <div className="flex flex-col gap-4">
      <div className="flex flex-wrap items-end justify-between gap-3">
        <h1 className="text-2xl font-bold">{t('title')}</h1>
        <label className="flex items-center gap-2">
          <span className="label mb-0">{t('date')}</span>
          <input type="date" className="field w-auto" value={date} onChange={(e) => e.target.value && setDate(e.target.value)} />
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
              <select className="field" value={l.dishId} disabled={!canEdit} onChange={(e) => setLine(i, 'dishId', e.target.value)}>
                {dishes.map((d) => <option key={d.id} value={d.id}>{d.name}</option>)}
              </select>
              {fields[`lines.${i}.dishId`] && <span className="field-error">{fields[`lines.${i}.dishId`]}</span>}
            </label>
            <label className="flex flex-col">
              <span className="label">{t('servings')}</span>
              <input className="field" inputMode="numeric" value={l.servings} disabled={!canEdit} onChange={(e) => setLine(i, 'servings', e.target.value)} aria-invalid={!!fields[`lines.${i}.servings`]} />
              {fields[`lines.${i}.servings`] && <span className="field-error">{fields[`lines.${i}.servings`]}</span>}
            </label>
            <label className="flex flex-col">
              <span className="label">{t('serveBy')}</span>
              <input className="field" type="time" value={l.serveBy} disabled={!canEdit} onChange={(e) => setLine(i, 'serveBy', e.target.value)} />
              {fields[`lines.${i}.serveBy`] && <span className="field-error">{fields[`lines.${i}.serveBy`]}</span>}
            </label>
            <label className="flex flex-col">
              <span className="label">{t('earliest')}</span>
              <input className="field" type="time" value={l.earliestStart} disabled={!canEdit} onChange={(e) => setLine(i, 'earliestStart', e.target.value)} />
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
            <button className="btn-primary">{t('save')}</button>
          </div>
        )}
        <Status message={status?.msg ?? null} tone={status?.tone} />
      </form>
      {canEdit && (
        <div className="card flex flex-wrap items-end gap-2">
          <label className="flex flex-col">
            <span className="label">{t('copyFrom')}</span>
            <input type="date" className="field" value={copyFrom} onChange={(e) => setCopyFrom(e.target.value)} />
          </label>
          <button type="button" className="btn-quiet" disabled={!copyFrom} onClick={copy}>{t('copy')}</button>
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
