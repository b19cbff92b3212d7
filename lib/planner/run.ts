/** What the phases of one plan share: the model, the search, the current and best plans, the budget. */
import type { Budget } from './budget';
import type { CookerEvaluator, PModel } from './model';
import type { Relaxation } from './relaxation';
import type { Search, State } from './search';

export interface SearchRun {
  m: PModel;
  relax: Relaxation;
  search: Search;
  /** The search's evaluators (its simulator may be a surrogate). */
  evals: CookerEvaluator[];
  /** The current plan, changed in place by every phase. */
  st: State;
  /** Per cooker, the sequence of its fixed batches that work. */
  fixedOnly: State;
  /** The best plan the local search has kept (starts as the greedy plan). */
  best: State;
  rng: () => number;
  budget: Budget;
  timeLimitS: number;
  /** Current upper bound on servings (the simple bound, the exact optimum once proven). */
  bound: number;
  say: (line: string) => void;
}
