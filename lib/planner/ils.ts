/**
 * Iterated local search around the large-neighbourhood search (Lourenço, Martin & Stützle 2003,
 * "Iterated local search", in Glover & Kochenberger (eds.), Handbook of Metaheuristics, Kluwer,
 * pp. 321–353): when the search stalls and wider destroys do not help, the best plan so far is
 * perturbed (a kick) and the search goes on from there. Restarting each kick from the best plan is
 * their "Better" acceptance criterion for the perturbation step; the best plan is kept across kicks.
 */
import type { PBatch } from './model';
import type { Search, State } from './search';

/** Share of the placed movable batches a kick takes out, each independently. Project choice. */
export const KICK_REMOVAL_SHARE = 0.25;
/** Kicks per plan before the search is declared converged (PlannerDeps.maxKicks overrides). */
export const DEFAULT_MAX_KICKS = 50;
/** Iterations without improvement that make a stall: max(STALL_MIN, STALL_PER_COOKER · cookers). Project choice. */
export const STALL_MIN = 16;
export const STALL_PER_COOKER = 4;
/** Wider destroys tried after a stall before a kick (each re-packs one more cooker, from 3). */
export const MAX_ESCALATIONS = 3;

/**
 * Kick (perturbation): each placed movable batch is taken out with probability `share`, then the
 * unplaced batches are re-inserted in a random order with a randomised choice among the best
 * forecasts. The result may be worse than `st`; the caller keeps the best plan.
 */
export function kick(search: Search, st: State, share = KICK_REMOVAL_SHARE): void {
  const m = search.m;
  for (const pc of m.cookers) {
    const ev = st.evs[pc.idx];
    if (!ev) continue;
    const out = ev.loads.filter((l) => !(m.batches[l.b] as PBatch).fixed && search.rng() < share);
    if (out.length === 0) continue;
    const keep = ev.loads.filter((l) => !out.includes(l));
    const next = search.evaluateOn(pc.idx, keep, ev);
    if (next.ok) st.evs[pc.idx] = next;
  }
  const order = search.unplaced(st);
  for (let i = order.length - 1; i > 0; i--) {
    const j = Math.floor(search.rng() * (i + 1));
    [order[i], order[j]] = [order[j] as number, order[i] as number];
  }
  const all = m.cookers.map((c) => c.idx);
  for (const bi of order) {
    if (search.timeUp()) return;
    const r = search.tryInsert(st, m.batches[bi] as PBatch, all, 0, search.rng);
    if (r) {
      st.evs[r.c] = r.ev;
      search.addColumn(r.c, r.ev);
    }
  }
}

/**
 * Counts iterations without improvement and decides what a stall leads to: a wider destroy (level
 * 1…MAX_ESCALATIONS: re-pack 2 + level cookers at once, while that leaves at least two cookers
 * untouched), then a kick.
 */
export class StallPolicy {
  /** Iterations since the last improvement. */
  stale = 0;
  /** 0: adaptive moves; k > 0: re-pack 2 + k cookers at once. */
  level = 0;
  readonly limit: number;
  constructor(readonly nCookers: number) {
    this.limit = Math.max(STALL_MIN, STALL_PER_COOKER * nCookers);
  }

  get stalled(): boolean {
    return this.stale >= this.limit;
  }

  /** The plan improved: back to the adaptive moves. */
  progress(): void {
    this.stale = 0;
    this.level = 0;
  }

  noProgress(): void {
    this.stale++;
  }

  /** A stall the passes and the master could not break: 'wider' (level raised) or 'kick' (level reset). */
  escalate(): 'wider' | 'kick' {
    this.stale = 0;
    this.level++;
    if (this.level > MAX_ESCALATIONS || this.level > this.nCookers - 2) {
      this.level = 0;
      return 'kick';
    }
    return 'wider';
  }

  /** Cookers a wider destroy re-packs at once. */
  get width(): number {
    return 2 + this.level;
  }
}
