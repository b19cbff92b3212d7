'use client';

import { Chart as ChartJS, CategoryScale, Filler, Legend, LinearScale, LineElement, PointElement, Tooltip } from 'chart.js';
import { useFormatter, useTranslations } from 'next-intl';
import { useCallback, useMemo, useState } from 'react';
import { Line } from 'react-chartjs-2';
import { apiFetch } from '@/lib/client/api';
import { ForecastUpload } from './forecast-upload';
import { usePrefs } from './prefs';

ChartJS.register(CategoryScale, LinearScale, PointElement, LineElement, Tooltip, Legend, Filler);

type Source = 'forecast' | 'stale-forecast' | 'upload' | 'clear-sky';

export interface DayForecast {
  date: string;
  timeZone: string;
  source: Source;
  issuedAt: string | null;
  fetchedAt: string | null;
  ageS: number | null;
  note: string | null;
  uploadName: string | null;
  uploadMode: 'as-is' | 'typical-day' | null;
  clearness: { values: number[]; isDefault: boolean };
  lastFailure: { at: string; error: string } | null;
  hours: { t: string; ghiWm2: number; dniWm2: number | null; dhiWm2: number | null; tAirC: number; windMS: number | null; cloudOkta: number | null; filled: boolean }[];
}

const SOURCE_STYLE: Record<Source, string> = {
  forecast: 'bg-tide-50 text-tide-700 border-tide-600',
  'stale-forecast': 'bg-ember-50 text-ember-800 border-ember-600',
  upload: 'bg-clay-100 text-clay-900 border-clay-700',
  'clear-sky': 'bg-ember-50 text-ember-800 border-ember-600',
};

function addDays(date: string, n: number): string {
  const [y, m, d] = date.split('-').map(Number) as [number, number, number];
  return new Date(Date.UTC(y, m - 1, d + n)).toISOString().slice(0, 10);
}

/**
 * The kitchen's weather for today and the next two days: irradiance and air temperature as a chart, each day's
 * source and age, the fallback in use, the last failed fetch, an hourly table, and (for leads) the upload form.
 */
export function ForecastView({ kitchenId, kitchenName, canUpload, initialDays }: { kitchenId: string; kitchenName: string; canUpload: boolean; initialDays: DayForecast[] }) {
  const t = useTranslations('forecast');
  const tc = useTranslations('common');
  const format = useFormatter();
  const { toUnit, fmtTemp, unitLabel, locale } = usePrefs();
  const [days, setDays] = useState<DayForecast[] | null>(initialDays);
  const [error, setError] = useState<string | null>(null);

  /** Reads the three days again after an upload (the page rendered the first ones). */
  const reload = useCallback(async () => {
    const first = await apiFetch<DayForecast>(`/api/v1/kitchens/${kitchenId}/forecast`);
    if (!first.ok) return setError(first.error.status === 0 ? tc('offline') : first.error.message);
    const rest = await Promise.all([1, 2].map((n) => apiFetch<DayForecast>(`/api/v1/kitchens/${kitchenId}/forecast?date=${addDays(first.data.date, n)}`)));
    const bad = rest.find((r) => !r.ok);
    if (bad && !bad.ok) return setError(bad.error.status === 0 ? tc('offline') : bad.error.message);
    setError(null);
    setDays([first.data, ...rest.map((r) => (r.ok ? r.data : first.data))]);
  }, [kitchenId, tc]);
  const tz = days?.[0]?.timeZone;
  const dayLabel = (date: string) => format.dateTime(new Date(`${date}T12:00:00Z`), { weekday: 'long', day: 'numeric', month: 'long', timeZone: 'UTC' });
  const hourLabel = useCallback(
    (iso: string) => format.dateTime(new Date(iso), { weekday: 'short', hour: '2-digit', minute: '2-digit', timeZone: tz }),
    [format, tz],
  );
  const ago = (iso: string) => format.relativeTime(new Date(iso), new Date());

  // Consecutive days share an hour in zones off the whole hour (e.g. +05:30): keep each hour once.
  const hours = useMemo(() => {
    const seen = new Set<string>();
    return (days ?? []).flatMap((d) => d.hours).filter((h) => !seen.has(h.t) && seen.add(h.t));
  }, [days]);
  const data = useMemo(() => {
    if (!hours.length) return null;
    return {
      labels: hours.map((h) => hourLabel(h.t)),
      datasets: [
        { label: `${t('ghi')} (W/m²)`, data: hours.map((h) => h.ghiWm2), borderColor: '#b4441e', backgroundColor: 'rgba(180,68,30,0.12)', fill: true, borderWidth: 2.5, pointRadius: 0, yAxisID: 'y' },
        { label: `${t('dni')} (W/m²)`, data: hours.map((h) => h.dniWm2), borderColor: '#963718', backgroundColor: '#963718', borderDash: [6, 4], borderWidth: 1.5, pointRadius: 0, yAxisID: 'y' },
        { label: `${t('dhi')} (W/m²)`, data: hours.map((h) => h.dhiWm2), borderColor: '#5c4a3a', backgroundColor: '#5c4a3a', borderDash: [2, 3], borderWidth: 1.5, pointRadius: 0, yAxisID: 'y' },
        { label: `${t('air')} (${unitLabel})`, data: hours.map((h) => toUnit(h.tAirC)), borderColor: '#0f6e6e', backgroundColor: '#0f6e6e', borderWidth: 2, pointRadius: 0, yAxisID: 'y1' },
      ],
    };
    // eslint-disable-next-line react-hooks/exhaustive-deps
  }, [hours, unitLabel, hourLabel, t]);

  const neverFetched = days?.every((d) => d.source === 'clear-sky' && !d.lastFailure) ?? false;
  const failure = days?.find((d) => d.lastFailure)?.lastFailure ?? null;
  const month = days ? Number(days[0]!.date.slice(5, 7)) - 1 : 0;

  return (
    <div className="flex flex-col gap-6">
      <div>
        <p className="text-clay-700">{kitchenName}</p>
        <h1 className="text-2xl font-bold">{t('title')}</h1>
        <p className="mt-1 max-w-3xl text-sm text-clay-700">{t('intro')}</p>
      </div>
      {error && <p role="alert" className="card text-ember-800">{error}</p>}
      {!days && !error && <p aria-busy="true">{tc('loading')}</p>}
      {days && (
        <>
          {neverFetched && (
            <section className="card border-ember-600" aria-labelledby="forecast-empty">
              <h2 id="forecast-empty" className="text-lg font-bold">{t('empty.title')}</h2>
              <p className="text-sm">{t('empty.body')}</p>
            </section>
          )}
          {failure && (
            <p role="alert" className="card border-ember-600 text-sm text-ember-800">
              {t('failed', { when: ago(failure.at), error: failure.error })}
            </p>
          )}
          <section aria-labelledby="forecast-days" className="card">
            <h2 id="forecast-days" className="mb-2 text-lg font-bold">{t('days')}</h2>
            <ul className="grid gap-3 sm:grid-cols-3">
              {days.map((d, i) => (
                <li key={d.date} className={`rounded-lg border-l-4 p-3 ${SOURCE_STYLE[d.source]}`}>
                  <span className="block text-sm font-semibold">{i === 0 ? t('today') : i === 1 ? t('tomorrow') : dayLabel(d.date)}</span>
                  <span className="block font-bold">{t(`sources.${d.source}`)}</span>
                  <span className="block text-sm">
                    {d.fetchedAt
                      ? d.source === 'upload'
                        ? t('uploaded', { when: ago(d.fetchedAt), name: d.uploadName ?? '' })
                        : t('fetched', { when: ago(d.fetchedAt) })
                      : t('clearness', { value: format.number(d.clearness.values[month] ?? 0, { maximumFractionDigits: 2 }) })}
                  </span>
                  {d.source === 'stale-forecast' && <span className="block text-sm">{t('staleHint')}</span>}
                  {d.source === 'clear-sky' && <span className="block text-sm">{d.clearness.isDefault ? t('clearnessDefault') : t('clearnessKitchen')}</span>}
                  {d.uploadMode === 'typical-day' && d.source === 'upload' && <span className="block text-sm">{t('typicalDay')}</span>}
                  <span className="block text-xs">{t('maxGhi', { value: format.number(Math.max(0, ...d.hours.map((h) => h.ghiWm2)), { maximumFractionDigits: 0 }) })} · {t('range', { min: fmtTemp(Math.min(...d.hours.map((h) => h.tAirC))), max: fmtTemp(Math.max(...d.hours.map((h) => h.tAirC))) })}</span>
                </li>
              ))}
            </ul>
            <p className="mt-3 text-xs text-clay-700">{t('zone', { zone: tz ?? '' })}</p>
          </section>
          {data && (
            <section aria-labelledby="forecast-chart" className="card">
              <h2 id="forecast-chart" className="mb-2 text-lg font-bold">{t('chart')}</h2>
              <div
                className="relative h-72 w-full sm:h-96"
                role="img"
                aria-label={t('chartLabel', { max: format.number(Math.max(0, ...hours.map((h) => h.ghiWm2)), { maximumFractionDigits: 0 }), min: fmtTemp(Math.min(...hours.map((h) => h.tAirC))), maxT: fmtTemp(Math.max(...hours.map((h) => h.tAirC))) })}
              >
                <Line
                  data={data}
                  options={{
                    responsive: true,
                    maintainAspectRatio: false,
                    animation: false,
                    locale,
                    interaction: { mode: 'index', intersect: false },
                    plugins: { legend: { position: 'bottom', labels: { usePointStyle: true } } },
                    scales: {
                      x: { ticks: { maxTicksLimit: 9, maxRotation: 0 } },
                      y: { min: 0, suggestedMax: 1000, title: { display: true, text: 'W/m²' } },
                      y1: { position: 'right', title: { display: true, text: unitLabel }, grid: { drawOnChartArea: false } },
                    },
                  }}
                />
              </div>
              <details className="mt-3">
                <summary className="cursor-pointer text-sm font-semibold">{t('table')}</summary>
                <div className="overflow-x-auto">
                  <table className="mt-2 w-full text-left text-sm">
                    <thead>
                      <tr>
                        <th scope="col">{t('hour')}</th>
                        <th scope="col">{t('ghi')}</th>
                        <th scope="col">{t('dni')}</th>
                        <th scope="col">{t('dhi')}</th>
                        <th scope="col">{t('air')}</th>
                        <th scope="col">{t('wind')}</th>
                        <th scope="col">{t('cloud')}</th>
                      </tr>
                    </thead>
                    <tbody>
                      {hours.map((h) => (
                        <tr key={h.t} className="border-t border-clay-100">
                          <td>{hourLabel(h.t)}{h.filled ? ' *' : ''}</td>
                          <td>{format.number(h.ghiWm2, { maximumFractionDigits: 0 })}</td>
                          <td>{h.dniWm2 == null ? '—' : format.number(h.dniWm2, { maximumFractionDigits: 0 })}</td>
                          <td>{h.dhiWm2 == null ? '—' : format.number(h.dhiWm2, { maximumFractionDigits: 0 })}</td>
                          <td>{fmtTemp(h.tAirC, 1)}</td>
                          <td>{h.windMS == null ? '—' : `${format.number(h.windMS, { maximumFractionDigits: 1 })} m/s`}</td>
                          <td>{h.cloudOkta == null ? '—' : `${format.number(h.cloudOkta, { maximumFractionDigits: 1 })} okta`}</td>
                        </tr>
                      ))}
                    </tbody>
                  </table>
                </div>
                <p className="mt-2 text-xs text-clay-700">{t('filledNote')}</p>
              </details>
            </section>
          )}
          {canUpload && <ForecastUpload kitchenId={kitchenId} defaultDate={addDays(days[0]!.date, 1)} onUploaded={() => void reload()} />}
        </>
      )}
    </div>
  );
}
