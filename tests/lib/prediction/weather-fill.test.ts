/**
 * Filling a forecast's missing hours with clear sky × the monthly clear-sky index, and predictDay passing the
 * weather's source and age through. Clear sky is lib/solar's Ineichen & Perez 2002 (clearSkyHourly).
 */
import { describe, expect, it } from 'vitest';
import { clearSkyHourly, type HourlyWeather } from '@/lib/solar';
import { clearSkyWithClearness, fillWithClearSky } from '@/lib/prediction/weather-fill';
import { predictDay } from '@/lib/prediction/predict-day';
import { referenceCooker } from '../thermal/fixtures';

const H = 3_600_000;
const site = { latitudeDeg: 12.3714, longitudeDeg: -1.5197, altitudeM: 305 };
const geometry = { tracking: 'two-axis' as const, tiltDeg: 0, surfaceAzimuthDeg: 180, beamOnly: true };

describe('clearSkyWithClearness', () => {
  it('scales each hour by its own UTC month’s value', () => {
    const monthly = Array.from({ length: 12 }, (_, m) => (m === 10 ? 0.5 : 0.8)); // November 0.5, December 0.8
    const from = Date.UTC(2026, 10, 30, 6);
    const hours = clearSkyWithClearness(site, from, from + 30 * H, monthly);
    expect(hours).toHaveLength(30);
    const clear = clearSkyHourly(site, from, from + 30 * H);
    for (let i = 0; i < hours.length; i++) {
      const k = new Date(hours[i]!.t).getUTCMonth() === 10 ? 0.5 : 0.8;
      // GHI is scaled exactly (the split then follows Erbs et al. 1982); tolerance for float sums.
      expect(Math.abs(hours[i]!.ghiWm2! - k * clear[i]!.ghiWm2!)).toBeLessThan(1e-9);
      expect(hours[i]!.t).toBe(clear[i]!.t);
    }
  });

  it('refuses a table that is not 12 months', () => {
    expect(() => clearSkyWithClearness(site, 0, H, [0.7, 0.7])).toThrow(/12 monthly values/);
  });
});

describe('fillWithClearSky', () => {
  const from = Date.UTC(2026, 11, 2, 0);
  const to = from + 48 * H;
  const forecast: HourlyWeather[] = Array.from({ length: 30 }, (_, i) => ({ t: from + (10 + i) * H, ghiWm2: 111, tAirC: 22 }));

  it('keeps the given hours and fills the others, before, after and inside', () => {
    const gap = forecast.filter((h) => h.t !== from + 20 * H);
    const { hourly, filledMs } = fillWithClearSky(site, from, to, gap, 0.75);
    expect(hourly).toHaveLength(48);
    for (let i = 1; i < 48; i++) expect(hourly[i]!.t - hourly[i - 1]!.t).toBe(H);
    expect(filledMs).toHaveLength(48 - 29);
    expect(filledMs).toContain(from + 20 * H);
    expect(hourly[15]!.ghiWm2).toBe(111);
    expect(hourly[20]!.ghiWm2).not.toBe(111);
  });

  it('changes nothing when the series is complete', () => {
    const full: HourlyWeather[] = Array.from({ length: 48 }, (_, i) => ({ t: from + i * H, ghiWm2: 5, tAirC: 20 }));
    const r = fillWithClearSky(site, from, to, full, 0.75);
    expect(r.filledMs).toEqual([]);
    expect(r.hourly).toEqual(full);
  });

  it('refuses hours off the whole UTC hour', () => {
    expect(() => fillWithClearSky(site, from, to, [{ t: from + 1800_000, ghiWm2: 1, tAirC: 1 }], 1)).toThrow(/whole UTC hour/);
  });
});

describe('predictDay with a partial forecast', () => {
  const date = '2026-12-03';
  const spec = referenceCooker('sunflower-oil');
  // A cloudy forecast for the day itself only (none for the day before): 40 % of clear sky.
  const dayHours = clearSkyHourly(site, Date.UTC(2026, 11, 3, 0), Date.UTC(2026, 11, 4, 1)).map((h) => ({ ...h, ghiWm2: h.ghiWm2! * 0.4, dniWm2: h.dniWm2! * 0.2, dhiWm2: h.dhiWm2! }));

  it('fills the day before with clear sky × clearness and passes the source and age through', () => {
    const p = predictDay({
      site,
      timeZone: 'Africa/Ouagadougou',
      date,
      spec,
      geometry,
      hourly: dayHours,
      weather: { source: 'stale-forecast', issuedAt: '2026-12-02T00:00:00.000Z', fetchedAt: '2026-12-02T00:10:00.000Z', ageS: 30_000, note: 'old' },
      clearness: 0.75,
    });
    expect(p.source).toBe('stale-forecast');
    expect(p.weather.ageS).toBe(30_000);
    expect(p.weather.note).toBe('old');
    // The day before (24 h) and the hour before it are filled; the day itself is not.
    expect(p.weather.filledHours).toBe(25);
    expect(p.weather.filledHoursInDay).toBe(0);
    // The forecast's clouds reach the aperture: less sun than on a clear day (balance closes as usual).
    const clear = predictDay({ site, timeZone: 'Africa/Ouagadougou', date, spec, geometry });
    expect(clear.source).toBe('clear-sky');
    expect(clear.weather.filledHoursInDay).toBe(24);
    const sum = (a: number[]) => a.reduce((x, y) => x + y, 0);
    expect(sum(p.series.gApertureWm2)).toBeLessThan(0.5 * sum(clear.series.gApertureWm2));
    expect(Math.abs(p.balance.relativeError)).toBeLessThan(1e-6);
  });

  it('says clear sky when the given weather misses the day entirely', () => {
    const other = clearSkyHourly(site, Date.UTC(2026, 11, 10), Date.UTC(2026, 11, 11));
    const p = predictDay({ site, timeZone: 'Africa/Ouagadougou', date, spec, geometry, hourly: other, weather: { source: 'forecast', issuedAt: null, fetchedAt: null, ageS: 0, note: null } });
    expect(p.source).toBe('clear-sky');
    expect(p.weather.note).toMatch(/does not cover this day/);
  });
});
