/**
 * planDay: packs a day's batches onto stored-heat solar cookers.
 *
 * Why not one big time-indexed MILP: with the store energy linearised and big-M store constraints, a
 * naive model of 6 cookers × 30 batches × 64 quarter-hours still had a 29 % gap after 60 s, and at
 * 12 × 60 × 72 it did worse than a greedy (measured in the project before this module). The structure is used instead:
 * batches on different cookers do not interact (each cooker has its own store), so a plan is one
 * simulated sequence per cooker, and HiGHS only recombines such sequences.
 *
 *  1. relaxations (relaxation.ts): where each batch could run alone, its quickest pot occupation and
 *     energy bounds — to prune candidates, explain backups and bound the optimum;
 *  2. greedy (search.ts): batches by serve-by, each at the (cooker, pot, grid start) the pot screen
 *     (screen.ts) forecasts to finish first, verified by simulating the receiving cooker only;
 *  3. small instances: every subset of batches on every cooker decided exactly (exact.ts);
 *  4. local search: swap and insertion passes, large-neighbourhood destroy-and-repair (one to a few
 *     cookers re-packed, or 1–2 batches per cooker taken out and re-inserted; the move drawn by its
 *     recent gain per unit of work, MoveChooser below), kicks from the best
 *     plan when it stalls (iterated local search), a final pass moving batches later to wait less;
 *     every feasible sequence met becomes a column;
 *  5. a set-packing master over all columns solved by HiGHS (master.ts), warm-started with the
 *     incumbent, run every few iterations (less often while it finds nothing);
 *  6. an upper bound (bound.ts: exact when 3 completed, else an LP relaxation or, when that is too
 *     slow for the budget, the sum of servings of batches feasible alone) and the gap;
 *  7. a final re-check: every cooker's sequence simulated in full from its initial state with the
 *     full simulator; a batch that fails is moved (another start or pot on its cooker) or sent to
 *     backup ('failed-recheck') with a sentence saying why.
 * The plan never scores below the greedy one (moves and the master only replace the plan with a
 * better one; the best plan is kept across kicks). Deterministic for the same inputs as long as the
 * time limit does not cut the search (deps.maxIterations makes it independent of machine speed).
 * The greedy always completes, so under heavy CPU contention the time limit can be exceeded.
 */
import type { Highs } from 'highs';
import { buildModel, ceilToGrid, CookerEvaluator, nextShiftStart, shiftEndAt, type Evaluation, type EvaluatorStats, type Load, type LoadOut, type PBatch, type PModel } from './model';
import { HIGHS_STOP_BYTES, highsHeapBytes, highsUsable, loadHighs, recycleHighsIfLarge, solveMaster, warmPlanner as warmHighs } from './master';
import { BOUND_METHOD_EXACT, BOUND_METHOD_SIMPLE, computeBound } from './bound';
import { enumerateExact } from './exact';
import { buildRelaxation, type Relaxation } from './relaxation';
import { mulberry32 } from '@/lib/random';
import { placedOf, Search, stateServings, stateValue, type State } from './search';
import type { BackupBatch, PlannerDeps, PlannerProblem, PlannerResult, PlannerStatus, SimulateFn } from './types';
import { STEP_MS, validateProblem } from './validate';
import { buildSlots, failureDetail } from './report';
import { getDefaultSimulate } from './simulator';
import { PotScreen } from './screen';

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
  const log: string[] = [];
  const say = (line: string) => {
    const l = `${Math.round(performance.now() - tStart)} ms: ${line}`;
    log.push(l);
    deps.onLog?.(l);
  };
  const simulate: SimulateFn = deps.simulate ?? (await getDefaultSimulate());
  const searchSim: SimulateFn = deps.searchSimulate ?? simulate;
  const m = buildModel(problem);
  const highsP: Promise<Highs | null> = deps.noSolver ? Promise.resolve(null) : loadHighs().catch(() => null);
  const budgetMs = problem.timeLimitS * 1000;
  const tEnd = tStart + budgetMs;
  const stats: EvaluatorStats = { sims: 0, simSteps: 0, cacheHits: 0 };
  const evals = m.cookers.map((c) => new CookerEvaluator(m, c, searchSim, stats));

  if (m.batches.length === 0) {
    return {
      status: 'empty',
      slots: [],
      backup: [],
      servingsOnSun: 0,
      objective: 0,
      upperBound: 0,
      boundMethod: 'no batches',
      gap: 0,
      solveTimeMs: performance.now() - tStart,
      greedyServings: 0,
      iterations: 0,
      log,
    };
  }

  for (const e of evals) e.storeAt(e.noLoad(), e.c.n);
  // Time kept for the final re-check: every cooker's day simulated once, at the simulator's measured
  // speed (re-measured after the greedy, when the code is compiled), with batches about twice as slow.
  const dayStepsTotal = m.cookers.reduce((a, c) => a + c.n, 0);
  const recheckEstimate = () => (2 * dayStepsTotal * (stats.simMs ?? 0)) / Math.max(1, stats.simSteps) + 10;
  let recheckMs = recheckEstimate();
  const screens = m.cookers.map((c) => new PotScreen(m, c));
  const relax = buildRelaxation(m, evals, screens);
  // Time kept for the LP bound, the final re-check and the result (at most 40 % of the budget).
  let triples = 0;
  for (const pb of relax.possible) for (const pc of pb) for (const x of pc) if (x) triples++;
  // The LP bound (bound.ts) costs ~0.1–0.3 s in HiGHS-Wasm at a few thousand variables: only when it
  // stays under 8 % of the budget.
  const lpMs = 30 + 0.05 * triples;
  const runLp = lpMs < 0.08 * budgetMs;
  const reserveMs = () => Math.min(0.4 * budgetMs, recheckMs + (runLp ? lpMs : 0) + 20);
  let deadline = tEnd - reserveMs();
  for (const e of evals) e.durationHint = durationHint(m, relax, e.c.idx);
  say(`relaxation: ${stats.sims} simulations; ${relax.impossible.filter((x) => x).length} batches possible nowhere`);

  // Start from the fixed batches; a fixed batch that cannot finish is dropped here and reported.
  const failedFixed = new Map<number, string>();
  const st: State = { evs: evals.map((e) => dropFailing(m, e, e.fixedLoads(), failedFixed, (ev) => e.evaluate(ev))) };
  const rng = mulberry32(problem.seed ?? 1);
  // The last 5 % before the deadline go to moving batches later (less waiting before serving).
  const searchDeadline = deadline - 0.05 * budgetMs;
  const search = new Search(m, evals, relax, screens, rng, searchDeadline);

  const fixedOnly: State = { evs: st.evs.slice() };
  search.fixedOnly = fixedOnly.evs;

  // 2. Greedy.
  const candidates = m.batches.filter((b) => !b.fixed && relax.impossible[b.idx] === null).map((b) => b.idx);
  search.greedy(st, search.greedyOrder(candidates), m.cookers.map((c) => c.idx));
  st.evs.forEach((ev, c) => search.addColumn(c, ev));
  const greedyValue = stateValue(m, st);
  const greedyServings = stateServings(m, st);
  say(`greedy: ${greedyServings} servings, objective ${greedyValue.toFixed(4)} (${stats.sims} simulations)`);
  recheckMs = recheckEstimate();
  deadline = tEnd - reserveMs();
  search.deadline = deadline - 0.05 * budgetMs;

  const highs = await highsP;
  if (!highs && !deps.noSolver) say('HiGHS could not be loaded: greedy and local search only');
  // A cheap bound to stop early; the LP bound (5.) runs after the search.
  let bound = computeBound(null, m, relax, 0).bound;

  // 3–4. Local search and master.
  const maxIt = deps.maxIterations ?? Infinity;
  const nC = m.cookers.length;
  const staleLimit = Math.max(16, 4 * nC);
  // The master runs every `masterEvery` iterations; the interval doubles while it finds nothing.
  let masterEvery = 2 * Math.max(8, nC);
  let nextMaster = masterEvery;
  let stale = 0;
  let level = 0;
  let kicks = 0;
  const maxKicks = deps.maxKicks ?? 50;
  const moves = new MoveChooser(nC > 1 ? MOVES.length : 2, rng);
  let best: State = { evs: st.evs.slice() };
  let lastMasterPool = 0;
  let masterRuns = 0;
  let lastMasterStatus = -1;
  let masterMs = 0;
  function atBoundNow(): boolean {
    return stateServings(m, st) >= bound - 1e-9;
  }
  let heapFull = false;
  const tryMaster = (final: boolean) => {
    if (!highsUsable(highs) || search.pool.size === lastMasterPool) return false;
    if (highsHeapBytes(highs) > HIGHS_STOP_BYTES) {
      if (!heapFull) say(`HiGHS heap at ${Math.round(highsHeapBytes(highs) / 2 ** 20)} MiB: no more master solves in this plan`);
      heapFull = true;
      return false;
    }
    const left = (deadline - performance.now()) / 1000;
    if (!final && left < 0.05) return false;
    masterRuns++;
    // The current plan's sequences go into the pool first, so that the MIP start is the whole plan.
    for (const [c, ev] of st.evs.entries()) search.addColumn(c, ev, true);
    lastMasterPool = search.pool.size;
    const cols = [...search.pool.values()];
    const inc = new Set(st.evs.map((ev, c) => `${c}|${ev.key}`));
    const tM = performance.now();
    // Intermediate masters get at most 5 % of the budget; HiGHS returns its best (≥ the warm start) at the limit.
    const res = solveMaster(highs, nC, cols, inc, Math.max(0.02, final ? left : Math.min(left / 3, 0.05 * problem.timeLimitS)));
    lastMasterStatus = res?.status ?? -1;
    masterMs += performance.now() - tM;
    if (!highsUsable(highs)) say('HiGHS failed: no more master solves in this plan (local search and the re-check go on)');
    if (!res) return false;
    const cur = stateValue(m, st);
    // The master counts the movable batches only; fixed and finished batches are the same in every plan.
    const constant = m.doneValue + fixedOnly.evs.reduce((a, ev) => a + ev.value, 0);
    if (res.objective + constant <= cur + 1e-7) return false;
    const next: Evaluation[] = fixedOnly.evs.slice();
    for (const col of res.chosen) next[col.c] = (evals[col.c] as CookerEvaluator).evaluate(col.loads);
    const trial: State = { evs: next.map((ev, c) => (ev.ok ? ev : (st.evs[c] as Evaluation))) };
    // Columns are disjoint, but a fallback to the old sequence could duplicate a batch: check.
    const seen = new Set<number>();
    let clash = false;
    for (const ev of trial.evs)
      for (const l of ev.loads) {
        if (seen.has(l.b)) clash = true;
        seen.add(l.b);
      }
    if (clash || stateValue(m, trial) <= cur + 1e-9) return false;
    st.evs = trial.evs;
    say(`master: ${cols.length} columns → objective ${stateValue(m, st).toFixed(4)}`);
    return true;
  };

  // Small instances: decide every subset of every cooker (exact.ts); the master over those columns is exact.
  let exactProof = false;
  if (!atBoundNow() && highsUsable(highs) && (deps.maxExactEvaluations ?? 4000) > 0 && performance.now() < deadline) {
    const ex = enumerateExact(m, search, fixedOnly, deps.maxExactEvaluations ?? 4000, performance.now() + 0.35 * (deadline - performance.now()));
    say(`exact enumeration: ${ex.complete ? 'complete' : 'stopped'}, ${ex.columns} columns, ${ex.evaluations} simulations`);
    if (ex.complete) {
      lastMasterPool = -1;
      const solved = tryMaster(true);
      if (lastMasterStatus === 7) {
        exactProof = true;
        bound = stateServings(m, st);
        say(`exact: optimum ${bound} servings${solved ? ' (master improved the plan)' : ''}`);
      }
    }
  }

  const atBound = () => stateServings(m, st) >= bound - 1e-9;
  let stopReason: 'bound' | 'converged' | 'time' | 'iterations' = 'converged';
  if (atBound()) stopReason = 'bound';
  else if (performance.now() < deadline) {
    if (search.swapPass(st, 40 * nC)) stale = 0;
    say(`swap pass: ${stateServings(m, st)} servings`);
    if (search.insertionPass(st)) stale = 0;
    tryMaster(false);
    say(`insertion pass and master: ${stateServings(m, st)} servings`);
    const perm = (): number[] => {
      const a = m.cookers.map((c) => c.idx);
      for (let i = a.length - 1; i > 0; i--) {
        const j = Math.floor(rng() * (i + 1));
        [a[i], a[j]] = [a[j] as number, a[i] as number];
      }
      return a;
    };
    let order = perm();
    let pos = 0;
    for (;;) {
      if (atBound()) {
        stopReason = 'bound';
        break;
      }
      if (search.timeUp()) {
        stopReason = 'time';
        break;
      }
      if (search.iterations >= maxIt) {
        stopReason = 'iterations';
        break;
      }
      if (stale >= staleLimit) {
        stale = 0;
        if (tryMaster(false) || search.swapPass(st, 20 * nC) || search.insertionPass(st)) {
          level = 0;
          continue;
        }
        // Nothing improves: destroy more cookers at once, up to three escalations; then kick the
        // best plan (iterated local search), at most `maxKicks` times.
        level++;
        if (level > 3 || level > nC - 2) {
          if (stateValue(m, st) > stateValue(m, best) + 1e-9) best = { evs: st.evs.slice() };
          if (kicks >= maxKicks) {
            stopReason = 'converged';
            break;
          }
          kicks++;
          st.evs = best.evs.slice();
          search.perturb(st, 0.25);
          level = 0;
          say(`search: kick ${kicks} from the best plan (${stateServings(m, best)} servings) → ${stateServings(m, st)} servings`);
          continue;
        }
        say(`search: no improvement, destroying up to ${2 + level} cookers`);
      }
      if (pos >= order.length) {
        order = perm();
        pos = 0;
      }
      const c1 = order[pos++] as number;
      const pick = [c1];
      // Level 0: a move drawn by its recent gain per unit of work; escalations re-pack 2 + level cookers.
      const op = level === 0 ? moves.draw() : -1;
      const want = op >= 0 ? (MOVES[op] as Move).cookers : 2 + level;
      for (let tries = 0; pick.length < Math.min(want, nC) && tries < 4 * want; tries++) {
        const c2 = pickPartner(m, relax, st, pick[pick.length - 1] as number, rng);
        if (!pick.includes(c2)) pick.push(c2);
      }
      const workBefore = search.work();
      const vBefore = stateValue(m, st);
      const improved = op >= 0 && (MOVES[op] as Move).partial ? search.lnsPartial(st, pick, 1 + Math.floor(rng() * 2)) : search.lns(st, pick);
      if (op >= 0) moves.record(op, Math.max(0, stateValue(m, st) - vBefore), search.work() - workBefore);
      if (improved) {
        stale = 0;
        level = 0;
        if (stateValue(m, st) > stateValue(m, best) + 1e-9) {
          if (stateServings(m, st) > stateServings(m, best)) say(`best: ${stateServings(m, st)} servings (iteration ${search.iterations})`);
          best = { evs: st.evs.slice() };
        }
      } else stale++;
      if (search.iterations >= nextMaster) {
        if (tryMaster(false)) {
          stale = 0;
          level = 0;
          masterEvery = 2 * Math.max(8, nC);
        } else masterEvery = Math.min(16 * Math.max(8, nC), 2 * masterEvery);
        nextMaster = search.iterations + masterEvery;
      }
    }
    if (stateValue(m, best) > stateValue(m, st) + 1e-9) st.evs = best.evs.slice();
    tryMaster(true);
  }
  search.deadline = deadline;
  if (!search.timeUp() && search.shiftPass(st, 30 * nC)) say(`shift pass: objective ${stateValue(m, st).toFixed(4)}`);
  say(`search: ${search.iterations} iterations, ${masterRuns} master solves (${Math.round(masterMs)} ms), ${search.pool.size} columns, ${search.noFitHits} repeated misses skipped, stop: ${stopReason}`);

  // 5. Upper bound: the LP relaxation when HiGHS is there and the cheap bound is not met.
  let boundRes = { bound, method: exactProof ? BOUND_METHOD_EXACT : BOUND_METHOD_SIMPLE, lpStatus: null as number | null };
  const lpLeftS = (tEnd - performance.now() - recheckMs - 10) / 1000;
  if (highsUsable(highs) && runLp && !exactProof && stateServings(m, st) < bound - 1e-9 && lpLeftS > 0.02) {
    boundRes = computeBound(highs, m, relax, lpLeftS);
    bound = boundRes.bound;
  }
  say(`bound: ${bound} servings (${boundRes.method.slice(0, 40)}…, LP status ${boundRes.lpStatus})`);

  // 6. Final re-check with the full simulator from the initial state.
  const finalEvals = m.cookers.map((c) => new CookerEvaluator(m, c, simulate, stats));
  for (const e of finalEvals) e.durationHint = durationHint(m, relax, e.c.idx);
  const failed = new Map<number, string>(failedFixed);
  const repairSearch = new Search(m, finalEvals, relax, screens, rng, Infinity);
  const finalState: State = { evs: [] };
  for (const c of m.cookers) {
    const fe = finalEvals[c.idx] as CookerEvaluator;
    let loads = (st.evs[c.idx] as Evaluation).loads;
    const tried = new Set<number>();
    let ev = fe.evaluateFull(loads);
    while (!ev.ok) {
      const j = ev.failIdx;
      const l = loads[j] as Load;
      const b = m.batches[l.b] as PBatch;
      const detail = failureDetail(m, fe, ev, j);
      loads = loads.filter((_, k) => k !== j);
      ev = fe.evaluateFull(loads);
      if (ev.ok && !b.fixed && !tried.has(l.b)) {
        tried.add(l.b);
        // tryInsert only reads the sequences of the cookers it is given.
        const tmp: State = { evs: m.cookers.map(() => ev) };
        const r = repairSearch.tryInsert(tmp, b, [c.idx], 12);
        if (r) {
          const full = fe.evaluateFull(r.ev.loads);
          if (full.ok) {
            say(`re-check: ${b.raw.dishName} (${b.id}) moved on ${c.name}`);
            loads = r.ev.loads;
            ev = full;
            continue;
          }
        }
      }
      failed.set(l.b, detail);
      say(`re-check: ${b.raw.dishName} (${b.id}) fails on ${c.name}: ${detail}`);
    }
    finalState.evs.push(ev);
  }

  // Result.
  const slots = buildSlots(m, finalState.evs);

  const where = placedOf(m, finalState);
  const backup: BackupBatch[] = [];
  for (const b of m.batches) {
    if ((where[b.idx] as number) >= 0) continue;
    const f = failed.get(b.idx);
    if (f !== undefined) backup.push({ batchId: b.id, reason: 'failed-recheck', detail: f });
    else {
      const imp = relax.impossible[b.idx];
      backup.push(imp ? { batchId: b.id, reason: imp.reason, detail: imp.detail } : whyNotPlaced(m, relax, finalEvals, finalState, b));
    }
  }

  const servingsOnSun = stateServings(m, finalState);
  const objective = stateValue(m, finalState);
  const upperBound = Math.max(bound, servingsOnSun);
  if (servingsOnSun > bound + 1e-9) say(`warning: plan ${servingsOnSun} servings above the bound ${bound}; bound raised (its energy assumption did not hold)`);
  const gap = upperBound > 0 ? (upperBound - servingsOnSun) / upperBound : 0;
  let status: PlannerStatus;
  if (gap <= 1e-9) status = 'optimal';
  else if (search.iterations === 0 && masterRuns === 0) status = 'greedy-only';
  else if (stopReason === 'time') status = 'time-limit';
  else if (stopReason === 'iterations') status = 'iteration-limit';
  else status = 'converged';
  if (recycleHighsIfLarge(highs)) say('HiGHS heap above its limit: the next plan loads a fresh instance');
  say(`final: ${servingsOnSun} servings, bound ${upperBound}, gap ${(gap * 100).toFixed(2)} %, ${stats.sims} simulations (${stats.simSteps} steps), ${backup.length} backup`);
  return {
    status,
    slots,
    backup,
    servingsOnSun,
    objective: round6(objective),
    upperBound,
    boundMethod: boundRes.method,
    gap,
    solveTimeMs: performance.now() - tStart,
    greedyServings,
    iterations: search.iterations,
    log,
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

/** Reason for a batch that could run alone somewhere but has no place in the final plan. */
function whyNotPlaced(m: PModel, relax: Relaxation, evals: CookerEvaluator[], st: State, b: PBatch): BackupBatch {
  let anyFree = false;
  let hottest = -Infinity;
  let hottestAt = 0;
  let hottestCooker = '';
  for (const c of m.cookers) {
    const e = evals[c.idx] as CookerEvaluator;
    const ev = st.evs[c.idx] as Evaluation;
    for (const pot of c.pots) {
      if (!relax.possible[b.idx]?.[c.idx]?.[pot.idx]) continue;
      const dmin = relax.dminMs[b.idx]?.[c.idx]?.[pot.idx] ?? Infinity;
      let s = ceilToGrid(Math.max(b.earliest, c.t0), m.slotMs);
      while (s + dmin <= Math.min(b.serveBy, c.tEnd)) {
        const se = shiftEndAt(m, s);
        if (se < 0) {
          const nx = nextShiftStart(m, s);
          if (nx === Infinity) break;
          s = ceilToGrid(nx, m.slotMs);
          continue;
        }
        let maxEnd = Math.min(b.serveBy, se, c.tEnd);
        let free = true;
        ev.loads.forEach((l, j) => {
          if (l.p !== pot.idx) return;
          const end = (ev.out[j] as LoadOut).endMs;
          if (l.s <= s && end + m.turnMs > s) free = false;
          if (l.s > s) maxEnd = Math.min(maxEnd, l.s - m.turnMs);
        });
        if (free && s + dmin <= maxEnd) {
          anyFree = true;
          const i0 = Math.round((s - c.t0) / STEP_MS);
          const i1 = Math.floor((maxEnd - b.holdMs - c.t0) / STEP_MS);
          for (let i = i0; i <= i1; i++) {
            const v = e.storeAt(ev, i);
            if (v > hottest) {
              hottest = v;
              hottestAt = c.t0 + i * STEP_MS;
              hottestCooker = c.name;
            }
          }
        }
        s += m.slotMs;
      }
    }
  }
  const need = Math.round(b.raw.minTempC);
  const others = m.cookers.some((c) => relax.possible[b.idx]?.[c.idx]?.some((x) => x) && (st.evs[c.idx]?.loads.length ?? 0) > 0);
  if (!anyFree) {
    return {
      batchId: b.id,
      reason: 'no-free-pot',
      detail: `every pot large enough is busy with other batches between ${m.clock(b.earliest)} and ${m.clock(b.serveBy)}`,
    };
  }
  if (hottest < b.raw.minTempC) {
    return {
      batchId: b.id,
      reason: 'no-cooker-hot-enough',
      detail: `with the other batches drawing heat, the hottest store while a pot is free would be ${Math.round(hottest)} °C at ${m.clock(hottestAt)} (${hottestCooker}); this dish needs ${need} °C`,
    };
  }
  return {
    batchId: b.id,
    reason: 'no-cooker-hot-enough',
    detail: `${others ? 'alongside the other batches, ' : ''}no store can bring the pot to ${need} °C and hold it ${Math.round(b.raw.holdS / 60)} min before ${m.clock(b.serveBy)}: the store cools as the pot draws its heat (hottest ${Math.round(hottest)} °C at ${m.clock(hottestAt)}, ${hottestCooker})`,
  };
}

/** Expected pot occupation for the simulation horizon: twice the quickest one plus half an hour [ms]. */
function durationHint(m: PModel, relax: Relaxation, c: number): (b: number, p: number) => number {
  return (b, p) => {
    const d = relax.dminMs[b]?.[c]?.[p] ?? Infinity;
    return Number.isFinite(d) ? 2 * d + 1800_000 : (m.batches[b] as PBatch).holdMs + 3 * 3600_000;
  };
}

function pickPartner(m: PModel, relax: Relaxation, st: State, c1: number, rng: () => number): number {
  // Prefer a cooker that could take one of c1's batches or an unplaced batch c1 could take.
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

interface Move {
  /** Small destroy (1–2 batches per cooker) rather than a whole-cooker re-pack. */
  partial: boolean;
  cookers: number;
}

/** The level-0 moves; the two-cooker ones come last so that a one-cooker plan can leave them out. */
const MOVES: readonly Move[] = [
  { partial: false, cookers: 1 },
  { partial: true, cookers: 1 },
  { partial: false, cookers: 2 },
  { partial: true, cookers: 2 },
];

/**
 * Adaptive choice of the destroy move, after the adaptive large-neighbourhood search of Ropke &
 * Pisinger (2006, "An adaptive large neighborhood search heuristic for the pickup and delivery
 * problem with time windows", Transportation Science 40(4):455–472, §3.4): each move's weight follows
 * its recent record. Our variant scores a move by its objective gain per unit of work (Search.work:
 * simulations and forecasts, not the clock, so runs repeat), with exponential averages of gain and
 * work (reaction factor 0.1), and keeps every move at least 8 % likely so one that stopped paying is
 * still tried now and then. Measured on the 12 × 60 benchmark at 2 s (6 seeds, fixed equal shares):
 * re-packing one cooker gained about 4× more per millisecond than re-packing two.
 */
export class MoveChooser {
  private readonly gain: Float64Array;
  private readonly work: Float64Array;
  constructor(
    readonly n: number,
    private readonly rng: () => number,
    private readonly reaction = 0.1,
    private readonly floor = 0.08,
  ) {
    // Every move starts with the same record (one unit of gain per unit of work).
    this.gain = new Float64Array(n).fill(1);
    this.work = new Float64Array(n).fill(1);
  }

  draw(): number {
    let total = 0;
    const score = new Float64Array(this.n);
    for (let k = 0; k < this.n; k++) total += score[k] = (this.gain[k] as number) / Math.max(1e-6, this.work[k] as number);
    let u = this.rng();
    for (let k = 0; k < this.n; k++) {
      const p = this.floor + (1 - this.n * this.floor) * (total > 0 ? (score[k] as number) / total : 1 / this.n);
      u -= p;
      if (u < 0) return k;
    }
    return this.n - 1;
  }

  record(k: number, gain: number, work: number): void {
    const r = this.reaction;
    this.gain[k] = (1 - r) * (this.gain[k] as number) + r * gain;
    this.work[k] = (1 - r) * (this.work[k] as number) + r * work;
  }
}
