/**
 * Placement heuristics on per-cooker sequences, every candidate checked by simulation:
 *
 * - construction (greedy): batches by serve-by (then the most heat first), each at the feasible
 *   (cooker, pot, grid start) forecast to finish first; only the cooker that receives it is
 *   re-simulated (Search.greedy);
 * - insertion (Search.tryInsert), the insertion every repair uses, and the passes: insertion, swap
 *   (take one batch out, put a more valuable one in), shift (move a batch later so it waits less
 *   before serving);
 * - the large-neighbourhood moves built on them are in lns.ts, the kicks in ils.ts.
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

/**
 * Randomised repair (noise in the insertion, as Ropke & Pisinger 2006 add noise to insertion costs;
 * the rule here is a project choice): with a `pick` generator, the second best forecast is tried first
 * when u < RANK_PICK_SECOND_BELOW, the third when u < RANK_PICK_THIRD_BELOW.
 */
export const RANK_PICK_SECOND_BELOW = 0.15;
export const RANK_PICK_THIRD_BELOW = 0.22;

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
      const j = u < RANK_PICK_SECOND_BELOW ? 1 : u < RANK_PICK_THIRD_BELOW && ranked.length > 2 && ranked[2]?.done !== Infinity ? 2 : 0;
      if (j > 0) ranked.unshift(...ranked.splice(j, 1));
    }
    return ranked;
  }

  /**
   * Places batch b on one of `cookers`: candidate (cooker, pot, start) triples that pass the
   * necessary tests are ranked by the pot screen's forecast completion time ('estimate' mode), and
   * simulated best first until one works (earliest completion; ties: earlier start, smaller pot,
   * then the order of `cookers`). Returns the new evaluation, or null.
   */
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

  /**
   * Construction (greedy insertion): each batch of `order` in turn at its first feasible candidate
   * (tryInsert) on `cookers`; a batch with none stays unplaced. Stops early only when time is up
   * after the search has begun.
   */
  greedy(st: State, order: readonly number[], cookers: readonly number[]): void {
    for (const bi of order) {
      if (this.timeUp() && this.iterations > 0) return;
      const b = this.m.batches[bi] as PBatch;
      const r = this.tryInsert(st, b, cookers);
      if (r) st.evs[r.c] = r.ev;
    }
  }

  /** The construction's order: earliest serve-by first, then the most heat, then the index. */
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
}
