/**
 * The fallback chain getWeatherForDay against the test database, each source in turn: clear sky (nothing
 * stored), a fresh forecast, the same forecast 7 hours later (stale, with its age), a newer upload, a failed
 * fetch said alongside, and the kitchen's own clear-sky index. Clear sky is Ineichen & Perez 2002 from
 * lib/solar; the 6-hour staleness limit and the 0.75/0.6 defaults are common practice, no source.
 */
import { afterAll, beforeAll, describe, expect, inject, it } from 'vitest';
import { KitchenSchema } from '../../entities';
import { getWeatherForDay } from '../../lib/forecast/weather-for-day';
import { refreshKitchenForecast } from '../../lib/forecast/refresh';
import { recordFailedFetch, saveForecast } from '../../lib/forecast/store';
import { clearSkyHourly } from '../../lib/solar';
import { addDays, localDateString, zonedDayBoundsMs } from '../../lib/time';
import { createWorld, closeTestOrm, testOrm, type World } from '../helpers/fixtures';

const H = 3_600_000;
let w: World;
const em = async () => (await testOrm()).em.fork();
const T0 = Math.floor(Date.now() / H) * H + 5 * 60_000;
const tz = 'Africa/Ouagadougou';
const today = localDateString(T0, tz);
const tomorrow = addDays(today, 1);

beforeAll(async () => {
  w = await createWorld();
});
afterAll(closeTestOrm);

describe('getWeatherForDay', () => {
  it('nothing stored → clear sky × the default monthly index, over the day before and the day, said in the note', async () => {
    const r = await getWeatherForDay(await em(), w.kitchenB, tomorrow, { nowMs: T0 });
    expect(r.source).toBe('clear-sky');
    expect(r.fetchedAt).toBeNull();
    expect(r.ageS).toBeNull();
    const [start, end] = zonedDayBoundsMs(tomorrow, tz);
    expect(r.hourly[0]!.t).toBe(start - 25 * H);
    expect(r.hourly.at(-1)!.t).toBe(end);
    // December, 12° N: dry season default 0.75 × clear sky (tolerance for float sums).
    const clear = clearSkyHourly({ latitudeDeg: 12.37, longitudeDeg: -1.52, altitudeM: 300 }, r.hourly[0]!.t, r.hourly.at(-1)!.t + H);
    const k = r.clearness.values[new Date(start).getUTCMonth()]!;
    r.hourly.forEach((h, i) => expect(Math.abs(h.ghiWm2! - k * clear[i]!.ghiWm2!)).toBeLessThan(1e-6));
    expect(r.note).toMatch(/No forecast or upload covers this day/);
  });

  it('a fresh forecast → "forecast" with its age', async () => {
    const o = await refreshKitchenForecast(await em(), w.kitchenB, { baseUrl: inject('forecastUrl'), now: () => T0 });
    expect(o.status).toBe('stored');
    const r = await getWeatherForDay(await em(), w.kitchenB, tomorrow, { nowMs: T0 + 30 * 60_000 });
    expect(r.source).toBe('forecast');
    expect(r.ageS).toBe(1800);
    expect(r.issuedAt).toBe(new Date(Math.floor(T0 / H) * H).toISOString());
    expect(r.note).toBeNull();
    // The day and the day before (from yesterday 00:00 UTC) plus an hour each side where the forecast has them.
    expect(r.hourly.length).toBeGreaterThanOrEqual(49);
  });

  it('the same forecast 7 hours later → "stale-forecast" with its age', async () => {
    const r = await getWeatherForDay(await em(), w.kitchenB, tomorrow, { nowMs: T0 + 7 * H });
    expect(r.source).toBe('stale-forecast');
    expect(r.ageS).toBe(7 * 3600);
    expect(r.note).toMatch(/The newest forecast is 7 h old/);
  });

  it('a failed fetch after it is said, and the forecast still used', async () => {
    await recordFailedFetch(await em(), w.kitchenB, 'the forecast service answered HTTP 500 (after 3 tries)', T0 + 8 * H);
    const r = await getWeatherForDay(await em(), w.kitchenB, tomorrow, { nowMs: T0 + 8 * H + 60_000 });
    expect(r.source).toBe('stale-forecast');
    expect(r.lastFailure?.error).toMatch(/HTTP 500/);
    expect(r.note).toMatch(/last fetch from the forecast service failed/);
  });

  it('a newer upload covering the day → "upload"', async () => {
    const [start, end] = zonedDayBoundsMs(tomorrow, tz);
    const hours = clearSkyHourly({ latitudeDeg: 12.37, longitudeDeg: -1.52, altitudeM: 300 }, start - H, end).map((h) => ({ ...h, tAirC: Number.NaN }));
    await saveForecast(await em(), w.kitchenB, { source: 'upload', issuedAtMs: T0 + 9 * H, fetchedAtMs: T0 + 9 * H, hours, uploadName: 'station.csv', uploadMode: 'as-is' });
    const r = await getWeatherForDay(await em(), w.kitchenB, tomorrow, { nowMs: T0 + 9 * H + 60_000 });
    expect(r.source).toBe('upload');
    expect(r.uploadName).toBe('station.csv');
    // No temperature in the file: the typical daily cycle fills it, and the note says so.
    expect(r.hourly.every((h) => Number.isFinite(h.tAirC))).toBe(true);
    expect(r.note).toMatch(/No air temperature in the file/);
    // Another day is still on the (stale) forecast.
    expect((await getWeatherForDay(await em(), w.kitchenB, addDays(tomorrow, 1), { nowMs: T0 + 9 * H + 60_000 })).source).toBe('stale-forecast');
  });

  it('a day no forecast covers uses the kitchen’s own clear-sky index when set', async () => {
    const e = await em();
    const k = await e.findOneOrFail(KitchenSchema, { id: w.kitchenB.id });
    k.clearness = Array.from({ length: 12 }, () => 0.5);
    await e.flush();
    const r = await getWeatherForDay(e, k, addDays(tomorrow, 10), { nowMs: T0 });
    expect(r.source).toBe('clear-sky');
    expect(r.clearness).toEqual({ values: k.clearness, isDefault: false });
    expect(r.note).toMatch(/clear-sky index 0.5\./);
  });
});
