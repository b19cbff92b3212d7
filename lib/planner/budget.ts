/**
 * The planner's time budget: how the wall-clock limit is shared between the search, the LP bound,
 * the final re-check and the result. Every share here is a project choice, measured on the
 * benchmark instances, not taken from a source.
 */
import type { EvaluatorStats, PModel } from './model';
import type { Relaxation } from './relaxation';

/** At most this share of the budget is kept back from the search (for the bound, the re-check and the result). */
export const RESERVE_MAX_SHARE = 0.4;
/** The last share of the search time goes to the shift pass (moving batches later). */
export const SHIFT_PASS_SHARE = 0.05;
/** The LP bound runs only when its estimated cost stays under this share of the budget. */
export const LP_MAX_SHARE = 0.08;
/** Estimated LP bound cost: LP_BASE_MS + LP_MS_PER_TRIPLE per possible (batch, cooker, pot) [ms] (HiGHS-Wasm, measured ~0.1–0.3 s at a few thousand variables). */
export const LP_BASE_MS = 30;
export const LP_MS_PER_TRIPLE = 0.05;
/** The re-check simulates every cooker's day once; with batches it runs about this much slower than without. */
export const RECHECK_SLOWDOWN = 2;
export const RECHECK_MARGIN_MS = 10;
export const RESERVE_MARGIN_MS = 20;

export class Budget {
  readonly budgetMs: number;
  readonly tEnd: number;
  /** Time kept for the final re-check [ms], from the simulator's measured speed. */
  recheckMs: number;
  /** Whether the LP bound fits the budget, and its estimated cost [ms]. */
  runLp = false;
  lpMs = 0;
  /** End of the search, shift pass included [performance.now() ms]. */
  deadline: number;
  private readonly dayStepsTotal: number;

  constructor(
    readonly tStart: number,
    timeLimitS: number,
    m: PModel,
    private readonly stats: EvaluatorStats,
  ) {
    this.budgetMs = timeLimitS * 1000;
    this.tEnd = tStart + this.budgetMs;
    this.dayStepsTotal = m.cookers.reduce((a, c) => a + c.n, 0);
    this.recheckMs = this.recheckEstimate();
    this.deadline = this.tEnd;
  }

  /** Decides the LP bound from the relaxation's size, then sets the deadline. */
  planLp(relax: Relaxation): void {
    let triples = 0;
    for (const pb of relax.possible) for (const pc of pb) for (const x of pc) if (x) triples++;
    this.lpMs = LP_BASE_MS + LP_MS_PER_TRIPLE * triples;
    this.runLp = this.lpMs < LP_MAX_SHARE * this.budgetMs;
    this.deadline = this.tEnd - this.reserveMs();
  }

  /** Re-measures the simulator speed (after the greedy, when the code is compiled) and moves the deadline. */
  remeasure(): void {
    this.recheckMs = this.recheckEstimate();
    this.deadline = this.tEnd - this.reserveMs();
  }

  /** End of the neighbourhood search proper, before the shift pass. */
  get searchDeadline(): number {
    return this.deadline - SHIFT_PASS_SHARE * this.budgetMs;
  }

  /** Seconds left for the LP bound after keeping the re-check's time. */
  lpLeftS(): number {
    return (this.tEnd - performance.now() - this.recheckMs - RECHECK_MARGIN_MS) / 1000;
  }

  private reserveMs(): number {
    return Math.min(RESERVE_MAX_SHARE * this.budgetMs, this.recheckMs + (this.runLp ? this.lpMs : 0) + RESERVE_MARGIN_MS);
  }

  private recheckEstimate(): number {
    return (RECHECK_SLOWDOWN * this.dayStepsTotal * (this.stats.simMs ?? 0)) / Math.max(1, this.stats.simSteps) + RECHECK_MARGIN_MS;
  }
}
