/**
 * Time-zone helpers (IANA zones): local calendar days ↔ UTC instants, on date-fns and `@date-fns/tz`.
 *
 * Wall times that do not exist (the hour skipped when clocks go forward) move forward by the jump
 * (Paris 2026-03-29 02:30 → 03:30 CEST); wall times that occur twice (the hour repeated when clocks go
 * back) take the later occurrence, after the change (Paris 2026-10-25 02:30 → 02:30 CET).
 */
import { TZDate, tzOffset } from '@date-fns/tz';
import { addDays as addCalendarDays, format } from 'date-fns';

const ymd = (dateStr: string) => dateStr.split('-').map(Number) as [number, number, number];

/** Offset of a zone from UTC at an instant [ms] (local − UTC). */
export function zoneOffsetMs(timeZone: string, atMs: number): number {
  return tzOffset(timeZone, new Date(atMs)) * 60_000;
}

/** UTC instant [ms] of a local wall-clock time in a zone; hh and mm may run past 23 and 59 (they carry). */
export function zonedTimeToUtcMs(dateStr: string, timeZone: string, hh = 0, mm = 0): number {
  const [y, m, d] = ymd(dateStr);
  return new TZDate(y, m - 1, d, hh, mm, timeZone).getTime();
}

/** [start, end) of a local calendar day as UTC instants [ms] (23 or 25 hours long on a day clocks change). */
export function zonedDayBoundsMs(dateStr: string, timeZone: string): [number, number] {
  const [y, m, d] = ymd(dateStr);
  const start = new TZDate(y, m - 1, d, timeZone);
  return [start.getTime(), addCalendarDays(start, 1).getTime()];
}

/** The local calendar date (YYYY-MM-DD) of an instant in a zone. */
export function localDateString(atMs: number, timeZone: string): string {
  return format(new TZDate(atMs, timeZone), 'yyyy-MM-dd');
}

/** Adds whole days to a YYYY-MM-DD date. */
export function addDays(dateStr: string, days: number): string {
  const [y, m, d] = ymd(dateStr);
  return format(addCalendarDays(new TZDate(y, m - 1, d, 'UTC'), days), 'yyyy-MM-dd');
}

/** Tomorrow's local date in a zone (the day leads usually plan). */
export function tomorrowIn(timeZone: string, nowMs = Date.now()): string {
  return addDays(localDateString(nowMs, timeZone), 1);
}
