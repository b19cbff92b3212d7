/**
 * planDay with the real simulator (lib/thermal simulateCooker). Expected values come from an
 * independent exhaustive search (oracle.ts) or from the rules themselves; no number here is tuned.
 */
import { beforeAll, describe, expect, it } from 'vitest';
import { planDay, warmPlanner } from '@/lib/planner';
import type { PlannerProblem, PlannerResult } from '@/lib/planner/types';
import { simulateCooker } from '@/lib/thermal';
import type { CookerSpec, SimulateOptions, WeatherStep } from '@/lib/thermal/types';
import { at, batchOf, cookerSpec, DISHES, makeCooker, makeInstance, makeSmall, makeWeather, pot } from './fixtures';
import { exhaustiveBestServings, planViolations } from './oracle';
import { stubSimulate } from './stub-simulator';

const rice = DISHES[0] as (typeof DISHES)[number];
const stew = DISHES[3] as (typeof DISHES)[number];

/** The parts of a result that must not depend on the run (not times, not the log). */
function planOf(r: PlannerResult) {
  return {
    status: r.status,
    slots: r.slots,
    backup: r.backup,
    servingsOnSun: r.servingsOnSun,
    objective: r.objective,
    upperBound: r.upperBound,
    gap: r.gap,
    greedyServings: r.greedyServings,
    iterations: r.iterations,
  };
}

beforeAll(async () => {
  await warmPlanner();
}, 60_000);

describe('small instances: the planner matches an exhaustive search', () => {
  // Seeds chosen (by running the oracle) so that the greedy start is below the optimum and the
  // optimum is below "everything on the sun": the search has to find something.
  for (const seed of [4, 12, 16, 17]) {
    it(`makeSmall(${seed}): 2 cookers × 5 batches, 30-min grid`, async () => {
      // A generous limit so a loaded machine cannot cut the enumeration; it stops at the proof.
      const p = { ...makeSmall(seed, 5), timeLimitS: 30 };
      const oracle = exhaustiveBestServings(p);
      const total = p.batches.reduce((s, b) => s + b.servings, 0);
      expect(oracle.best).toBeLessThan(total);
      const r = await planDay(p);
      expect(planViolations(p, r)).toEqual([]);
      expect(r.servingsOnSun).toBe(oracle.best);
      expect(r.greedyServings).toBeLessThan(oracle.best);
      // Every subset was decided, so the plan is proven optimal and the bound is the optimum.
      expect(r.status).toBe('optimal');
      expect(r.upperBound).toBe(oracle.best);
      expect(r.gap).toBe(0);
    });
  }

  it('makeSmall(3) with 4 batches', async () => {
    const p = { ...makeSmall(3, 4), timeLimitS: 30 };
    const oracle = exhaustiveBestServings(p);
    const r = await planDay(p);
    expect(planViolations(p, r)).toEqual([]);
    expect(r.servingsOnSun).toBe(oracle.best);
  });

  it('without the exact enumeration the local search stays valid, at or above greedy, at or below the optimum', async () => {
    for (const seed of [4, 16]) {
      const p = makeSmall(seed, 5);
      const oracle = exhaustiveBestServings(p);
      const r = await planDay(p, { maxExactEvaluations: 0 });
      expect(planViolations(p, r)).toEqual([]);
      expect(r.servingsOnSun).toBeGreaterThanOrEqual(r.greedyServings);
      expect(r.servingsOnSun).toBeLessThanOrEqual(oracle.best);
      expect(r.upperBound).toBeGreaterThanOrEqual(oracle.best);
    }
  });
});

describe('backup reasons', () => {
  const spec = cookerSpec({ apertureM2: 1.5, storeKg: 60, pots: [pot('p1', 40, 40)] });
  const weather = makeWeather(11, 1, 9, 19);
  const base = (batches: PlannerProblem['batches'], store = 150): PlannerProblem => ({
    cookers: [makeCooker('A', spec, weather, store)],
    batches,
    shifts: [{ startMs: at(9), endMs: at(18) }],
    turnaroundS: 600,
    slotMinutes: 15,
    altitudeM: 0,
    timeLimitS: 2,
  });

  it('pot too small, outside shift hours, no cooker hot enough', async () => {
    const big = { ...batchOf('big', stew, 60, at(10), at(13)), potVolumeNeededL: 500 };
    const night = batchOf('night', stew, 60, at(5), at(8, 30));
    const fry = { ...batchOf('fry', stew, 40, at(10), at(13)), method: 'fry' as const, minTempC: 230, waterKg: 0 };
    const r = await planDay(base([big, night, fry]));
    const why = Object.fromEntries(r.backup.map((b) => [b.batchId, b]));
    expect(why.big?.reason).toBe('pot-too-small');
    expect(why.big?.detail).toMatch(/500 L.*40 L/);
    expect(why.night?.reason).toBe('outside-shift');
    // The store never exceeds its 200 °C safe limit: 230 °C cannot be reached.
    expect(why.fry?.reason).toBe('no-cooker-hot-enough');
    expect(why.fry?.detail).toMatch(/\d+ °C.*230 °C/);
    expect(r.slots).toEqual([]);
  });

  it('no free pot: two batches that each need the only pot for the same hour', async () => {
    // Hot store (180 °C), small batches: heat is plenty, the pot is the bottleneck.
    // Each holds 40 min; with the 10-min turnaround two cannot share 11:00–12:15.
    const a = { ...batchOf('a', stew, 40, at(11), at(12, 15)), holdS: 2400 };
    const b = { ...batchOf('b', stew, 40, at(11), at(12, 15)), holdS: 2400 };
    const r = await planDay(base([a, b], 180));
    expect(r.slots).toHaveLength(1);
    expect(r.backup).toHaveLength(1);
    expect(r.backup[0]?.reason).toBe('no-free-pot');
    expect(planViolations(base([a, b], 180), r)).toEqual([]);
  });
});

describe('final re-check with the full simulator', () => {
  // Two heavy rice batches back to back on one pot of a small store (40 kg oil, 0.8 m²).
  const p: PlannerProblem = {
    cookers: [makeCooker('A', cookerSpec({ apertureM2: 0.8, storeKg: 40, pots: [pot('p1', 60, 60)] }), makeWeather(7, 1, 9, 19), 170)],
    batches: [batchOf('heavy1', rice, 80, at(10), at(11, 30)), batchOf('heavy2', rice, 80, at(10, 30), at(12, 30))],
    shifts: [{ startMs: at(9), endMs: at(18) }],
    turnaroundS: 600,
    slotMinutes: 15,
    altitudeM: 0,
    timeLimitS: 3,
  };
  // A deliberately optimistic surrogate for the search: the store holds three times its heat.
  const optimistic = (s: CookerSpec, w: WeatherStep[], o: SimulateOptions) => simulateCooker({ ...s, store: { ...s.store, massKg: s.store.massKg * 3 } }, w, o);

  it('the optimistic search places both; the re-check sends one to backup with a reason a cook understands', async () => {
    const r = await planDay(p, { searchSimulate: optimistic });
    expect(r.log.some((l) => /re-check: .* fails/.test(l))).toBe(true);
    expect(r.slots).toHaveLength(1);
    const failed = r.backup.find((b) => b.reason === 'failed-recheck');
    expect(failed).toBeDefined();
    expect(failed?.detail).toMatch(/\d\d:\d\d/);
    expect(failed?.detail).toMatch(/°C/);
    // What is left is valid under the real simulator.
    expect(planViolations(p, r)).toEqual([]);
  });

  it('with the real simulator throughout, the same instance keeps one batch and nothing fails the re-check', async () => {
    const r = await planDay(p);
    expect(r.slots).toHaveLength(1);
    expect(r.backup.map((b) => b.reason)).toEqual(['no-cooker-hot-enough']);
    expect(planViolations(p, r)).toEqual([]);
  });
});

describe('determinism, greedy floor, re-planning', () => {
  it('same inputs → identical plan (iteration cap makes it independent of machine speed)', async () => {
    const p = makeInstance(3, 10, 5, 30);
    const a = await planDay(p, { maxIterations: 25 });
    const b = await planDay(p, { maxIterations: 25 });
    expect(planOf(b)).toEqual(planOf(a));
    expect(planViolations(p, a)).toEqual([]);
    expect(a.servingsOnSun).toBeGreaterThanOrEqual(a.greedyServings);
    expect(a.upperBound).toBeGreaterThanOrEqual(a.servingsOnSun);
  });

  it('3 cookers × 10 batches: valid, never below greedy, gap consistent with the bound', async () => {
    const p = makeInstance(3, 10, 2, 2);
    const r = await planDay(p);
    expect(planViolations(p, r)).toEqual([]);
    expect(r.servingsOnSun).toBeGreaterThanOrEqual(r.greedyServings);
    expect(r.gap).toBeCloseTo((r.upperBound - r.servingsOnSun) / r.upperBound, 12);
    expect(r.boundMethod.length).toBeGreaterThan(20);
  });

  it('re-planning from 11:00: a finished batch and a running batch stay; the rest is planned around them', async () => {
    const p0 = makeSmall(4, 5);
    const from = at(11);
    const cookers = p0.cookers.map((c) => ({ ...c, weather: c.weather.filter((w) => w.t >= from), initialStoreTempC: 120 }));
    const [b1, b2, ...rest] = p0.batches;
    if (!b1 || !b2) throw new Error('fixture');
    const done = { ...b1, fixed: { cookerId: 'A', potId: 'p1', startMs: at(9, 30), doneMs: at(10, 40) } };
    const running = { ...b2, earliestStartMs: at(10), fixed: { cookerId: 'A', potId: 'p2', startMs: at(10, 30), contentsTempC: 70 } };
    const p: PlannerProblem = { ...p0, cookers, batches: [done, running, ...rest] };
    const r = await planDay(p);
    const sd = r.slots.find((s) => s.batchId === done.id);
    expect(sd).toMatchObject({ fixed: true, cookerId: 'A', potId: 'p1', startMs: at(9, 30), doneMs: at(10, 40), predictedStoreTempAtStartC: null });
    const sr = r.slots.find((s) => s.batchId === running.id);
    if (sr) {
      expect(sr).toMatchObject({ fixed: true, cookerId: 'A', potId: 'p2', startMs: at(10, 30) });
    } else {
      expect(r.backup.find((b) => b.batchId === running.id)?.reason).toBe('failed-recheck');
    }
    expect(r.servingsOnSun).toBeGreaterThanOrEqual(done.servings);
    expect(planViolations(p, r)).toEqual([]);
    for (const s of r.slots.filter((x) => !x.fixed)) expect(s.startMs).toBeGreaterThanOrEqual(from);
  });
});

describe('stratified stores', () => {
  it('a 4-layer store: the search restarts approximately, the re-check keeps the plan valid', async () => {
    const p = makeSmall(12, 5);
    for (const c of p.cookers) c.spec.store.nodes = 4;
    const r = await planDay(p);
    expect(planViolations(p, r)).toEqual([]);
    expect(r.servingsOnSun).toBeGreaterThan(0);
  });
});

describe('dependency injection', () => {
  it('uses the simulator it is given (stub) for search and re-check', async () => {
    let calls = 0;
    const counting = (s: CookerSpec, w: WeatherStep[], o: SimulateOptions) => {
      calls++;
      return stubSimulate(s, w, o);
    };
    const r = await planDay(makeSmall(6, 4), { simulate: counting, noSolver: true });
    expect(calls).toBeGreaterThan(0);
    expect(r.slots.length + r.backup.length).toBe(4);
  });
});

describe('bad inputs name the field', () => {
  const ok = makeSmall(2, 2);
  const cases: [string, (p: PlannerProblem) => void, RegExp][] = [
    ['non-contiguous weather', (p) => ((p.cookers[0] as { weather: WeatherStep[] }).weather[1] = { ...(p.cookers[0]?.weather[1] as WeatherStep), t: 0 }), /cookers\[0\]\.weather\[1\]\.t/],
    ['negative servings', (p) => ((p.batches[0] as { servings: number }).servings = -1), /batches\[0\]\.servings/],
    ['serve-by before earliest start', (p) => ((p.batches[1] as { serveByMs: number }).serveByMs = 0), /batches\[1\]\.serveByMs/],
    ['unknown method', (p) => ((p.batches[0] as { method: string }).method = 'roast'), /batches\[0\]\.method/],
    ['shift ending before it starts', (p) => (p.shifts[0] = { startMs: at(12), endMs: at(11) }), /shifts\[0\]\.endMs/],
    ['turnaround not a number', (p) => (p.turnaroundS = Number.NaN), /turnaroundS/],
    ['duplicate batch id', (p) => ((p.batches[1] as { id: string }).id = p.batches[0]?.id ?? ''), /batches\[1\]\.id/],
    ['fixed on an unknown cooker', (p) => ((p.batches[0] as { fixed?: object }).fixed = { cookerId: 'Z', potId: 'p1', startMs: at(10) }), /batches\[0\]\.fixed\.cookerId/],
    ['slot minutes not whole', (p) => (p.slotMinutes = 7.5), /slotMinutes/],
    ['no shifts', (p) => (p.shifts = []), /shifts/],
  ];
  for (const [name, mutate, re] of cases) {
    it(name, async () => {
      const p = structuredClone(ok);
      mutate(p);
      await expect(planDay(p)).rejects.toThrow(RangeError);
      await expect(planDay(p)).rejects.toThrow(re);
    });
  }
});
