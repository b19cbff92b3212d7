/**
 * The planner's upper bound (bound.ts) against plans found independently: the exhaustive oracle
 * (oracle.ts: every subset of batches on every cooker tried with the real simulator) and the plans
 * planDay returns, which the oracle checks for validity.
 */
import { beforeAll, describe, expect, it } from 'vitest';
import type { Highs } from 'highs';
import { BOUND_METHOD_EXACT, computeBound } from '@/lib/planner/bound';
import { loadHighs } from '@/lib/planner/master';
import { buildModel, CookerEvaluator } from '@/lib/planner/model';
import { planDay, warmPlanner } from '@/lib/planner/plan';
import { buildRelaxation } from '@/lib/planner/relaxation';
import { PotScreen } from '@/lib/planner/screen';
import type { PlannerProblem } from '@/lib/planner/types';
import { simulateCooker } from '@/lib/thermal';
import { makeInstance, makeSmall } from './fixtures';
import { exhaustiveBestServings, planViolations } from './oracle';

let highs: Highs;
beforeAll(async () => {
  await warmPlanner();
  highs = await loadHighs();
}, 60_000);

/** The simple bound (no solver) and the LP bound of a problem, computed as planDay does. */
function bounds(p: PlannerProblem): { simple: number; lp: number } {
  const m = buildModel(p);
  const stats = { sims: 0, simSteps: 0, cacheHits: 0 };
  const evals = m.cookers.map((c) => new CookerEvaluator(m, c, simulateCooker, stats));
  for (const e of evals) e.storeAt(e.noLoad(), e.c.n);
  const relax = buildRelaxation(m, evals, m.cookers.map((c) => new PotScreen(m, c)));
  return { simple: computeBound(null, m, relax, 0).bound, lp: computeBound(highs, m, relax, 10).bound };
}

/** Servings of the batches the oracle finds feasible alone (a singleton subset on some cooker). */
function feasibleAloneServings(p: PlannerProblem, sets: string[][]): number {
  const alone = new Set(sets.flat().filter((s) => s !== '' && !s.includes('+')));
  return p.batches.filter((b) => alone.has(b.id)).reduce((a, b) => a + b.servings, 0);
}

describe('upper bound', () => {
  const seeds = [2, 3, 4, 5, 12, 16, 17];

  for (const seed of seeds) {
    it(`makeSmall(${seed}): simple bound = servings of batches feasible alone; LP ≤ simple; both ≥ the exhaustive optimum`, () => {
      const p = makeSmall(seed, 5);
      const oracle = exhaustiveBestServings(p);
      const { simple, lp } = bounds(p);
      expect(simple).toBe(feasibleAloneServings(p, oracle.feasibleSets));
      expect(lp).toBeLessThanOrEqual(simple);
      expect(lp).toBeGreaterThanOrEqual(oracle.best);
      expect(simple).toBeGreaterThanOrEqual(oracle.best);
    });
  }

  // Seeds where the simple bound is above the optimum, so the plan is only proven by the exact enumeration (found by running the oracle).
  for (const seed of [4, 7, 12]) {
    it(`makeSmall(${seed}, 4): the exact bound equals the brute-force optimum`, async () => {
      const p = { ...makeSmall(seed, 4), timeLimitS: 30 };
      const oracle = exhaustiveBestServings(p);
      expect(bounds(p).simple).toBeGreaterThan(oracle.best);
      const r = await planDay(p);
      expect(r.boundMethod).toBe(BOUND_METHOD_EXACT);
      expect(r.upperBound).toBe(oracle.best);
      expect(r.servingsOnSun).toBe(oracle.best);
    });
  }

  for (const seed of [1, 2, 5]) {
    it(`makeInstance(3, 10, ${seed}): the LP bound is not below the servings of the valid plan planDay finds`, async () => {
      const p = makeInstance(3, 10, seed, 30);
      const r = await planDay(p, { maxIterations: 60 });
      expect(planViolations(p, r)).toEqual([]);
      const { simple, lp } = bounds(p);
      expect(lp).toBeGreaterThanOrEqual(r.servingsOnSun);
      expect(simple).toBeGreaterThanOrEqual(lp);
    });
  }
});
