/**
 * Large-neighbourhood search moves (Shaw 1998, "Using constraint programming and local search methods
 * to solve vehicle routing problems", CP-98; in the adaptive form of Ropke & Pisinger 2006,
 * Transportation Science 40(4):455–472): destroy part of the plan, repair it with a randomised greedy
 * insertion, and decide the result with the acceptance criterion (acceptance.ts).
 *
 * Destroy operators:
 * - emptyCookers: every movable batch of the chosen cookers taken out (a whole-cooker re-pack);
 * - removeRandomBatches: a few random movable batches of each chosen cooker taken out (Ropke &
 *   Pisinger's random removal, per cooker). Cheaper, so many more of these fit in the time.
 * The removed batches and the unplaced batches that could go on those cookers are re-inserted in an
 * order drawn from a repair rule, each at its best forecast (cooker, pot, start) (Search.tryInsert).
 * Fixed batches are never removed.
 */
import { acceptRepair } from './acceptance';
import type { CookerEvaluator, Evaluation, Load, PBatch, PModel } from './model';
import type { Relaxation } from './relaxation';
import { placedOf, type Search, type State } from './search';

/** removeRandomBatches takes between these many batches out of each cooker (uniform). Project choice. */
export const FEW_BATCHES_MIN = 1;
export const FEW_BATCHES_MAX = 2;
/** Noise on a batch's value in the few-batches repair order: × (1 ± 0.15), uniform. Project choice. */
export const FEW_BATCHES_VALUE_NOISE = 0.15;
/** Noise in the re-pack orders: serve-by ± 1 h, values × (1 ± 0.2), uniform. Project choice. */
export const REPACK_SERVE_BY_NOISE_MS = 3600_000;
export const REPACK_VALUE_NOISE = 0.2;
/** Probability that a two-cooker re-pack fills the cookers in reverse order, and that its repair sometimes takes the second or third best forecast (Search.rank). */
export const REPACK_REVERSE_PROBABILITY = 0.5;
export const REPACK_RANDOM_PICK_PROBABILITY = 0.5;

/** The order rules of a re-pack, drawn with equal probability. */
export const REPACK_ORDER_RULES = ['serve-by', 'value-per-energy', 'random', 'value'] as const;

export interface Destroyed {
  /** The plan with the batches taken out (the other cookers unchanged). */
  trial: State;
  /** Batches taken out, in the order they were removed. */
  removed: number[];
}

/**
 * Destroy: empties `cookers` down to their fixed batches (the sequence of fixed batches that work).
 */
export function emptyCookers(search: Search, st: State, cookers: readonly number[]): Destroyed {
  const m = search.m;
  const removed: number[] = [];
  const trial: State = { evs: st.evs.slice() };
  for (const c of cookers) {
    const ev = st.evs[c] as Evaluation;
    for (const l of ev.loads) if (!(m.batches[l.b] as PBatch).fixed && !removed.includes(l.b)) removed.push(l.b);
    const e = search.evals[c] as CookerEvaluator;
    trial.evs[c] = search.fixedOnly[c] ?? e.evaluate(e.fixedLoads());
  }
  return { trial, removed };
}

/**
 * Destroy: takes `k` random movable batches out of each of `cookers` (fewer when a cooker has fewer);
 * a cooker whose shortened sequence fails in simulation is left as it was.
 */
export function removeRandomBatches(search: Search, st: State, cookers: readonly number[], k: number): Destroyed {
  const bs = search.m.batches;
  const removed: number[] = [];
  const trial: State = { evs: st.evs.slice() };
  for (const c of cookers) {
    const ev = st.evs[c] as Evaluation;
    const movable = ev.loads.filter((l) => !(bs[l.b] as PBatch).fixed);
    const out: Load[] = [];
    for (let t = 0; t < k && movable.length > 0; t++) out.push(...movable.splice(Math.floor(search.rng() * movable.length), 1));
    if (out.length === 0) continue;
    const next = search.evaluateOn(
      c,
      ev.loads.filter((l) => !out.includes(l)),
      ev,
    );
    if (!next.ok) continue;
    trial.evs[c] = next;
    for (const l of out) if (!removed.includes(l.b)) removed.push(l.b);
  }
  return { trial, removed };
}

/** The batches a repair tries: the removed ones and the unplaced ones possible on one of `cookers`, by index. */
export function repairCandidates(search: Search, st: State, cookers: readonly number[], removed: readonly number[]): number[] {
  const pool = new Set<number>(removed);
  for (const bi of search.unplaced(st)) if (cookers.some((c) => search.relax.possible[bi]?.[c]?.some((x) => x))) pool.add(bi);
  return [...pool].sort((a, z) => a - z);
}

/** Repair order of the few-batches move: most valuable first, values × (1 ± FEW_BATCHES_VALUE_NOISE); ties by index. */
export function orderByNoisyValue(search: Search, items: readonly number[]): number[] {
  const bs = search.m.batches;
  const noise = new Map(items.map((bi) => [bi, search.rng()]));
  const lo = 1 - FEW_BATCHES_VALUE_NOISE;
  const span = 2 * FEW_BATCHES_VALUE_NOISE;
  const key = (bi: number) => (bs[bi] as PBatch).base * (lo + span * (noise.get(bi) as number));
  return [...items].sort((a, z) => key(z) - key(a) || a - z);
}

/**
 * Repair order of a re-pack: one of REPACK_ORDER_RULES drawn at random — serve-by (± 1 h), value per
 * lower bound of heat drawn on the first cooker, random, or value (values × (1 ± 0.2)); ties by index.
 */
export function orderByRandomRule(search: Search, items: readonly number[], firstCooker: number): number[] {
  const bs = search.m.batches;
  const relax: Relaxation = search.relax;
  const rule = REPACK_ORDER_RULES[Math.floor(search.rng() * REPACK_ORDER_RULES.length)];
  const noise = items.map(() => search.rng());
  const lo = 1 - REPACK_VALUE_NOISE;
  const span = 2 * REPACK_VALUE_NOISE;
  const key = new Map<number, number>();
  items.forEach((bi, k) => {
    const b = bs[bi] as PBatch;
    const nz = noise[k] as number;
    const eLow = Math.max(1, Math.min(...(relax.energyLowJ[bi]?.[firstCooker] ?? [1])));
    if (rule === 'serve-by') key.set(bi, b.serveBy + (nz - 0.5) * 2 * REPACK_SERVE_BY_NOISE_MS);
    else if (rule === 'value-per-energy') key.set(bi, -(b.base / eLow) * (lo + span * nz));
    else if (rule === 'random') key.set(bi, nz);
    else key.set(bi, -b.base * (lo + span * nz));
  });
  return [...items].sort((a, z) => (key.get(a) as number) - (key.get(z) as number) || a - z);
}

/**
 * Repair: inserts `items` in that order into `trial` on `order`'s cookers, each at the first
 * candidate that simulates feasible (Search.tryInsert), trusting the forecast (a start it expects to
 * fail is not simulated). Every sequence it writes into `trial` is a feasible simulated one. False
 * when the search ran out of time before the end (the trial is then incomplete).
 */
export function repair(search: Search, trial: State, items: readonly number[], order: readonly number[], pick?: () => number): boolean {
  const bs = search.m.batches;
  const keep = search.maxFailTries;
  search.maxFailTries = 0;
  try {
    for (const bi of items) {
      if (search.timeUp()) return false;
      const r = search.tryInsert(trial, bs[bi] as PBatch, order, 0, pick);
      if (r) trial.evs[r.c] = r.ev;
    }
  } finally {
    search.maxFailTries = keep;
  }
  return true;
}

/**
 * Repairs the destroyed `trial`, keeps its sequences as columns and takes it into `st` when the
 * acceptance criterion accepts it. Batches taken out and not re-placed lose their value: the sums over
 * `cookers` before and after account for it. True when `st` improved.
 */
function repairAndAccept(search: Search, st: State, cookers: readonly number[], trial: State, items: readonly number[], order: readonly number[], pick?: () => number): boolean {
  const before = cookers.reduce((s, c) => s + (st.evs[c] as Evaluation).value, 0);
  if (!repair(search, trial, items, order, pick)) return false;
  const after = cookers.reduce((s, c) => s + (trial.evs[c] as Evaluation).value, 0);
  for (const c of cookers) search.addColumn(c, trial.evs[c] as Evaluation);
  const verdict = acceptRepair(before, after, search.rng);
  if (verdict !== 'reject') for (const c of cookers) st.evs[c] = trial.evs[c] as Evaluation;
  return verdict === 'improve';
}

/** One iteration: removeRandomBatches (1–2 per cooker), repair by noisy value, accept. True when `st` improved. */
export function reinsertFewBatches(search: Search, st: State, cookers: readonly number[]): boolean {
  const k = FEW_BATCHES_MIN + Math.floor(search.rng() * (FEW_BATCHES_MAX - FEW_BATCHES_MIN + 1));
  search.iterations++;
  const { trial, removed } = removeRandomBatches(search, st, cookers, k);
  const items = orderByNoisyValue(search, repairCandidates(search, st, cookers, removed));
  return repairAndAccept(search, st, cookers, trial, items, cookers, search.rng);
}

/** One iteration: emptyCookers, repair in a randomly drawn order, accept. True when `st` improved. */
export function repackCookers(search: Search, st: State, cookers: readonly number[]): boolean {
  search.iterations++;
  const { trial, removed } = emptyCookers(search, st, cookers);
  const items = orderByRandomRule(search, repairCandidates(search, st, cookers, removed), cookers[0] as number);
  const order = cookers.length > 1 && search.rng() < REPACK_REVERSE_PROBABILITY ? [...cookers].reverse() : cookers;
  const pick = search.rng() < REPACK_RANDOM_PICK_PROBABILITY ? search.rng : undefined;
  return repairAndAccept(search, st, cookers, trial, items, order, pick);
}

/**
 * The cookers a move destroys: `first`, then up to want − 1 partners each related to the previous one
 * (relatedCooker), at most 4·want draws. A related-removal choice in the spirit of Shaw (1998).
 */
export function chooseCookers(m: PModel, relax: Relaxation, st: State, first: number, want: number, rng: () => number): number[] {
  const pick = [first];
  for (let tries = 0; pick.length < Math.min(want, m.cookers.length) && tries < 4 * want; tries++) {
    const c2 = relatedCooker(m, relax, st, pick[pick.length - 1] as number, rng);
    if (!pick.includes(c2)) pick.push(c2);
  }
  return pick;
}

/**
 * A cooker other than c1, drawn in proportion to the number of batches it could take that are on c1
 * or unplaced (uniform when there are none). Needs at least two cookers.
 */
export function relatedCooker(m: PModel, relax: Relaxation, st: State, c1: number, rng: () => number): number {
  const nC = m.cookers.length;
  const where = placedOf(m, st);
  const score = new Array<number>(nC).fill(0);
  for (const b of m.batches) {
    if (b.fixed) continue;
    const w = where[b.idx] as number;
    if (w !== c1 && w >= 0) continue;
    const poss = relax.possible[b.idx];
    if (!poss) continue;
    for (let c = 0; c < nC; c++) if (c !== c1 && poss[c]?.some((x) => x)) score[c] = (score[c] as number) + 1;
  }
  const total = score.reduce((s, x) => s + x, 0);
  if (total === 0) {
    const r = Math.floor(rng() * (nC - 1));
    return r >= c1 ? r + 1 : r;
  }
  let u = rng() * total;
  for (let c = 0; c < nC; c++) {
    u -= score[c] as number;
    if (u < 0 && c !== c1) return c;
  }
  return c1 === 0 ? 1 : 0;
}

/** Each cooker in turn as the first of a move, in a fresh random permutation (Fisher–Yates) each round. */
export class CookerCycle {
  private order: number[];
  private pos = 0;
  constructor(
    private readonly m: PModel,
    private readonly rng: () => number,
  ) {
    this.order = this.permutation();
  }

  next(): number {
    if (this.pos >= this.order.length) {
      this.order = this.permutation();
      this.pos = 0;
    }
    return this.order[this.pos++] as number;
  }

  private permutation(): number[] {
    const a = this.m.cookers.map((c) => c.idx);
    for (let i = a.length - 1; i > 0; i--) {
      const j = Math.floor(this.rng() * (i + 1));
      [a[i], a[j]] = [a[j] as number, a[i] as number];
    }
    return a;
  }
}
