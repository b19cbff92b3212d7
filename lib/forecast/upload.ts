/**
 * Weather uploads: a kitchen lead's CSV or EPW file, used for one local day as the file gives it ('as-is') or
 * as the EPW's typical day for that date of year ('typical-day'). Nothing is saved when the file has a problem;
 * the answer lists the first 20 with their line and field.
 */
import type { EntityManager } from '@mikro-orm/postgresql';
import type { Kitchen, UploadMode } from '@/entities';
import { recordAudit } from '@/lib/audit';
import { HttpError, unprocessable } from '@/lib/http/errors';
import type { HourlyWeather } from '@/lib/solar';
import { addDays, zonedDayBoundsMs } from '@/lib/time';
import { parseWeatherCsv, type FileIssue } from './csv';
import { epwHoursAsIs, epwHoursTypical, parseEpw } from './epw';
import { saveForecast } from './store';
import { HOUR_MS } from './types';

/** Largest file accepted [bytes] (a year of hourly EPW is about 1.6 MB). */
export const UPLOAD_LIMIT_BYTES = 5 * 1024 * 1024;
/** Largest multipart body: the file plus the form's other fields and boundaries [bytes]. */
export const UPLOAD_BODY_LIMIT_BYTES = UPLOAD_LIMIT_BYTES + 64 * 1024;
/** Issues listed in an answer. */
export const MAX_LISTED_ISSUES = 20;
/** Distance beyond which an EPW station is said to be far from the kitchen [km] (common practice, no source). */
const FAR_STATION_KM = 100;

export const fileTooLarge = () => new HttpError(413, 'too_large', 'The file is larger than 5 MB. Upload at most 5 MB (a year of hourly EPW is about 1.6 MB).');

export type UploadKind = 'csv' | 'epw';

/** EPW by name or by its first line, CSV otherwise. */
export function detectUploadKind(fileName: string, text: string): UploadKind {
  if (/\.epw$/i.test(fileName)) return 'epw';
  if (/\.csv$/i.test(fileName)) return 'csv';
  return /^\uFEFF?LOCATION,/i.test(text) ? 'epw' : 'csv';
}

/**
 * Puts hours that start off the whole UTC hour (e.g. a +05:30 zone) on whole UTC hours: each UTC hour is the
 * overlap-weighted mean of the two file hours it straddles (exact for hour means that are constant within
 * each file hour); at the ends of the file, where a UTC hour has only one neighbour, that neighbour's values
 * are held (so a file of exactly one local day still covers it). An optional value is kept when both have it.
 */
export function alignToUtcHours(hours: readonly HourlyWeather[]): HourlyWeather[] {
  if (!hours.length) return [];
  const phase = ((hours[0]!.t % HOUR_MS) + HOUR_MS) % HOUR_MS;
  if (phase === 0) return [...hours];
  const byT = new Map(hours.map((h) => [h.t, h]));
  const wa = phase / HOUR_MS; // share of the UTC hour covered by the file hour that starts before it
  const targets = new Set<number>();
  for (const h of hours) {
    targets.add(h.t - phase); // the UTC hour this file hour ends in…
    targets.add(h.t + HOUR_MS - phase); // …and the one it starts in
  }
  const out: HourlyWeather[] = [];
  for (const t of [...targets].sort((x, y) => x - y)) {
    const a = byT.get(t - HOUR_MS + phase) ?? byT.get(t + phase)!;
    const b = byT.get(t + phase) ?? a;
    const mix = (x: number | undefined, y: number | undefined) => (x === undefined || y === undefined ? undefined : wa * x + (1 - wa) * y);
    const h: HourlyWeather = { t, ghiWm2: mix(a.ghiWm2, b.ghiWm2) ?? 0, tAirC: wa * a.tAirC + (1 - wa) * b.tAirC };
    const dni = mix(a.dniWm2, b.dniWm2);
    const dhi = mix(a.dhiWm2, b.dhiWm2);
    if (dni !== undefined && dhi !== undefined) {
      h.dniWm2 = dni;
      h.dhiWm2 = dhi;
    }
    const wind = mix(a.windMS, b.windMS);
    if (wind !== undefined) h.windMS = wind;
    const okta = mix(a.cloudOkta, b.cloudOkta);
    if (okta !== undefined) h.cloudOkta = okta;
    out.push(h);
  }
  return out;
}

/** Great-circle distance [km] (haversine, mean Earth radius 6371 km). */
function distanceKm(lat1: number, lon1: number, lat2: number, lon2: number): number {
  const r = Math.PI / 180;
  const a = Math.sin(((lat2 - lat1) * r) / 2) ** 2 + Math.cos(lat1 * r) * Math.cos(lat2 * r) * Math.sin(((lon2 - lon1) * r) / 2) ** 2;
  return 2 * 6371 * Math.asin(Math.min(1, Math.sqrt(a)));
}

function issuesError(issues: FileIssue[], total: number): HttpError {
  const fields: Record<string, string> = {};
  for (const i of issues.slice(0, MAX_LISTED_ISSUES)) fields[`line ${i.line}.${i.field}`] ??= i.message;
  const listed = Object.keys(fields).length;
  const message =
    total === 1
      ? 'The file has a problem; nothing was saved.'
      : `The file has ${total} problems; nothing was saved.${total > listed ? ` The first ${listed} are listed.` : ''}`;
  return unprocessable(message, fields);
}

const hhmm = (ms: number, timeZone: string) => new Intl.DateTimeFormat('en-GB', { timeZone, hour: '2-digit', minute: '2-digit', hourCycle: 'h23' }).format(new Date(ms));

export interface PreparedUpload {
  kind: UploadKind;
  hours: HourlyWeather[];
  /** The chosen day on whole UTC hours [epoch ms]: what the upload covers. */
  coversFromMs: number;
  coversToMs: number;
  warnings: string[];
}

/**
 * Reads a file and picks the hours for a kitchen's local day (with the day before when the file has it).
 * Pure apart from the clock-free inputs; throws 422 with fields for any problem.
 * @param date the local day YYYY-MM-DD in the kitchen's zone
 */
export function prepareUpload(kitchen: Pick<Kitchen, 'timeZone' | 'latitude' | 'longitude'>, input: { fileName: string; text: string; date: string; mode: UploadMode }): PreparedUpload {
  const kind = detectUploadKind(input.fileName, input.text);
  const warnings: string[] = [];
  const [dayStart, dayEnd] = zonedDayBoundsMs(input.date, kitchen.timeZone);
  const prevStart = zonedDayBoundsMs(addDays(input.date, -1), kitchen.timeZone)[0];
  // Local dates in the file's own zone that can overlap the kitchen's day and the day before it.
  const dates = [-2, -1, 0, 1].map((d) => addDays(input.date, d));
  const from = Math.floor((prevStart - HOUR_MS) / HOUR_MS) * HOUR_MS;
  const to = Math.ceil((dayEnd + HOUR_MS) / HOUR_MS) * HOUR_MS;
  let raw: HourlyWeather[];
  if (kind === 'csv') {
    const p = parseWeatherCsv(input.text, MAX_LISTED_ISSUES);
    if (p.issueCount) throw issuesError(p.issues, p.issueCount);
    if (input.mode === 'typical-day') throw unprocessable('A typical day needs an EPW file (a year of hours); use "as-is" for a CSV.', { mode: 'Use "as-is" for a CSV file.' });
    raw = p.hours;
  } else {
    const p = parseEpw(input.text, MAX_LISTED_ISSUES);
    if (p.issueCount) throw issuesError(p.issues, p.issueCount);
    const loc = p.location!;
    const km = distanceKm(loc.latitudeDeg, loc.longitudeDeg, kitchen.latitude, kitchen.longitude);
    if (km > FAR_STATION_KM) warnings.push(`The file's station (${loc.city || 'unnamed'}) is ${Math.round(km)} km from the kitchen.`);
    const picked = input.mode === 'typical-day' ? epwHoursTypical(p, dates) : epwHoursAsIs(p, dates);
    raw = picked.hours;
    // Missing radiation matters only in the hours used (the chosen day and the day before).
    const used = picked.issues.filter((i) => i.t + HOUR_MS > prevStart && i.t < dayEnd);
    if (used.length) throw issuesError(used, used.length);
  }
  const hours = alignToUtcHours(raw).filter((h) => h.t >= from && h.t < to);
  const have = new Set(hours.map((h) => h.t));
  const missing: number[] = [];
  for (let t = Math.floor(dayStart / HOUR_MS) * HOUR_MS; t < dayEnd; t += HOUR_MS) if (!have.has(t)) missing.push(t);
  if (missing.length) {
    const tz = kitchen.timeZone;
    const what = missing.length >= 24 ? 'none of its hours' : `missing ${missing.length} hour${missing.length > 1 ? 's' : ''} from ${hhmm(Math.max(missing[0]!, dayStart), tz)}`;
    const hint = kind === 'epw' && input.mode === 'as-is' ? ' For a typical-year file, choose "typical day".' : '';
    throw unprocessable(`The file does not cover ${input.date} in the kitchen's time zone (${tz}): ${what}.${hint}`, {
      date: `The file covers ${hours.length ? `${new Date(hours[0]!.t).toISOString().slice(0, 16)}Z to ${new Date(hours[hours.length - 1]!.t + HOUR_MS).toISOString().slice(0, 16)}Z` : 'no hours near this day'}.`,
    });
  }
  if (hours.some((h) => !Number.isFinite(h.tAirC))) warnings.push('The file has no air temperature for some hours; a typical daily cycle is used for them.');
  return { kind, hours, coversFromMs: Math.floor(dayStart / HOUR_MS) * HOUR_MS, coversToMs: Math.ceil(dayEnd / HOUR_MS) * HOUR_MS, warnings };
}

/**
 * Saves an upload for a kitchen (with an audit event, in one transaction).
 * @returns what was stored, for the API answer
 */
export async function createForecastUpload(
  em: EntityManager,
  kitchen: Kitchen,
  actorId: string,
  input: { fileName: string; text: string; date: string; mode: UploadMode },
  nowMs = Date.now(),
) {
  const prepared = prepareUpload(kitchen, input);
  const uploadName = input.fileName.replace(/[\u0000-\u001f]/g, '').slice(0, 255) || 'upload';
  const { id } = await saveForecast(em, kitchen, {
    source: 'upload',
    issuedAtMs: nowMs,
    fetchedAtMs: nowMs,
    hours: prepared.hours,
    coversFromMs: prepared.coversFromMs,
    coversToMs: prepared.coversToMs,
    uploadName,
    uploadMode: input.mode,
    inTransaction: (tx, forecastId) =>
      recordAudit(tx, {
        organisationId: kitchen.organisation.id,
        kitchenId: kitchen.id,
        actorId,
        action: 'forecast.upload',
        entityType: 'Forecast',
        entityId: forecastId,
        details: { file: uploadName, kind: prepared.kind, date: input.date, mode: input.mode, hours: prepared.hours.length },
      }),
  });
  return {
    id,
    source: 'upload' as const,
    kind: prepared.kind,
    uploadName,
    mode: input.mode,
    date: input.date,
    hours: prepared.hours.length,
    coversFrom: new Date(prepared.coversFromMs).toISOString(),
    coversTo: new Date(prepared.coversToMs).toISOString(),
    warnings: prepared.warnings,
  };
}
