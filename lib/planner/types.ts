/**
 * The planner's public contract: a day's cookers (with their forecast), batches and shifts in;
 * slots, backup-fuel batches and the quality of the answer (bound, gap) out.
 * Plain data, JSON-serialisable. Times are epoch milliseconds (UTC), durations seconds,
 * temperatures °C (lib/GLOSSARY.md).
 */
import type { CookerSpec, SimulateOptions, SimulationResult, WeatherStep } from '@/lib/thermal/types';

export type CookMethod = 'boil' | 'simmer' | 'steam' | 'bake' | 'fry';

export interface PlannerCooker {
  id: string;
  name: string;
  spec: CookerSpec;
  /** Forecast already resolved to this cooker's aperture, contiguous 60-s steps. */
  weather: WeatherStep[];
  /** Store temperature at weather[0].t [°C] (forecast, or the measured state when re-planning). */
  initialStoreTempC: number;
}

/** A batch already started or finished (re-planning mid-day): it stays where it is. */
export interface FixedSlot {
  cookerId: string;
  potId: string;
  /** When the pot went (or goes) onto the store [epoch ms]; may be before the weather starts. */
  startMs: number;
  /** When it finished [epoch ms], if it already has: it then only counts as served. */
  doneMs?: number;
  /** Measured temperature of the contents at the start of the weather [°C], for a batch still cooking. */
  contentsTempC?: number;
}

export interface PlannerBatch {
  id: string;
  dishId: string;
  dishName: string;
  /** Servings in this batch [–]. */
  servings: number;
  method: CookMethod;
  /** Pot volume the batch needs [L]. */
  potVolumeNeededL: number;
  /** Food (non-water) mass [kg] and its specific heat [J/(kg·K)]; water mass [kg]. */
  foodKg: number;
  foodCpJPerKgK: number;
  waterKg: number;
  /** The pot must hold at least minTempC [°C] for holdS [s]. */
  minTempC: number;
  holdS: number;
  lidOn: boolean;
  /** Earliest time the pot may go on [epoch ms]; the batch must be done by serveByMs [epoch ms]. */
  earliestStartMs: number;
  serveByMs: number;
  fixed?: FixedSlot;
}

export interface Shift {
  startMs: number;
  endMs: number;
}

export interface PlannerProblem {
  cookers: PlannerCooker[];
  batches: PlannerBatch[];
  /** Cooks' working hours: a batch starts and is done within one shift. */
  shifts: Shift[];
  /** Time between two batches on the same pot (emptying, cleaning, filling) [s]. */
  turnaroundS: number;
  /** Start-time grid [min]; default 15. Starts are multiples of it since the epoch (UTC). */
  slotMinutes?: number;
  /** Kitchen altitude [m] (boiling point). */
  altitudeM: number;
  /** Wall-clock budget for the whole solve [s]. */
  timeLimitS: number;
  /** Seed of the search's pseudo-random choices; default 1. */
  seed?: number;
  /** IANA time zone for the clock times in backup details; default 'UTC'. */
  timeZone?: string;
}

/**
 * Why a batch goes to backup fuel. 'above-boiling-point': the dish minimum is above the boiling point
 * of water at the kitchen's altitude, so a pot with water cannot reach it; 'not-placed': a place
 * exists next to the final plan but the search stopped before it found it.
 */
export type BackupReason = 'no-cooker-hot-enough' | 'no-free-pot' | 'outside-shift' | 'pot-too-small' | 'failed-recheck' | 'above-boiling-point' | 'not-placed';

export interface PlannedSlot {
  batchId: string;
  cookerId: string;
  potId: string;
  /** Pot onto the store [epoch ms]. */
  startMs: number;
  /** Pot reaches the dish's minimum temperature [epoch ms] (the ready alert). */
  readyMs: number;
  /** Hold complete; pot comes off [epoch ms]. */
  doneMs: number;
  /** Store temperature when the pot goes on [°C]. */
  predictedStoreTempAtStartC: number | null;
  /** Highest pot temperature [°C]. Both are null for a fixed batch that finished before the forecast starts. */
  predictedPotMaxC: number | null;
  /** True for a batch that was fixed by the caller (already started or done). */
  fixed?: boolean;
}

export interface BackupBatch {
  batchId: string;
  reason: BackupReason;
  /** A sentence a cook understands, e.g. "the store would be 96 °C at 17:40; this dish needs 110 °C". */
  detail: string;
}

export type PlannerStatus =
  /** The plan's servings equal the upper bound. */
  | 'optimal'
  /** The search ran out of time with a gap left. */
  | 'time-limit'
  /** The search ended (no neighbourhood improved any more) before the time limit, with a gap left. */
  | 'converged'
  /** The search stopped at deps.maxIterations with a gap left. */
  | 'iteration-limit'
  /** Only the greedy placement ran (the time budget or the solver was not available). */
  | 'greedy-only'
  /** Nothing to plan. */
  | 'empty';

export interface PlannerResult {
  status: PlannerStatus;
  /** Slots sorted by start, then cooker, then pot. */
  slots: PlannedSlot[];
  backup: BackupBatch[];
  /** Servings cooked on the sun (including fixed batches that complete). */
  servingsOnSun: number;
  /**
   * Objective of the plan: servings on the sun, plus a tie-break below one serving in total that
   * prefers placing the batches needing the most backup heat and finishing close to serve-by.
   */
  objective: number;
  /** Upper bound on servings on the sun (see boundMethod). */
  upperBound: number;
  boundMethod: string;
  /** (upperBound − servingsOnSun) / upperBound; 0 when the bound is 0. */
  gap: number;
  solveTimeMs: number;
  /** Servings on the sun of the greedy placement alone. */
  greedyServings: number;
  /** Search iterations (neighbourhood moves) done. */
  iterations: number;
  log: string[];
}

/** The simulator the planner calls; lib/thermal's simulateCooker by default. */
export type SimulateFn = (spec: CookerSpec, weather: WeatherStep[], opts: SimulateOptions) => SimulationResult;

export interface PlannerDeps {
  /** Simulator; default lib/thermal simulateCooker. The final re-check always uses this one. */
  simulate?: SimulateFn;
  /**
   * Optional cheaper surrogate used while searching (e.g. a coarser step or a linearised store);
   * whatever it gets wrong, the final re-check with `simulate` removes or repairs.
   */
  searchSimulate?: SimulateFn;
  /** Stop after this many search iterations (makes results independent of machine speed). */
  maxIterations?: number;
  /** Restarts of the local search from a perturbed best plan once it stalls (default 50). */
  maxKicks?: number;
  /** Budget of simulations for the complete enumeration of small instances (default 4000; 0 disables it). */
  maxExactEvaluations?: number;
  /** Skip the HiGHS master and bound LP (greedy and local search only). */
  noSolver?: boolean;
  /** Called with each log line as it is written. */
  onLog?: (line: string) => void;
}
