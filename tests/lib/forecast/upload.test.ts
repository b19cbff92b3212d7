/**
 * Choosing an upload's hours for a kitchen's day (pure part of the upload): hours off the whole UTC hour are
 * put on it, the day must be covered in the kitchen's zone, and problems become one 422 with line-keyed fields.
 * Files written by hand after the documented formats (lib/forecast/csv.ts; EnergyPlus EPW data dictionary).
 */
import { describe, expect, it } from 'vitest';
import { HttpError } from '@/lib/http/errors';
import { alignToUtcHours, prepareUpload } from '@/lib/forecast/upload';

const H = 3_600_000;
const jodhpur = { timeZone: 'Asia/Kolkata', latitude: 26.2389, longitude: 73.0243 };

function epw(tz: string, lat: string, lon: string, days: [number, number, number][]) {
  const rows: string[] = [];
  for (const [y, m, d] of days) {
    for (let h = 1; h <= 24; h++) {
      const s = Math.max(0, Math.sin((Math.PI * (h - 0.5 - 6)) / 12));
      rows.push([y, m, d, h, 0, 'flags', (15 + 10 * s).toFixed(1), 5, 30, 99000, 0, 0, 300, Math.round(800 * s), Math.round(700 * s), Math.round(100 * s), 0, 0, 0, 0, 0, 1.5, 0, 0, 30, 77777, 9, 999999999, 10, 0.1, 0, 88, 0.2, 0, 0].join(','));
    }
  }
  return [`LOCATION,Jodhpur,RJ,IND,Hand-written,423390,${lat},${lon},${tz},224.0`, 'DESIGN CONDITIONS,0', 'TYPICAL/EXTREME PERIODS,0', 'GROUND TEMPERATURES,0', 'HOLIDAYS/DAYLIGHT SAVINGS,No,0,0,0', 'COMMENTS 1,-', 'COMMENTS 2,-', 'DATA PERIODS,1,1,Data,Sunday, 1/ 1,12/31', ...rows].join('\n');
}

function httpError(f: () => unknown): HttpError {
  try {
    f();
  } catch (err) {
    if (err instanceof HttpError) return err;
    throw err;
  }
  throw new Error('expected an HttpError');
}

describe('alignToUtcHours', () => {
  it('weights the two file hours a UTC hour straddles by their overlap (+05:30 → 30 min each)', () => {
    const t0 = Date.UTC(2026, 11, 3, 4, 30);
    const out = alignToUtcHours([
      { t: t0, ghiWm2: 400, dniWm2: 500, dhiWm2: 100, tAirC: 20, windMS: 2 },
      { t: t0 + H, ghiWm2: 600, dniWm2: 700, dhiWm2: 120, tAirC: 22 },
    ]);
    expect(out).toEqual([
      // Before the file: only its first hour overlaps, its values are held.
      { t: Date.UTC(2026, 11, 3, 4), ghiWm2: 400, dniWm2: 500, dhiWm2: 100, tAirC: 20, windMS: 2 },
      { t: Date.UTC(2026, 11, 3, 5), ghiWm2: 500, dniWm2: 600, dhiWm2: 110, tAirC: 21 },
      { t: Date.UTC(2026, 11, 3, 6), ghiWm2: 600, dniWm2: 700, dhiWm2: 120, tAirC: 22 },
    ]);
  });

  it('+05:45: 45 min from the earlier hour, 15 min from the later', () => {
    const t0 = Date.UTC(2026, 11, 3, 4, 15);
    const [, h] = alignToUtcHours([
      { t: t0, ghiWm2: 400, tAirC: 20 },
      { t: t0 + H, ghiWm2: 800, tAirC: 24 },
    ]);
    expect(h!.t).toBe(Date.UTC(2026, 11, 3, 5));
    expect(Math.abs(h!.ghiWm2! - (0.25 * 400 + 0.75 * 800))).toBeLessThan(1e-9);
  });

  it('leaves whole-hour series alone', () => {
    const hours = [{ t: Date.UTC(2026, 11, 3, 5), ghiWm2: 1, tAirC: 1 }];
    expect(alignToUtcHours(hours)).toEqual(hours);
  });
});

describe('prepareUpload', () => {
  it('a CSV of exactly one local day at +05:30 covers it (the edge half-hours are held)', () => {
    const lines = ['time,ghi_w_m2,temp_c'];
    for (let h = 0; h < 24; h++) lines.push(`2026-12-03T${String(h).padStart(2, '0')}:00+05:30,${h > 6 && h < 18 ? 500 : 0},25`);
    const p = prepareUpload(jodhpur, { fileName: 'x.csv', text: lines.join('\n'), date: '2026-12-03', mode: 'as-is' });
    expect(p.hours).toHaveLength(25);
    expect(p.hours[0]!.t).toBe(Date.UTC(2026, 11, 2, 18));
  });

  it('an EPW at UTC+5.5 for Jodhpur, as-is: hours on whole UTC hours covering the local day and the day before', () => {
    const text = epw('5.5', '26.30', '73.02', [[2026, 12, 1], [2026, 12, 2], [2026, 12, 3], [2026, 12, 4]]);
    const p = prepareUpload(jodhpur, { fileName: 'jodhpur.epw', text, date: '2026-12-03', mode: 'as-is' });
    expect(p.kind).toBe('epw');
    expect(p.warnings).toEqual([]);
    expect(p.hours.every((h) => h.t % H === 0)).toBe(true);
    // The local day 3 Dec (Asia/Kolkata) is 2 Dec 18:30Z – 3 Dec 18:30Z: UTC hours 18:00 (2 Dec) to 18:00 (3 Dec).
    const have = new Set(p.hours.map((h) => h.t));
    for (let t = Date.UTC(2026, 11, 2, 18); t <= Date.UTC(2026, 11, 3, 18); t += H) expect(have.has(t)).toBe(true);
  });

  it('a far-away station is said in a warning', () => {
    const text = epw('5.5', '28.6', '77.2', [[2026, 12, 2], [2026, 12, 3], [2026, 12, 4]]); // Delhi
    const p = prepareUpload(jodhpur, { fileName: 'delhi.epw', text, date: '2026-12-03', mode: 'as-is' });
    // Jodhpur–Delhi ≈ 490 km on the great circle (haversine, R = 6371 km; hand calculation).
    expect(p.warnings[0]).toMatch(/is 4[89]\d km from the kitchen/);
  });

  it('as-is with a typical-year file has no hours for the date: 422 saying to choose a typical day', () => {
    const text = epw('5.5', '26.30', '73.02', [[2005, 12, 2], [2005, 12, 3]]);
    const e = httpError(() => prepareUpload(jodhpur, { fileName: 'tmy.epw', text, date: '2026-12-03', mode: 'as-is' }));
    expect(e.status).toBe(422);
    expect(e.message).toMatch(/does not cover 2026-12-03 .*none of its hours.*typical day/);
    const ok = prepareUpload(jodhpur, { fileName: 'tmy.epw', text: epw('5.5', '26.30', '73.02', [[2005, 12, 2], [2005, 12, 3], [2005, 12, 4]]), date: '2026-12-03', mode: 'typical-day' });
    expect(ok.hours.length).toBeGreaterThanOrEqual(25);
  });

  it('a CSV missing hours of the day: 422 on date, with the first missing local hour', () => {
    const lines = ['time,ghi_w_m2,temp_c'];
    for (let h = 0; h < 20; h++) lines.push(`2026-12-03T${String(h).padStart(2, '0')}:00+05:30,${h > 6 && h < 18 ? 500 : 0},25`);
    const e = httpError(() => prepareUpload(jodhpur, { fileName: 'x.csv', text: lines.join('\n'), date: '2026-12-03', mode: 'as-is' }));
    expect(e.status).toBe(422);
    // Local hours 00–19 given (18:30Z on 2 Dec to 14:30Z on 3 Dec): UTC hours 15:00–18:00Z on 3 Dec are missing,
    // the first starting 20:30 local.
    expect(e.message).toMatch(/missing 4 hours from 20:30/);
    expect(e.fields?.date).toMatch(/The file covers/);
  });

  it('file problems: one 422 whose fields are keyed "line N.field", at most 20', () => {
    const lines = ['time,ghi_w_m2'];
    for (let i = 0; i < 30; i++) lines.push(`2026-12-03T${String(i % 24).padStart(2, '0')}:00Z,${i < 24 ? -1 : 5}`);
    const e = httpError(() => prepareUpload(jodhpur, { fileName: 'x.csv', text: lines.join('\n'), date: '2026-12-03', mode: 'as-is' }));
    expect(e.status).toBe(422);
    expect(e.message).toBe('The file has 30 problems; nothing was saved. The first 20 are listed.');
    expect(Object.keys(e.fields ?? {})).toHaveLength(20);
    expect(e.fields?.['line 2.ghi_w_m2']).toBe('Must be between 0 and 1500 W/m²; got -1.');
  });
});
