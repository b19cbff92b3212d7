/**
 * The named parts of the planner's search, each on its own: the acceptance criterion
 * (acceptance.ts), the operator weights (move-chooser.ts), the destroy operators and the repair
 * (lns.ts), the kick and the stall policy (ils.ts), the master schedule and the stopping rule
 * (improve.ts). Feasibility is judged by the independent oracle (oracle.ts planViolations: the real
 * simulator on each cooker's whole sequence, grid, shift and pot rules), not by the planner's own
 * evaluator.
 */
import { beforeAll, describe, expect, it } from 'vitest';
import { acceptRepair, ACCEPT_SIDEWAYS_PROBABILITY, VALUE_EPS } from '@/lib/planner/acceptance';
import { kick, MAX_ESCALATIONS, StallPolicy, STALL_MIN, STALL_PER_COOKER } from '@/lib/planner/ils';
import { MASTER_MAX_INTERVAL_FACTOR, MasterSchedule, stoppingRule } from '@/lib/planner/improve';
import { emptyCookers, FEW_BATCHES_MAX, FEW_BATCHES_MIN, orderByNoisyValue, orderByRandomRule, reinsertFewBatches, removeRandomBatches, repackCookers, repair, repairCandidates } from '@/lib/planner/lns';
import { buildModel, CookerEvaluator, type Evaluation, type PModel } from '@/lib/planner/model';
import { MOVE_MIN_SHARE, MOVE_REACTION, MoveChooser } from '@/lib/planner/move-chooser';
import { planDay, warmPlanner } from '@/lib/planner/plan';
import { buildRelaxation } from '@/lib/planner/relaxation';
import { buildSlots } from '@/lib/planner/report';
import { PotScreen } from '@/lib/planner/screen';
import { placedOf, Search, stateValue, type State } from '@/lib/planner/search';
import type { PlannerProblem } from '@/lib/planner/types';
import { mulberry32 } from '@/lib/random';
import { simulateCooker } from '@/lib/thermal';
import { at, makeInstance, makeSmall } from './fixtures';
import { planViolations } from './oracle';

/** A search over the greedy plan of `p`, set up as planDay does (real simulator, no time limit). */
function searchOver(p: PlannerProblem, seed = 1): { m: PModel; search: Search; st: State } {
  const m = buildModel(p);
  const stats = { sims: 0, simSteps: 0, cacheHits: 0 };
  const evals = m.cookers.map((c) => new CookerEvaluator(m, c, simulateCooker, stats));
  for (const e of evals) e.storeAt(e.noLoad(), e.c.n);
  const screens = m.cookers.map((c) => new PotScreen(m, c));
  const relax = buildRelaxation(m, evals, screens);
  const st: State = { evs: evals.map((e) => e.evaluate(e.fixedLoads())) };
  const search = new Search(m, evals, relax, screens, mulberry32(seed), Infinity);
  search.fixedOnly = st.evs.slice();
  const candidates = m.batches.filter((b) => !b.fixed && relax.impossible[b.idx] === null).map((b) => b.idx);
  search.greedy(st, search.greedyOrder(candidates), m.cookers.map((c) => c.idx));
  return { m, search, st };
}

/** planViolations of a search state, as the result it would give (unplaced batches in backup). */
function violations(p: PlannerProblem, m: PModel, st: State): string[] {
  const where = placedOf(m, st);
  const backup = m.batches.filter((b) => (where[b.idx] as number) < 0).map((b) => ({ batchId: b.id, reason: 'no-free-pot' as const, detail: '' }));
  return planViolations(p, {
    status: 'converged',
    slots: buildSlots(m, st.evs),
    backup,
    servingsOnSun: 0,
    objective: 0,
    upperBound: 0,
    boundMethod: '',
    gap: 0,
    solveTimeMs: 0,
    greedyServings: 0,
    iterations: 0,
    log: [],
  });
}

/** A problem with fixed batches (re-planning from 11:00, one finished and one running), as in plan.test.ts. */
function replanning(): PlannerProblem {
  const p0 = makeSmall(4, 5);
  const from = at(11);
  const cookers = p0.cookers.map((c) => ({ ...c, weather: c.weather.filter((w) => w.t >= from), initialStoreTempC: 120 }));
  const [b1, b2, ...rest] = p0.batches;
  if (!b1 || !b2) throw new Error('fixture');
  const done = { ...b1, fixed: { cookerId: 'A', potId: 'p1', startMs: at(9, 30), doneMs: at(10, 40) } };
  const running = { ...b2, earliestStartMs: at(10), fixed: { cookerId: 'A', potId: 'p2', startMs: at(10, 30), contentsTempC: 70 } };
  return { ...p0, cookers, batches: [done, running, ...rest] };
}

/** Normal approximation of the binomial: |k − np| ≤ z·√(np(1 − p)) (common practice, no source). */
function withinBinomial(k: number, n: number, p: number, z = 4): boolean {
  return Math.abs(k - n * p) <= z * Math.sqrt(n * p * (1 - p));
}

describe('acceptance criterion (acceptRepair)', () => {
  const never = () => {
    throw new Error('no draw expected');
  };

  it('accepts an improvement and rejects a worse plan without drawing', () => {
    expect(acceptRepair(10, 10.5, never)).toBe('improve');
    expect(acceptRepair(10, 10 + 2 * VALUE_EPS, never)).toBe('improve');
    expect(acceptRepair(10, 9.5, never)).toBe('reject');
    expect(acceptRepair(10, 10 - 2 * VALUE_EPS, never)).toBe('reject');
  });

  it(`accepts an equal plan (within ${VALUE_EPS}) with probability ${ACCEPT_SIDEWAYS_PROBABILITY}, within a binomial tolerance`, () => {
    const rng = mulberry32(2024);
    const n = 20_000;
    let k = 0;
    for (let i = 0; i < n; i++) {
      const v = acceptRepair(5, 5 + (i % 2 ? 0.5 : -0.5) * VALUE_EPS, rng);
      expect(v).not.toBe('improve');
      if (v === 'sideways') k++;
    }
    expect(withinBinomial(k, n, ACCEPT_SIDEWAYS_PROBABILITY)).toBe(true);
  });
});

describe('operator weights (MoveChooser)', () => {
  it('record follows the exponential averages and shares() the floor-plus-proportional formula', () => {
    const ch = new MoveChooser(3, mulberry32(1));
    ch.record(0, 5, 2);
    ch.record(1, 0, 4);
    // By hand from the doc formula, starting at gain = work = 1 for every move:
    const r = MOVE_REACTION;
    const score = [((1 - r) + r * 5) / ((1 - r) + r * 2), (1 - r) / ((1 - r) + r * 4), 1];
    const total = score.reduce((a, x) => a + x, 0);
    const expected = score.map((s) => MOVE_MIN_SHARE + (1 - 3 * MOVE_MIN_SHARE) * (s / total));
    const got = ch.shares();
    for (let k = 0; k < 3; k++) expect(got[k]).toBeCloseTo(expected[k] as number, 12);
    expect(got.reduce((a, x) => a + x, 0)).toBeCloseTo(1, 12);
  });

  it('draws each move with its share, within a binomial tolerance', () => {
    const ch = new MoveChooser(3, mulberry32(9));
    ch.record(0, 30, 1);
    const p = ch.shares();
    const n = 30_000;
    const count = [0, 0, 0];
    for (let i = 0; i < n; i++) count[ch.draw()]! += 1;
    for (let k = 0; k < 3; k++) expect(withinBinomial(count[k] as number, n, p[k] as number)).toBe(true);
  });
});

describe('stopping rule, master schedule, stall policy', () => {
  it('stoppingRule: bound first, then time, then maxIterations', () => {
    expect(stoppingRule({ atBound: false, timeUp: false, iterations: 24, maxIterations: 25 })).toBeNull();
    expect(stoppingRule({ atBound: false, timeUp: false, iterations: 25, maxIterations: 25 })).toBe('iterations');
    expect(stoppingRule({ atBound: false, timeUp: true, iterations: 3, maxIterations: 25 })).toBe('time');
    expect(stoppingRule({ atBound: true, timeUp: true, iterations: 30, maxIterations: 25 })).toBe('bound');
    expect(stoppingRule({ atBound: false, timeUp: false, iterations: 1e9, maxIterations: Infinity })).toBeNull();
  });

  it('MasterSchedule: due at the base interval, doubling to its cap while nothing is found, back on success', () => {
    const s = new MasterSchedule(3);
    expect(s.base).toBe(16); // 2 · max(8, 3)
    expect(s.due(15)).toBe(false);
    expect(s.due(16)).toBe(true);
    let it = 16;
    const intervals: number[] = [];
    for (let k = 0; k < 5; k++) {
      s.record(false, it);
      intervals.push(s.interval);
      it = s.next;
    }
    expect(intervals).toEqual([32, 64, 128, 128, 128]);
    expect(s.max).toBe(MASTER_MAX_INTERVAL_FACTOR * 16);
    s.record(true, it);
    expect(s.interval).toBe(16);
    expect(s.next).toBe(it + 16);
  });

  it('StallPolicy: stalls after max(16, 4·cookers) misses; widens up to three times, then kicks', () => {
    const six = new StallPolicy(6);
    expect(six.limit).toBe(Math.max(STALL_MIN, STALL_PER_COOKER * 6));
    for (let i = 0; i < six.limit - 1; i++) six.noProgress();
    expect(six.stalled).toBe(false);
    six.noProgress();
    expect(six.stalled).toBe(true);
    const steps = Array.from({ length: MAX_ESCALATIONS + 1 }, () => [six.escalate(), six.width]);
    expect(steps).toEqual([['wider', 3], ['wider', 4], ['wider', 5], ['kick', 2]]);
    expect(six.stalled).toBe(false);
    // With 2 cookers a wider destroy would leave none untouched: kick at once; with 4, one widening.
    expect(new StallPolicy(2).escalate()).toBe('kick');
    const four = new StallPolicy(4);
    expect([four.escalate(), four.escalate(), four.escalate()]).toEqual(['wider', 'wider', 'kick']);
  });
});

describe('destroy operators and repair', () => {
  beforeAll(async () => {
    await warmPlanner();
  }, 60_000);

  const problems: [string, PlannerProblem][] = [
    ['3 cookers × 10 batches', makeInstance(3, 10, 5)],
    ['re-planning with a finished and a running batch', replanning()],
  ];

  for (const [name, p] of problems) {
    it(`${name}: removeRandomBatches takes k = ${FEW_BATCHES_MIN}…${FEW_BATCHES_MAX + 1} movable batches per cooker, never a fixed one`, () => {
      const { m, search, st } = searchOver(p);
      let changed = 0;
      for (const k of [FEW_BATCHES_MIN, FEW_BATCHES_MAX, FEW_BATCHES_MAX + 1]) {
        for (let round = 0; round < 5; round++) {
          const cookers = m.cookers.map((c) => c.idx);
          const { trial, removed } = removeRandomBatches(search, st, cookers, k);
          let expectedRemoved = 0;
          for (const c of cookers) {
            const before = st.evs[c] as Evaluation;
            const after = trial.evs[c] as Evaluation;
            const movable = before.loads.filter((l) => !m.batches[l.b]?.fixed).length;
            if (after === before) continue; // unchanged: nothing movable, or the shortened sequence failed
            changed++;
            const gone = before.loads.filter((l) => !after.loads.some((x) => x.b === l.b));
            expect(gone).toHaveLength(Math.min(k, movable));
            expectedRemoved += gone.length;
            for (const l of gone) expect(m.batches[l.b]?.fixed).toBeUndefined();
            for (const l of before.loads) if (m.batches[l.b]?.fixed) expect(after.loads.some((x) => x.b === l.b)).toBe(true);
          }
          expect(removed).toHaveLength(expectedRemoved);
        }
      }
      // The test must see real removals, not only unchanged cookers.
      expect(changed).toBeGreaterThan(5);
    });

    it(`${name}: emptyCookers leaves the fixed batches only and names every movable one removed`, () => {
      const { m, search, st } = searchOver(p);
      const { trial, removed } = emptyCookers(search, st, [0]);
      const ev0 = st.evs[0] as Evaluation;
      expect(removed.length).toBeGreaterThan(0);
      expect(new Set(removed)).toEqual(new Set(ev0.loads.filter((l) => !m.batches[l.b]?.fixed).map((l) => l.b)));
      for (const l of (trial.evs[0] as Evaluation).loads) expect(m.batches[l.b]?.fixed).toBeDefined();
      expect(trial.evs.slice(1)).toEqual(st.evs.slice(1));
    });

    it(`${name}: repair after either destroy gives a plan the oracle finds valid, each batch at most once`, () => {
      const { m, search, st } = searchOver(p, 3);
      for (let round = 0; round < 12; round++) {
        const cookers = [round % m.cookers.length];
        const d = round % 2 ? removeRandomBatches(search, st, cookers, 2) : emptyCookers(search, st, cookers);
        const items = round % 2 ? orderByNoisyValue(search, repairCandidates(search, st, cookers, d.removed)) : orderByRandomRule(search, repairCandidates(search, st, cookers, d.removed), cookers[0] as number);
        expect(repair(search, d.trial, items, cookers, search.rng)).toBe(true);
        for (const ev of d.trial.evs) expect(ev.ok).toBe(true);
        expect(violations(p, m, d.trial)).toEqual([]);
        // Any repaired plan is a valid starting point for the next round.
        st.evs = d.trial.evs;
      }
      expect(violations(p, m, st)).toEqual([]);
      expect(placedOf(m, st).some((w, b) => w >= 0 && !m.batches[b]?.fixed)).toBe(true);
    });

    it(`${name}: a move counts one iteration, never lowers the objective, keeps the plan valid; a kick keeps it valid`, () => {
      const { m, search, st } = searchOver(p, 7);
      for (let round = 0; round < 10; round++) {
        const before = stateValue(m, st);
        const it0 = search.iterations;
        const cookers = [round % m.cookers.length];
        const improved = round % 2 ? reinsertFewBatches(search, st, cookers) : repackCookers(search, st, cookers);
        expect(search.iterations).toBe(it0 + 1);
        const after = stateValue(m, st);
        expect(after).toBeGreaterThanOrEqual(before - VALUE_EPS);
        expect(improved).toBe(after > before + VALUE_EPS);
      }
      expect(violations(p, m, st)).toEqual([]);
      const fixedBefore = st.evs.flatMap((ev) => ev.loads.filter((l) => m.batches[l.b]?.fixed).map((l) => l.b));
      kick(search, st);
      expect(violations(p, m, st)).toEqual([]);
      const fixedAfter = st.evs.flatMap((ev) => ev.loads.filter((l) => m.batches[l.b]?.fixed).map((l) => l.b));
      expect(fixedAfter).toEqual(fixedBefore);
    });
  }
});

describe('stopping rule in the planner', () => {
  beforeAll(async () => {
    await warmPlanner();
  }, 60_000);

  it('stops at exactly maxIterations with the iteration-limit status when a gap is left', async () => {
    // makeInstance(3, 10, 5) keeps a gap under 40 iterations (measured on this fixture).
    const r = await planDay(makeInstance(3, 10, 5, 60), { maxIterations: 12 });
    expect(r.iterations).toBe(12);
    expect(r.status).toBe('iteration-limit');
  });

  it('stops at the time limit: a 0.6 s budget on an instance with a gap ends near it', async () => {
    const r = await planDay(makeInstance(3, 10, 1, 0.6), { maxExactEvaluations: 0 });
    expect(['time-limit', 'greedy-only']).toContain(r.status);
    // The greedy always completes, so a loaded machine can exceed the limit; 5 s is generous (common practice, no source).
    expect(r.solveTimeMs).toBeLessThan(5000);
  });
});
