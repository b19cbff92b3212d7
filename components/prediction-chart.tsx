'use client';

import { Chart as ChartJS, CategoryScale, Filler, Legend, LinearScale, LineElement, PointElement, Tooltip } from 'chart.js';
import { useFormatter, useTranslations } from 'next-intl';
import { useEffect, useMemo, useState } from 'react';
import { Line } from 'react-chartjs-2';
import { apiFetch } from '@/lib/client/api';
import { usePrefs } from './prefs';

ChartJS.register(CategoryScale, LinearScale, PointElement, LineElement, Tooltip, Legend, Filler);

export interface Prediction {
  date: string;
  timeZone: string;
  source: 'forecast' | 'stale-forecast' | 'upload' | 'clear-sky';
  initialStoreTempC: number;
  minUsefulTempC: number;
  maxSafeTempC: number;
  boilingPointC: number;
  series: { t: number[]; storeTempC: number[]; potTempC: Record<string, (number | null)[]>; charge: number[]; gApertureWm2: number[]; tAirC: number[] };
  loads: { id: string; potId: string; reachedMs: number | null; doneMs: number | null; ok: boolean }[];
  referenceLoad: { potId: string; waterKg: number; minTempC: number } | null;
  balance: { relativeError: number };
}

/**
 * A cooker's predicted day as a chart (store and pot temperature on the left axis in the user's unit,
 * charge on the right axis in %), with a summary and an hourly table for screen readers and print.
 */
export function PredictionChart({ kitchenId, cookerId, potNames }: { kitchenId: string; cookerId: string; potNames: Record<string, string> }) {
  const t = useTranslations('cookers.prediction');
  const tc = useTranslations('common');
  const format = useFormatter();
  const { toUnit, fmtTemp, unitLabel } = usePrefs();
  const [date, setDate] = useState('');
  const [p, setP] = useState<Prediction | null>(null);
  const [error, setError] = useState<string | null>(null);
  // The request key last answered; "busy" while the chosen day differs from it.
  const [answered, setAnswered] = useState<string | null>(null);
  const busy = answered !== (date || 'default');
  // Readings of the chosen day, drawn as points against the prediction.
  const [readings, setReadings] = useState<{ date: string; list: { at: string; storeC: number | null; potC: number | null }[] } | null>(null);
  const readingsDate = p?.date ?? null;
  useEffect(() => {
    if (!readingsDate) return;
    let live = true;
    apiFetch<{ date: string; readings: { at: string; storeC: number | null; potC: number | null }[] }>(`/api/v1/kitchens/${kitchenId}/cookers/${cookerId}/readings?date=${readingsDate}`).then((r) => {
      if (live) setReadings(r.ok ? { date: r.data.date, list: r.data.readings } : null);
    });
    return () => {
      live = false;
    };
  }, [kitchenId, cookerId, readingsDate]);

  useEffect(() => {
    let live = true;
    const key = date || 'default';
    apiFetch<Prediction>(`/api/v1/kitchens/${kitchenId}/cookers/${cookerId}/prediction${date ? `?date=${date}` : ''}`).then((r) => {
      if (!live) return;
      if (r.ok) {
        setP(r.data);
        setError(null);
        setAnswered(r.data.date);
        if (!date) setDate(r.data.date);
      } else {
        setAnswered(key);
        setError(r.error.status === 0 ? tc('offline') : r.error.message);
      }
    });
    return () => {
      live = false;
    };
  }, [kitchenId, cookerId, date, tc]);

  const hhmm = (ms: number) => (p ? format.dateTime(new Date(ms), { timeZone: p.timeZone, hour: '2-digit', minute: '2-digit' }) : '');

  const data = useMemo(() => {
    if (!p) return null;
    const refPot = p.referenceLoad?.potId;
    // Each reading on the nearest point of the prediction's time axis (10-min steps).
    const measured = (key: 'storeC' | 'potC') => {
      const out: (number | null)[] = p.series.t.map(() => null);
      const t0 = p.series.t[0] ?? 0;
      const dt = (p.series.t[1] ?? t0 + 600_000) - t0;
      for (const r of readings?.date === p.date ? readings.list : []) {
        const v = r[key];
        const i = Math.round((Date.parse(r.at) - t0) / dt);
        if (v != null && i >= 0 && i < out.length) out[i] = toUnit(v);
      }
      return out;
    };
    const hasReadings = readings?.date === p.date && readings.list.length > 0;
    return {
      labels: p.series.t.map(hhmm),
      datasets: [
        { label: `${t('store')} (${unitLabel})`, data: p.series.storeTempC.map(toUnit), borderColor: '#b4441e', backgroundColor: '#b4441e', borderWidth: 3, pointRadius: 0, yAxisID: 'y' },
        ...(refPot && p.series.potTempC[refPot]
          ? [{ label: `${t('pot')} (${unitLabel})`, data: p.series.potTempC[refPot]!.map((v) => (v == null ? null : toUnit(v))), borderColor: '#0f6e6e', backgroundColor: '#0f6e6e', borderDash: [6, 4], borderWidth: 2, pointRadius: 0, yAxisID: 'y', spanGaps: false }]
          : []),
        ...(hasReadings
          ? [
              { label: `${t('measuredStore')} (${unitLabel})`, data: measured('storeC'), borderColor: '#772c14', backgroundColor: '#772c14', showLine: false, pointRadius: 4, pointStyle: 'rectRot' as const, yAxisID: 'y' },
              { label: `${t('measuredPot')} (${unitLabel})`, data: measured('potC'), borderColor: '#0b5656', backgroundColor: '#0b5656', showLine: false, pointRadius: 4, pointStyle: 'triangle' as const, yAxisID: 'y' },
            ]
          : []),
        { label: `${t('charge')} (%)`, data: p.series.charge.map((c) => Math.round(c * 100)), borderColor: '#5c4a3a', backgroundColor: 'rgba(92,74,58,0.08)', fill: true, borderDash: [2, 3], borderWidth: 1.5, pointRadius: 0, yAxisID: 'y1' },
      ],
    };
    // eslint-disable-next-line react-hooks/exhaustive-deps
  }, [p, unitLabel, readings]);

  const summary = useMemo(() => {
    if (!p) return null;
    const ref = p.loads.find((l) => l.id === 'reference');
    return {
      max: Math.max(...p.series.storeTempC),
      min: Math.min(...p.series.storeTempC),
      ready: ref?.reachedMs ?? null,
    };
  }, [p]);

  return (
    <section aria-labelledby="prediction-title" className="card flex flex-col gap-3">
      <div className="flex flex-wrap items-end justify-between gap-3">
        <h2 id="prediction-title" className="text-lg font-bold">{t('title')}</h2>
        <label className="flex items-center gap-2 text-sm">
          {t('date')}
          <input type="date" className="field w-auto" value={date} onChange={(e) => e.target.value && setDate(e.target.value)} />
        </label>
      </div>
      {busy && <p aria-busy="true" role="status">{t('loading')}</p>}
      {error && <p role="alert" className="text-ember-800">{error}</p>}
      {p && data && summary && (
        <>
          <p className="text-sm">
            <span className="font-semibold">{t('source')}:</span> {t(`sources.${p.source}`)}
          </p>
          <ul className="grid gap-2 text-sm sm:grid-cols-4">
            <li className="rounded-lg bg-clay-100 p-2"><span className="block font-semibold">{t('startTemp')}</span>{fmtTemp(p.initialStoreTempC)}</li>
            <li className="rounded-lg bg-clay-100 p-2"><span className="block font-semibold">{t('maxStore')}</span>{fmtTemp(summary.max)}</li>
            <li className="rounded-lg bg-clay-100 p-2"><span className="block font-semibold">{t('minStore')}</span>{fmtTemp(summary.min)}</li>
            <li className="rounded-lg bg-clay-100 p-2">
              <span className="block font-semibold">{summary.ready ? t('ready') : t('notReady')}</span>
              {summary.ready ? hhmm(summary.ready) : '—'}
            </li>
          </ul>
          <div className="relative h-72 w-full sm:h-96" role="img" aria-label={`${t('title')}: ${t('store')} ${fmtTemp(summary.min)}–${fmtTemp(summary.max)}`}>
            <Line
              data={data}
              options={{
                responsive: true,
                maintainAspectRatio: false,
                animation: false,
                interaction: { mode: 'index', intersect: false },
                plugins: { legend: { position: 'bottom', labels: { usePointStyle: true } } },
                scales: {
                  x: { ticks: { maxTicksLimit: 12 } },
                  y: { title: { display: true, text: unitLabel }, suggestedMin: toUnit(20) },
                  y1: { position: 'right', min: 0, max: 100, title: { display: true, text: `${t('charge')} %` }, grid: { drawOnChartArea: false } },
                },
              }}
            />
          </div>
          {readings?.date === p.date && readings.list.length > 0 && <p className="text-sm text-clay-700">{t('readingsCount', { count: readings.list.length })}</p>}
          {p.referenceLoad && (
            <p className="text-sm text-clay-700">
              {t('reference', { water: format.number(p.referenceLoad.waterKg, { maximumFractionDigits: 0 }), pot: potNames[p.referenceLoad.potId] ?? p.referenceLoad.potId, min: fmtTemp(p.referenceLoad.minTempC) })}
            </p>
          )}
          <details>
            <summary className="cursor-pointer text-sm font-semibold">{t('table')}</summary>
            <table className="mt-2 w-full text-left text-sm">
              <thead>
                <tr>
                  <th scope="col">{t('hour')}</th>
                  <th scope="col">{t('store')}</th>
                  <th scope="col">{t('charge')}</th>
                  <th scope="col">{t('irradiance')}</th>
                  <th scope="col">{t('air')}</th>
                </tr>
              </thead>
              <tbody>
                {p.series.t.map((ms, i) =>
                  i % 6 === 0 ? (
                    <tr key={ms} className="border-t border-clay-100">
                      <td>{hhmm(ms)}</td>
                      <td>{fmtTemp(p.series.storeTempC[i])}</td>
                      <td>{format.number(p.series.charge[i] ?? 0, { style: 'percent' })}</td>
                      <td>{format.number(p.series.gApertureWm2[i] ?? 0, { maximumFractionDigits: 0 })} W/m²</td>
                      <td>{fmtTemp(p.series.tAirC[i])}</td>
                    </tr>
                  ) : null,
                )}
              </tbody>
            </table>
            <p className="mt-2 text-xs text-clay-700">{t('balance', { err: format.number(p.balance.relativeError, { style: 'percent', maximumSignificantDigits: 2 }) })}</p>
          </details>
        </>
      )}
    </section>
  );
}
