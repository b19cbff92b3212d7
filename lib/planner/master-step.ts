/**
 * The set-packing master as a step of the search: every column met so far, solved by HiGHS
 * (master.ts) warm-started with the current plan, and the current plan replaced when the master's
 * selection is better. When it runs is MasterSchedule's decision (improve.ts).
 */
import type { Highs } from 'highs';
import { HIGHS_STOP_BYTES, highsHeapBytes, highsUsable, solveMaster } from './master';
import type { CookerEvaluator, Evaluation } from './model';
import type { SearchRun } from './run';
import { stateValue, type State } from './search';

/** Smallest HiGHS time limit of one master [s]. */
export const MASTER_MIN_TIME_S = 0.02;
/** An intermediate master gets at most this share of the whole budget, and a third of what is left. */
export const MASTER_MAX_SHARE = 0.05;
/** No intermediate master with less than this left before the deadline [s]. */
export const MASTER_MIN_LEFT_S = 0.05;

export class MasterStep {
  runs = 0;
  /** HiGHS status of the last solve (7: optimal), −1 when none. */
  lastStatus = -1;
  /** Time spent in master solves [ms]. */
  ms = 0;
  private lastPool = 0;
  private heapFull = false;
  constructor(
    readonly highs: Highs | null,
    private readonly run: SearchRun,
  ) {}

  get usable(): boolean {
    return highsUsable(this.highs);
  }

  /** Lets the next solve run even when no column was added (after the exact enumeration). */
  forgetPool(): void {
    this.lastPool = -1;
  }

  /**
   * Solves the master over every column when there are new ones; `final` gives it all the time left.
   * True when the current plan was replaced by a better one.
   */
  solve(final: boolean): boolean {
    const { m, search, st, fixedOnly, evals, say } = this.run;
    const highs = this.highs;
    if (!highsUsable(highs) || search.pool.size === this.lastPool) return false;
    if (highsHeapBytes(highs) > HIGHS_STOP_BYTES) {
      if (!this.heapFull) say(`HiGHS heap at ${Math.round(highsHeapBytes(highs) / 2 ** 20)} MiB: no more master solves in this plan`);
      this.heapFull = true;
      return false;
    }
    const left = (this.run.budget.deadline - performance.now()) / 1000;
    if (!final && left < MASTER_MIN_LEFT_S) return false;
    this.runs++;
    // The current plan's sequences go into the pool first, so that the MIP start is the whole plan.
    for (const [c, ev] of st.evs.entries()) search.addColumn(c, ev, true);
    this.lastPool = search.pool.size;
    const cols = [...search.pool.values()];
    const inc = new Set(st.evs.map((ev, c) => `${c}|${ev.key}`));
    const tM = performance.now();
    // HiGHS returns its best (≥ the warm start) at the limit.
    const limitS = Math.max(MASTER_MIN_TIME_S, final ? left : Math.min(left / 3, MASTER_MAX_SHARE * this.run.timeLimitS));
    const res = solveMaster(highs, m.cookers.length, cols, inc, limitS);
    this.lastStatus = res?.status ?? -1;
    this.ms += performance.now() - tM;
    if (!highsUsable(highs)) say('HiGHS failed: no more master solves in this plan (local search and the re-check go on)');
    if (!res) return false;
    const cur = stateValue(m, st);
    // The master counts the movable batches only; fixed and finished batches are the same in every plan.
    const constant = m.doneValue + fixedOnly.evs.reduce((a, ev) => a + ev.value, 0);
    if (res.objective + constant <= cur + 1e-7) return false;
    const next: Evaluation[] = fixedOnly.evs.slice();
    for (const col of res.chosen) next[col.c] = (evals[col.c] as CookerEvaluator).evaluate(col.loads);
    const trial: State = { evs: next.map((ev, c) => (ev.ok ? ev : (st.evs[c] as Evaluation))) };
    if (hasDuplicate(trial) || stateValue(m, trial) <= cur + 1e-9) return false;
    st.evs = trial.evs;
    say(`master: ${cols.length} columns → objective ${stateValue(m, st).toFixed(4)}`);
    return true;
  }
}

/** Columns are disjoint, but a fallback to the old sequence could duplicate a batch. */
function hasDuplicate(s: State): boolean {
  const seen = new Set<number>();
  for (const ev of s.evs)
    for (const l of ev.loads) {
      if (seen.has(l.b)) return true;
      seen.add(l.b);
    }
  return false;
}
