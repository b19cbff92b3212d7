'use client';

import dynamic from 'next/dynamic';
import Link from 'next/link';
import { Chart as ChartJS, CategoryScale, Legend, LinearScale, LineElement, PointElement, Tooltip } from 'chart.js';
import { useFormatter, useTranslations } from 'next-intl';
import { useCallback, useEffect, useMemo, useState } from 'react';
import { Line } from 'react-chartjs-2';
import { apiFetch } from '@/lib/client/api';
import { zonedTimeToUtcMs } from '@/lib/time';
import type { SafetyNote } from '@/lib/safety/notes';
import type { CalendarSlot } from './plan-calendar';
import { Status } from './field';
import { usePrefs } from './prefs';
import { SafetyList } from './safety-list';

ChartJS.register(CategoryScale, LinearScale, PointElement, LineElement, Tooltip, Legend);

const PlanCalendar = dynamic(() => import('./plan-calendar'), { ssr: false, loading: () => <p aria-busy="true">…</p> });

interface Batch { id: string; dishName: string; index: number; of: number; servings: number; method: string; serveByMs: number; potVolumeNeededL: number }
interface Slot { batchId: string; cookerId: string; potId: string; startMs: number; readyMs: number; doneMs: number; predictedStoreTempAtStartC: number | null; fixed?: boolean }
interface CookerView { id: string; name: string; pots: { id: string; name: string; volumeL: number }[]; series: { t: number[]; storeTempC: number[]; charge: number[] }; minUsefulTempC: number }
interface FuelRow { batchId: string; stoveId: string; fuelId: string; amount: number; unit: string; cost: number | null; co2Kg: number; co2BiogenicKg: number }
export interface PlanDto {
  id: string;
  date: string;
  version: number;
  status: 'draft' | 'published' | 'superseded';
  weatherSource: string;
  publishedAt: string | null;
  batches: Batch[];
  result: { status: string; slots: Slot[]; backup: { batchId: string; reason: string; detail: string }[]; servingsOnSun: number; upperBound: number; gap: number; solveTimeMs: number; greedyServings: number };
  fuel: { currency: string; perBatch: FuelRow[]; byFuel: Record<string, { amount: number; unit: string; cost: number | null; co2Kg: number; co2BiogenicKg: number }>; total: { cost: number | null; co2Kg: number; co2BiogenicKg: number }; allOnWood: { woodKg: number }; solarShareOfHeat: number };
  cookers: CookerView[];
  safety: Record<string, SafetyNote[]>;
}

const LINE_COLOURS = ['#b4441e', '#0f6e6e', '#5c4a3a', '#7a5cc2', '#2f6fb0', '#9a6b00'];

/** The day's plan: solve, look (calendar by cooker, store chart, backup fuel), drag to adjust, publish. */
export function PlanView({ kitchenId, initialDate, timeZone, canEdit }: { kitchenId: string; initialDate: string; timeZone: string; canEdit: boolean }) {
  const t = useTranslations('plan');
  const tc = useTranslations('common');
  const tm = useTranslations('menu');
  const format = useFormatter();
  const { fmtTemp, toUnit, unitLabel } = usePrefs();
  const [date, setDate] = useState(initialDate);
  const [plans, setPlans] = useState<{ draft: PlanDto | null; published: PlanDto | null } | null>(null);
  const [show, setShow] = useState<'draft' | 'published'>('draft');
  const [busy, setBusy] = useState<'solve' | 'publish' | 'move' | null>(null);
  const [status, setStatus] = useState<{ msg: string; tone: 'info' | 'error' } | null>(null);

  const fetchPlans = useCallback(() => apiFetch<{ draft: PlanDto | null; published: PlanDto | null }>(`/api/v1/kitchens/${kitchenId}/plans?date=${date}`), [kitchenId, date]);
  const load = useCallback(async () => {
    const r = await fetchPlans();
    if (r.ok) {
      setPlans(r.data);
      setShow(r.data.draft ? 'draft' : 'published');
    } else setStatus({ msg: r.error.message || tc('offline'), tone: 'error' });
  }, [fetchPlans, tc]);
  useEffect(() => {
    let live = true;
    fetchPlans().then((r) => {
      if (!live) return;
      if (r.ok) {
        setPlans(r.data);
        setShow(r.data.draft ? 'draft' : 'published');
      } else setStatus({ msg: r.error.message || tc('offline'), tone: 'error' });
    });
    return () => {
      live = false;
    };
  }, [fetchPlans, tc]);

  const plan = plans ? (show === 'draft' ? plans.draft : plans.published) ?? plans.draft ?? plans.published : null;
  const editable = canEdit && plan?.status === 'draft';
  const clock = useCallback((ms: number) => format.dateTime(new Date(ms), { timeZone, hour: '2-digit', minute: '2-digit', hour12: false }), [format, timeZone]);
  const localMin = useCallback((ms: number) => {
    const [h, m] = clock(ms).split(':').map(Number);
    return (h ?? 0) * 60 + (m ?? 0);
  }, [clock]);

  async function solve() {
    setBusy('solve');
    setStatus({ msg: t('solving'), tone: 'info' });
    const r = await apiFetch<PlanDto>(`/api/v1/kitchens/${kitchenId}/plans`, { method: 'POST', body: { date, timeLimitS: 5 } });
    setBusy(null);
    if (r.ok) {
      setStatus(null);
      await load();
      setShow('draft');
    } else setStatus({ msg: r.error.status === 0 ? tc('offline') : r.error.message, tone: 'error' });
  }

  async function publish() {
    if (!plan) return;
    setBusy('publish');
    const r = await apiFetch<PlanDto>(`/api/v1/kitchens/${kitchenId}/plans/${plan.id}/publish`, { method: 'POST' });
    setBusy(null);
    if (r.ok) {
      setStatus({ msg: t('published', { version: r.data.version }), tone: 'info' });
      await load();
      setShow('published');
    } else setStatus({ msg: r.error.message, tone: 'error' });
  }

  const move = useCallback(
    async (batchId: string, cookerIndex: number, startMin: number, revert: () => void) => {
      if (!plan) return;
      const cooker = plan.cookers[cookerIndex];
      const slot = plan.result.slots.find((s) => s.batchId === batchId);
      const batch = plan.batches.find((b) => b.id === batchId);
      if (!cooker || !slot || !batch) return revert();
      const pot = cooker.pots.find((p) => p.id === slot.potId && cooker.id === slot.cookerId) ?? cooker.pots.find((p) => p.volumeL >= batch.potVolumeNeededL) ?? cooker.pots[0];
      const startMs = zonedTimeToUtcMs(plan.date, timeZone, Math.floor(startMin / 60), startMin % 60);
      setBusy('move');
      const r = await apiFetch<PlanDto>(`/api/v1/kitchens/${kitchenId}/plans/${plan.id}/slots/${batchId}`, { method: 'PATCH', body: { cookerId: cooker.id, potId: pot?.id ?? '', start: new Date(startMs).toISOString() } });
      setBusy(null);
      if (r.ok) {
        setPlans((p) => (p ? { ...p, draft: r.data } : p));
        setStatus({ msg: t('moved'), tone: 'info' });
      } else {
        revert();
        setStatus({ msg: t('moveRefused', { reason: r.error.message }), tone: 'error' });
      }
    },
    [plan, kitchenId, timeZone, t],
  );

  const calendarSlots: CalendarSlot[] = useMemo(() => {
    if (!plan) return [];
    return plan.result.slots.map((s) => {
      const b = plan.batches.find((x) => x.id === s.batchId);
      const ci = plan.cookers.findIndex((c) => c.id === s.cookerId);
      const pot = plan.cookers[ci]?.pots.find((p) => p.id === s.potId);
      return {
        id: s.batchId,
        title: b ? t('slot', { dish: b.dishName, index: b.index, of: b.of, servings: b.servings }) : s.batchId,
        subtitle: `${pot?.name ?? s.potId} · ${clock(s.startMs)}–${clock(s.doneMs)}`,
        cookerIndex: Math.max(0, ci),
        startMin: localMin(s.startMs),
        endMin: localMin(s.doneMs) || 24 * 60,
        method: b?.method ?? 'boil',
        warn: (plan.safety[s.batchId] ?? []).some((n) => n.level === 'danger' && n.code === 'smoke-point'),
      };
    });
  }, [plan, t, clock, localMin]);

  const chart = useMemo(() => {
    if (!plan?.cookers.length) return null;
    const ts = plan.cookers[0]!.series.t;
    return {
      labels: ts.map(clock),
      datasets: plan.cookers.map((c, i) => ({
        label: `${c.name} (${unitLabel})`,
        data: c.series.storeTempC.map(toUnit),
        borderColor: LINE_COLOURS[i % LINE_COLOURS.length],
        backgroundColor: LINE_COLOURS[i % LINE_COLOURS.length],
        borderDash: i % 2 ? [6, 3] : [],
        pointRadius: 0,
        borderWidth: 2,
      })),
    };
    // eslint-disable-next-line react-hooks/exhaustive-deps
  }, [plan, unitLabel, clock]);

  const backupServings = plan ? plan.result.backup.reduce((s, b) => s + (plan.batches.find((x) => x.id === b.batchId)?.servings ?? 0), 0) : 0;
  const money = (v: number | null) => (v === null || !plan ? '—' : format.number(v, { style: 'currency', currency: plan.fuel.currency }));

  return (
    <div className="flex flex-col gap-4">
      <div className="flex flex-wrap items-end justify-between gap-3">
        <h1 className="text-2xl font-bold">{t('title')}</h1>
        <div className="flex flex-wrap items-end gap-2">
          <label className="flex items-center gap-2">
            <span className="label mb-0">{tm('date')}</span>
            <input type="date" className="field w-auto" value={date} onChange={(e) => e.target.value && setDate(e.target.value)} />
          </label>
          {canEdit && (
            <button type="button" className="btn-primary" onClick={solve} disabled={busy !== null}>
              {plans?.draft || plans?.published ? t('resolve') : t('solve')}
            </button>
          )}
          {canEdit && plan?.status === 'draft' && (
            <button type="button" className="btn-quiet" onClick={publish} disabled={busy !== null}>{t('publish')}</button>
          )}
        </div>
      </div>
      {busy === 'solve' && <progress className="h-2 w-full accent-ember-600" aria-label={t('solving')} />}
      <Status message={status?.msg ?? null} tone={status?.tone} />
      {!plans && <p aria-busy="true">{tc('loading')}</p>}
      {plans && !plan && (
        <p className="card">
          {t('none')} <Link className="text-tide-700 underline" href={`/kitchens/${kitchenId}/menu?date=${date}`}>{t('noMenu')}</Link>
        </p>
      )}
      {plan && (
        <>
          <div className="flex flex-wrap items-center gap-2 text-sm">
            {plans?.draft && plans.published && (
              <div role="group" className="flex gap-1">
                <button type="button" className={show === 'draft' ? 'btn-primary' : 'btn-quiet'} aria-pressed={show === 'draft'} onClick={() => setShow('draft')}>{t('draft')}</button>
                <button type="button" className={show === 'published' ? 'btn-primary' : 'btn-quiet'} aria-pressed={show === 'published'} onClick={() => setShow('published')}>{t('published', { version: plans.published.version })}</button>
              </div>
            )}
            <span className="rounded-full bg-clay-100 px-3 py-1 font-semibold">
              {plan.status === 'draft' ? t('draft') : t('published', { version: plan.version })}
              {plan.publishedAt ? ` · ${t('publishedOn', { when: format.dateTime(new Date(plan.publishedAt), { dateStyle: 'medium', timeStyle: 'short', timeZone }) })}` : ''}
            </span>
            <span>{t('weather', { source: plan.weatherSource })}</span>
          </div>
          <ul className="grid gap-2 sm:grid-cols-2">
            <li className="card"><span className="block text-sm font-semibold">{t('onSun')}</span><span className="text-2xl font-bold">{t('servings', { n: format.number(plan.result.servingsOnSun) })}</span></li>
            <li className="card"><span className="block text-sm font-semibold">{t('onBackup')}</span><span className="text-2xl font-bold">{t('servings', { n: format.number(backupServings) })}</span></li>
          </ul>
          <p className="text-xs text-clay-700">
            {t('quality', { status: t(`status.${plan.result.status}` as 'status.optimal'), sun: plan.result.servingsOnSun, bound: plan.result.upperBound, gap: format.number(plan.result.gap, { style: 'percent', maximumFractionDigits: 1 }), ms: Math.round(plan.result.solveTimeMs), greedy: plan.result.greedyServings })}
          </p>
          {!editable && canEdit && <p className="text-sm">{t('readOnly')}</p>}
          <section aria-labelledby="cal" className="card">
            <h2 id="cal" className="text-lg font-bold">{t('calendar')}</h2>
            {editable && <p className="mb-2 text-sm text-clay-700">{t('calendarHint')}</p>}
            <PlanCalendar cookers={plan.cookers.map((c) => c.name)} slots={calendarSlots} editable={editable && busy === null} onMove={move} />
          </section>
          {chart && (
            <section aria-labelledby="store" className="card">
              <h2 id="store" className="text-lg font-bold">{t('storeChart')}</h2>
              <div className="relative h-64" role="img" aria-label={t('storeChart')}>
                <Line data={chart} options={{ responsive: true, maintainAspectRatio: false, animation: false, plugins: { legend: { position: 'bottom' } }, scales: { x: { ticks: { maxTicksLimit: 12 } }, y: { title: { display: true, text: unitLabel } } } }} />
              </div>
            </section>
          )}
          <section aria-labelledby="slots" className="card">
            <h2 id="slots" className="mb-2 text-lg font-bold">{t('safety')}</h2>
            <ul className="flex flex-col gap-4">
              {plan.result.slots.map((s) => {
                const b = plan.batches.find((x) => x.id === s.batchId);
                const c = plan.cookers.find((x) => x.id === s.cookerId);
                return (
                  <li key={s.batchId} className="border-t border-clay-100 pt-3">
                    <h3 className="font-bold">{b ? t('slot', { dish: b.dishName, index: b.index, of: b.of, servings: b.servings }) : s.batchId}</h3>
                    <p className="text-sm">
                      {c?.name} · {c?.pots.find((p) => p.id === s.potId)?.name} · {t('slotTimes', { start: clock(s.startMs), ready: clock(s.readyMs), done: clock(s.doneMs) })}
                      {s.predictedStoreTempAtStartC !== null ? ` · ${fmtTemp(s.predictedStoreTempAtStartC)}` : ''}
                    </p>
                    <SafetyList notes={plan.safety[s.batchId] ?? []} compact />
                  </li>
                );
              })}
            </ul>
          </section>
          <section aria-labelledby="backup" className="card">
            <h2 id="backup" className="mb-2 text-lg font-bold">{t('backup')}</h2>
            {plan.result.backup.length === 0 ? (
              <p>{t('backupEmpty')}</p>
            ) : (
              <div className="overflow-x-auto">
                <table className="w-full text-left text-sm">
                  <thead>
                    <tr>
                      <th scope="col">{tm('dish')}</th>
                      <th scope="col">{t('reason')}</th>
                      <th scope="col">{t('fuel')}</th>
                      <th scope="col">{t('amount')}</th>
                      <th scope="col">{t('cost')}</th>
                      <th scope="col">{t('co2')}</th>
                    </tr>
                  </thead>
                  <tbody>
                    {plan.result.backup.map((bk) => {
                      const b = plan.batches.find((x) => x.id === bk.batchId);
                      const f = plan.fuel.perBatch.find((x) => x.batchId === bk.batchId);
                      return (
                        <tr key={bk.batchId} className="border-t border-clay-100 align-top">
                          <th scope="row" className="py-1 pr-2">{b ? t('slot', { dish: b.dishName, index: b.index, of: b.of, servings: b.servings }) : bk.batchId}</th>
                          <td className="py-1 pr-2">{t(`reasons.${bk.reason}` as 'reasons.no-free-pot')}<br /><span className="text-xs text-clay-700">{bk.detail}</span></td>
                          <td className="py-1 pr-2">{f?.stoveId}</td>
                          <td className="py-1 pr-2">{f ? `${format.number(f.amount, { maximumFractionDigits: 1 })} ${f.unit}` : '—'}</td>
                          <td className="py-1 pr-2">{money(f?.cost ?? null)}</td>
                          <td className="py-1 pr-2">{f ? `${format.number(f.co2Kg + f.co2BiogenicKg, { maximumFractionDigits: 1 })} kg` : '—'}</td>
                        </tr>
                      );
                    })}
                  </tbody>
                  <tfoot>
                    <tr className="border-t-2 border-clay-200 font-semibold">
                      <th scope="row" colSpan={3} className="py-1">{t('totals')}</th>
                      <td className="py-1">{Object.entries(plan.fuel.byFuel).map(([id, f]) => `${format.number(f.amount, { maximumFractionDigits: 1 })} ${f.unit} ${id}`).join(', ')}</td>
                      <td className="py-1">{money(plan.fuel.total.cost)}</td>
                      <td className="py-1">{format.number(plan.fuel.total.co2Kg, { maximumFractionDigits: 1 })} kg {t('co2')}; {format.number(plan.fuel.total.co2BiogenicKg, { maximumFractionDigits: 1 })} kg {t('co2bio')}</td>
                    </tr>
                  </tfoot>
                </table>
              </div>
            )}
            <p className="mt-2 text-sm">{t('woodCompare', { wood: format.number(plan.fuel.allOnWood.woodKg, { maximumFractionDigits: 0 }), share: format.number(plan.fuel.solarShareOfHeat, { style: 'percent' }) })}</p>
          </section>
        </>
      )}
    </div>
  );
}
