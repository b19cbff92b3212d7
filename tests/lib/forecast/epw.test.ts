/**
 * The EPW parser. The well-formed files below were written by hand following the published format description
 * (EnergyPlus Auxiliary Programs, "EnergyPlus Weather File (EPW) Data Dictionary": 8 header lines; LOCATION with
 * latitude, longitude, time zone and elevation; 35 fields per hourly row — year, month, day, hour 1–24, minute,
 * flags, dry bulb (7), …, global horizontal (14), direct normal (15), diffuse horizontal (16) radiation in
 * Wh/m², …, wind speed (22), total sky cover in tenths (23), …; missing codes 99.9, 9999, 999, 99).
 */
import { describe, expect, it } from 'vitest';
import { epwHoursAsIs, epwHoursTypical, epwRecordStartMs, parseEpw } from '@/lib/forecast/epw';

const FLAGS = '?9?9?9?9E0?9?9?9?9?9?9?9?9?9?9?9?9?9?9*9*9?9*9*9';

const header = (tz: string, lat = '12.35', lon = '-1.52', perHour = '1') => [
  `LOCATION,Ouagadougou,-,BFA,Hand-written test file,655030,${lat},${lon},${tz},306.0`,
  'DESIGN CONDITIONS,0',
  'TYPICAL/EXTREME PERIODS,0',
  'GROUND TEMPERATURES,0',
  'HOLIDAYS/DAYLIGHT SAVINGS,No,0,0,0',
  'COMMENTS 1,Written by hand for the Hearthcast tests',
  'COMMENTS 2,Values are plausible, not measured',
  `DATA PERIODS,1,${perHour},Data,Sunday, 1/ 1,12/31`,
];

/**
 * One hourly row in the data-dictionary order (35 fields). Only the fields we read vary; the others carry
 * plausible constants or their missing codes.
 */
function row(y: number, m: number, d: number, h: number, v: { t?: number | string; ghi?: number | string; dni?: number; dhi?: number; wind?: number | string; sky?: number }) {
  return [
    y, m, d, h, 0, FLAGS,
    v.t ?? 25.0, 8.0, 30, 97000, 0, 0, 380,
    v.ghi ?? 0, v.dni ?? 0, v.dhi ?? 0,
    999999, 999999, 999999, 9999, 90,
    v.wind ?? 2.0, v.sky ?? 0, 0, 30.0, 77777, 9, 999999999, 20, 0.1, 0, 88, 0.2, 0, 0,
  ].join(',');
}

/** A clear day: sun from hour 7 to hour 18 (local standard time), peaking at 900 Wh/m² for the hour ending 13:00. */
function day(y: number, m: number, d: number, extra: Partial<Record<number, Parameters<typeof row>[4]>> = {}) {
  return Array.from({ length: 24 }, (_, i) => {
    const h = i + 1;
    const s = Math.max(0, Math.sin((Math.PI * (h - 6.5)) / 13));
    return row(y, m, d, h, { t: 20 + 10 * s, ghi: Math.round(900 * s), dni: Math.round(800 * s), dhi: Math.round(120 * s), sky: 2, ...extra[h] });
  });
}

describe('parseEpw — well-formed', () => {
  const text = [...header('0.0'), ...day(2026, 12, 2), ...day(2026, 12, 3), ...day(2026, 12, 4)].join('\r\n') + '\r\n';
  const p = parseEpw(text);

  it('reads the LOCATION header', () => {
    expect(p.issues).toEqual([]);
    expect(p.location).toEqual({ city: 'Ouagadougou', latitudeDeg: 12.35, longitudeDeg: -1.52, timeZoneH: 0, elevationM: 306 });
    expect(p.records).toHaveLength(72);
  });

  it('reads the fields by position: dry bulb (7), radiation (14–16), wind (22), sky cover in tenths → okta (23)', () => {
    const r = p.records.find((x) => x.day === 3 && x.hour === 13)!;
    expect(Math.abs(r.tAirC! - (20 + 10 * Math.sin((Math.PI * 6.5) / 13)))).toBeLessThan(1e-9);
    expect(r.ghiWm2).toBe(900);
    expect(r.dniWm2).toBe(800);
    expect(r.dhiWm2).toBe(120);
    expect(r.windMS).toBe(2);
    expect(Math.abs(r.cloudOkta! - 1.6)).toBeLessThan(1e-12); // 2 tenths × 0.8
  });

  it('hour h covers (h − 1):00 to h:00 local standard time: hour 13 of 3 Dec at UTC+0 starts 12:00Z; at UTC+5.5, 06:30Z', () => {
    expect(epwRecordStartMs({ year: 2026, month: 12, day: 3, hour: 13 }, 0)).toBe(Date.UTC(2026, 11, 3, 12));
    expect(epwRecordStartMs({ year: 2026, month: 12, day: 3, hour: 13 }, 5.5)).toBe(Date.UTC(2026, 11, 3, 6, 30));
    expect(epwRecordStartMs({ year: 2026, month: 12, day: 3, hour: 1 }, -5)).toBe(Date.UTC(2026, 11, 3, 5));
  });

  it('as-is: the file’s hours on the dates asked for, in time order', () => {
    const { hours, issues } = epwHoursAsIs(p, ['2026-12-03']);
    expect(issues).toEqual([]);
    expect(hours).toHaveLength(24);
    expect(hours[0]!.t).toBe(Date.UTC(2026, 11, 3, 0));
    expect(hours[12]!.ghiWm2).toBe(900);
    expect(epwHoursAsIs(p, ['2027-12-03']).hours).toEqual([]);
  });

  it('typical day: the same month and day from any year, moved to the date; several years averaged', () => {
    const tmy = parseEpw([...header('0.0'), ...day(2005, 12, 3), ...day(2011, 12, 3, { 13: { ghi: 500, dni: 300, dhi: 200 } })].join('\n'));
    expect(tmy.issues).toEqual([]);
    const { hours } = epwHoursTypical(tmy, ['2026-12-03']);
    expect(hours).toHaveLength(24);
    expect(hours[0]!.t).toBe(Date.UTC(2026, 11, 3, 0));
    const noon = hours.find((h) => h.t === Date.UTC(2026, 11, 3, 12))!;
    expect(noon.ghiWm2).toBe(700); // (900 + 500) / 2
    expect(noon.dhiWm2).toBe(160);
    // 29 February falls back to 28 February.
    const feb = parseEpw([...header('0.0'), ...day(2005, 2, 28)].join('\n'));
    expect(epwHoursTypical(feb, ['2028-02-29']).hours[0]!.t).toBe(Date.UTC(2028, 1, 29, 0));
  });

  it('missing codes are read as missing, not as errors; a missing global radiation in a used hour is reported', () => {
    const m = parseEpw([...header('0.0'), ...day(2026, 12, 3, { 10: { t: 99.9, wind: 999, sky: 99 }, 11: { ghi: 9999 } })].join('\n'));
    expect(m.issues).toEqual([]);
    const r10 = m.records.find((r) => r.hour === 10)!;
    expect(r10.tAirC).toBeUndefined();
    expect(r10.windMS).toBeUndefined();
    expect(r10.cloudOkta).toBeUndefined();
    const { hours, issues } = epwHoursAsIs(m, ['2026-12-03']);
    expect(hours).toHaveLength(23);
    expect(Number.isNaN(hours.find((h) => h.t === Date.UTC(2026, 11, 3, 9))!.tAirC)).toBe(true);
    expect(issues).toEqual([{ t: Date.UTC(2026, 11, 3, 10), line: 19, field: 'global_horizontal_radiation', message: expect.stringMatching(/missing \(9999\)/) }]);
  });
});

describe('parseEpw — broken files', () => {
  const issues = (lines: string[]) => parseEpw(lines.join('\n')).issues.map((i) => `line ${i.line}.${i.field}: ${i.message}`);

  it('too short, or header lines out of place', () => {
    expect(issues(header('0.0'))).toEqual(['line 1.(file): An EPW file has 8 header lines and then one line per hour; this one has 8 lines.']);
    const h = header('0.0');
    h[3] = 'COMMENTS 1,misplaced';
    expect(issues([...h, ...day(2026, 12, 3)])).toEqual(['line 4.(header): Line 4 of an EPW file starts with "GROUND TEMPERATURES".']);
  });

  it('a bad LOCATION line, or sub-hourly data', () => {
    expect(issues([...header('0.0', '95'), ...day(2026, 12, 3)])).toEqual(['line 1.latitude: Must be a number between -90 and 90 °; got "95".']);
    expect(issues([...header('UTC'), ...day(2026, 12, 3)])).toEqual(['line 1.time_zone: Must be a number between -12 and 14 h; got "UTC".']);
    expect(issues([...header('0.0', '12.35', '-1.52', '4'), ...day(2026, 12, 3)])).toEqual(['line 8.records_per_hour: We read hourly EPW files (1 record per hour); this one has 4.']);
  });

  it('wrong field count, bad dates and hours', () => {
    const rows = day(2026, 12, 3);
    rows[0] = '2026,12,3,1,0';
    rows[1] = rows[1]!.replace(/^2026,12,3,2,/, '2026,13,3,2,');
    rows[2] = rows[2]!.replace(/^2026,12,3,3,/, '2026,2,30,3,');
    rows[3] = rows[3]!.replace(/^2026,12,3,4,/, '2026,12,3,25,');
    expect(issues([...header('0.0'), ...rows])).toEqual([
      'line 9.(row): Expected at least 23 fields (35 in a full EPW row), found 5.',
      'line 10.month: Must be a whole number from 1 to 12; got "13".',
      'line 11.day: 2026-02 has no day 30.',
      'line 12.hour: Must be a whole number from 1 to 24; got "25".',
    ]);
  });

  it('values out of range (not missing codes), not numbers, diffuse above global, duplicate hours', () => {
    const rows = day(2026, 12, 3, { 10: { wind: 45 }, 11: { t: 75 }, 12: { ghi: 'sunny' }, 13: { ghi: 100, dhi: 300 } });
    rows.push(rows[5]!);
    expect(issues([...header('0.0'), ...rows])).toEqual([
      'line 18.wind_speed: Must be between 0 and 40 m/s (missing: 999); got 45.',
      'line 19.dry_bulb_temperature: Must be between -70 and 70 °C (missing: 99.9); got 75.',
      'line 20.global_horizontal_radiation: Not a number: "sunny" (Wh/m²).',
      'line 21.diffuse_horizontal_radiation: Diffuse radiation (300 Wh/m²) cannot exceed global radiation (100 Wh/m²).',
      'line 33.hour: The same hour as line 14; give each hour once.',
    ]);
  });
});
