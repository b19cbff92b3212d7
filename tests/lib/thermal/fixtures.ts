/** Shared fixtures for the thermal tests: a seeded PRNG, weather builders and a reference cooker. */
import type { CookerSpec, PotLoad, WeatherStep } from '@/lib/thermal';
import { mulberry32 } from '@/lib/random';

export { mulberry32 };

export const T0_MS = Date.UTC(2026, 2, 1, 0, 0, 0);
export const MIN_MS = 60_000;
export const HOUR_MS = 3_600_000;

/** Constant weather: n one-minute steps. */
export function constantWeather(n: number, gApertureWm2: number, tAirC: number, windMS = 0): WeatherStep[] {
  const w: WeatherStep[] = [];
  for (let i = 0; i < n; i++) w.push({ t: T0_MS + i * MIN_MS, gApertureWm2, tAirC, windMS });
  return w;
}

/**
 * Varied weather for `days` days of one-minute steps: a clear-sky-like sine for the sun (06:00–18:00) cut by random
 * clouds that persist for random spells, a diurnal air temperature and gusty wind, all from a seeded PRNG.
 */
export function variedWeather(days: number, seed: number): WeatherStep[] {
  const rnd = mulberry32(seed);
  const w: WeatherStep[] = [];
  let cloud = 1;
  let spell = 0;
  for (let d = 0; d < days; d++) {
    const peak = 700 + 250 * rnd();
    const tMean = 22 + 8 * rnd();
    for (let m = 0; m < 1440; m++) {
      if (spell <= 0) {
        cloud = rnd() < 0.3 ? 0.1 + 0.5 * rnd() : 1;
        spell = 5 + Math.floor(60 * rnd());
      }
      spell--;
      const hr = m / 60;
      const sun = hr > 6 && hr < 18 ? Math.sin((Math.PI * (hr - 6)) / 12) : 0;
      w.push({
        t: T0_MS + (d * 1440 + m) * MIN_MS,
        gApertureWm2: peak * sun * cloud,
        tAirC: tMean + 6 * Math.sin((Math.PI * (hr - 9)) / 12) + rnd(),
        windMS: 3 * rnd(),
      });
    }
  }
  return w;
}

/** A community-kitchen cooker: 2.5 m² concentrator, 60 kg store, two 30 L pots (the store medium is set per test). */
export function referenceCooker(mediumId: string, nodes = 1): CookerSpec {
  return {
    collector: { model: 'iso9806', apertureM2: 2.5, eta0: 0.62, a1: 1.2, a2: 0.004 },
    store: { mediumId, massKg: 60, uaLossWPerK: 2.0, uaWindWPerKPerMS: 0.15, nodes, maxSafeTempC: 180, minUsefulTempC: 95 },
    pots: [
      { id: 'big', volumeL: 30, massKg: 4, cpJPerKgK: 900, coupling: { kind: 'natural-convection', contactAreaM2: 0.25 }, lidAreaM2: 0.09, lidUWPerM2K: 8 },
      { id: 'small', volumeL: 15, massKg: 2.5, cpJPerKgK: 500, coupling: { kind: 'constant', uaWPerK: 12 }, lidAreaM2: 0.05, lidUWPerM2K: 8 },
    ],
  };
}

/** Two or three batches a day on the two pots of referenceCooker (water dishes and a frying batch). */
export function dailyLoads(days: number): PotLoad[] {
  const loads: PotLoad[] = [];
  for (let d = 0; d < days; d++) {
    const base = T0_MS + d * 24 * HOUR_MS;
    loads.push({ id: `rice-${d}`, potId: 'big', startMs: base + 10 * HOUR_MS + 13 * MIN_MS, foodKg: 4, foodCpJPerKgK: 1800, waterKg: 8, lidOn: true, minTempC: 90, holdS: 1200, maxEndMs: base + 13 * HOUR_MS });
    loads.push({ id: `beans-${d}`, potId: 'big', startMs: base + 14 * HOUR_MS, foodKg: 5, foodCpJPerKgK: 3200, waterKg: 6, lidOn: false, minTempC: 85, holdS: 2400, maxEndMs: base + 19 * HOUR_MS });
    loads.push({ id: `fry-${d}`, potId: 'small', startMs: base + 17 * HOUR_MS + 30 * MIN_MS, foodKg: 6, foodCpJPerKgK: 2100, waterKg: 0, lidOn: false, minTempC: 120, holdS: 600, maxEndMs: base + 21 * HOUR_MS });
  }
  return loads;
}
