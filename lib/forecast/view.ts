/** The forecast as the API and the page show it: the hours of one local day with their source and age. */
import type { EntityManager } from '@mikro-orm/postgresql';
import type { Kitchen } from '@/entities';
import { fillWithClearSky } from '@/lib/prediction/weather-fill';
import { localDateString } from '@/lib/time';
import { CLEARNESS_DEFAULT_SOURCE } from './clearness';
import { HOUR_MS } from './types';
import { getWeatherForDay, kitchenSite } from './weather-for-day';

const r1 = (x: number) => Math.round(x * 10) / 10;

/**
 * The hourly series in use for a kitchen's local day (today by default), with its source, issue and fetch
 * times, age, note, the clear-sky index in use and the last failed fetch, if any.
 */
export async function getDayForecast(em: EntityManager, kitchen: Kitchen, date?: string, nowMs = Date.now()) {
  const day = date ?? localDateString(nowMs, kitchen.timeZone);
  const w = await getWeatherForDay(em, kitchen, day, { nowMs });
  const filled = fillWithClearSky(kitchenSite(kitchen), w.dayStartMs, w.dayEndMs, w.hourly.filter((h) => h.t + HOUR_MS > w.dayStartMs && h.t < w.dayEndMs), w.clearness.values);
  const filledSet = new Set(filled.filledMs);
  return {
    date: day,
    timeZone: kitchen.timeZone,
    source: w.source,
    issuedAt: w.issuedAt,
    fetchedAt: w.fetchedAt,
    ageS: w.ageS,
    note: w.note,
    uploadName: w.uploadName,
    uploadMode: w.uploadMode,
    clearness: { values: w.clearness.values, isDefault: w.clearness.isDefault, ...(w.clearness.isDefault ? { source: CLEARNESS_DEFAULT_SOURCE } : {}) },
    lastFailure: w.lastFailure,
    hours: filled.hourly.map((h) => ({
      t: new Date(h.t).toISOString(),
      ghiWm2: r1(h.ghiWm2 ?? 0),
      dniWm2: h.dniWm2 === undefined ? null : r1(h.dniWm2),
      dhiWm2: h.dhiWm2 === undefined ? null : r1(h.dhiWm2),
      tAirC: r1(h.tAirC),
      windMS: h.windMS === undefined ? null : r1(h.windMS),
      cloudOkta: h.cloudOkta === undefined ? null : r1(h.cloudOkta),
      filled: filledSet.has(h.t),
    })),
  };
}

export type DayForecast = Awaited<ReturnType<typeof getDayForecast>>;
