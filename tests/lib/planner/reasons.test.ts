/**
 * Backup reasons hold for the plan they explain: each reason's claim is rebuilt from the final
 * plan's slots (and the real simulator through the oracle, oracle.ts), independently of the
 * planner's code that chose the reason.
 */
import { beforeAll, describe, expect, it } from 'vitest';
import { planDay, warmPlanner } from '@/lib/planner';
import type { BackupBatch, PlannerBatch, PlannerProblem, PlannerResult } from '@/lib/planner/types';
import { at, batchOf, cookerSpec, DAY0, DISHES, makeCooker, makeInstance, makeSmall, makeWeather, pot } from './fixtures';
import { simulateCookerLoads, type OracleLoad } from './oracle';
import { buildModel, CookerEvaluator } from '@/lib/planner/model';
import { buildRelaxation } from '@/lib/planner/relaxation';
import { backupReasons } from '@/lib/planner/report';
import { PotScreen } from '@/lib/planner/screen';
import { simulateCooker } from '@/lib/thermal';

const stew = DISHES[1] as (typeof DISHES)[number];
const veg = DISHES[3] as (typeof DISHES)[number];

beforeAll(async () => {
  await warmPlanner();
}, 60_000);

/** Shifts merged where they overlap or touch (common practice, no source). */
function mergedShifts(p: PlannerProblem): { startMs: number; endMs: number }[] {
  const out: { startMs: number; endMs: number }[] = [];
  for (const s of [...p.shifts].sort((a, z) => a.startMs - z.startMs)) {
    const last = out[out.length - 1];
    if (last && s.startMs <= last.endMs) last.endMs = Math.max(last.endMs, s.endMs);
    else out.push({ ...s });
  }
  return out;
}

interface Window {
  cookerId: string;
  potId: string;
  startMs: number;
}

/**
 * Where batch b could go next to the final plan's slots: every pot large enough, every grid start
 * from its earliest start inside a shift, the pot not occupied then (a slot from start to done plus
 * turnaround), and the hold fitting before serve-by, the shift's end, the forecast's end and the next
 * slot on that pot less turnaround. `slots` empty: the windows of an empty plan.
 */
function windows(p: PlannerProblem, b: PlannerBatch, slots: PlannerResult['slots']): Window[] {
  const grid = (p.slotMinutes ?? 15) * 60_000;
  const turn = p.turnaroundS * 1000;
  const hold = b.holdS * 1000;
  const shifts = mergedShifts(p);
  const out: Window[] = [];
  for (const c of p.cookers) {
    const t0 = c.weather[0]?.t ?? 0;
    const tEnd = t0 + c.weather.length * 60_000;
    for (const pt of c.spec.pots) {
      if (pt.volumeL < b.potVolumeNeededL) continue;
      const mine = slots.filter((s) => s.cookerId === c.id && s.potId === pt.id);
      for (let s = Math.ceil(Math.max(b.earliestStartMs, t0) / grid) * grid; s + hold <= Math.min(b.serveByMs, tEnd); s += grid) {
        const sh = shifts.find((x) => x.startMs <= s && s < x.endMs);
        if (!sh) continue;
        let maxEnd = Math.min(b.serveByMs, sh.endMs, tEnd);
        let free = true;
        for (const o of mine) {
          if (o.startMs <= s && s < o.doneMs + turn) free = false;
          if (o.startMs > s) maxEnd = Math.min(maxEnd, o.startMs - turn);
        }
        if (free && s + hold <= maxEnd) out.push({ cookerId: c.id, potId: pt.id, startMs: s });
      }
    }
  }
  return out;
}

/** The final plan's loads on a cooker (finished fixed batches left out), for the oracle. */
function loadsOf(p: PlannerProblem, r: PlannerResult, cookerId: string): OracleLoad[] {
  return r.slots
    .filter((s) => s.cookerId === cookerId)
    .map((s) => ({ batch: p.batches.find((x) => x.id === s.batchId) as PlannerBatch, potId: s.potId, startMs: s.startMs }))
    .filter((l) => l.batch.fixed?.doneMs === undefined);
}

/** "HH:MM" (UTC, the fixtures' zone) on the fixtures' day → epoch ms. */
function clockMs(hhmm: string): number {
  const [h, mm] = hhmm.split(':').map(Number);
  return DAY0 + (h as number) * 3600_000 + (mm as number) * 60_000;
}

/**
 * Boiling point of water at altitude from sources other than lib/thermal's Antoine fit: ISA pressure
 * p = 101325·(1 − 2.25577e-5·h)^5.25588 Pa (ISO 2533:1975), then the Clausius–Clapeyron equation
 * 1/T = 1/T0 − R·ln(p/p0)/ΔH_vap with T0 = 373.15 K at p0 = 101325 Pa, ΔH_vap = 40.65 kJ/mol at
 * 100 °C and R = 8.314 J/(mol·K) (CRC Handbook of Chemistry and Physics, enthalpy of vaporisation
 * of water; from memory). Constant ΔH_vap makes it good to a few tenths of a kelvin near 100 °C.
 */
function boilingPointClausiusClapeyronC(altitudeM: number): number {
  const p = 101325 * Math.pow(1 - 2.25577e-5 * altitudeM, 5.25588);
  const invT = 1 / 373.15 - (8.314 * Math.log(p / 101325)) / 40650;
  return 1 / invT - 273.15;
}

/** Rebuilds the claim of one backup reason from the final plan; returns what does not hold. */
function claimProblems(p: PlannerProblem, r: PlannerResult, bk: BackupBatch): string[] {
  const b = p.batches.find((x) => x.id === bk.batchId) as PlannerBatch;
  const bad: string[] = [];
  const free = windows(p, b, r.slots);
  switch (bk.reason) {
    case 'pot-too-small':
      if (p.cookers.some((c) => c.spec.pots.some((x) => x.volumeL >= b.potVolumeNeededL))) bad.push('a pot is large enough');
      break;
    case 'outside-shift':
      if (windows(p, b, []).length > 0) bad.push('a shift leaves room for the hold');
      break;
    case 'no-free-pot':
      // "no pot large enough is free for the hold within a shift …: other batches occupy them".
      if (free.length > 0) bad.push(`pot ${free[0]?.potId} of ${free[0]?.cookerId} is free at ${new Date(free[0]?.startMs ?? 0).toISOString()}`);
      if (windows(p, b, []).length === 0) bad.push('the pots are not free even without other batches');
      break;
    case 'no-cooker-hot-enough': {
      // No free start works next to the final plan (the real simulator on the whole cooker).
      for (const w of free) {
        const c = p.cookers.find((x) => x.id === w.cookerId);
        if (!c) continue;
        const sim = simulateCookerLoads(p, c, [...loadsOf(p, r, c.id), { batch: b, potId: w.potId, startMs: w.startMs }]);
        if (sim) bad.push(`it works on ${w.potId} of ${w.cookerId} at ${new Date(w.startMs).toISOString()}`);
      }
      // The hottest store named: the store of that cooker's final plan at that time.
      const m = /hottest store while a pot large enough is free (?:would be|is) (\d+) °C at (\d\d:\d\d) \((.+?)\)/.exec(bk.detail);
      if (m) {
        const c = p.cookers.find((x) => x.name === m[3]);
        const sim = c ? simulateCookerLoads(p, c, loadsOf(p, r, c.id)) : null;
        const t0 = c?.weather[0]?.t ?? 0;
        const i = Math.round((clockMs(m[2] as string) - t0) / 60_000);
        const tStore = sim?.series.storeTempC[i];
        // The detail rounds to whole degrees: 0.5 K plus 0.1 K for the two simulators' sums.
        if (tStore === undefined || Math.abs(tStore - Number(m[1])) > 0.6) bad.push(`store ${tStore} °C at ${m[2]}, detail says ${m[1]} °C`);
        const cold = /would be/.test(bk.detail);
        if (cold && Number(m[1]) >= b.minTempC) bad.push('the "too cold" store is at the dish minimum');
      }
      break;
    }
    case 'above-boiling-point': {
      const tb = boilingPointClausiusClapeyronC(p.altitudeM);
      if (!(b.minTempC > tb + 0.5 && b.waterKg > 0)) bad.push(`${b.minTempC} °C is not above the boiling point ${tb.toFixed(1)} °C`);
      break;
    }
    case 'not-placed': {
      const m = /on pot (\S+) of (.+?) at (\d\d:\d\d)/.exec(bk.detail);
      const c = p.cookers.find((x) => x.name === m?.[2]);
      if (!m || !c || !simulateCookerLoads(p, c, [...loadsOf(p, r, c.id), { batch: b, potId: m[1] as string, startMs: clockMs(m[3] as string) }])) bad.push('the named start does not work');
      break;
    }
    case 'failed-recheck':
      // About the sequence the re-check removed it from, which is not in the final plan.
      break;
  }
  return bad.map((x) => `${bk.batchId} (${bk.reason}): ${x}`);
}

/** One hot cooker with one 40 L pot, one cold cooker with two empty 60 L pots, two batches for the same hour. */
function coldEmptyPots(): PlannerProblem {
  const weather = makeWeather(11, 1, 9, 19);
  const dim = makeWeather(12, 8, 9, 19).map((w) => ({ ...w, gApertureWm2: 0.05 * w.gApertureWm2 }));
  const a = { ...batchOf('a', veg, 40, at(11), at(12, 15)), holdS: 2400 };
  const b = { ...batchOf('b', veg, 40, at(11), at(12, 15)), holdS: 2400 };
  return {
    cookers: [
      makeCooker('A', cookerSpec({ apertureM2: 1.5, storeKg: 60, pots: [pot('p1', 40, 40)] }), weather, 180),
      makeCooker('B', cookerSpec({ apertureM2: 0.5, storeKg: 60, pots: [pot('p1', 60, 40), pot('p2', 60, 40)] }), dim, 35),
    ],
    batches: [a, b],
    shifts: [{ startMs: at(9), endMs: at(18) }],
    turnaroundS: 600,
    slotMinutes: 15,
    altitudeM: 0,
    timeLimitS: 10,
  };
}

describe('backup reasons hold for the final plan', () => {
  it('two empty pots on a cold cooker: not "no free pot" but the store, and the claim holds', async () => {
    const p = coldEmptyPots();
    const r = await planDay(p);
    expect(r.slots).toHaveLength(1);
    // Cooker B's pots stay empty all day.
    expect(r.slots.filter((s) => s.cookerId === 'B')).toEqual([]);
    expect(r.backup).toHaveLength(1);
    const bk = r.backup[0] as BackupBatch;
    expect(bk.reason).toBe('no-cooker-hot-enough');
    expect(windows(p, p.batches.find((x) => x.id === bk.batchId) as PlannerBatch, r.slots).some((w) => w.cookerId === 'B')).toBe(true);
    expect(claimProblems(p, r, bk)).toEqual([]);
  });

  it('the only pot taken for the same hour: "no free pot", and it is busy over every start', async () => {
    const p = { ...coldEmptyPots(), cookers: coldEmptyPots().cookers.slice(0, 1) };
    const r = await planDay(p);
    expect(r.backup.map((x) => x.reason)).toEqual(['no-free-pot']);
    expect(claimProblems(p, r, r.backup[0] as BackupBatch)).toEqual([]);
  });

  it('pot too small, outside shift hours, a fry above the safe store temperature', async () => {
    const base = coldEmptyPots();
    const big = { ...batchOf('big', veg, 60, at(10), at(13)), potVolumeNeededL: 500 };
    const night = batchOf('night', veg, 60, at(5), at(8, 30));
    const fry = { ...batchOf('fry', veg, 40, at(10), at(13)), method: 'fry' as const, minTempC: 230, waterKg: 0 };
    const p = { ...base, batches: [big, night, fry] };
    const r = await planDay(p);
    expect(r.backup.map((x) => x.reason).sort()).toEqual(['no-cooker-hot-enough', 'outside-shift', 'pot-too-small']);
    for (const bk of r.backup) expect(claimProblems(p, r, bk)).toEqual([]);
  });

  const plans: [string, () => PlannerProblem, number][] = [
    ['makeInstance(3, 10, 1)', () => makeInstance(3, 10, 1, 60), 40],
    ['makeInstance(4, 16, 2)', () => makeInstance(4, 16, 2, 60), 60],
    ['makeInstance(1, 6, 3)', () => makeInstance(1, 6, 3, 60), 30],
    ['makeSmall(4)', () => makeSmall(4, 5), 30],
  ];
  for (const [name, make, maxIterations] of plans) {
    it(`${name}: every backup reason's claim holds`, async () => {
      const p = make();
      const r = await planDay(p, { maxIterations, maxExactEvaluations: 0 });
      expect(r.backup.length).toBeGreaterThan(0);
      for (const bk of r.backup) expect(claimProblems(p, r, bk)).toEqual([]);
    }, 60_000);
  }
});

describe('a place the search did not find', () => {
  it('next to an empty plan every batch possible alone is "not-placed", at a start the oracle confirms', () => {
    const p = makeSmall(4, 5);
    const m = buildModel(p);
    const stats = { sims: 0, simSteps: 0, cacheHits: 0 };
    const evals = m.cookers.map((c) => new CookerEvaluator(m, c, simulateCooker, stats));
    for (const e of evals) e.storeAt(e.noLoad(), e.c.n);
    const screens = m.cookers.map((c) => new PotScreen(m, c));
    const relax = buildRelaxation(m, evals, screens);
    const empty = { evs: evals.map((e) => e.noLoad()) };
    const backup = backupReasons(m, relax, evals, screens, empty, new Map());
    expect(backup).toHaveLength(p.batches.length);
    const r: PlannerResult = { status: 'converged', slots: [], backup, servingsOnSun: 0, objective: 0, upperBound: 0, boundMethod: '', gap: 0, solveTimeMs: 0, greedyServings: 0, iterations: 0, log: [] };
    expect(backup.filter((x) => x.reason === 'not-placed').length).toBeGreaterThan(0);
    for (const bk of backup) expect(claimProblems(p, r, bk)).toEqual([]);
  });
});

describe('a dish whose minimum is above the local boiling point', () => {
  // 1,795 m (e.g. Addis Ababa's lower districts; an example altitude): water boils near 94 °C.
  const altitudeM = 1795;

  it('the independent boiling point is about 94 °C there (ISA + Clausius–Clapeyron)', () => {
    expect(boilingPointClausiusClapeyronC(altitudeM)).toBeCloseTo(93.9, 0);
    // Sea level by construction: 100 °C.
    expect(boilingPointClausiusClapeyronC(0)).toBeCloseTo(100, 6);
  });

  it('a 96 °C stew goes to backup as above-boiling-point, in words, not blamed on the store', async () => {
    const base = coldEmptyPots();
    const hot = { ...batchOf('hot', stew, 40, at(10), at(14)), minTempC: 96 };
    const fine = { ...batchOf('fine', stew, 40, at(10), at(14)), minTempC: 90 };
    const p: PlannerProblem = { ...base, cookers: base.cookers.slice(0, 1), batches: [hot, fine], altitudeM };
    const r = await planDay(p);
    const why = Object.fromEntries(r.backup.map((x) => [x.batchId, x]));
    expect(why.hot?.reason).toBe('above-boiling-point');
    expect(why.hot?.detail).toMatch(/96 °C/);
    expect(why.hot?.detail).toMatch(/cannot reach/);
    // The boiling point the detail states agrees with the independent one within 0.5 K.
    const stated = Number(/boils at ([\d.]+) °C/.exec(why.hot?.detail ?? '')?.[1]);
    expect(Math.abs(stated - boilingPointClausiusClapeyronC(altitudeM))).toBeLessThan(0.5);
    expect(r.slots.map((s) => s.batchId)).toEqual(['fine']);
    for (const bk of r.backup) expect(claimProblems(p, r, bk)).toEqual([]);
  });

  it('the same 96 °C dish without water (a fry) is not above-boiling-point', async () => {
    const base = coldEmptyPots();
    const fry = { ...batchOf('fry', stew, 40, at(10), at(14)), method: 'fry' as const, minTempC: 96, waterKg: 0 };
    const p: PlannerProblem = { ...base, cookers: base.cookers.slice(0, 1), batches: [fry], altitudeM };
    const r = await planDay(p);
    expect(r.backup.find((x) => x.reason === 'above-boiling-point')).toBeUndefined();
  });
});
