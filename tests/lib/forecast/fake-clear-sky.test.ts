/**
 * The forecast fake's cloudless sky against lib/solar and against Haurwitz 1945.
 * - vs lib/solar clearSkyHourly (Ineichen & Perez 2002, hourly means of 5-minute samples): the fake computes the
 *   same thing and rounds to 0.1 W/m², so the adapter's hours must agree to 0.05 W/m² (tight).
 * - vs Haurwitz (B. Haurwitz, J. Meteorol. 2:154–166, 1945: GHI = 1098·cos z·exp(−0.059/cos z)), a different
 *   empirical model with no site inputs: loose, within 15 % of the hour mean around solar noon on a clear day
 *   (our tolerance, common practice, no source); and zero at night for both.
 */
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { startForecastFake, type ForecastFake } from '@/lib/fakes/forecast';
import { fetchOpenMeteoForecast } from '@/lib/forecast/open-meteo';
import { clearSkyHaurwitz1945, clearSkyHourly, solarPositionSpa } from '@/lib/solar';

const H = 3_600_000;
const NOW = Date.UTC(2026, 11, 2, 10);
let fake: ForecastFake;

beforeAll(async () => {
  fake = await startForecastFake({ port: 0, clouds: false, now: () => NOW });
});
afterAll(() => fake.close());

const places = [
  { name: 'Ouagadougou', latitudeDeg: 12.3714, longitudeDeg: -1.5197, altitudeM: 305 },
  { name: 'Dodoma', latitudeDeg: -6.163, longitudeDeg: 35.7516, altitudeM: 1120 },
  { name: 'Jodhpur', latitudeDeg: 26.2389, longitudeDeg: 73.0243, altitudeM: 231 },
];

/** Mean of Haurwitz GHI over an hour, 12 five-minute samples, sun by NREL SPA (apparent zenith). */
function haurwitzHourMean(site: (typeof places)[number], t: number): number {
  let s = 0;
  for (let j = 0; j < 12; j++) {
    const p = solarPositionSpa({ timeMs: t + (j + 0.5) * 300_000, latitudeDeg: site.latitudeDeg, longitudeDeg: site.longitudeDeg, altitudeM: site.altitudeM });
    s += clearSkyHaurwitz1945(p.zenithDeg).ghiWm2;
  }
  return s / 12;
}

describe.each(places)('cloudless fake at $name', (site) => {
  it('equals lib/solar clearSkyHourly (Ineichen–Perez) hour by hour, within 0.05 W/m²', async () => {
    const f = await fetchOpenMeteoForecast(site, { baseUrl: fake.url });
    const ref = clearSkyHourly(site, f.hours[0]!.t, f.hours[f.hours.length - 1]!.t + H);
    expect(ref).toHaveLength(f.hours.length);
    let maxDiff = 0;
    f.hours.forEach((h, i) => {
      const r = ref[i]!;
      expect(r.t).toBe(h.t);
      maxDiff = Math.max(maxDiff, Math.abs((h.ghiWm2 ?? 0) - (r.ghiWm2 ?? 0)), Math.abs((h.dniWm2 ?? 0) - (r.dniWm2 ?? 0)), Math.abs((h.dhiWm2 ?? 0) - (r.dhiWm2 ?? 0)));
    });
    expect(maxDiff).toBeLessThanOrEqual(0.05 + 1e-9);
    expect(f.hours.every((h) => h.cloudOkta === 0)).toBe(true);
  });

  it('agrees with Haurwitz within 15 % around solar noon, and both are zero at night', async () => {
    const f = await fetchOpenMeteoForecast(site, { baseUrl: fake.url });
    // The hour containing solar noon of 3 December: UTC noon − longitude/15 h (equation of time ≈ +10 min then).
    const noonUtcH = 12 - site.longitudeDeg / 15 - 10 / 60;
    const t = Date.UTC(2026, 11, 3, Math.floor(noonUtcH));
    const h = f.hours.find((x) => x.t === t)!;
    const hz = haurwitzHourMean(site, t);
    const rel = Math.abs((h.ghiWm2 ?? 0) - hz) / hz;
    expect(rel).toBeLessThan(0.15);
    // Midnight local solar time: both zero.
    const tn = Date.UTC(2026, 11, 3, Math.floor((24 - site.longitudeDeg / 15) % 24));
    expect(f.hours.find((x) => x.t === tn)!.ghiWm2).toBe(0);
    expect(haurwitzHourMean(site, tn)).toBe(0);
  });
});
