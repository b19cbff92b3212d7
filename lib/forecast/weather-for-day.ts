/**
 * The fallback chain: which hourly weather a kitchen's day is planned on, never silently.
 * 1. The newest good forecast or upload whose hours cover the whole local day:
 *    - an upload → 'upload';
 *    - a forecast fetched at most 6 hours ago → 'forecast', older → 'stale-forecast' with its age.
 * 2. Otherwise clear sky (Ineichen & Perez 2002, lib/solar) × the kitchen's monthly clear-sky index → 'clear-sky'.
 * Every answer carries its source, issue and fetch times, age and a note on the fallback in use.
 */
import type { EntityManager } from '@mikro-orm/postgresql';
import { ForecastSchema, type Kitchen } from '@/entities';
import { dailyAirTemperatureC, type HourlyWeather, type Site } from '@/lib/solar';
import { clearSkyWithClearness, FALLBACK_TAIR_C } from '@/lib/prediction/weather-fill';
import type { WeatherMeta, WeatherSource } from '@/lib/prediction/predict-day';
import { addDays, zonedDayBoundsMs } from '@/lib/time';
import { CLEARNESS_DEFAULT_SOURCE, kitchenClearness } from './clearness';
import { getForecastHours } from './store';
import { HOUR_MS } from './types';

/** A forecast older than this is still used but called stale [s] (common practice, no source). */
export const STALE_AFTER_S = 6 * 3600;

export interface WeatherForDay extends WeatherMeta {
  date: string;
  timeZone: string;
  /** Hours from the hour before the previous local day to the hour after this one (the forecast's, possibly with gaps). */
  hourly: HourlyWeather[];
  /** [start, end) of the local day [epoch ms]. */
  dayStartMs: number;
  dayEndMs: number;
  forecastId: string | null;
  uploadName: string | null;
  uploadMode: string | null;
  /** The kitchen's 12 monthly clear-sky index values and whether they are the defaults. */
  clearness: { values: number[]; isDefault: boolean };
  /** The newest fetch from the service, when it failed after the newest good one. */
  lastFailure: { at: string; error: string } | null;
}

export function kitchenSite(k: Kitchen): Site {
  return { latitudeDeg: k.latitude, longitudeDeg: k.longitude, altitudeM: k.altitudeM };
}

const hoursAgo = (s: number) => `${Math.round(s / 360) / 10} h`;

/**
 * The weather a kitchen's local day is planned on.
 * @param date local date YYYY-MM-DD in the kitchen's zone
 * @param opts.nowMs the clock [epoch ms] (tests)
 */
export async function getWeatherForDay(em: EntityManager, kitchen: Kitchen, date: string, opts: { nowMs?: number } = {}): Promise<WeatherForDay> {
  const nowMs = opts.nowMs ?? Date.now();
  const [dayStartMs, dayEndMs] = zonedDayBoundsMs(date, kitchen.timeZone);
  const prevStart = zonedDayBoundsMs(addDays(date, -1), kitchen.timeZone)[0];
  const fromMs = Math.floor((prevStart - HOUR_MS) / HOUR_MS) * HOUR_MS;
  const toMs = Math.ceil((dayEndMs + HOUR_MS) / HOUR_MS) * HOUR_MS;
  const site = kitchenSite(kitchen);
  const clearness = kitchenClearness(kitchen);

  const [best, newestService] = await Promise.all([
    em.findOne(
      ForecastSchema,
      { kitchen: kitchen.id, status: 'ok', coversFrom: { $lte: new Date(dayStartMs) }, coversTo: { $gte: new Date(dayEndMs) } },
      { orderBy: { fetchedAt: 'desc', createdAt: 'desc' } },
    ),
    em.findOne(ForecastSchema, { kitchen: kitchen.id, source: 'service' }, { orderBy: { fetchedAt: 'desc', createdAt: 'desc' } }),
  ]);
  const lastFailure =
    newestService && newestService.status === 'failed' ? { at: newestService.fetchedAt.toISOString(), error: newestService.error ?? 'unknown error' } : null;
  const failureNote = lastFailure ? ` The last fetch from the forecast service failed (${lastFailure.at}): ${lastFailure.error}.` : '';
  const base = { date, timeZone: kitchen.timeZone, dayStartMs, dayEndMs, clearness, lastFailure };

  if (best) {
    const hours = await getForecastHours(em, best.id, fromMs, toMs);
    // An upload without air temperature: the fallback's daily cycle (local mean solar time), said in the note.
    let missingTemp = false;
    for (const h of hours) {
      if (!Number.isFinite(h.tAirC)) {
        missingTemp = true;
        h.tAirC = dailyAirTemperatureC((h.t + HOUR_MS / 2) / HOUR_MS + kitchen.longitude / 15, FALLBACK_TAIR_C.minC, FALLBACK_TAIR_C.maxC);
      }
    }
    const ageS = Math.max(0, Math.round((nowMs - best.fetchedAt.getTime()) / 1000));
    let source: WeatherSource;
    let note: string | null = null;
    if (best.source === 'upload') {
      source = 'upload';
      note = `Uploaded weather${best.uploadName ? ` (${best.uploadName}${best.uploadMode === 'typical-day' ? ', typical day' : ''})` : ''}.`;
    } else if (ageS > STALE_AFTER_S) {
      source = 'stale-forecast';
      note = `The newest forecast is ${hoursAgo(ageS)} old.${failureNote}`;
    } else {
      source = 'forecast';
      note = lastFailure ? failureNote.trim() : null;
    }
    if (missingTemp) note = `${note ? `${note} ` : ''}No air temperature in the file; a typical daily cycle (${FALLBACK_TAIR_C.minC}–${FALLBACK_TAIR_C.maxC} °C) is used.`;
    if (hours.length && hours[0]!.t > prevStart) note = `${note ? `${note} ` : ''}The day before is not fully covered; clear sky fills its missing hours.`;
    return {
      ...base,
      hourly: hours,
      source,
      issuedAt: best.issuedAt?.toISOString() ?? null,
      fetchedAt: best.fetchedAt.toISOString(),
      ageS,
      note,
      forecastId: best.id,
      uploadName: best.uploadName,
      uploadMode: best.uploadMode,
    };
  }

  const month = new Date(Math.floor((dayStartMs + dayEndMs) / 2)).getUTCMonth();
  const k = clearness.values[month]!;
  return {
    ...base,
    hourly: clearSkyWithClearness(site, fromMs, toMs, clearness.values),
    source: 'clear-sky',
    issuedAt: null,
    fetchedAt: null,
    ageS: null,
    note: `No forecast or upload covers this day: clear sky × the month's clear-sky index ${k}${clearness.isDefault ? ` (default: ${CLEARNESS_DEFAULT_SOURCE})` : ''}.${failureNote}`,
    forecastId: null,
    uploadName: null,
    uploadMode: null,
  };
}

/** The meta part of a WeatherForDay, for predictDay. */
export function weatherMeta(w: WeatherForDay): WeatherMeta {
  return { source: w.source, issuedAt: w.issuedAt, fetchedAt: w.fetchedAt, ageS: w.ageS, note: w.note };
}
