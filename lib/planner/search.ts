/**
 * Placement heuristics on per-cooker sequences, every candidate checked by simulation:
 *
 * - greedy: batches by serve-by (then the most heat first), each at the earliest feasible
 *   (cooker, pot, grid start); only the cooker that receives it is re-simulated;
 * - insertion, swap (take one batch out, put a more valuable one in), shift (move a batch later so
 *   it waits less before serving);
 * - large-neighbourhood search: empty one or two cookers and re-pack them, together with the
 *   batches nobody serves, in a randomised order (a seeded generator, so runs repeat).
 *
 * Every feasible cooker sequence met on the way is kept as a column for the set-packing master
 * (master.ts), which recombines columns across cookers.
 */
import {
  ceilToGrid,
  compareLoads,
  insertLoad,
  loadValue,
  nextShiftStart,
  removeBatch,
  shiftEndAt,
  type CookerEvaluator,
  type Evaluation,
  type Load,
  type LoadOut,
  type PBatch,
  type PModel,
} from './model';
import type { Relaxation } from './relaxation';
import { newTrace, type DeltaTrace, type PotScreen } from './screen';
import { STEP_MS } from './validate';


export interface Column {
  c: number;
  loads: Load[];
  value: number;
  /** Non-fixed batches the column serves, and each one's objective value in this sequence. */
  batches: number[];
  values: number[];
  key: string;
}

export interface State {
  evs: Evaluation[];
}

export function stateValue(m: PModel, s: State): number {
  let v = m.doneValue;
  for (const e of s.evs) v += e.value;
  return v;
}

export function stateServings(m: PModel, s: State): number {
  let v = m.doneServings;
  for (const e of s.evs) for (let j = 0; j < e.loads.length; j++) if ((e.out[j] as LoadOut).ok) v += (m.batches[(e.loads[j] as Load).b] as PBatch).servings;
  return v;
}

export function placedOf(m: PModel, s: State): Int32Array {
  const where = new Int32Array(m.batches.length).fill(-1);
  s.evs.forEach((e, c) => {
    for (const l of e.loads) where[l.b] = c;
  });
  m.batches.forEach((b) => {
    if (b.fixed?.done) where[b.idx] = b.fixed.c;
  });
  return where;
}

interface Ranked {
  c: number;
  p: number;
  s: number;
  maxEnd: number;
  done: number;
  prio: number;
}

export class Search {
  readonly pool = new Map<string, Column>();
  evalCount = 0;
  iterations = 0;
  /** Per cooker, the sequence of its fixed batches that work (set by the planner). */
  fixedOnly: Evaluation[] = [];
  /** Candidates forecast to fail that tryInsert still simulates (the forecast is an approximation). */
  maxFailTries = 2;
  constructor(
    readonly m: PModel,
    readonly evals: CookerEvaluator[],
    readonly relax: Relaxation,
    readonly screens: PotScreen[],
    readonly rng: () => number,
    public deadline: number,
    readonly maxPool = 40_000,
  ) {}

  /** Simulated sequence of a cooker → batches a one-cooker repair found no place for there. */
  private readonly noFit = new WeakMap<Evaluation, Set<number>>();
  noFitHits = 0;

  /** Pot forecasts run by rank() (the screen's 'estimate' mode). */
  forecasts = 0;

  /**
   * Work done so far, in sequence evaluations (cache hits included) plus ranking forecasts, a
   * forecast counted 1/12 (measured on the benchmark instances: about 17 µs per forecast against
   * 0.2 ms per incremental simulation). Deterministic, unlike a clock, so that moves chosen by their
   * cost repeat from run to run.
   */
  work(): number {
    return this.evalCount + this.forecasts / 12;
  }

  timeUp(): boolean {
    return performance.now() > this.deadline;
  }

  /** Keeps a feasible sequence as a column; `force` passes the pool's cap (the current plan's sequences). */
  addColumn(c: number, ev: Evaluation, force = false): void {
    if (!ev.ok) return;
    const key = `${c}|${ev.key}`;
    if (this.pool.has(key) || (!force && this.pool.size >= this.maxPool)) return;
    const batches: number[] = [];
    const values: number[] = [];
    ev.loads.forEach((l, j) => {
      const b = this.m.batches[l.b] as PBatch;
      if (b.fixed) return;
      batches.push(l.b);
      values.push(loadValue(this.m, b, (ev.out[j] as LoadOut).doneMs as number));
    });
    this.pool.set(key, { c, loads: ev.loads, value: ev.value, batches, values, key });
  }

  /** Simulates a sequence on cooker c reusing `base` (counted). */
  evaluateOn(c: number, loads: Load[], base: Evaluation): Evaluation {
    return this.evaluate(c, loads, base);
  }

  private evaluate(c: number, loads: Load[], base: Evaluation): Evaluation {
    this.evalCount++;
    return (this.evals[c] as CookerEvaluator).evaluate(loads, base);
  }

  /**
   * Grid starts of batch b on pot p of cooker c that pass the cheap necessary tests against the
   * sequence `ev`: inside a shift, pot free for the quickest occupation plus turnaround, and the
   * store (as `ev` predicts it, before this batch draws anything) at least the dish minimum
   * somewhere before the hold must start.
   */
  *starts(ev: Evaluation, b: PBatch, c: number, p: number, descending = false, from?: number, withScreen = true): Generator<number, undefined, number | undefined> {
    const m = this.m;
    const ce = this.evals[c] as CookerEvaluator;
    const pc = ce.c;
    const dmin = this.relax.dminMs[b.idx]?.[c]?.[p] ?? Infinity;
    if (dmin === Infinity) return undefined;
    const busy: { s: number; e: number }[] = [];
    for (let j = 0; j < ev.loads.length; j++) {
      const l = ev.loads[j] as Load;
      if (l.p === p && l.b !== b.idx) busy.push({ s: l.s, e: (ev.out[j] as LoadOut).endMs });
    }
    const lo = ceilToGrid(Math.max(b.earliest, pc.t0), m.slotMs);
    const hi = Math.min(b.serveBy, pc.tEnd) - Math.max(dmin, b.holdMs);
    const check = (s: number): boolean => {
      const se = shiftEndAt(m, s);
      if (se < 0) return false;
      let maxEnd = Math.min(b.serveBy, se, pc.tEnd);
      for (const x of busy) {
        if (x.s <= s) {
          if (x.e + m.turnMs > s) return false;
        } else maxEnd = Math.min(maxEnd, x.s - m.turnMs);
      }
      if (s + dmin > maxEnd) return false;
      const i0 = Math.round((s - pc.t0) / STEP_MS);
      const i1 = Math.floor((maxEnd - b.holdMs - pc.t0) / STEP_MS);
      if (ce.storeMax(ev, i0, i1) < b.raw.minTempC) return false;
      return !withScreen || screen.run(b, p, s, maxEnd, store, 'upper').ok;
    };
    const screen = this.screens[c] as PotScreen;
    const store = ce.storeUpTo(ev, pc.n);
    if (!descending) {
      let s = from !== undefined ? Math.max(lo, from) : lo;
      while (s <= hi) {
        if (shiftEndAt(m, s) < 0) {
          const nx = nextShiftStart(m, s);
          if (nx === Infinity) return undefined;
          s = ceilToGrid(nx, m.slotMs);
          continue;
        }
        let skipTo: number | undefined;
        if (check(s)) skipTo = yield s;
        s = skipTo !== undefined && skipTo > s + m.slotMs ? Math.ceil(skipTo / m.slotMs) * m.slotMs : s + m.slotMs;
      }
    } else {
      let s = Math.floor(hi / m.slotMs) * m.slotMs;
      if (from !== undefined) s = Math.min(s, from);
      for (; s >= lo; s -= m.slotMs) if (check(s)) yield s;
    }
    return undefined;
  }

  /**
   * Places batch b on one of `cookers`: candidate (cooker, pot, start) triples that pass the
   * necessary tests are ranked by the pot screen's forecast completion time ('estimate' mode), and
   * simulated best first until one works (earliest completion; ties: earlier start, smaller pot,
   * then the order of `cookers`). Returns the new evaluation, or null.
   */
  /** Candidate (cooker, pot, start) triples of batch b ranked by forecast completion. */
  rank(st: State, b: PBatch, cookers: readonly number[], pick?: () => number): Ranked[] {
    const ranked: Ranked[] = [];
    let rank = 0;
    let bestDone = Infinity;
    for (const c of cookers) {
      const ev = st.evs[c] as Evaluation;
      const ce = this.evals[c] as CookerEvaluator;
      const screen = this.screens[c] as PotScreen;
      const store = ce.storeUpTo(ev, ce.c.n);
      const pots = this.m.cookers[c]?.pots ?? [];
      for (const pot of pots) {
        if (!this.relax.possible[b.idx]?.[c]?.[pot.idx]) continue;
        const dmin = this.relax.dminMs[b.idx]?.[c]?.[pot.idx] ?? Infinity;
        const prio = pot.volumeL * 1000 + rank++;
        let k = 0;
        // Cheap tests only here; the forecast below is stricter than the 'upper' screen, and a start
        // it rejects gets the 'upper' screen before it is simulated.
        const gen = this.starts(ev, b, c, pot.idx, false, undefined, false);
        for (let it = gen.next(); !it.done; ) {
          const s = it.value;
          // Later starts cannot finish before the best forecast so far.
          if (s + dmin > bestDone + 2 * this.m.slotMs) break;
          k++;
          const maxEnd = this.maxEndFor(ev, b, c, pot.idx, s);
          const cutoff = bestDone + 2 * this.m.slotMs;
          this.forecasts++;
          const f = screen.run(b, pot.idx, s, maxEnd, store, 'estimate', undefined, undefined, undefined, cutoff);
          // Cut off: not better than the best so far; ranked just after it, outcome left to the simulation.
          const done = f.cutoff ? cutoff + 1 : f.ok && f.doneMs !== null ? f.doneMs : Infinity;
          if (done < bestDone) bestDone = done;
          ranked.push({ c, p: pot.idx, s, maxEnd, done, prio });
          // Forecast the first starts one by one, then thin out (stride 2, then 4 slots).
          it = gen.next(s + (k < 4 ? 1 : k < 8 ? 2 : 4) * this.m.slotMs);
        }
      }
    }
    ranked.sort((x, z) => x.done - z.done || x.s - z.s || x.prio - z.prio);
    // Randomised repair: sometimes take the second or third best forecast first.
    if (pick && ranked.length > 1 && ranked[1]?.done !== Infinity) {
      const u = pick();
      const j = u < 0.15 ? 1 : u < 0.22 && ranked.length > 2 && ranked[2]?.done !== Infinity ? 2 : 0;
      if (j > 0) ranked.unshift(...ranked.splice(j, 1));
    }
    return ranked;
  }

  tryInsert(st: State, b: PBatch, cookers: readonly number[], maxEvals = 0, pick?: () => number): { c: number; ev: Evaluation } | null {
    // One-cooker repairs (no simulation of starts forecast to fail) remember where a batch did not
    // fit: the same simulated sequence (the same Evaluation, so the same store trajectory) gives the
    // same forecasts and simulations, so the answer would repeat. Only one-cooker calls, both to
    // record and to use: with several cookers, one cooker's forecasts change which of another's
    // starts get simulated.
    const memo = this.maxFailTries === 0 && maxEvals === 0 && cookers.length === 1;
    const memoEv = memo ? (st.evs[cookers[0] as number] as Evaluation) : null;
    if (memoEv && this.noFit.get(memoEv)?.has(b.idx)) {
      this.noFitHits++;
      return null;
    }
    const ranked = this.rank(st, b, cookers, pick);
    const trace = newTrace();
    const limit = maxEvals > 0 ? maxEvals : 12;
    let used = 0;
    let failTries = 0;
    const deferred: Ranked[] = [];
    const simulateCand = (cand: Ranked): { c: number; ev: Evaluation } | null => {
      const base = st.evs[cand.c] as Evaluation;
      const ev = this.evaluate(cand.c, insertLoad(base.loads, { b: b.idx, p: cand.p, s: cand.s }), base);
      used++;
      return ev.ok ? { c: cand.c, ev } : null;
    };
    for (const cand of ranked) {
      if (used >= limit) return null;
      if (cand.done === Infinity) {
        deferred.push(cand);
        continue;
      }
      // Would a batch already on this cooker, still to come or still cooking, fail?
      const ev = st.evs[cand.c] as Evaluation;
      const ce = this.evals[cand.c] as CookerEvaluator;
      (this.screens[cand.c] as PotScreen).run(b, cand.p, cand.s, cand.maxEnd, ce.storeUpTo(ev, ce.c.n), 'estimate', undefined, trace);
      if (!this.othersSurvive(ev, cand.c, cand.s, trace, undefined, undefined, { b: b.idx, p: cand.p, s: cand.s })) {
        deferred.push(cand);
        continue;
      }
      const r = simulateCand(cand);
      if (r) return r;
    }
    // The forecast is rarely wrong about a failure: try only a few of those.
    for (const cand of deferred) {
      if (used >= limit || failTries >= this.maxFailTries) break;
      const ev = st.evs[cand.c] as Evaluation;
      const ce = this.evals[cand.c] as CookerEvaluator;
      if (!(this.screens[cand.c] as PotScreen).run(b, cand.p, cand.s, cand.maxEnd, ce.storeUpTo(ev, ce.c.n), 'upper').ok) continue;
      failTries++;
      const r = simulateCand(cand);
      if (r) return r;
    }
    if (memoEv && used < limit) {
      let set = this.noFit.get(memoEv);
      if (!set) this.noFit.set(memoEv, (set = new Set()));
      set.add(b.idx);
    }
    return null;
  }

  /**
   * Screen ('existing' mode) of the batches of `ev` that end after `s`, against the store lowered
   * by the candidate's Δ: false when one of them is forecast to fail.
   */
  othersSurvive(ev: Evaluation, c: number, s: number, trace: DeltaTrace, ends?: Map<number, number>, maxEnds?: number[], newLoad?: Load): boolean {
    const ce = this.evals[c] as CookerEvaluator;
    const screen = this.screens[c] as PotScreen;
    const store = ce.storeUpTo(ev, ce.c.n);
    for (let j = 0; j < ev.loads.length; j++) {
      const o = ev.out[j] as LoadOut;
      if (o.endMs <= s) continue;
      const l = ev.loads[j] as Load;
      // The deadline of a batch can shrink when the new one follows it on the same pot.
      let maxEnd = ev.maxEnd[j] as number;
      if (newLoad && newLoad.p === l.p && newLoad.s > l.s) maxEnd = Math.min(maxEnd, newLoad.s - this.m.turnMs);
      if (maxEnds) maxEnd = Math.min(maxEnd, maxEnds[j] ?? maxEnd);
      const f = screen.run(this.m.batches[l.b] as PBatch, l.p, l.s, maxEnd, store, 'existing', undefined, undefined, trace);
      if (!f.ok) return false;
      if (ends && f.doneMs !== null) ends.set(l.b, f.doneMs);
    }
    return true;
  }

  /** Hard stop of batch b started at s on pot p of cooker c, next to the loads of `ev` [ms]. */
  maxEndFor(ev: Evaluation, b: PBatch, c: number, p: number, s: number): number {
    const pc = this.m.cookers[c];
    if (!pc) return s;
    let e = Math.min(b.serveBy, pc.tEnd);
    const se = shiftEndAt(this.m, s);
    if (se >= 0) e = Math.min(e, se);
    for (const l of ev.loads) if (l.p === p && l.s > s) e = Math.min(e, l.s - this.m.turnMs);
    return e;
  }

  /** Greedy placement of `order` into the state's cookers. */
  greedy(st: State, order: readonly number[], cookers: readonly number[]): void {
    for (const bi of order) {
      if (this.timeUp() && this.iterations > 0) return;
      const b = this.m.batches[bi] as PBatch;
      const r = this.tryInsert(st, b, cookers);
      if (r) st.evs[r.c] = r.ev;
    }
  }

  greedyOrder(batches: readonly number[]): number[] {
    const bs = this.m.batches;
    return [...batches].sort((x, y) => {
      const a = bs[x] as PBatch;
      const z = bs[y] as PBatch;
      return a.serveBy - z.serveBy || z.heatJ - a.heatJ || a.idx - z.idx;
    });
  }

  unplaced(st: State): number[] {
    const where = placedOf(this.m, st);
    const out: number[] = [];
    for (let i = 0; i < where.length; i++) {
      const b = this.m.batches[i] as PBatch;
      if ((where[i] as number) < 0 && !b.fixed && this.relax.impossible[i] === null) out.push(i);
    }
    return out;
  }

  /** Insert every unplaced batch that fits anywhere, most valuable first. */
  insertionPass(st: State): boolean {
    let improved = false;
    const order = this.unplaced(st).sort((x, y) => (this.m.batches[y] as PBatch).base - (this.m.batches[x] as PBatch).base || x - y);
    const all = this.m.cookers.map((c) => c.idx);
    for (const bi of order) {
      if (this.timeUp()) break;
      const r = this.tryInsert(st, this.m.batches[bi] as PBatch, all);
      if (r) {
        st.evs[r.c] = r.ev;
        this.addColumn(r.c, r.ev);
        improved = true;
      }
    }
    return improved;
  }

  /**
   * Small destroy-and-repair: take up to `k` random batches out of each of `cookers`, then insert the
   * removed and the unplaced batches (most valuable first, ties random) into those cookers. Cheaper
   * than re-packing whole cookers, so many more of these fit in the time. Accepts improvements
   * (and equal plans now and then, to move along plateaus).
   */
  lnsPartial(st: State, cookers: number[], k: number): boolean {
    this.iterations++;
    const m = this.m;
    const bs = m.batches;
    const trial: State = { evs: st.evs.slice() };
    const pool = new Set<number>();
    for (const c of cookers) {
      const ev = st.evs[c] as Evaluation;
      const movable = ev.loads.filter((l) => !(bs[l.b] as PBatch).fixed);
      const out: Load[] = [];
      for (let t = 0; t < k && movable.length > 0; t++) out.push(...movable.splice(Math.floor(this.rng() * movable.length), 1));
      if (out.length === 0) continue;
      const next = this.evaluate(c, ev.loads.filter((l) => !out.includes(l)), ev);
      if (!next.ok) continue;
      trial.evs[c] = next;
      for (const l of out) pool.add(l.b);
    }
    for (const bi of this.unplaced(st)) if (cookers.some((c) => this.relax.possible[bi]?.[c]?.some((x) => x))) pool.add(bi);
    const items = [...pool].sort((a, z) => a - z);
    const noise = new Map(items.map((bi) => [bi, this.rng()]));
    items.sort((a, z) => (bs[z] as PBatch).base * (0.85 + 0.3 * (noise.get(z) as number)) - (bs[a] as PBatch).base * (0.85 + 0.3 * (noise.get(a) as number)) || a - z);
    return this.repairAndAccept(st, trial, cookers, items, cookers, this.rng);
  }

  /**
   * Kick for an iterated local search: take a random share of the placed batches out and re-insert
   * the unplaced batches in a random order. The result may be worse; the caller keeps the best.
   */
  perturb(st: State, share: number): void {
    const m = this.m;
    for (const pc of m.cookers) {
      const ev = st.evs[pc.idx] as Evaluation;
      const out = ev.loads.filter((l) => !(m.batches[l.b] as PBatch).fixed && this.rng() < share);
      if (out.length === 0) continue;
      const keep = ev.loads.filter((l) => !out.includes(l));
      const next = this.evaluate(pc.idx, keep, ev);
      if (next.ok) st.evs[pc.idx] = next;
    }
    const order = this.unplaced(st);
    for (let i = order.length - 1; i > 0; i--) {
      const j = Math.floor(this.rng() * (i + 1));
      [order[i], order[j]] = [order[j] as number, order[i] as number];
    }
    const all = m.cookers.map((c) => c.idx);
    for (const bi of order) {
      if (this.timeUp()) return;
      const r = this.tryInsert(st, m.batches[bi] as PBatch, all, 0, this.rng);
      if (r) {
        st.evs[r.c] = r.ev;
        this.addColumn(r.c, r.ev);
      }
    }
  }

  /** Take a less valuable batch out of a cooker to let a more valuable unplaced one in. */
  swapPass(st: State, budget: number): boolean {
    let improved = false;
    let spent = 0;
    const order = this.unplaced(st).sort((x, y) => (this.m.batches[y] as PBatch).base - (this.m.batches[x] as PBatch).base || x - y);
    for (const bi of order) {
      const b = this.m.batches[bi] as PBatch;
      let done = false;
      for (const pc of this.m.cookers) {
        if (done || this.timeUp() || spent > budget) break;
        const c = pc.idx;
        if (!this.relax.possible[bi]?.[c]?.some((x) => x)) continue;
        const ev = st.evs[c] as Evaluation;
        const victims = ev.loads
          .filter((l) => !(this.m.batches[l.b] as PBatch).fixed && (this.m.batches[l.b] as PBatch).base < b.base)
          .sort((x, y) => (this.m.batches[x.b] as PBatch).base - (this.m.batches[y.b] as PBatch).base || x.b - y.b);
        for (const v of victims) {
          if (spent > budget) break;
          const without = this.evaluate(c, removeBatch(ev.loads, v.b), ev);
          spent++;
          if (!without.ok) continue;
          const trial: State = { evs: st.evs.slice() };
          trial.evs[c] = without;
          const r = this.tryInsert(trial, b, [c], 6);
          spent += 6;
          // The victim becomes unplaced, so the cooker's value alone decides.
          if (r && r.ev.value > ev.value + 1e-9) {
            st.evs[c] = r.ev;
            this.addColumn(c, r.ev);
            improved = true;
            done = true;
            break;
          }
        }
      }
    }
    return improved;
  }

  /** Move batches later (less waiting before serving) where the cooker still works out. */
  shiftPass(st: State, budget: number): boolean {
    let improved = false;
    let spent = 0;
    for (const pc of this.m.cookers) {
      const c = pc.idx;
      const loads = (st.evs[c] as Evaluation).loads.slice().sort((x, y) => y.s - x.s || compareLoads(x, y));
      for (const l of loads) {
        if (this.timeUp() || spent > budget) return improved;
        const b = this.m.batches[l.b] as PBatch;
        if (b.fixed) continue;
        const ev = st.evs[c] as Evaluation;
        if (!ev.loads.some((x) => x.b === l.b && x.s === l.s)) continue;
        const without = this.evaluate(c, removeBatch(ev.loads, l.b), ev);
        spent++;
        if (!without.ok) continue;
        const gen = this.starts(without, b, c, l.p, true);
        for (let k = 0; k < 6; k++) {
          const nx = gen.next();
          if (nx.done || nx.value <= l.s) break;
          const cand = this.evaluate(c, insertLoad(without.loads, { b: l.b, p: l.p, s: nx.value }), without);
          spent++;
          if (cand.ok && cand.value > ev.value + 1e-9) {
            st.evs[c] = cand;
            this.addColumn(c, cand);
            improved = true;
            break;
          }
        }
      }
    }
    return improved;
  }

  /**
   * Destroy-and-repair one or two cookers: take their batches out and re-pack them together with
   * the unplaced batches, in an order drawn from one of four rules. Accepts a result at least as
   * good as before.
   */
  lns(st: State, cookers: number[]): boolean {
    this.iterations++;
    const m = this.m;
    const pool = new Set<number>();
    const trial: State = { evs: st.evs.slice() };
    for (const c of cookers) {
      const ev = st.evs[c] as Evaluation;
      for (const l of ev.loads) if (!(m.batches[l.b] as PBatch).fixed) pool.add(l.b);
      trial.evs[c] = this.fixedOnly[c] ?? (this.evals[c] as CookerEvaluator).evaluate((this.evals[c] as CookerEvaluator).fixedLoads());
    }
    for (const bi of this.unplaced(st)) if (cookers.some((c) => this.relax.possible[bi]?.[c]?.some((x) => x))) pool.add(bi);
    const items = [...pool].sort((a, z) => a - z);
    const rule = Math.floor(this.rng() * 4);
    const bs = m.batches;
    const noise = items.map(() => this.rng());
    const key = new Map<number, number>();
    items.forEach((bi, k) => {
      const b = bs[bi] as PBatch;
      const nz = noise[k] as number;
      const eLow = Math.max(1, Math.min(...(this.relax.energyLowJ[bi]?.[cookers[0] as number] ?? [1])));
      if (rule === 0) key.set(bi, b.serveBy + (nz - 0.5) * 2 * 3600_000);
      else if (rule === 1) key.set(bi, -(b.base / eLow) * (0.8 + 0.4 * nz));
      else if (rule === 2) key.set(bi, nz);
      else key.set(bi, -b.base * (0.8 + 0.4 * nz));
    });
    items.sort((a, z) => (key.get(a) as number) - (key.get(z) as number) || a - z);
    const order = cookers.length > 1 && this.rng() < 0.5 ? [...cookers].reverse() : cookers;
    const randomPick = this.rng() < 0.5 ? this.rng : undefined;
    return this.repairAndAccept(st, trial, cookers, items, order, randomPick);
  }

  /**
   * The repair both destroy moves share: inserts `items` in that order into `trial` on `order`'s
   * cookers, trusting the forecast (a start it expects to fail is not simulated); keeps the new
   * sequences as columns; takes the trial into `st` when it is better, or now and then when equal (to
   * move along plateaus). Batches taken out and not re-placed lose their value: the sums over
   * `cookers` before and after account for it. True when `st` improved.
   */
  private repairAndAccept(st: State, trial: State, cookers: readonly number[], items: readonly number[], order: readonly number[], pick?: () => number): boolean {
    const bs = this.m.batches;
    const before = cookers.reduce((s, c) => s + (st.evs[c] as Evaluation).value, 0);
    const keep = this.maxFailTries;
    this.maxFailTries = 0;
    try {
      for (const bi of items) {
        if (this.timeUp()) return false;
        const r = this.tryInsert(trial, bs[bi] as PBatch, order, 0, pick);
        if (r) trial.evs[r.c] = r.ev;
      }
    } finally {
      this.maxFailTries = keep;
    }
    const after = cookers.reduce((s, c) => s + (trial.evs[c] as Evaluation).value, 0);
    for (const c of cookers) this.addColumn(c, trial.evs[c] as Evaluation);
    if (after > before + 1e-9 || (after > before - 1e-9 && this.rng() < 0.3)) {
      for (const c of cookers) st.evs[c] = trial.evs[c] as Evaluation;
      return after > before + 1e-9;
    }
    return false;
  }
}
