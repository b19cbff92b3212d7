/**
 * planDay: packs a day's batches onto stored-heat solar cookers.
 *
 * Why not one big time-indexed MILP: with the store energy linearised and big-M store constraints, a
 * naive model of 6 cookers × 30 batches × 64 quarter-hours still had a 29 % gap after 60 s, and at
 * 12 × 60 × 72 it did worse than a greedy (measured in the project before this module). The structure is used instead:
 * batches on different cookers do not interact (each cooker has its own store), so a plan is one
 * simulated sequence per cooker, and HiGHS only recombines such sequences.
 *
 * The method, one module per part:
 *  1. relaxations (relaxation.ts): where each batch could run alone, its quickest pot occupation and
 *     energy bounds — to prune candidates, explain backups and bound the optimum; the time budget
 *     (budget.ts);
 *  2. construction (search.ts Search.greedy): batches by serve-by, each at the (cooker, pot, grid
 *     start) the pot screen (screen.ts) forecasts to finish first, verified by simulating the
 *     receiving cooker only;
 *  3. small instances: every subset of batches on every cooker decided exactly (exact.ts);
 *  4. improvement (improve.ts): an adaptive large-neighbourhood search (Ropke & Pisinger 2006,
 *     Transportation Science 40(4):455–472) — destroy operators and repair in lns.ts, the acceptance
 *     criterion in acceptance.ts, the adaptive move weights in move-chooser.ts — inside an iterated
 *     local search (kicks from the best plan, ils.ts; Lourenço, Martin & Stützle 2003), with the
 *     set-packing master over every feasible sequence met (master-step.ts, master.ts) on a schedule;
 *     then a pass moving batches later to wait less;
 *  5. an upper bound (bound.ts: exact when 3 completed, else an LP relaxation or, when that is too
 *     slow for the budget, the sum of servings of batches feasible alone) and the gap;
 *  6. a final re-check (recheck.ts): every cooker's sequence simulated in full from its initial state
 *     with the full simulator; a batch that fails is moved or sent to backup ('failed-recheck');
 *  7. the result: slots and the backup reasons, each checked against the final plan (report.ts).
 * The plan never scores below the greedy one (moves and the master only replace the plan with a
 * better one; the best plan is kept across kicks). Deterministic for the same inputs as long as the
 * time limit does not cut the search (deps.maxIterations makes it independent of machine speed).
 * The greedy always completes, so under heavy CPU contention the time limit can be exceeded.
 */
import type { Highs } from 'highs';
import { BOUND_METHOD_EXACT, BOUND_METHOD_SIMPLE, computeBound, type BoundResult } from './bound';
import { Budget } from './budget';
import { enumerateExact } from './exact';
import { improvePlan, type StopReason } from './improve';
import { highsUsable, loadHighs, recycleHighsIfLarge, warmPlanner as warmHighs } from './master';
import { MasterStep } from './master-step';
import { buildModel, CookerEvaluator, type Evaluation, type EvaluatorStats, type Load, type PBatch, type PModel } from './model';
import { mulberry32 } from '@/lib/random';
import { recheckPlan } from './recheck';
import { buildRelaxation, type Relaxation } from './relaxation';
import { backupReasons, buildSlots, failureDetail } from './report';
import type { SearchRun } from './run';
import { PotScreen } from './screen';
import { Search, stateServings, stateValue, type State } from './search';
import { getDefaultSimulate } from './simulator';
import type { PlannerDeps, PlannerProblem, PlannerResult, PlannerStatus, SimulateFn } from './types';
import { validateProblem } from './validate';

/** Simulations the exact enumeration of a small instance may spend (PlannerDeps.maxExactEvaluations overrides). */
export const DEFAULT_MAX_EXACT_EVALUATIONS = 4000;
/** Share of the time left that the exact enumeration may use. Project choice. */
export const EXACT_TIME_SHARE = 0.35;
/** Work budget of the final shift pass (candidate evaluations per cooker). Project choice. */
export const SHIFT_BUDGET_PER_COOKER = 30;
/** The LP bound is not started with less than this left [s]. */
export const LP_MIN_TIME_S = 0.02;

/**
 * Loads HiGHS once for the process and runs a small plan (0.8 s), so that the Wasm solver and the
 * simulator and search code are compiled before the first real plan: measured, the first 12 × 60 plan
 * of a process otherwise ran about six times fewer search iterations in its 2 s than the next one.
 */
export async function warmPlanner(): Promise<void> {
  await warmHighs();
  // A small instance short of heat, so that the greedy, the local search and the master all run.
  const t0 = Date.UTC(2024, 0, 1, 7);
  const weather = Array.from({ length: 600 }, (_, i) => ({ t: t0 + i * 60_000, gApertureWm2: Math.max(0, 900 * Math.sin((Math.PI * i) / 600)), tAirC: 30 }));
  const batch = (id: string, h: number, servings: number) => ({
    id,
    dishId: 'warm-up',
    dishName: 'Warm-up',
    servings,
    method: 'simmer' as const,
    potVolumeNeededL: 20,
    foodKg: servings * 0.1,
    foodCpJPerKgK: 3000,
    waterKg: servings * 0.15,
    minTempC: 88,
    holdS: 1200,
    lidOn: true,
    earliestStartMs: t0 + h * 3600_000,
    serveByMs: t0 + (h + 3) * 3600_000,
  });
  const cooker = (id: string, massKg: number) => ({
    id,
    name: id,
    spec: {
      collector: { model: 'lumped' as const, apertureM2: 1.5, eta0: 0.6, uLossWPerK: 3 },
      store: { mediumId: 'sunflower-oil', massKg, uaLossWPerK: 1.5, maxSafeTempC: 200, minUsefulTempC: 100 },
      pots: [
        { id: 'p1', volumeL: 40, massKg: 4, cpJPerKgK: 900, coupling: { kind: 'constant' as const, uaWPerK: 40 }, lidAreaM2: 0.07, lidUWPerM2K: 8 },
        { id: 'p2', volumeL: 40, massKg: 4, cpJPerKgK: 900, coupling: { kind: 'constant' as const, uaWPerK: 30 }, lidAreaM2: 0.07, lidUWPerM2K: 8 },
      ],
    },
    weather,
    initialStoreTempC: 90,
  });
  await planDay(
    {
      cookers: [cooker('warm-up-1', 40), cooker('warm-up-2', 60), cooker('warm-up-3', 50)],
      batches: Array.from({ length: 12 }, (_, i) => batch(`w${i}`, 1 + (i % 5), 60 + 10 * (i % 4))),
      shifts: [{ startMs: t0, endMs: t0 + 10 * 3600_000 }],
      turnaroundS: 600,
      altitudeM: 0,
      timeLimitS: 0.8,
    },
    { maxExactEvaluations: 0 },
  );
}

export async function planDay(problem: PlannerProblem, deps: PlannerDeps = {}): Promise<PlannerResult> {
  const tStart = performance.now();
  validateProblem(problem);
  const { log, say } = planLog(tStart, deps.onLog);
  const simulate: SimulateFn = deps.simulate ?? (await getDefaultSimulate());
  const m = buildModel(problem);
  const highsP: Promise<Highs | null> = deps.noSolver ? Promise.resolve(null) : loadHighs().catch(() => null);
  const stats: EvaluatorStats = { sims: 0, simSteps: 0, cacheHits: 0 };
  const evals = m.cookers.map((c) => new CookerEvaluator(m, c, deps.searchSimulate ?? simulate, stats));
  if (m.batches.length === 0) return emptyResult(performance.now() - tStart, log);

  // 1. Relaxations and the time budget.
  for (const e of evals) e.storeAt(e.noLoad(), e.c.n);
  const budget = new Budget(tStart, problem.timeLimitS, m, stats);
  const screens = m.cookers.map((c) => new PotScreen(m, c));
  const relax = buildRelaxation(m, evals, screens);
  budget.planLp(relax);
  for (const e of evals) e.durationHint = durationHint(m, relax, e.c.idx);
  say(`relaxation: ${stats.sims} simulations; ${relax.impossible.filter((x) => x).length} batches possible nowhere`);

  // 2. Construction: the fixed batches that work, then the greedy.
  const failedFixed = new Map<number, string>();
  const run = startRun(m, relax, evals, screens, budget, problem, failedFixed, say);
  const greedyServings = construct(run, stats);

  const highs = await highsP;
  if (!highs && !deps.noSolver) say('HiGHS could not be loaded: greedy and local search only');
  // A cheap bound to stop early; the LP bound (5.) runs after the search.
  run.bound = computeBound(null, m, relax, 0).bound;
  const master = new MasterStep(highs, run);

  // 3. Small instances: decided exactly.
  const exactProof = solveExactly(run, master, deps.maxExactEvaluations ?? DEFAULT_MAX_EXACT_EVALUATIONS);

  // 4. Improvement: adaptive large-neighbourhood search, kicks and the master; then the shift pass.
  const stopReason = improvePlan(run, master, { maxIterations: deps.maxIterations ?? Infinity, maxKicks: deps.maxKicks });
  run.search.deadline = budget.deadline;
  if (!run.search.timeUp() && run.search.shiftPass(run.st, SHIFT_BUDGET_PER_COOKER * m.cookers.length)) say(`shift pass: objective ${stateValue(m, run.st).toFixed(4)}`);
  const { search } = run;
  say(`search: ${search.iterations} iterations, ${master.runs} master solves (${Math.round(master.ms)} ms), ${search.pool.size} columns, ${search.noFitHits} repeated misses skipped, stop: ${stopReason}`);

  // 5. Upper bound.
  const boundRes = finalBound(run, highs, exactProof);

  // 6. Final re-check with the full simulator from the initial state.
  const finalEvals = m.cookers.map((c) => new CookerEvaluator(m, c, simulate, stats));
  for (const e of finalEvals) e.durationHint = durationHint(m, relax, e.c.idx);
  const checked = recheckPlan(m, run.st, finalEvals, relax, screens, run.rng, failedFixed, say);

  // 7. Result.
  const backup = backupReasons(m, relax, finalEvals, screens, checked.plan, checked.failed);
  const result = resultOf(m, checked.plan, backup, boundRes, { greedyServings, iterations: search.iterations, masterRuns: master.runs, stopReason }, say);
  if (recycleHighsIfLarge(highs)) say('HiGHS heap above its limit: the next plan loads a fresh instance');
  say(`final: ${result.servingsOnSun} servings, bound ${result.upperBound}, gap ${(result.gap * 100).toFixed(2)} %, ${stats.sims} simulations (${stats.simSteps} steps), ${backup.length} backup`);
  return { ...result, solveTimeMs: performance.now() - tStart, log };
}

/** The plan's log: each line stamped with the time since the start and passed to onLog. */
function planLog(tStart: number, onLog?: (line: string) => void): { log: string[]; say: (line: string) => void } {
  const log: string[] = [];
  const say = (line: string) => {
    const l = `${Math.round(performance.now() - tStart)} ms: ${line}`;
    log.push(l);
    onLog?.(l);
  };
  return { log, say };
}

function emptyResult(solveTimeMs: number, log: string[]): PlannerResult {
  return { status: 'empty', slots: [], backup: [], servingsOnSun: 0, objective: 0, upperBound: 0, boundMethod: 'no batches', gap: 0, solveTimeMs, greedyServings: 0, iterations: 0, log };
}

/** The starting plan (fixed batches that work; a fixed batch that cannot finish goes to `failedFixed`) and the search over it. */
function startRun(m: PModel, relax: Relaxation, evals: CookerEvaluator[], screens: PotScreen[], budget: Budget, problem: PlannerProblem, failedFixed: Map<number, string>, say: (line: string) => void): SearchRun {
  const st: State = { evs: evals.map((e) => dropFailing(m, e, e.fixedLoads(), failedFixed, (ev) => e.evaluate(ev))) };
  const rng = mulberry32(problem.seed ?? 1);
  const search = new Search(m, evals, relax, screens, rng, budget.searchDeadline);
  const fixedOnly: State = { evs: st.evs.slice() };
  search.fixedOnly = fixedOnly.evs;
  return { m, relax, search, evals, st, fixedOnly, best: st, rng, budget, timeLimitS: problem.timeLimitS, bound: Infinity, say };
}

/** Construction: the greedy over every movable batch possible somewhere; its sequences become columns. Returns its servings. */
function construct(run: SearchRun, stats: EvaluatorStats): number {
  const { m, relax, search, st, budget } = run;
  const candidates = m.batches.filter((b) => !b.fixed && relax.impossible[b.idx] === null).map((b) => b.idx);
  search.greedy(st, search.greedyOrder(candidates), m.cookers.map((c) => c.idx));
  st.evs.forEach((ev, c) => search.addColumn(c, ev));
  run.best = { evs: st.evs.slice() };
  const greedyServings = stateServings(m, st);
  run.say(`greedy: ${greedyServings} servings, objective ${stateValue(m, st).toFixed(4)} (${stats.sims} simulations)`);
  budget.remeasure();
  search.deadline = budget.searchDeadline;
  return greedyServings;
}

/**
 * Small instances: every subset of every cooker decided (exact.ts), then the master over those
 * columns solved to optimality. True when that proves the plan optimal (run.bound is then its servings).
 */
function solveExactly(run: SearchRun, master: MasterStep, maxEvaluations: number): boolean {
  const { m, search, st, budget, say } = run;
  if (stateServings(m, st) >= run.bound - 1e-9 || !master.usable || maxEvaluations <= 0 || performance.now() >= budget.deadline) return false;
  const ex = enumerateExact(m, search, run.fixedOnly, maxEvaluations, performance.now() + EXACT_TIME_SHARE * (budget.deadline - performance.now()));
  say(`exact enumeration: ${ex.complete ? 'complete' : 'stopped'}, ${ex.columns} columns, ${ex.evaluations} simulations`);
  if (!ex.complete) return false;
  master.forgetPool();
  const solved = master.solve(true);
  if (master.lastStatus !== 7) return false;
  run.bound = stateServings(m, st);
  say(`exact: optimum ${run.bound} servings${solved ? ' (master improved the plan)' : ''}`);
  return true;
}

/** The bound reported: the exact optimum, else the LP relaxation when HiGHS is there, the budget allows and the cheap bound is not met. */
function finalBound(run: SearchRun, highs: Highs | null, exactProof: boolean): BoundResult {
  const { m, relax, st, budget } = run;
  let res: BoundResult = { bound: run.bound, method: exactProof ? BOUND_METHOD_EXACT : BOUND_METHOD_SIMPLE, lpStatus: null };
  const lpLeftS = budget.lpLeftS();
  if (highsUsable(highs) && budget.runLp && !exactProof && stateServings(m, st) < run.bound - 1e-9 && lpLeftS > LP_MIN_TIME_S) res = computeBound(highs, m, relax, lpLeftS);
  run.say(`bound: ${res.bound} servings (${res.method.slice(0, 40)}…, LP status ${res.lpStatus})`);
  return res;
}

interface SearchSummary {
  greedyServings: number;
  iterations: number;
  masterRuns: number;
  stopReason: StopReason;
}

/** Slots, servings, objective, bound, gap and status of the re-checked plan. */
function resultOf(m: PModel, plan: State, backup: PlannerResult['backup'], boundRes: BoundResult, s: SearchSummary, say: (line: string) => void): Omit<PlannerResult, 'solveTimeMs' | 'log'> {
  const servingsOnSun = stateServings(m, plan);
  const upperBound = Math.max(boundRes.bound, servingsOnSun);
  if (servingsOnSun > boundRes.bound + 1e-9) say(`warning: plan ${servingsOnSun} servings above the bound ${boundRes.bound}; bound raised (its energy assumption did not hold)`);
  const gap = upperBound > 0 ? (upperBound - servingsOnSun) / upperBound : 0;
  let status: PlannerStatus;
  if (gap <= 1e-9) status = 'optimal';
  else if (s.iterations === 0 && s.masterRuns === 0) status = 'greedy-only';
  else if (s.stopReason === 'time') status = 'time-limit';
  else if (s.stopReason === 'iterations') status = 'iteration-limit';
  else status = 'converged';
  return {
    status,
    slots: buildSlots(m, plan.evs),
    backup,
    servingsOnSun,
    objective: round6(stateValue(m, plan)),
    upperBound,
    boundMethod: boundRes.method,
    gap,
    greedyServings: s.greedyServings,
    iterations: s.iterations,
  };
}

function round6(x: number): number {
  return Math.round(x * 1e6) / 1e6;
}

/** Drops failing loads one by one (first failure first) until the sequence works. */
function dropFailing(m: PModel, e: CookerEvaluator, loads: Load[], failed: Map<number, string>, ev: (l: Load[]) => Evaluation): Evaluation {
  let cur = ev(loads);
  while (!cur.ok) {
    const j = cur.failIdx;
    const l = cur.loads[j] as Load;
    failed.set(l.b, failureDetail(m, e, cur, j));
    cur = ev(cur.loads.filter((_, k) => k !== j));
  }
  return cur;
}

/** Expected pot occupation for the simulation horizon: twice the quickest one plus half an hour [ms]. */
function durationHint(m: PModel, relax: Relaxation, c: number): (b: number, p: number) => number {
  return (b, p) => {
    const d = relax.dminMs[b]?.[c]?.[p] ?? Infinity;
    return Number.isFinite(d) ? 2 * d + 1800_000 : (m.batches[b] as PBatch).holdMs + 3 * 3600_000;
  };
}
