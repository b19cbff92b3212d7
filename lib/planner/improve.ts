/**
 * The improvement phase: an adaptive large-neighbourhood search (Ropke & Pisinger 2006,
 * Transportation Science 40(4):455–472) inside an iterated local search (Lourenço, Martin & Stützle
 * 2003), with the set-packing master run on a schedule. Outline of one iteration:
 *
 *   stop?  (stoppingRule: at the bound, out of time, or at maxIterations)
 *   stall? (StallPolicy: master, swap and insertion passes; else a wider destroy; else a kick)
 *   choose a move (MoveChooser) and its cookers (chooseCookers), destroy, repair, accept (lns.ts)
 *   record the move's gain per unit of work; keep the best plan
 *   master due? (MasterSchedule)
 */
import { VALUE_EPS } from './acceptance';
import { DEFAULT_MAX_KICKS, kick, StallPolicy } from './ils';
import { chooseCookers, CookerCycle, reinsertFewBatches, repackCookers } from './lns';
import type { MasterStep } from './master-step';
import { LNS_MOVES, MoveChooser, movesFor, type LnsMove } from './move-chooser';
import type { SearchRun } from './run';
import { stateServings, stateValue } from './search';

export type StopReason = 'bound' | 'converged' | 'time' | 'iterations';

/** Work budgets of the swap pass (candidate evaluations per cooker) at the start and at a stall. Project choice. */
export const SWAP_BUDGET_START_PER_COOKER = 40;
export const SWAP_BUDGET_STALL_PER_COOKER = 20;

/**
 * Stopping rule, checked before every iteration in this order: the plan reaches the upper bound
 * (proven optimal), the search deadline passed, or `maxIterations` iterations were done. Null: go on.
 * (The search also ends, 'converged', when the kicks are used up: improvePlan.)
 */
export function stoppingRule(s: { atBound: boolean; timeUp: boolean; iterations: number; maxIterations: number }): StopReason | null {
  if (s.atBound) return 'bound';
  if (s.timeUp) return 'time';
  if (s.iterations >= s.maxIterations) return 'iterations';
  return null;
}

/**
 * When the master runs: every `interval` iterations, starting at MASTER_BASE_INTERVAL_PER_COOKER ·
 * max(8, cookers); the interval doubles each time the master finds nothing, up to 8× that, and falls
 * back when it finds something. Project choice (the master's cost grows with the pool).
 */
export const MASTER_BASE_INTERVAL_PER_COOKER = 2;
export const MASTER_MIN_COOKERS = 8;
export const MASTER_MAX_INTERVAL_FACTOR = 8;

export class MasterSchedule {
  readonly base: number;
  readonly max: number;
  interval: number;
  /** Iteration count at which the master is next due. */
  next: number;
  constructor(nCookers: number) {
    this.base = MASTER_BASE_INTERVAL_PER_COOKER * Math.max(MASTER_MIN_COOKERS, nCookers);
    this.max = MASTER_MAX_INTERVAL_FACTOR * this.base;
    this.interval = this.base;
    this.next = this.base;
  }

  due(iterations: number): boolean {
    return iterations >= this.next;
  }

  /** After a master at `iterations`: back to the base interval when it `found` a better plan, else twice as long. */
  record(found: boolean, iterations: number): void {
    this.interval = found ? this.base : Math.min(this.max, 2 * this.interval);
    this.next = iterations + this.interval;
  }
}

export interface ImproveLimits {
  maxIterations: number;
  maxKicks?: number;
}

/**
 * Improves `run.st` in place until the stopping rule holds or the kicks are used up; ends on the best
 * plan met, after a final master. Returns why it stopped.
 */
export function improvePlan(run: SearchRun, master: MasterStep, limits: ImproveLimits): StopReason {
  const { m, search, st, say } = run;
  const nC = m.cookers.length;
  const atBound = () => stateServings(m, st) >= run.bound - 1e-9;
  if (atBound()) return 'bound';
  if (performance.now() >= run.budget.deadline) return 'converged';
  search.swapPass(st, SWAP_BUDGET_START_PER_COOKER * nC);
  say(`swap pass: ${stateServings(m, st)} servings`);
  search.insertionPass(st);
  master.solve(false);
  say(`insertion pass and master: ${stateServings(m, st)} servings`);

  const stop = searchLoop(run, master, limits, atBound);
  keepBest(run, true);
  master.solve(true);
  return stop;
}

function searchLoop(run: SearchRun, master: MasterStep, limits: ImproveLimits, atBound: () => boolean): StopReason {
  const { m, relax, search, st, say, rng } = run;
  const nC = m.cookers.length;
  const maxKicks = limits.maxKicks ?? DEFAULT_MAX_KICKS;
  const moves = new MoveChooser(movesFor(nC), rng);
  const stall = new StallPolicy(nC);
  const schedule = new MasterSchedule(nC);
  const cycle = new CookerCycle(m, rng);
  let kicks = 0;
  for (;;) {
    const stop = stoppingRule({ atBound: atBound(), timeUp: search.timeUp(), iterations: search.iterations, maxIterations: limits.maxIterations });
    if (stop) return stop;
    if (stall.stalled) {
      if (master.solve(false) || search.swapPass(st, SWAP_BUDGET_STALL_PER_COOKER * nC) || search.insertionPass(st)) {
        stall.progress();
        continue;
      }
      if (stall.escalate() === 'kick') {
        keepBest(run, false);
        if (kicks >= maxKicks) return 'converged';
        kicks++;
        st.evs = run.best.evs.slice();
        kick(search, st);
        say(`search: kick ${kicks} from the best plan (${stateServings(m, run.best)} servings) → ${stateServings(m, st)} servings`);
        continue;
      }
      say(`search: no improvement, destroying up to ${stall.width} cookers`);
    }
    // Level 0: a move drawn by its recent gain per unit of work; a wider destroy re-packs stall.width cookers.
    const first = cycle.next();
    const op = stall.level === 0 ? moves.draw() : -1;
    const move: LnsMove | undefined = LNS_MOVES[op];
    const cookers = chooseCookers(m, relax, st, first, move ? move.cookers : stall.width, rng);
    const workBefore = search.work();
    const vBefore = stateValue(m, st);
    const improved = move?.partial ? reinsertFewBatches(search, st, cookers) : repackCookers(search, st, cookers);
    if (move) moves.record(op, Math.max(0, stateValue(m, st) - vBefore), search.work() - workBefore);
    if (improved) {
      stall.progress();
      if (stateValue(m, st) > stateValue(m, run.best) + VALUE_EPS) {
        if (stateServings(m, st) > stateServings(m, run.best)) say(`best: ${stateServings(m, st)} servings (iteration ${search.iterations})`);
        run.best = { evs: st.evs.slice() };
      }
    } else stall.noProgress();
    if (schedule.due(search.iterations)) {
      const found = master.solve(false);
      if (found) stall.progress();
      schedule.record(found, search.iterations);
    }
  }
}

/**
 * Keeps the better of the current and the best plan: `intoCurrent` copies the best into the current
 * plan when it is better, otherwise the current one becomes the best when better.
 */
function keepBest(run: SearchRun, intoCurrent: boolean): void {
  const { m, st } = run;
  if (intoCurrent) {
    if (stateValue(m, run.best) > stateValue(m, st) + VALUE_EPS) st.evs = run.best.evs.slice();
  } else if (stateValue(m, st) > stateValue(m, run.best) + VALUE_EPS) run.best = { evs: st.evs.slice() };
}

