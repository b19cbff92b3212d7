/**
 * Local days ↔ UTC instants in zones with and without daylight-saving time.
 *
 * Expected instants are hand-computed from the published rules:
 * - Europe/Paris: CET = UTC+1, CEST = UTC+2; summer time starts on the last Sunday of March and ends on the last
 *   Sunday of October, both at 01:00 UTC (Directive 2000/84/EC of the European Parliament and of the Council,
 *   19 January 2001, Articles 2 and 3). In 2026 those Sundays are 29 March and 25 October.
 * - Africa/Dar_es_Salaam: EAT = UTC+3 all year, no summer time (IANA tz database, file `africa`, zone
 *   Africa/Dar_es_Salaam, rule "-" since 1961).
 * Each offset is also checked against the runtime's own ICU data through `Intl.DateTimeFormat`
 * (`timeZoneName: 'longOffset'`), a second source that does not go through date-fns.
 */
import { describe, expect, it } from 'vitest';
import { addDays, localDateString, tomorrowIn, zonedDayBoundsMs, zonedTimeToUtcMs, zoneOffsetMs } from '@/lib/time';

const H = 3_600_000;
const PARIS = 'Europe/Paris';
const DAR = 'Africa/Dar_es_Salaam';

/** Offset [ms] as Intl prints it ("GMT+02:00"), independent of date-fns. */
function intlOffsetMs(timeZone: string, atMs: number): number {
  const name = new Intl.DateTimeFormat('en-US', { timeZone, timeZoneName: 'longOffset' })
    .formatToParts(new Date(atMs))
    .find((p) => p.type === 'timeZoneName')!.value;
  const m = /^GMT(?:([+-])(\d{2}):(\d{2}))?$/.exec(name);
  if (!m) throw new Error(`unexpected offset name ${name}`);
  if (!m[1]) return 0;
  return (m[1] === '-' ? -1 : 1) * (Number(m[2]) * H + Number(m[3]) * 60_000);
}

describe('zoneOffsetMs', () => {
  it('Paris changes offset at 01:00 UTC on the EU change days (Directive 2000/84/EC)', () => {
    const springJump = Date.UTC(2026, 2, 29, 1, 0);
    const autumnJump = Date.UTC(2026, 9, 25, 1, 0);
    const cases: [number, number][] = [
      [springJump - 1000, 1 * H],
      [springJump, 2 * H],
      [autumnJump - 1000, 2 * H],
      [autumnJump, 1 * H],
      [Date.UTC(2026, 6, 1, 12), 2 * H],
      [Date.UTC(2026, 0, 15, 12), 1 * H],
    ];
    for (const [at, expected] of cases) {
      expect(zoneOffsetMs(PARIS, at)).toBe(expected);
      expect(intlOffsetMs(PARIS, at)).toBe(expected);
    }
  });

  it('Dar es Salaam is UTC+3 all year (IANA tz, no rule)', () => {
    for (const at of [Date.UTC(2026, 2, 29, 1), Date.UTC(2026, 6, 1), Date.UTC(2026, 9, 25, 1), Date.UTC(2026, 11, 31, 23)]) {
      expect(zoneOffsetMs(DAR, at)).toBe(3 * H);
      expect(intlOffsetMs(DAR, at)).toBe(3 * H);
    }
  });
});

describe('zonedDayBoundsMs', () => {
  it('the spring change day in Paris is 23 hours long', () => {
    const [start, end] = zonedDayBoundsMs('2026-03-29', PARIS);
    expect(start).toBe(Date.UTC(2026, 2, 28, 23)); // 00:00 CET = 23:00 UTC the day before
    expect(end).toBe(Date.UTC(2026, 2, 29, 22)); // 00:00 CEST on the 30th = 22:00 UTC
    expect(end - start).toBe(23 * H);
  });

  it('the autumn change day in Paris is 25 hours long', () => {
    const [start, end] = zonedDayBoundsMs('2026-10-25', PARIS);
    expect(start).toBe(Date.UTC(2026, 9, 24, 22)); // 00:00 CEST
    expect(end).toBe(Date.UTC(2026, 9, 25, 23)); // 00:00 CET on the 26th
    expect(end - start).toBe(25 * H);
  });

  it('an ordinary day is 24 hours, in Paris and in Dar es Salaam', () => {
    const [ps, pe] = zonedDayBoundsMs('2026-07-01', PARIS);
    expect([ps, pe]).toEqual([Date.UTC(2026, 5, 30, 22), Date.UTC(2026, 6, 1, 22)]);
    const [ds, de] = zonedDayBoundsMs('2026-03-29', DAR);
    expect([ds, de]).toEqual([Date.UTC(2026, 2, 28, 21), Date.UTC(2026, 2, 29, 21)]);
  });

  it('the last day of a year ends at the first instant of the next', () => {
    expect(zonedDayBoundsMs('2026-12-31', DAR)[1]).toBe(zonedDayBoundsMs('2027-01-01', DAR)[0]);
    expect(zonedDayBoundsMs('2026-12-31', PARIS)[1]).toBe(Date.UTC(2026, 11, 31, 23));
  });
});

describe('localDateString', () => {
  it('an instant near midnight falls on the local date, not the UTC date', () => {
    // 22:30 UTC on 28 March is 23:30 CET (still the 28th); 23:30 UTC is 00:30 CET on the 29th.
    expect(localDateString(Date.UTC(2026, 2, 28, 22, 30), PARIS)).toBe('2026-03-28');
    expect(localDateString(Date.UTC(2026, 2, 28, 23, 30), PARIS)).toBe('2026-03-29');
    // 21:59:59 UTC on 29 March is 23:59:59 CEST (the 29th); 22:00 UTC is midnight of the 30th.
    expect(localDateString(Date.UTC(2026, 2, 29, 21, 59, 59), PARIS)).toBe('2026-03-29');
    expect(localDateString(Date.UTC(2026, 2, 29, 22), PARIS)).toBe('2026-03-30');
    // Dar es Salaam: 21:00 UTC is midnight.
    expect(localDateString(Date.UTC(2026, 5, 30, 20, 59), DAR)).toBe('2026-06-30');
    expect(localDateString(Date.UTC(2026, 5, 30, 21, 0), DAR)).toBe('2026-07-01');
  });

  it('agrees with Intl at the day bounds (every bound is the first instant of its own local date)', () => {
    for (const date of ['2026-03-29', '2026-10-25', '2026-07-01']) {
      const [start, end] = zonedDayBoundsMs(date, PARIS);
      const intlDate = (ms: number) => new Intl.DateTimeFormat('en-CA', { timeZone: PARIS }).format(new Date(ms));
      expect(localDateString(start, PARIS)).toBe(date);
      expect(intlDate(start)).toBe(date);
      expect(localDateString(end - 1, PARIS)).toBe(date);
      expect(intlDate(end)).toBe(addDays(date, 1));
    }
  });
});

describe('zonedTimeToUtcMs', () => {
  it('spring: wall times before and after the skipped hour', () => {
    expect(zonedTimeToUtcMs('2026-03-29', PARIS, 1, 30)).toBe(Date.UTC(2026, 2, 29, 0, 30)); // CET
    expect(zonedTimeToUtcMs('2026-03-29', PARIS, 3, 0)).toBe(Date.UTC(2026, 2, 29, 1, 0)); // CEST
    expect(zonedTimeToUtcMs('2026-03-29', PARIS, 10, 0)).toBe(Date.UTC(2026, 2, 29, 8, 0)); // CEST
  });

  it('spring: a wall time in the skipped hour moves forward by the jump (02:30 → 03:30 CEST)', () => {
    expect(zonedTimeToUtcMs('2026-03-29', PARIS, 2, 30)).toBe(Date.UTC(2026, 2, 29, 1, 30));
  });

  it('autumn: wall times before and after the repeated hour; inside it, the later occurrence', () => {
    expect(zonedTimeToUtcMs('2026-10-25', PARIS, 1, 30)).toBe(Date.UTC(2026, 9, 24, 23, 30)); // CEST
    expect(zonedTimeToUtcMs('2026-10-25', PARIS, 3, 0)).toBe(Date.UTC(2026, 9, 25, 2, 0)); // CET
    expect(zonedTimeToUtcMs('2026-10-25', PARIS, 2, 30)).toBe(Date.UTC(2026, 9, 25, 1, 30)); // 02:30 CET
    expect(zonedTimeToUtcMs('2026-10-25', PARIS, 17, 0)).toBe(Date.UTC(2026, 9, 25, 16, 0)); // CET
  });

  it('no DST: Dar es Salaam is always 3 hours ahead', () => {
    expect(zonedTimeToUtcMs('2026-03-29', DAR, 2, 30)).toBe(Date.UTC(2026, 2, 28, 23, 30));
    expect(zonedTimeToUtcMs('2026-10-25', DAR, 10, 0)).toBe(Date.UTC(2026, 9, 25, 7, 0));
  });

  it('minutes past 59 carry into hours (the plan grid passes minutes of the day)', () => {
    expect(zonedTimeToUtcMs('2026-07-01', DAR, 0, 600)).toBe(zonedTimeToUtcMs('2026-07-01', DAR, 10, 0));
  });

  it('every wall time of a day lands on that local date and hour (round trip through Intl)', () => {
    for (const date of ['2026-03-29', '2026-10-25']) {
      for (let hh = 0; hh < 24; hh++) {
        if (date === '2026-03-29' && hh === 2) continue; // skipped hour, checked above
        const ms = zonedTimeToUtcMs(date, PARIS, hh, 15);
        const parts = new Intl.DateTimeFormat('en-CA', { timeZone: PARIS, hourCycle: 'h23', year: 'numeric', month: '2-digit', day: '2-digit', hour: '2-digit', minute: '2-digit' }).formatToParts(new Date(ms));
        const get = (t: string) => parts.find((p) => p.type === t)!.value;
        expect(`${get('year')}-${get('month')}-${get('day')} ${get('hour')}:${get('minute')}`).toBe(`${date} ${String(hh).padStart(2, '0')}:15`);
      }
    }
  });
});

describe('addDays and tomorrowIn', () => {
  it('adds calendar days across month, year and leap-day edges (Gregorian calendar)', () => {
    expect(addDays('2026-03-28', 1)).toBe('2026-03-29');
    expect(addDays('2026-12-31', 1)).toBe('2027-01-01');
    expect(addDays('2028-02-28', 1)).toBe('2028-02-29');
    expect(addDays('2026-03-01', -1)).toBe('2026-02-28');
    expect(addDays('2026-10-25', 7)).toBe('2026-11-01');
  });

  it('tomorrow is taken from the local date, not the UTC date', () => {
    // 23:30 UTC on 30 June is 02:30 on 1 July in Dar es Salaam: tomorrow there is 2 July.
    expect(tomorrowIn(DAR, Date.UTC(2026, 5, 30, 23, 30))).toBe('2026-07-02');
    expect(tomorrowIn(PARIS, Date.UTC(2026, 2, 28, 22, 30))).toBe('2026-03-29');
  });
});
