'use client';

import Link from 'next/link';
import { BarElement, CategoryScale, Chart as ChartJS, Legend, LinearScale, Tooltip } from 'chart.js';
import { useFormatter, useTranslations } from 'next-intl';
import { useEffect, useState } from 'react';
import { Bar } from 'react-chartjs-2';
import { apiFetch } from '@/lib/client/api';

ChartJS.register(CategoryScale, LinearScale, BarElement, Tooltip, Legend);

interface Row {
  kitchenId: string;
  kitchenName: string;
  plan: null | {
    status: string;
    version: number;
    servingsTotal: number;
    servingsOnSun: number;
    servingsBackup: number;
    backupDishes: { batchId: string; dishName: string; servings: number; reason: string }[];
    fuel: { currency: string; byFuel: Record<string, { amount: number; unit: string }>; total: { cost: number | null; co2Kg: number; co2BiogenicKg: number } };
  };
}
interface Overview {
  date: string;
  kitchens: Row[];
  totals: { servingsTotal: number; servingsOnSun: number; servingsBackup: number; byFuel: Record<string, { amount: number; unit: string }>; costByCurrency: Record<string, number>; co2Kg: number; co2BiogenicKg: number; woodAllKg: number; woodAllCo2BiogenicKg: number };
}

/** Coordinators: which dishes fall back to another fuel across kitchens, how much fuel, cost and CO₂. */
export function OrganisationOverview({ initialDate }: { initialDate: string }) {
  const t = useTranslations('overview');
  const tp = useTranslations('plan');
  const tc = useTranslations('common');
  const format = useFormatter();
  const [date, setDate] = useState(initialDate);
  const [data, setData] = useState<Overview | null>(null);
  const [error, setError] = useState<string | null>(null);
  useEffect(() => {
    apiFetch<Overview>(`/api/v1/organisation/overview?date=${date}`).then((r) => (r.ok ? (setData(r.data), setError(null)) : setError(r.error.message || tc('offline'))));
  }, [date, tc]);
  const fuels = (f: Record<string, { amount: number; unit: string }>) => Object.entries(f).map(([id, x]) => `${format.number(x.amount, { maximumFractionDigits: 1 })} ${x.unit} ${id}`).join(', ') || '—';

  return (
    <div className="flex flex-col gap-4">
      <div className="flex flex-wrap items-end justify-between gap-3">
        <h1 className="text-2xl font-bold">{t('title')}</h1>
        <label className="flex items-center gap-2">
          <span className="label mb-0">{t('date')}</span>
          <input type="date" className="field w-auto" value={date} onChange={(e) => e.target.value && setDate(e.target.value)} />
        </label>
      </div>
      {error && <p role="alert" className="card text-ember-800">{error}</p>}
      {!data && !error && <p aria-busy="true">{tc('loading')}</p>}
      {data && (
        <>
          <section className="card" aria-labelledby="ov-chart">
            <h2 id="ov-chart" className="text-lg font-bold">{t('chart')}</h2>
            <div className="relative h-64" role="img" aria-label={`${t('chart')}: ${data.kitchens.map((k) => `${k.kitchenName} ${k.plan?.servingsOnSun ?? 0}/${k.plan?.servingsBackup ?? 0}`).join('; ')}`}>
              <Bar
                data={{
                  labels: data.kitchens.map((k) => k.kitchenName),
                  datasets: [
                    { label: t('onSun'), data: data.kitchens.map((k) => k.plan?.servingsOnSun ?? 0), backgroundColor: '#e0a526' },
                    { label: t('onBackup'), data: data.kitchens.map((k) => k.plan?.servingsBackup ?? 0), backgroundColor: '#5c4a3a' },
                  ],
                }}
                options={{ responsive: true, maintainAspectRatio: false, animation: false, scales: { x: { stacked: true }, y: { stacked: true, title: { display: true, text: tp('servings', { n: '' }).trim() } } } }}
              />
            </div>
          </section>
          <div className="card overflow-x-auto p-0">
            <table className="w-full text-left text-sm">
              <thead className="bg-clay-100">
                <tr>
                  <th scope="col" className="px-2 py-2">{t('kitchen')}</th>
                  <th scope="col" className="px-2 py-2">{t('plan')}</th>
                  <th scope="col" className="px-2 py-2">{t('onSun')}</th>
                  <th scope="col" className="px-2 py-2">{t('onBackup')}</th>
                  <th scope="col" className="px-2 py-2">{t('fuel')}</th>
                  <th scope="col" className="px-2 py-2">{t('cost')}</th>
                  <th scope="col" className="px-2 py-2">{t('co2')}</th>
                </tr>
              </thead>
              <tbody>
                {data.kitchens.map((k) => (
                  <tr key={k.kitchenId} className="border-t border-clay-100 align-top">
                    <th scope="row" className="px-2 py-2"><Link className="underline" href={`/kitchens/${k.kitchenId}/plan?date=${date}`}>{k.kitchenName}</Link></th>
                    {k.plan ? (
                      <>
                        <td className="px-2 py-2">{k.plan.status === 'published' ? tp('published', { version: k.plan.version }) : tp('draft')}</td>
                        <td className="px-2 py-2">{format.number(k.plan.servingsOnSun)}</td>
                        <td className="px-2 py-2">
                          {format.number(k.plan.servingsBackup)}
                          {k.plan.backupDishes.length > 0 && (
                            <ul className="text-xs text-clay-700">
                              {k.plan.backupDishes.map((d) => <li key={d.batchId}>{d.dishName} ({d.servings}) — {tp(`reasons.${d.reason}` as 'reasons.no-free-pot')}</li>)}
                            </ul>
                          )}
                        </td>
                        <td className="px-2 py-2">{fuels(k.plan.fuel.byFuel)}</td>
                        <td className="px-2 py-2">{k.plan.fuel.total.cost === null ? '—' : format.number(k.plan.fuel.total.cost, { style: 'currency', currency: k.plan.fuel.currency })}</td>
                        <td className="px-2 py-2">{format.number(k.plan.fuel.total.co2Kg, { maximumFractionDigits: 1 })} kg</td>
                      </>
                    ) : (
                      <td colSpan={6} className="px-2 py-2 text-clay-700">{t('noPlan')}</td>
                    )}
                  </tr>
                ))}
              </tbody>
              <tfoot>
                <tr className="border-t-2 border-clay-200 font-semibold">
                  <th scope="row" className="px-2 py-2">{t('total')}</th>
                  <td />
                  <td className="px-2 py-2">{format.number(data.totals.servingsOnSun)}</td>
                  <td className="px-2 py-2">{format.number(data.totals.servingsBackup)}</td>
                  <td className="px-2 py-2">{fuels(data.totals.byFuel)}</td>
                  <td className="px-2 py-2">{Object.entries(data.totals.costByCurrency).map(([cur, v]) => format.number(v, { style: 'currency', currency: cur })).join(' + ') || '—'}</td>
                  <td className="px-2 py-2">{format.number(data.totals.co2Kg, { maximumFractionDigits: 1 })} kg</td>
                </tr>
              </tfoot>
            </table>
          </div>
          <p className="text-sm">{t('woodCompare', { wood: format.number(data.totals.woodAllKg, { maximumFractionDigits: 0 }), co2: format.number(data.totals.woodAllCo2BiogenicKg, { maximumFractionDigits: 0 }) })}</p>
        </>
      )}
    </div>
  );
}
