/**
 * Seeded planning instances for the planner's tests and benchmark.
 *
 * Weather: a simple clear-sky beam curve for a two-axis tracking concentrator at 10° N on the March
 * equinox, noon at 12:00 UTC — elevation from sin e = sin φ sin δ + cos φ cos δ cos ω (δ = 0),
 * beam DNI = 1353·0.7^(AM^0.678) with AM = 1/sin e (Meinel & Meinel 1976, "Applied Solar Energy",
 * as quoted in PVEducation; secondary) — times a cloud factor 1 − 0.75·(N/8)^3.4 (Kasten & Czeplak 1980)
 * with the cloud cover N (oktas) a seeded random walk per half hour. Air 22–32 °C, peak at 14:00.
 * Not a forecast: numbers of the right order for benchmarking.
 */
import type { CookerSpec, PotSpec, WeatherStep } from '@/lib/thermal/types';
import type { PlannerBatch, PlannerCooker, PlannerProblem } from '@/lib/planner/types';
import { mulberry32 } from '@/lib/random';

export const DAY0 = Date.UTC(2024, 2, 20, 0, 0);
export const H = 3600_000;
export const at = (h: number, min = 0) => DAY0 + h * H + min * 60_000;

export function clearSkyBeamWm2(tMs: number, latitudeDeg = 10): number {
  const hours = (tMs - DAY0) / H;
  const omega = ((hours - 12) * 15 * Math.PI) / 180;
  const phi = (latitudeDeg * Math.PI) / 180;
  const sinE = Math.cos(phi) * Math.cos(omega);
  if (sinE <= 0.02) return 0;
  const am = 1 / sinE;
  return 1353 * Math.pow(0.7, Math.pow(am, 0.678));
}

export function kastenCzeplak(okta: number): number {
  return 1 - 0.75 * Math.pow(okta / 8, 3.4);
}

/** Minute weather from `fromH` to `toH` hours UTC with a seeded cloud walk of mean `meanOkta`. */
export function makeWeather(seed: number, meanOkta: number, fromH = 6, toH = 21): WeatherStep[] {
  const rng = mulberry32(seed);
  const out: WeatherStep[] = [];
  let okta = meanOkta;
  let block = -1;
  for (let t = at(fromH); t < at(toH); t += 60_000) {
    const b = Math.floor((t - DAY0) / (H / 2));
    if (b !== block) {
      block = b;
      okta = Math.min(8, Math.max(0, okta + (rng() - 0.5) * 3 + (meanOkta - okta) * 0.3));
    }
    const hours = (t - DAY0) / H;
    out.push({
      t,
      gApertureWm2: clearSkyBeamWm2(t) * kastenCzeplak(okta),
      tAirC: 27 + 5 * Math.cos(((hours - 14) / 24) * 2 * Math.PI),
      windMS: 1,
    });
  }
  return out;
}

export function pot(id: string, volumeL: number, uaWPerK = 40): PotSpec {
  return { id, volumeL, massKg: 0.12 * volumeL, cpJPerKgK: 900, coupling: { kind: 'constant', uaWPerK }, lidAreaM2: 0.07, lidUWPerM2K: 8 };
}

export function cookerSpec(opts: { apertureM2?: number; storeKg?: number; pots: PotSpec[]; nodes?: number }): CookerSpec {
  return {
    collector: { model: 'lumped', apertureM2: opts.apertureM2 ?? 2, eta0: 0.6, uLossWPerK: 3 },
    store: {
      mediumId: 'sunflower-oil',
      massKg: opts.storeKg ?? 60,
      uaLossWPerK: 1.5,
      maxSafeTempC: 200,
      minUsefulTempC: 100,
      ...(opts.nodes ? { nodes: opts.nodes } : {}),
    },
    pots: opts.pots,
  };
}

export function makeCooker(id: string, spec: CookerSpec, weather: WeatherStep[], initialStoreTempC = 60): PlannerCooker {
  return { id, name: `Cooker ${id}`, spec, weather, initialStoreTempC };
}

interface Dish {
  id: string;
  name: string;
  method: PlannerBatch['method'];
  /** per serving */
  foodKg: number;
  waterKg: number;
  cp: number;
  minTempC: number;
  holdS: number;
  lidOn: boolean;
  litresPerServing: number;
}

export const DISHES: Dish[] = [
  { id: 'rice', name: 'Rice', method: 'boil', foodKg: 0.08, waterKg: 0.16, cp: 1800, minTempC: 95, holdS: 1200, lidOn: true, litresPerServing: 0.3 },
  { id: 'beans', name: 'Bean stew', method: 'simmer', foodKg: 0.1, waterKg: 0.15, cp: 3000, minTempC: 90, holdS: 2700, lidOn: true, litresPerServing: 0.3 },
  { id: 'porridge', name: 'Maize porridge', method: 'simmer', foodKg: 0.07, waterKg: 0.2, cp: 2500, minTempC: 88, holdS: 900, lidOn: true, litresPerServing: 0.3 },
  { id: 'veg', name: 'Vegetable stew', method: 'simmer', foodKg: 0.12, waterKg: 0.08, cp: 3600, minTempC: 85, holdS: 1200, lidOn: true, litresPerServing: 0.25 },
  { id: 'chicken', name: 'Chicken stew', method: 'simmer', foodKg: 0.12, waterKg: 0.1, cp: 3300, minTempC: 80, holdS: 1500, lidOn: true, litresPerServing: 0.25 },
];

export function batchOf(id: string, dish: Dish, servings: number, earliestStartMs: number, serveByMs: number): PlannerBatch {
  return {
    id,
    dishId: dish.id,
    dishName: dish.name,
    servings,
    method: dish.method,
    potVolumeNeededL: Math.ceil(dish.litresPerServing * servings),
    foodKg: dish.foodKg * servings,
    foodCpJPerKgK: dish.cp,
    waterKg: dish.waterKg * servings,
    minTempC: dish.minTempC,
    holdS: dish.holdS,
    lidOn: dish.lidOn,
    earliestStartMs,
    serveByMs,
  };
}

/**
 * A seeded instance: `nCookers` cookers of varied size and weather, `nBatches` batches split
 * between lunch (serve by 12:00–13:30) and dinner (serve by 17:30–19:30).
 */
export function makeInstance(nCookers: number, nBatches: number, seed: number, timeLimitS = 2): PlannerProblem {
  const rng = mulberry32(seed * 7919 + 17);
  const cookers: PlannerCooker[] = [];
  for (let c = 0; c < nCookers; c++) {
    const nPots = 1 + Math.floor(rng() * 3);
    const pots = Array.from({ length: nPots }, (_, j) => pot(`p${j + 1}`, [40, 60, 80][Math.floor(rng() * 3)] as number, 30 + Math.floor(rng() * 30)));
    const spec = cookerSpec({ apertureM2: 1.5 + rng() * 2.5, storeKg: 40 + Math.floor(rng() * 80), pots });
    const weather = makeWeather(seed * 1000 + c, rng() * 5);
    cookers.push(makeCooker(`c${String(c + 1).padStart(2, '0')}`, spec, weather, 40 + rng() * 60));
  }
  const batches: PlannerBatch[] = [];
  for (let i = 0; i < nBatches; i++) {
    const dish = DISHES[Math.floor(rng() * DISHES.length)] as Dish;
    const servings = 60 + 20 * Math.floor(rng() * 8);
    const lunch = rng() < 0.5;
    const serveBy = lunch ? at(12) + Math.floor(rng() * 7) * 15 * 60_000 : at(17, 30) + Math.floor(rng() * 9) * 15 * 60_000;
    const earliest = serveBy - (3 + Math.floor(rng() * 4)) * H;
    batches.push(batchOf(`b${String(i + 1).padStart(3, '0')}`, dish, servings, earliest, serveBy));
  }
  return {
    cookers,
    batches,
    shifts: [
      { startMs: at(7), endMs: at(14) },
      { startMs: at(13), endMs: at(20) },
    ],
    turnaroundS: 900,
    slotMinutes: 15,
    altitudeM: 500,
    timeLimitS,
    seed,
  };
}

/**
 * A small seeded instance for exhaustive checks: two cookers with small stores (one with two pots),
 * 4–5 batches competing for the same afternoon, 30-min start grid.
 */
export function makeSmall(seed: number, nBatches = 5): PlannerProblem {
  const rng = mulberry32(seed * 104729 + 3);
  const cookers: PlannerCooker[] = [
    makeCooker('A', cookerSpec({ apertureM2: 1.2 + rng() * 0.8, storeKg: 30 + Math.floor(rng() * 30), pots: [pot('p1', 40, 35), pot('p2', 30, 30)] }), makeWeather(seed * 31 + 1, 1 + rng() * 3, 9, 19), 90 + rng() * 40),
    makeCooker('B', cookerSpec({ apertureM2: 1 + rng() * 0.8, storeKg: 30 + Math.floor(rng() * 30), pots: [pot('p1', 40, 40)] }), makeWeather(seed * 31 + 2, 1 + rng() * 3, 9, 19), 90 + rng() * 40),
  ];
  const batches: PlannerBatch[] = [];
  for (let i = 0; i < nBatches; i++) {
    const dish = DISHES[Math.floor(rng() * DISHES.length)] as Dish;
    const servings = 40 + 10 * Math.floor(rng() * 7);
    const serveBy = at(13) + Math.floor(rng() * 9) * 30 * 60_000;
    const earliest = serveBy - (2 + Math.floor(rng() * 3)) * H;
    batches.push(batchOf(`s${i + 1}`, dish, servings, earliest, serveBy));
  }
  return {
    cookers,
    batches,
    shifts: [{ startMs: at(9), endMs: at(18, 30) }],
    turnaroundS: 600,
    slotMinutes: 30,
    altitudeM: 0,
    timeLimitS: 3,
    seed: 1,
  };
}
