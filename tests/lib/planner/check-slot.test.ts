/**
 * checkSlotMove (drag-and-drop in the plan view) with the real simulator.
 */
import { beforeAll, describe, expect, it } from 'vitest';
import { checkSlotMove, planDay, warmPlanner } from '@/lib/planner';
import type { PlannerProblem } from '@/lib/planner/types';
import { at, batchOf, cookerSpec, DISHES, makeCooker, makeSmall, makeWeather, pot } from './fixtures';
import { planViolations } from './oracle';

const rice = DISHES[0] as (typeof DISHES)[number];

beforeAll(async () => {
  await warmPlanner();
}, 60_000);

describe('checkSlotMove', () => {
  it('accepts a feasible move and returns a valid plan with the batch at its new place', async () => {
    const p = makeSmall(4, 5);
    const plan = await planDay(p);
    let accepted = 0;
    let refused = 0;
    for (const s of plan.slots) {
      for (const dMin of [30, 60, -30]) {
        const res = await checkSlotMove(p, plan, { batchId: s.batchId, cookerId: s.cookerId, potId: s.potId, startMs: s.startMs + dMin * 60_000 });
        if (res.ok) {
          accepted++;
          const moved = res.plan?.slots.find((x) => x.batchId === s.batchId);
          expect(moved?.startMs).toBe(s.startMs + dMin * 60_000);
          expect(planViolations(p, res.plan as NonNullable<typeof res.plan>)).toEqual([]);
          expect(res.plan?.servingsOnSun).toBe(plan.servingsOnSun);
        } else {
          refused++;
          expect(res.reason).toMatch(/\w+/);
        }
      }
    }
    // The grid offers both: some shifts keep every batch feasible, some do not.
    expect(accepted).toBeGreaterThan(0);
    expect(refused).toBeGreaterThan(0);
  });

  it('refuses a busy pot, a pot too small, a start outside shifts and a fixed batch', async () => {
    const p = makeSmall(4, 5);
    const first = p.batches[0];
    if (!first) throw new Error('fixture');
    first.potVolumeNeededL = 35; // fits p1 (40 L) of A, not p2 (30 L)
    const plan = await planDay(p);
    const s0 = plan.slots[0];
    if (!s0) throw new Error('expected a slot');
    const other = plan.slots.find((x) => x.batchId !== s0.batchId);
    if (other) {
      const busy = await checkSlotMove(p, plan, { batchId: other.batchId, cookerId: s0.cookerId, potId: s0.potId, startMs: s0.startMs + 5 * 60_000 });
      expect(busy.ok).toBe(false);
      expect(busy.reason).toMatch(/busy|before|leaves|finish/);
    }
    const small = await checkSlotMove(p, plan, { batchId: first.id, cookerId: 'A', potId: 'p2', startMs: at(12) });
    expect(small).toEqual({ ok: false, reason: 'pot p2 holds 30 L; this batch needs 35 L' });
    const night = await checkSlotMove(p, plan, { batchId: first.id, cookerId: 'A', potId: 'p1', startMs: at(18, 45) });
    expect(night.ok).toBe(false);

    const fixedP: PlannerProblem = structuredClone(p);
    (fixedP.batches[1] as { fixed?: object }).fixed = { cookerId: 'B', potId: 'p1', startMs: at(11) };
    const fixedPlan = await planDay(fixedP);
    const fx = await checkSlotMove(fixedP, fixedPlan, { batchId: fixedP.batches[1]?.id ?? '', cookerId: 'B', potId: 'p1', startMs: at(12) });
    expect(fx.ok).toBe(false);
    expect(fx.reason).toMatch(/already started/);
  });

  it('refuses a move that makes a batch fail, with the temperatures in the reason', async () => {
    // One small store, two pots: heavy1 is planned; putting heavy2 on the other pot at the same time
    // splits the heat and one of them no longer finishes.
    const p: PlannerProblem = {
      cookers: [makeCooker('A', cookerSpec({ apertureM2: 0.8, storeKg: 40, pots: [pot('p1', 60, 60), pot('p2', 60, 60)] }), makeWeather(7, 1, 9, 19), 170)],
      batches: [batchOf('heavy1', rice, 80, at(10), at(11, 30)), batchOf('heavy2', rice, 80, at(10), at(11, 30))],
      shifts: [{ startMs: at(9), endMs: at(18) }],
      turnaroundS: 600,
      slotMinutes: 15,
      altitudeM: 0,
      timeLimitS: 2,
    };
    const plan = await planDay(p);
    expect(plan.slots).toHaveLength(1);
    const placed = plan.slots[0];
    const waiting = plan.backup[0];
    if (!placed || !waiting) throw new Error('expected one slot and one backup');
    const otherPot = placed.potId === 'p1' ? 'p2' : 'p1';
    const res = await checkSlotMove(p, plan, { batchId: waiting.batchId, cookerId: 'A', potId: otherPot, startMs: placed.startMs });
    expect(res.ok).toBe(false);
    expect(res.reason).toMatch(/would (no longer )?finish: .*°C/);
  });

  it('names the field of a bad move', async () => {
    const p = makeSmall(4, 4);
    const plan = await planDay(p);
    await expect(checkSlotMove(p, plan, { batchId: 'nope', cookerId: 'A', potId: 'p1', startMs: at(12) })).rejects.toThrow(/move\.batchId/);
    await expect(checkSlotMove(p, plan, { batchId: p.batches[0]?.id ?? '', cookerId: 'Z', potId: 'p1', startMs: at(12) })).rejects.toThrow(/move\.cookerId/);
    await expect(checkSlotMove(p, plan, { batchId: p.batches[0]?.id ?? '', cookerId: 'A', potId: 'p1', startMs: at(12) + 1 })).rejects.toThrow(/move\.startMs/);
  });
});
