/**
 * Parser of EnergyPlus weather files (EPW, an open format; pure, no I/O).
 * Format: EnergyPlus Auxiliary Programs, "EnergyPlus Weather File (EPW) Data Dictionary":
 * - 8 header lines: LOCATION, DESIGN CONDITIONS, TYPICAL/EXTREME PERIODS, GROUND TEMPERATURES,
 *   HOLIDAYS/DAYLIGHT SAVINGS, COMMENTS 1, COMMENTS 2, DATA PERIODS;
 *   LOCATION,city,state,country,source,WMO,latitude (+N),longitude (+E),time zone (h from GMT),elevation (m);
 *   DATA PERIODS,number of periods,records per hour (we read hourly files: 1),…
 * - then one comma-separated row per hour: 1 year, 2 month, 3 day, 4 hour (1–24: hour h covers (h − 1):00 to
 *   h:00 local standard time, no daylight saving), 5 minute, 6 source flags, 7 dry bulb [°C] (> −70, < 70,
 *   missing 99.9), …, 14 global horizontal radiation [Wh/m²] (≥ 0, missing ≥ 9999), 15 direct normal [Wh/m²],
 *   16 diffuse horizontal [Wh/m²], …, 22 wind speed [m/s] (0–40, missing 999), 23 total sky cover [tenths]
 *   (0–10, missing 99), … (35 fields in a full row).
 * Radiation over one hour in Wh/m² is numerically the hour's mean irradiance in W/m². Sky cover in tenths →
 * okta = tenths × 0.8. A value at or above its "missing" code is read as missing, not as an error; an
 * out-of-range value is an error.
 */
import type { HourlyWeather } from '@/lib/solar';
import { IssueList, type FileIssue } from './csv';
import { HOUR_MS } from './types';

export interface EpwLocation {
  city: string;
  /** [°], north positive */
  latitudeDeg: number;
  /** [°], east positive */
  longitudeDeg: number;
  /** Local standard time − UTC [h] */
  timeZoneH: number;
  /** [m] */
  elevationM: number;
}

/** One data row, with missing values undefined. */
export interface EpwRecord {
  line: number;
  year: number;
  month: number;
  day: number;
  /** 1–24 */
  hour: number;
  tAirC?: number;
  ghiWm2?: number;
  dniWm2?: number;
  dhiWm2?: number;
  windMS?: number;
  cloudOkta?: number;
}

export interface ParsedEpw {
  location: EpwLocation | null;
  records: EpwRecord[];
  issues: FileIssue[];
  issueCount: number;
}

/** The fields we read: 1-based position, name in messages, range, the "missing" code (values ≥ it are missing). */
const DATA_FIELDS = {
  tAirC: { pos: 7, name: 'dry_bulb_temperature', min: -70, max: 70, exclusive: true, missing: 99.9, unit: '°C' },
  ghiWm2: { pos: 14, name: 'global_horizontal_radiation', min: 0, max: 1500, exclusive: false, missing: 9999, unit: 'Wh/m²' },
  dniWm2: { pos: 15, name: 'direct_normal_radiation', min: 0, max: 1450, exclusive: false, missing: 9999, unit: 'Wh/m²' },
  dhiWm2: { pos: 16, name: 'diffuse_horizontal_radiation', min: 0, max: 1000, exclusive: false, missing: 9999, unit: 'Wh/m²' },
  windMS: { pos: 22, name: 'wind_speed', min: 0, max: 40, exclusive: false, missing: 999, unit: 'm/s' },
  cloudTenths: { pos: 23, name: 'total_sky_cover', min: 0, max: 10, exclusive: false, missing: 99, unit: 'tenths' },
} as const;

/** Fields a row needs at least (up to total sky cover); a full row has 35. */
const MIN_FIELDS = 23;
const NUMBER_RE = /^[-+]?(\d+\.?\d*|\.\d+)([eE][-+]?\d+)?$/;
const HEADER_NAMES = ['LOCATION', 'DESIGN CONDITIONS', 'TYPICAL/EXTREME PERIODS', 'GROUND TEMPERATURES', 'HOLIDAYS/DAYLIGHT SAVINGS', 'COMMENTS 1', 'COMMENTS 2', 'DATA PERIODS'];

/**
 * Parses an EPW file.
 * @param text the file's text
 * @param maxIssues issues kept (all are counted); default 20
 */
export function parseEpw(text: string, maxIssues = 20): ParsedEpw {
  const found = new IssueList(maxIssues);
  const issue = found.add;
  const lines = text.replace(/^\uFEFF/, '').split(/\r\n|\n|\r/);
  while (lines.length && !lines[lines.length - 1]!.trim()) lines.pop();
  if (lines.length <= 8) {
    issue(1, '(file)', `An EPW file has 8 header lines and then one line per hour; this one has ${lines.length} lines.`);
    return { location: null, records: [], issues: found.issues, issueCount: found.count };
  }
  HEADER_NAMES.forEach((name, i) => {
    const first = lines[i]!.split(',')[0]!.trim().toUpperCase();
    // "HOLIDAYS/DAYLIGHT SAVING" (singular) is also seen in files.
    if (first !== name && !(name.startsWith('HOLIDAYS') && first.startsWith('HOLIDAYS'))) issue(i + 1, '(header)', `Line ${i + 1} of an EPW file starts with "${name}".`);
  });

  let location: EpwLocation | null = null;
  const loc = lines[0]!.split(',').map((c) => c.trim());
  if (loc.length < 10) {
    issue(1, 'location', `The LOCATION line has 10 fields (…, latitude, longitude, time zone, elevation); found ${loc.length}.`);
  } else {
    const num = (i: number, name: string, min: number, max: number, unit: string) => {
      const c = loc[i]!;
      const v = Number(c);
      if (!NUMBER_RE.test(c) || v < min || v > max) {
        issue(1, name, `Must be a number between ${min} and ${max} ${unit}; got "${c.slice(0, 20)}".`);
        return Number.NaN;
      }
      return v;
    };
    const latitudeDeg = num(6, 'latitude', -90, 90, '°');
    const longitudeDeg = num(7, 'longitude', -180, 180, '°');
    const timeZoneH = num(8, 'time_zone', -12, 14, 'h');
    const elevationM = num(9, 'elevation', -1000, 9999.9, 'm');
    if ([latitudeDeg, longitudeDeg, timeZoneH, elevationM].every(Number.isFinite)) {
      location = { city: loc[1] ?? '', latitudeDeg, longitudeDeg, timeZoneH, elevationM };
    }
  }
  const periods = lines[7]!.split(',').map((c) => c.trim());
  if (periods[0]?.toUpperCase() === 'DATA PERIODS' && periods[2] !== undefined && periods[2] !== '1') {
    issue(8, 'records_per_hour', `We read hourly EPW files (1 record per hour); this one has ${periods[2]}.`);
  }

  const records: EpwRecord[] = [];
  const seen = new Map<string, number>();
  for (let i = 8; i < lines.length; i++) {
    const raw = lines[i]!;
    const line = i + 1;
    if (!raw.trim()) {
      issue(line, '(row)', 'Empty line among the hours.');
      continue;
    }
    const f = raw.split(',').map((c) => c.trim());
    if (f.length < MIN_FIELDS) {
      issue(line, '(row)', `Expected at least ${MIN_FIELDS} fields (35 in a full EPW row), found ${f.length}.`);
      continue;
    }
    let ok = true;
    const int = (pos: number, name: string, min: number, max: number) => {
      const c = f[pos - 1]!;
      const v = Number(c);
      if (!/^[-+]?\d+$/.test(c) || v < min || v > max) {
        issue(line, name, `Must be a whole number from ${min} to ${max}; got "${c.slice(0, 12)}".`);
        ok = false;
      }
      return v;
    };
    const year = int(1, 'year', 1800, 2200);
    const month = int(2, 'month', 1, 12);
    let day = int(3, 'day', 1, 31);
    const hour = int(4, 'hour', 1, 24);
    if (ok && day > new Date(Date.UTC(year, month, 0)).getUTCDate()) {
      issue(line, 'day', `${year}-${String(month).padStart(2, '0')} has no day ${day}.`);
      ok = false;
      day = Number.NaN;
    }
    const rec: EpwRecord = { line, year, month, day, hour };
    for (const [key, spec] of Object.entries(DATA_FIELDS)) {
      const c = f[spec.pos - 1]!;
      if (c === '') continue;
      if (!NUMBER_RE.test(c)) {
        issue(line, spec.name, `Not a number: "${c.slice(0, 12)}" (${spec.unit}).`);
        ok = false;
        continue;
      }
      const v = Number(c);
      if (v >= spec.missing) continue;
      const below = spec.exclusive ? v <= spec.min : v < spec.min;
      const above = spec.exclusive ? v >= spec.max : v > spec.max;
      if (below || above) {
        issue(line, spec.name, `Must be between ${spec.min} and ${spec.max} ${spec.unit} (missing: ${spec.missing}); got ${v}.`);
        ok = false;
        continue;
      }
      if (key === 'cloudTenths') rec.cloudOkta = v * 0.8;
      else rec[key as 'tAirC' | 'ghiWm2' | 'dniWm2' | 'dhiWm2' | 'windMS'] = v;
    }
    if (rec.dhiWm2 !== undefined && rec.ghiWm2 !== undefined && rec.dhiWm2 > rec.ghiWm2 + 1) {
      issue(line, 'diffuse_horizontal_radiation', `Diffuse radiation (${rec.dhiWm2} Wh/m²) cannot exceed global radiation (${rec.ghiWm2} Wh/m²).`);
      ok = false;
    }
    if (!ok) continue;
    const key = `${year}-${month}-${day}-${hour}`;
    const dup = seen.get(key);
    if (dup !== undefined) {
      issue(line, 'hour', `The same hour as line ${dup}; give each hour once.`);
      continue;
    }
    seen.set(key, line);
    records.push(rec);
  }
  if (!records.length && !found.count) issue(9, '(file)', 'The file has a header but no hours.');
  return { location, records, issues: found.issues, issueCount: found.count };
}

/** Start of the hour a record describes [epoch ms]: hour h covers (h − 1):00–h:00 local standard time. */
export function epwRecordStartMs(r: Pick<EpwRecord, 'year' | 'month' | 'day' | 'hour'>, timeZoneH: number): number {
  return Date.UTC(r.year, r.month - 1, r.day, r.hour - 1) - Math.round(timeZoneH * HOUR_MS);
}

/** A record as lib/solar HourlyWeather (tAirC NaN when missing); null when its global radiation is missing. */
export function epwRecordToHour(r: EpwRecord, startMs: number): HourlyWeather | null {
  if (r.ghiWm2 === undefined) return null;
  const h: HourlyWeather = { t: startMs, ghiWm2: r.ghiWm2, tAirC: r.tAirC ?? Number.NaN };
  if (r.dniWm2 !== undefined && r.dhiWm2 !== undefined) {
    h.dniWm2 = r.dniWm2;
    h.dhiWm2 = r.dhiWm2;
  }
  if (r.windMS !== undefined) h.windMS = r.windMS;
  if (r.cloudOkta !== undefined) h.cloudOkta = r.cloudOkta;
  return h;
}

const pad = (n: number) => String(n).padStart(2, '0');

/** A problem with one selected hour, with the hour's start [epoch ms] so the caller can keep those it uses. */
export type HourIssue = FileIssue & { t: number };
const MISSING_GHI = 'Global radiation is missing (9999) for an hour of the chosen day.';

/**
 * The file's own hours on the given local-standard-time dates (year, month and day must match).
 * @param dates YYYY-MM-DD dates
 * @returns hours, and issues for selected hours whose global radiation is missing
 */
export function epwHoursAsIs(epw: ParsedEpw, dates: readonly string[]): { hours: HourlyWeather[]; issues: HourIssue[] } {
  const tz = epw.location?.timeZoneH ?? 0;
  const want = new Set(dates);
  const hours: HourlyWeather[] = [];
  const issues: HourIssue[] = [];
  for (const r of epw.records) {
    if (!want.has(`${r.year}-${pad(r.month)}-${pad(r.day)}`)) continue;
    const t = epwRecordStartMs(r, tz);
    const h = epwRecordToHour(r, t);
    if (h) hours.push(h);
    else issues.push({ t, line: r.line, field: DATA_FIELDS.ghiWm2.name, message: MISSING_GHI });
  }
  return { hours: hours.sort((a, b) => a.t - b.t), issues };
}

/**
 * A typical day for each given date: the file's hours for the same month and day (any year; 29 February falls
 * back to 28 February), moved to the given date. When the file has several years, each hour is the mean over
 * them (of the values present). This is how a typical meteorological year (TMY) file is used for planning.
 * @param dates YYYY-MM-DD dates
 */
export function epwHoursTypical(epw: ParsedEpw, dates: readonly string[]): { hours: HourlyWeather[]; issues: HourIssue[] } {
  const tz = epw.location?.timeZoneH ?? 0;
  const byMonthDay = new Map<string, EpwRecord[]>();
  for (const r of epw.records) {
    const k = `${r.month}-${r.day}`;
    const list = byMonthDay.get(k);
    if (list) list.push(r);
    else byMonthDay.set(k, [r]);
  }
  const hours: HourlyWeather[] = [];
  const issues: HourIssue[] = [];
  for (const date of dates) {
    const [y, m, d] = date.split('-').map(Number) as [number, number, number];
    const rows = byMonthDay.get(`${m}-${d}`) ?? (m === 2 && d === 29 ? byMonthDay.get('2-28') : undefined) ?? [];
    for (let hour = 1; hour <= 24; hour++) {
      const same = rows.filter((r) => r.hour === hour);
      if (!same.length) continue;
      const meanOf = (key: 'tAirC' | 'ghiWm2' | 'dniWm2' | 'dhiWm2' | 'windMS' | 'cloudOkta') => {
        const vs = same.map((r) => r[key]).filter((v): v is number => v !== undefined);
        return vs.length ? vs.reduce((a, b) => a + b, 0) / vs.length : undefined;
      };
      const merged: EpwRecord = { line: same[0]!.line, year: y, month: m, day: d, hour };
      for (const key of ['tAirC', 'ghiWm2', 'dniWm2', 'dhiWm2', 'windMS', 'cloudOkta'] as const) {
        const v = meanOf(key);
        if (v !== undefined) merged[key] = v;
      }
      const t = epwRecordStartMs(merged, tz);
      const h = epwRecordToHour(merged, t);
      if (h) hours.push(h);
      else issues.push({ t, line: same[0]!.line, field: DATA_FIELDS.ghiWm2.name, message: MISSING_GHI });
    }
  }
  return { hours: hours.sort((a, b) => a.t - b.t), issues };
}
