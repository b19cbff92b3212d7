/**
 * A small published day for the read-model tests: one cooker with two pots, three batches (two of one
 * dish), one on backup fuel. Times are epoch ms on an invented day (UTC kitchen).
 */
import type { DayInputs, DayPlan } from '@/lib/day/model';
import type { StoredBatch } from '@/lib/plan-records';

export const H = 3_600_000;
export const DAY0 = Date.UTC(2026, 11, 10);
export const at = (h: number) => DAY0 + h * H;

const batch = (id: string, lineId: string, index: number, of: number, over: Partial<StoredBatch> = {}): StoredBatch => ({
  id,
  lineId,
  dishId: lineId,
  dishName: lineId === 'rice' ? 'Rice' : 'Beans',
  method: 'boil',
  servings: 100,
  potVolumeNeededL: 30,
  foodKg: 8,
  foodCpJPerKgK: 1800,
  waterKg: 16,
  minTempC: 90,
  holdS: 1200,
  safeCoreTempC: 74,
  lidOn: true,
  backupStove: 'lpg',
  earliestStartMs: at(6),
  serveByMs: at(12),
  index,
  of,
  ...over,
});

export function dayPlan(): DayPlan {
  return {
    id: 'plan-1',
    version: 1,
    publishedAt: new Date(at(-4)).toISOString(),
    batches: [batch('rice-1', 'rice', 1, 2), batch('rice-2', 'rice', 2, 2), batch('beans-1', 'beans', 1, 1, { serveByMs: at(13), method: 'simmer' })],
    result: {
      status: 'converged',
      slots: [
        { batchId: 'rice-1', cookerId: 'c1', potId: 'p1', startMs: at(7), readyMs: at(8), doneMs: at(8.5), predictedStoreTempAtStartC: 150, predictedPotMaxC: 96 },
        { batchId: 'rice-2', cookerId: 'c1', potId: 'p2', startMs: at(9), readyMs: at(10), doneMs: at(10.5), predictedStoreTempAtStartC: 140, predictedPotMaxC: 95 },
      ],
      backup: [{ batchId: 'beans-1', reason: 'no-cooker-hot-enough', detail: 'the store would be 96 °C at 11:00; this dish needs 110 °C' }],
      servingsOnSun: 200,
      objective: 200,
      upperBound: 200,
      boundMethod: 'exact',
      gap: 0,
      solveTimeMs: 10,
      greedyServings: 200,
      iterations: 1,
      log: [],
    },
    cookers: [
      {
        id: 'c1',
        name: 'Dish 1',
        pots: [
          { id: 'p1', name: 'Pot A', volumeL: 40 },
          { id: 'p2', name: 'Pot B', volumeL: 40 },
        ],
        minUsefulTempC: 100,
        maxSafeTempC: 220,
        medium: { kind: 'oil', name: 'Sunflower oil', smokePointC: 225 },
        series: { t: [at(0), at(6), at(12)], storeTempC: [120, 140, 160], charge: [0.2, 0.4, 0.6] },
      },
    ],
    fuel: {
      currency: 'USD',
      perBatch: [{ batchId: 'beans-1', stoveId: 'lpg', fuelId: 'lpg', amount: 1.2, unit: 'kg', cost: null, co2Kg: 3.6, co2BiogenicKg: 0, usefulKWh: 5 }],
      byFuel: {},
      total: { cost: null, co2Kg: 3.6, co2BiogenicKg: 0, usefulKWh: 5 },
      allOnWood: { woodKg: 0, co2BiogenicKg: 0, cost: null },
      solarShareOfHeat: 0.6,
    },
  };
}

export function dayInputs(over: Partial<DayInputs> = {}): DayInputs {
  return {
    kitchen: { id: 'k1', name: 'Test kitchen', timeZone: 'UTC' },
    date: '2026-12-10',
    nowMs: at(5),
    plan: dayPlan(),
    checkIns: [],
    readings: new Map(),
    repredicted: new Map(),
    skippedFuel: [],
    ...over,
  };
}
