/**
 * The planner's working model: the problem indexed for speed, the start-time grid and shifts,
 * and one evaluator per cooker that checks a cooker's sequence of batches with the full
 * simulator (lib/thermal simulateCooker contract), reusing the unchanged beginning of the day.
 *
 * Why a per-cooker evaluator: batches on different cookers do not interact (each cooker has its
 * own store), so a plan is feasible exactly when every cooker's sequence is; only the cooker a move
 * touches is re-simulated.
 *
 * Incremental simulation: a sequence that differs from an already simulated one only after
 * time r, where no pot is on the store at r, is simulated from r on with the store temperature the
 * earlier run predicted at r. For a well-mixed store that state is exact; for a stratified store
 * (nodes > 1) all layers restart at the mean, an approximation the final full re-check removes.
 */
import { mergeShifts, potLoadEndMs, shiftEndOf } from './pot-loads';
import { estimateBatchHeat } from '@/lib/fuel/energy';
import type { PotLoad, SimulationResult, WeatherStep } from '@/lib/thermal/types';
import type { PlannerBatch, PlannerCooker, PlannerProblem, SimulateFn } from './types';
import { STEP_MS } from './validate';

/** Tie-break weights: in total strictly below one serving so servings always dominate. */
export const FUEL_TIE = 0.3;
export const WAIT_TIE = 0.3;

export interface PPot {
  idx: number;
  id: string;
  volumeL: number;
  massKg: number;
  cpJPerKgK: number;
}

export interface PCooker {
  idx: number;
  id: string;
  name: string;
  raw: PlannerCooker;
  /** First weather instant [ms], number of steps, end of the weather [ms]. */
  t0: number;
  n: number;
  tEnd: number;
  pots: PPot[];
  tAirMaxC: number;
  tAirMinC: number;
}

export interface PFixed {
  c: number;
  p: number;
  /** Load start used in the simulation [ms] (clamped to the weather start). */
  s: number;
  /** Finished before the weather starts: counts as served, no load. */
  done: boolean;
  initialTempC?: number;
}

export interface PBatch {
  idx: number;
  id: string;
  raw: PlannerBatch;
  servings: number;
  /** Useful heat the batch would need on a backup stove [J] (lib/fuel estimate). */
  heatJ: number;
  /** servings + fuel tie-break. */
  base: number;
  earliest: number;
  serveBy: number;
  holdMs: number;
  fixed?: PFixed;
}

/** A batch placed on a pot at a start time. Indices into PModel.batches / cooker.pots. */
export interface Load {
  b: number;
  p: number;
  s: number;
}

export interface LoadOut {
  reachedMs: number | null;
  doneMs: number | null;
  endMs: number;
  ok: boolean;
  maxPotC: number;
  drawnJ: number;
}

export interface Evaluation {
  key: string;
  loads: Load[];
  maxEnd: number[];
  out: LoadOut[];
  ok: boolean;
  /** Index of the first failing load, −1 if none. */
  failIdx: number;
  /** Store temperature at step boundaries [°C]; valid up to validTo, extended on demand. */
  store: Float64Array;
  validTo: number;
  /** Objective contribution of this cooker's sequence (ok loads only). */
  value: number;
}

export interface PModel {
  problem: PlannerProblem;
  cookers: PCooker[];
  batches: PBatch[];
  slotMs: number;
  turnMs: number;
  /** Merged shifts, sorted. */
  shifts: { startMs: number; endMs: number }[];
  horizonMs: number;
  heatSumJ: number;
  /** Servings and value of fixed batches already done before the weather starts. */
  doneServings: number;
  doneValue: number;
  /** batch → cooker → pot ids with room (volume). */
  fits: boolean[][][];
  /** Clock time "HH:MM" in the problem's time zone, for sentences shown to cooks. */
  clock: (ms: number) => string;
}

export function loadsKey(loads: readonly Load[], t0: number): string {
  let k = '';
  for (const l of loads) k += `${l.b}.${l.p}.${(l.s - t0) / STEP_MS},`;
  return k;
}

export function compareLoads(a: Load, b: Load): number {
  return a.s - b.s || a.p - b.p || a.b - b.b;
}

export function insertLoad(loads: readonly Load[], l: Load): Load[] {
  const out = loads.slice();
  let i = out.length;
  while (i > 0 && compareLoads(out[i - 1] as Load, l) > 0) i--;
  out.splice(i, 0, l);
  return out;
}

export function removeBatch(loads: readonly Load[], b: number): Load[] {
  return loads.filter((l) => l.b !== b);
}

export function buildModel(problem: PlannerProblem): PModel {
  const slotMs = (problem.slotMinutes ?? 15) * 60_000;
  const cookers: PCooker[] = problem.cookers.map((c, idx) => {
    const t0 = (c.weather[0] as WeatherStep).t;
    let tMax = -Infinity;
    let tMin = Infinity;
    for (const w of c.weather) {
      if (w.tAirC > tMax) tMax = w.tAirC;
      if (w.tAirC < tMin) tMin = w.tAirC;
    }
    return {
      idx,
      id: c.id,
      name: c.name,
      raw: c,
      t0,
      n: c.weather.length,
      tEnd: t0 + c.weather.length * STEP_MS,
      pots: c.spec.pots.map((p, j) => ({ idx: j, id: p.id, volumeL: p.volumeL, massKg: p.massKg, cpJPerKgK: p.cpJPerKgK })),
      tAirMaxC: tMax,
      tAirMinC: tMin,
    };
  });
  const ambient = cookers.length > 0 ? cookers.reduce((s, c) => s + (c.tAirMaxC + c.tAirMinC) / 2, 0) / cookers.length : 25;
  let minEarliest = Infinity;
  let maxServe = -Infinity;
  for (const b of problem.batches) {
    minEarliest = Math.min(minEarliest, b.earliestStartMs);
    maxServe = Math.max(maxServe, b.serveByMs);
  }
  const horizonMs = Math.max(STEP_MS, maxServe - minEarliest);
  const heats = problem.batches.map(
    (b) =>
      estimateBatchHeat(
        { id: b.id, method: b.method, potVolumeNeededL: b.potVolumeNeededL, foodKg: b.foodKg, foodCpJPerKgK: b.foodCpJPerKgK, waterKg: b.waterKg, minTempC: b.minTempC, holdS: b.holdS, lidOn: b.lidOn },
        { ambientC: ambient, altitudeM: problem.altitudeM },
      ).usefulJ,
  );
  const heatSumJ = heats.reduce((s, h) => s + h, 0) || 1;
  let doneServings = 0;
  let doneValue = 0;
  const batches: PBatch[] = problem.batches.map((raw, idx) => {
    const heatJ = heats[idx] as number;
    const base = raw.servings + (FUEL_TIE * heatJ) / heatSumJ;
    const pb: PBatch = { idx, id: raw.id, raw, servings: raw.servings, heatJ, base, earliest: raw.earliestStartMs, serveBy: raw.serveByMs, holdMs: raw.holdS * 1000 };
    if (raw.fixed) {
      const c = cookers.findIndex((x) => x.id === raw.fixed?.cookerId);
      const pc = cookers[c] as PCooker;
      const p = pc.pots.findIndex((x) => x.id === raw.fixed?.potId);
      const done = raw.fixed.doneMs !== undefined && raw.fixed.doneMs <= pc.t0;
      pb.fixed = {
        c,
        p,
        s: Math.max(raw.fixed.startMs, pc.t0),
        done,
        ...(raw.fixed.startMs < pc.t0 && raw.fixed.contentsTempC !== undefined ? { initialTempC: raw.fixed.contentsTempC } : {}),
      };
      if (done) {
        doneServings += raw.servings;
        doneValue += base;
      }
    }
    return pb;
  });
  const fits = batches.map((b) => cookers.map((c) => c.pots.map((p) => p.volumeL >= b.raw.potVolumeNeededL)));
  return {
    problem,
    cookers,
    batches,
    slotMs,
    turnMs: problem.turnaroundS * 1000,
    shifts: mergeShifts(problem.shifts),
    horizonMs,
    heatSumJ,
    doneServings,
    doneValue,
    fits,
    clock: makeClock(problem.timeZone ?? 'UTC'),
  };
}

function makeClock(timeZone: string): (ms: number) => string {
  const fmt = new Intl.DateTimeFormat('en-GB', { timeZone, hour: '2-digit', minute: '2-digit', hourCycle: 'h23' });
  return (ms) => fmt.format(new Date(ms));
}

/** End of the (merged) shift containing t [ms], or −1 when t is outside every shift. */
export function shiftEndAt(m: PModel, t: number): number {
  return shiftEndOf(m.shifts, t);
}

/** First shift start strictly after t [ms], or Infinity. */
export function nextShiftStart(m: PModel, t: number): number {
  for (const s of m.shifts) if (s.startMs > t) return s.startMs;
  return Infinity;
}

/**
 * The grid starts a batch may take on a cooker, in time order: from its earliest start (or the
 * weather's first step) while its hold still fits before serve-by and the weather's end, skipping the
 * time between shifts. Each comes with the latest end the shift, serve-by and weather allow [ms].
 */
export function* gridStartsInShifts(m: PModel, c: Pick<PCooker, 't0' | 'tEnd'>, b: Pick<PBatch, 'earliest' | 'serveBy' | 'holdMs'>): Generator<{ s: number; maxEnd: number }> {
  let s = ceilToGrid(Math.max(b.earliest, c.t0), m.slotMs);
  while (s + b.holdMs <= Math.min(b.serveBy, c.tEnd)) {
    const se = shiftEndAt(m, s);
    if (se < 0) {
      const nx = nextShiftStart(m, s);
      if (nx === Infinity) return;
      s = ceilToGrid(nx, m.slotMs);
      continue;
    }
    yield { s, maxEnd: Math.min(b.serveBy, se, c.tEnd) };
    s += m.slotMs;
  }
}

export function ceilToGrid(t: number, slotMs: number): number {
  return Math.ceil(t / slotMs) * slotMs;
}

/** Objective contribution of one completed batch [servings + tie-breaks]. */
export function loadValue(m: PModel, b: PBatch, doneMs: number): number {
  const waitMs = Math.max(0, b.serveBy - doneMs);
  return b.base - (WAIT_TIE * Math.min(1, waitMs / m.horizonMs)) / Math.max(1, m.batches.length);
}

export interface EvaluatorStats {
  sims: number;
  simSteps: number;
  /** Wall time spent inside the simulator [ms]. */
  simMs?: number;
  cacheHits: number;
}

/**
 * Simulates one cooker's sequences, with a small cache and incremental restarts.
 */
export class CookerEvaluator {
  readonly cache = new Map<string, Evaluation>();
  private empty: Evaluation | null = null;
  /**
   * Likely time a batch occupies a pot [ms] (e.g. twice its quickest occupation). Simulations first
   * run only until every batch should be done by this estimate; a batch still cooking at that cut is
   * simulated again to its real deadline, so the hint changes speed, never results.
   */
  durationHint: (b: number, p: number) => number = (b) => (this.m.batches[b] as PBatch).holdMs + 3 * 3600_000;
  constructor(
    readonly m: PModel,
    readonly c: PCooker,
    readonly simulate: SimulateFn,
    readonly stats: EvaluatorStats,
    readonly cacheSize = 400,
  ) {}

  private idxOf(t: number): number {
    return Math.round((t - this.c.t0) / STEP_MS);
  }

  /** The sequence holding only this cooker's fixed (running or future) batches. */
  fixedLoads(): Load[] {
    const loads: Load[] = [];
    for (const b of this.m.batches) if (b.fixed && !b.fixed.done && b.fixed.c === this.c.idx) loads.push({ b: b.idx, p: b.fixed.p, s: b.fixed.s });
    return loads.sort(compareLoads);
  }

  /** maxEndMs of each load: serve-by, end of its shift, next batch on the same pot less turnaround, end of weather. */
  maxEnds(loads: readonly Load[]): number[] {
    const out: number[] = new Array<number>(loads.length);
    const nextOnPot = new Map<number, number>();
    for (let i = loads.length - 1; i >= 0; i--) {
      const l = loads[i] as Load;
      const b = this.m.batches[l.b] as PBatch;
      out[i] = potLoadEndMs(l.s, b.serveBy, this.c.tEnd, b.fixed ? null : shiftEndAt(this.m, l.s), nextOnPot.get(l.p), this.m.turnMs);
      nextOnPot.set(l.p, l.s);
    }
    return out;
  }

  private potLoad(l: Load, maxEnd: number): PotLoad {
    const b = this.m.batches[l.b] as PBatch;
    const r = b.raw;
    return {
      id: r.id,
      potId: (this.c.pots[l.p] as PPot).id,
      startMs: l.s,
      foodKg: r.foodKg,
      foodCpJPerKgK: r.foodCpJPerKgK,
      waterKg: r.waterKg,
      ...(b.fixed?.initialTempC !== undefined && b.fixed.c === this.c.idx ? { initialTempC: b.fixed.initialTempC } : {}),
      lidOn: r.lidOn,
      minTempC: r.minTempC,
      holdS: r.holdS,
      maxEndMs: maxEnd,
    };
  }

  private run(fromIdx: number, toIdx: number, initialC: number, loads: PotLoad[]): SimulationResult {
    const weather = this.c.raw.weather.slice(fromIdx, toIdx);
    this.stats.sims++;
    this.stats.simSteps += weather.length;
    const t = performance.now();
    const r = this.simulate(this.c.raw.spec, weather, { stepS: 60, initialStoreTempC: initialC, altitudeM: this.m.problem.altitudeM, loads });
    this.stats.simMs = (this.stats.simMs ?? 0) + performance.now() - t;
    return r;
  }

  /** The store trajectory with no batches at all (whole weather). */
  noLoad(): Evaluation {
    if (!this.empty) this.empty = this.evaluate([]);
    return this.empty;
  }

  /** Store temperature at step boundary i [°C], simulating the idle tail on demand. */
  storeAt(ev: Evaluation, i: number): number {
    const idx = Math.max(0, Math.min(this.c.n, i));
    if (idx > ev.validTo) this.extend(ev);
    return ev.store[idx] as number;
  }

  /** The store series of `ev`, valid at least up to boundary i (simulating the idle tail if needed). */
  storeUpTo(ev: Evaluation, i: number): Float64Array {
    if (Math.min(this.c.n, i) > ev.validTo) this.extend(ev);
    return ev.store;
  }

  /** Highest store temperature over boundaries [i0, i1] [°C]. */
  storeMax(ev: Evaluation, i0: number, i1: number): number {
    const a = Math.max(0, i0);
    const z = Math.min(this.c.n, i1);
    if (z > ev.validTo) this.extend(ev);
    let mx = -Infinity;
    for (let i = a; i <= z; i++) {
      const v = ev.store[i] as number;
      if (v > mx) mx = v;
    }
    return mx;
  }

  private extend(ev: Evaluation): void {
    if (ev.validTo >= this.c.n) return;
    const from = ev.validTo;
    const sim = this.run(from, this.c.n, ev.store[from] as number, []);
    const st = sim.series.storeTempC;
    for (let k = 0; k < st.length && from + k <= this.c.n; k++) ev.store[from + k] = st[k] as number;
    ev.validTo = this.c.n;
  }

  /**
   * Simulates a sequence (sorted by compareLoads), reusing `base` up to the first change.
   * Loads must respect the pot order (no two loads of one pot at the same start).
   */
  evaluate(loads: Load[], base?: Evaluation): Evaluation {
    const key = loadsKey(loads, this.c.t0);
    const hit = this.cache.get(key);
    if (hit) {
      this.stats.cacheHits++;
      this.cache.delete(key);
      this.cache.set(key, hit);
      return hit;
    }
    const maxEnd = this.maxEnds(loads);
    const n = this.c.n;
    // Structural infeasibility needs no simulation: no room to hold, or a start outside the weather.
    for (let i = 0; i < loads.length; i++) {
      const l = loads[i] as Load;
      const b = this.m.batches[l.b] as PBatch;
      if (l.s < this.c.t0 || l.s >= this.c.tEnd || (maxEnd[i] as number) - l.s < b.holdMs) {
        return this.remember(key, this.failed(loads, maxEnd, i));
      }
    }
    let r = this.c.t0;
    let reuse = 0;
    let useBase: Evaluation | undefined;
    if (base && base.ok) {
      let i = 0;
      const bl = base.loads;
      while (i < loads.length && i < bl.length) {
        const a = loads[i] as Load;
        const z = bl[i] as Load;
        if (a.b !== z.b || a.p !== z.p || a.s !== z.s || maxEnd[i] !== base.maxEnd[i]) break;
        i++;
      }
      r = Math.min(loads[i]?.s ?? Infinity, bl[i]?.s ?? Infinity);
      if (r === Infinity) return this.remember(key, base);
      let changed = true;
      while (changed) {
        changed = false;
        for (let j = 0; j < i; j++) {
          const lj = loads[j] as Load;
          if (lj.s < r && (base.out[j] as LoadOut).endMs > r) {
            r = lj.s;
            changed = true;
          }
        }
      }
      reuse = 0;
      while (reuse < i && (loads[reuse] as Load).s < r) reuse++;
      useBase = base;
    }
    const ri = Math.max(0, Math.floor((r - this.c.t0) / STEP_MS));
    const simIdx: number[] = [];
    let lastEnd = r;
    for (let j = reuse; j < loads.length; j++) {
      simIdx.push(j);
      lastEnd = Math.max(lastEnd, maxEnd[j] as number);
    }
    const ei = Math.min(n, Math.ceil((lastEnd - this.c.t0) / STEP_MS));
    const store = new Float64Array(n + 1);
    const out: LoadOut[] = new Array<LoadOut>(loads.length);
    if (useBase) {
      if (ri > useBase.validTo) this.extend(useBase);
      store.set(useBase.store.subarray(0, ri + 1));
      for (let j = 0; j < reuse; j++) out[j] = useBase.out[j] as LoadOut;
    }
    const initialC = useBase ? (useBase.store[ri] as number) : this.c.raw.initialStoreTempC;
    let validTo = ri;
    if (!useBase) store[0] = initialC;
    if (simIdx.length > 0 || !useBase) {
      const to = simIdx.length > 0 ? Math.max(ei, ri + 1) : n;
      const potLoads = simIdx.map((j) => this.potLoad(loads[j] as Load, maxEnd[j] as number));
      // First try a shorter horizon; the simulation is causal, so everything up to the cut is exact.
      let cut = to;
      if (simIdx.length > 0) {
        let guess = r;
        for (const j of simIdx) {
          const l = loads[j] as Load;
          guess = Math.max(guess, l.s + this.durationHint(l.b, l.p));
        }
        cut = Math.max(ri + 1, Math.min(to, Math.ceil((guess - this.c.t0) / STEP_MS)));
      }
      let sim = this.run(ri, cut, initialC, potLoads);
      if (cut < to) {
        const cutMs = this.c.t0 + cut * STEP_MS;
        const truncated = sim.loads.some((o) => !o.ok && o.endMs >= cutMs && (potLoads.find((pl) => pl.id === o.id)?.maxEndMs ?? 0) > cutMs);
        if (truncated) sim = this.run(ri, to, initialC, potLoads);
      }
      const st = sim.series.storeTempC;
      for (let k = 0; k < st.length && ri + k <= n; k++) store[ri + k] = st[k] as number;
      validTo = Math.min(n, ri + st.length - 1);
      const byId = new Map(sim.loads.map((o) => [o.id, o]));
      for (const j of simIdx) {
        const l = loads[j] as Load;
        const o = byId.get((this.m.batches[l.b] as PBatch).id);
        out[j] = o
          ? { reachedMs: o.reachedMs, doneMs: o.doneMs, endMs: o.endMs, ok: o.ok && o.doneMs !== null && o.doneMs <= (maxEnd[j] as number), maxPotC: o.maxPotTempC, drawnJ: o.drawnJ }
          : { reachedMs: null, doneMs: null, endMs: maxEnd[j] as number, ok: false, maxPotC: Number.NaN, drawnJ: 0 };
      }
    }
    let failIdx = -1;
    let value = 0;
    for (let j = 0; j < loads.length; j++) {
      const o = out[j] as LoadOut;
      if (!o.ok) {
        if (failIdx < 0) failIdx = j;
      } else value += loadValue(this.m, this.m.batches[(loads[j] as Load).b] as PBatch, o.doneMs as number);
    }
    const ev: Evaluation = { key, loads, maxEnd, out, ok: failIdx < 0, failIdx, store, validTo, value };
    return this.remember(key, ev);
  }

  /** Simulates the whole day from the initial state (no reuse): the final re-check. */
  evaluateFull(loads: Load[]): Evaluation {
    this.cache.delete(loadsKey(loads, this.c.t0));
    const ev = this.evaluate(loads);
    if (ev.ok && ev.validTo < this.c.n) this.extend(ev);
    return ev;
  }

  private failed(loads: Load[], maxEnd: number[], i: number): Evaluation {
    const out = loads.map((l, j) => ({ reachedMs: null, doneMs: null, endMs: maxEnd[j] as number, ok: j !== i, maxPotC: Number.NaN, drawnJ: 0 }));
    return { key: loadsKey(loads, this.c.t0), loads, maxEnd, out, ok: false, failIdx: i, store: new Float64Array(0), validTo: -1, value: -Infinity };
  }

  private remember(key: string, ev: Evaluation): Evaluation {
    this.cache.set(key, ev);
    if (this.cache.size > this.cacheSize) {
      const first = this.cache.keys().next().value as string;
      this.cache.delete(first);
    }
    return ev;
  }
}
