/**
 * Parser of the hourly weather CSV a kitchen lead may upload (pure; no I/O).
 *
 * Format (our own, documented on the forecast page and in the OpenAPI document):
 * - comma-separated text (RFC 4180: a field may be quoted, "a,b", with "" for a quote), UTF-8 with or without a
 *   byte-order mark, LF or CRLF line ends; one header line then one line per hour; blank lines ignored; cells
 *   are trimmed;
 * - header names (any order): `time` and `ghi_w_m2` required; `dni_w_m2`, `dhi_w_m2`, `temp_c`, `wind_m_s`,
 *   `cloud_okta` optional;
 * - `time`: ISO 8601 timestamp with its UTC offset (`2026-12-03T10:00+03:00` or `…Z`), the START of the hour
 *   the values describe; on the hour of its own offset; hours a whole number of hours apart, each once;
 * - `ghi_w_m2`, `dni_w_m2`, `dhi_w_m2`: global horizontal, direct normal, diffuse horizontal irradiance, mean
 *   over the hour [W/m²]; `temp_c` air temperature [°C]; `wind_m_s` wind speed [m/s]; `cloud_okta` cloud cover
 *   [okta, 0–8]. An optional cell may be empty.
 * Every problem is reported with its line number and column; the caller saves nothing when there is one.
 */
import Papa from 'papaparse';
import type { HourlyWeather } from '@/lib/solar';
import { HOUR_MS } from './types';

export const CSV_COLUMNS = ['time', 'ghi_w_m2', 'dni_w_m2', 'dhi_w_m2', 'temp_c', 'wind_m_s', 'cloud_okta'] as const;
export type CsvColumn = (typeof CSV_COLUMNS)[number];

/** A problem in an uploaded file, at a line (1-based) and a field. */
export interface FileIssue {
  line: number;
  field: string;
  message: string;
}

/** Issues of one file as a parser finds them: every one counted, the first `max` kept. */
export class IssueList {
  readonly issues: FileIssue[] = [];
  count = 0;
  constructor(private readonly max: number) {}

  readonly add = (line: number, field: string, message: string): void => {
    this.count++;
    if (this.issues.length < this.max) this.issues.push({ line, field, message });
  };
}

/** Hours read from a file; tAirC is NaN where the file gave none. */
export interface ParsedHours {
  hours: HourlyWeather[];
  issues: FileIssue[];
  /** Issues found in all (issues holds at most maxIssues). */
  issueCount: number;
}

/** Accepted ranges of the numeric columns, with their unit. */
export const CSV_RANGES: Record<Exclude<CsvColumn, 'time'>, { min: number; max: number; unit: string }> = {
  ghi_w_m2: { min: 0, max: 1500, unit: 'W/m²' },
  dni_w_m2: { min: 0, max: 1450, unit: 'W/m²' },
  dhi_w_m2: { min: 0, max: 1000, unit: 'W/m²' },
  temp_c: { min: -60, max: 60, unit: '°C' },
  wind_m_s: { min: 0, max: 60, unit: 'm/s' },
  cloud_okta: { min: 0, max: 8, unit: 'okta' },
};

const TIME_RE = /^(\d{4})-(\d{2})-(\d{2})T(\d{2}):(\d{2})(?::(\d{2})(?:\.\d+)?)?(Z|[+-]\d{2}:?\d{2})$/;
const NUMBER_RE = /^[-+]?(\d+\.?\d*|\.\d+)([eE][-+]?\d+)?$/;

/**
 * Parses an ISO 8601 timestamp that carries its offset.
 * @returns epoch ms, or an explanation of what is wrong
 */
export function parseIsoWithOffset(s: string): { ms: number } | { error: string } {
  const m = TIME_RE.exec(s);
  if (!m) {
    return /^\d{4}-\d{2}-\d{2}T\d{2}:\d{2}(:\d{2})?$/.test(s)
      ? { error: 'Add the UTC offset, e.g. 2026-12-03T10:00+03:00 or …Z.' }
      : { error: 'Use an ISO 8601 time with its offset, e.g. 2026-12-03T10:00+03:00.' };
  }
  const [, y, mo, d, h, mi, sec, off] = m;
  const month = Number(mo);
  const day = Number(d);
  let offsetMin = 0;
  if (off && off !== 'Z') {
    const digits = off.slice(1).replace(':', '');
    offsetMin = (off[0] === '-' ? -1 : 1) * (Number(digits.slice(0, 2)) * 60 + Number(digits.slice(2)));
  }
  const ms = Date.UTC(Number(y), month - 1, day, Number(h), Number(mi), Number(sec ?? 0)) - offsetMin * 60_000;
  const valid =
    Math.abs(offsetMin) <= 14 * 60 &&
    month >= 1 &&
    month <= 12 &&
    day >= 1 &&
    day <= new Date(Date.UTC(Number(y), month, 0)).getUTCDate() &&
    Number(h) <= 23 &&
    Number(mi) <= 59 &&
    Number(sec ?? 0) <= 59;
  if (!valid) return { error: `Not a real date and time: ${s}.` };
  if (Number(mi) !== 0 || Number(sec ?? 0) !== 0) return { error: 'Times must be on the hour (the start of the hour the values describe).' };
  return { ms };
}

/** One record of the file: its trimmed cells, the line (1-based) it starts on, and a quoting problem if any. */
interface CsvRow {
  cells: string[];
  line: number;
  blank: boolean;
  error?: string;
}

const QUOTE_ERRORS: Record<string, string> = {
  MissingQuotes: 'A quoted field is not closed; end it with a double quote (").',
  InvalidQuotes: 'A quoted field has text after its closing quote; write a quote inside a quoted field as "".',
};

/**
 * Splits the text into records with papaparse (RFC 4180 quoting, comma delimiter, cells trimmed). Line ends are
 * made LF first, so CRLF, LF and CR files (and mixtures) read alike, and a record's line is the number of line
 * ends before its first character plus one (papaparse's step cursor is the offset just after each record).
 */
function splitRows(text: string): CsvRow[] {
  const src = text.replace(/^\uFEFF/, '').replace(/\r\n?/g, '\n');
  const rows: CsvRow[] = [];
  let start = 0;
  let line = 1;
  Papa.parse<string[]>(src, {
    delimiter: ',',
    newline: '\n',
    skipEmptyLines: false,
    transform: (v) => v.trim(),
    step: (r) => {
      const cells = r.data;
      const err = r.errors[0];
      rows.push({
        cells,
        line,
        blank: cells.length === 1 && cells[0] === '',
        ...(err ? { error: QUOTE_ERRORS[err.code] ?? err.message } : {}),
      });
      const end = r.meta.cursor;
      for (let i = start; i < end && i < src.length; i++) if (src.charCodeAt(i) === 10) line++;
      start = end;
    },
  });
  return rows;
}

/**
 * Parses the hourly weather CSV.
 * @param text the file's text
 * @param maxIssues issues kept (all are counted); default 20
 * @returns hours sorted by time (tAirC NaN when the file has no temperature), and the issues
 */
export function parseWeatherCsv(text: string, maxIssues = 20): ParsedHours {
  const found = new IssueList(maxIssues);
  const issue = found.add;
  const rows = splitRows(text);
  const headerIdx = rows.findIndex((r) => !r.blank);
  if (headerIdx < 0) {
    issue(1, '(file)', 'The file is empty.');
    return { hours: [], issues: found.issues, issueCount: found.count };
  }
  const headerRow = rows[headerIdx]!;
  const headerLine = headerRow.line;
  if (headerRow.error) issue(headerLine, '(row)', headerRow.error);
  const header = headerRow.cells.map((c) => c.toLowerCase());
  const cols = new Map<CsvColumn, number>();
  header.forEach((name, idx) => {
    if (!(CSV_COLUMNS as readonly string[]).includes(name)) {
      issue(headerLine, name || `column ${idx + 1}`, `Unknown column; the columns are ${CSV_COLUMNS.join(', ')}.`);
    } else if (cols.has(name as CsvColumn)) {
      issue(headerLine, name, 'This column appears twice.');
    } else {
      cols.set(name as CsvColumn, idx);
    }
  });
  for (const req of ['time', 'ghi_w_m2'] as const) if (!cols.has(req)) issue(headerLine, req, `The header needs a "${req}" column.`);
  if (found.count) return { hours: [], issues: found.issues, issueCount: found.count };

  const hours: HourlyWeather[] = [];
  const seen = new Map<number, number>();
  let firstT: number | null = null;
  let firstLine = 0;
  for (const row of rows.slice(headerIdx + 1)) {
    if (row.blank) continue;
    const { line, cells } = row;
    if (row.error) {
      issue(line, '(row)', row.error);
      continue;
    }
    if (cells.length !== header.length) {
      issue(line, '(row)', `Expected ${header.length} fields as in the header, found ${cells.length}.`);
      continue;
    }
    let ok = true;
    const timeCell = cells[cols.get('time')!]!;
    const parsedTime = parseIsoWithOffset(timeCell);
    let t = Number.NaN;
    if ('error' in parsedTime) {
      issue(line, 'time', timeCell ? parsedTime.error : 'The time is missing.');
      ok = false;
    } else {
      t = parsedTime.ms;
      const dup = seen.get(t);
      if (dup !== undefined) {
        issue(line, 'time', `The same hour as line ${dup}; give each hour once.`);
        ok = false;
      } else if (firstT !== null && (t - firstT) % HOUR_MS !== 0) {
        issue(line, 'time', `Not a whole number of hours after line ${firstLine}; the hours must line up.`);
        ok = false;
      } else {
        seen.set(t, line);
        if (firstT === null) {
          firstT = t;
          firstLine = line;
        }
      }
    }
    const values: Partial<Record<Exclude<CsvColumn, 'time'>, number>> = {};
    for (const [name, idx] of cols) {
      if (name === 'time') continue;
      const cell = cells[idx]!;
      if (!cell) {
        if (name === 'ghi_w_m2') {
          issue(line, name, 'Global irradiance is required on every line.');
          ok = false;
        }
        continue;
      }
      const { min, max, unit } = CSV_RANGES[name];
      if (!NUMBER_RE.test(cell)) {
        issue(line, name, `Not a number: "${cell.slice(0, 20)}" (${unit}).`);
        ok = false;
        continue;
      }
      const v = Number(cell);
      if (v < min || v > max) {
        issue(line, name, `Must be between ${min} and ${max} ${unit}; got ${v}.`);
        ok = false;
        continue;
      }
      values[name] = v;
    }
    if (values.dhi_w_m2 !== undefined && values.ghi_w_m2 !== undefined && values.dhi_w_m2 > values.ghi_w_m2 + 1) {
      issue(line, 'dhi_w_m2', `Diffuse irradiance (${values.dhi_w_m2} W/m²) cannot exceed global irradiance (${values.ghi_w_m2} W/m²).`);
      ok = false;
    }
    if (!ok) continue;
    const h: HourlyWeather = { t, ghiWm2: values.ghi_w_m2!, tAirC: values.temp_c ?? Number.NaN };
    if (values.dni_w_m2 !== undefined && values.dhi_w_m2 !== undefined) {
      h.dniWm2 = values.dni_w_m2;
      h.dhiWm2 = values.dhi_w_m2;
    }
    if (values.wind_m_s !== undefined) h.windMS = values.wind_m_s;
    if (values.cloud_okta !== undefined) h.cloudOkta = values.cloud_okta;
    hours.push(h);
  }
  if (!hours.length && !found.count) issue(headerLine + 1, '(file)', 'The file has a header but no hours.');
  hours.sort((a, b) => a.t - b.t);
  return { hours, issues: found.issues, issueCount: found.count };
}
