/**
 * Time-zone helpers on Intl only (IANA zones): local calendar days ↔ UTC instants.
 */

/** Offset of a zone from UTC at an instant [ms] (local − UTC). */
export function zoneOffsetMs(timeZone: string, atMs: number): number {
  const parts = new Intl.DateTimeFormat('en-US', {
    timeZone,
    hourCycle: 'h23',
    year: 'numeric',
    month: '2-digit',
    day: '2-digit',
    hour: '2-digit',
    minute: '2-digit',
    second: '2-digit',
  }).formatToParts(new Date(atMs));
  const get = (t: string) => Number(parts.find((p) => p.type === t)?.value ?? 0);
  const asUtc = Date.UTC(get('year'), get('month') - 1, get('day'), get('hour'), get('minute'), get('second'));
  return asUtc - Math.floor(atMs / 1000) * 1000;
}

/** UTC instant of a local wall-clock time in a zone (two passes settle DST edges). */
export function zonedTimeToUtcMs(dateStr: string, timeZone: string, hh = 0, mm = 0): number {
  const [y, m, d] = dateStr.split('-').map(Number) as [number, number, number];
  const naive = Date.UTC(y, m - 1, d, hh, mm);
  let utc = naive - zoneOffsetMs(timeZone, naive);
  utc = naive - zoneOffsetMs(timeZone, utc);
  return utc;
}

/** [start, end) of a local calendar day as UTC instants [ms]. */
export function zonedDayBoundsMs(dateStr: string, timeZone: string): [number, number] {
  const start = zonedTimeToUtcMs(dateStr, timeZone);
  const [y, m, d] = dateStr.split('-').map(Number) as [number, number, number];
  const next = new Date(Date.UTC(y, m - 1, d + 1)).toISOString().slice(0, 10);
  return [start, zonedTimeToUtcMs(next, timeZone)];
}

/** The local calendar date (YYYY-MM-DD) of an instant in a zone. */
export function localDateString(atMs: number, timeZone: string): string {
  return new Date(atMs + zoneOffsetMs(timeZone, atMs)).toISOString().slice(0, 10);
}

/** Adds whole days to a YYYY-MM-DD date. */
export function addDays(dateStr: string, days: number): string {
  const [y, m, d] = dateStr.split('-').map(Number) as [number, number, number];
  return new Date(Date.UTC(y, m - 1, d + days)).toISOString().slice(0, 10);
}

/** Tomorrow's local date in a zone (the day leads usually plan). */
export function tomorrowIn(timeZone: string, nowMs = Date.now()): string {
  return addDays(localDateString(nowMs, timeZone), 1);
}
