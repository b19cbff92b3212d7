/**
 * checkSlotMove: the lead drags a batch to another cooker, pot or start time in the plan view.
 * Only the cookers the move touches (the one it leaves and the one it joins) are simulated again, in
 * full from their initial state, with every batch they then carry. Returns the updated plan when all
 * of those batches still complete, else the reason in a sentence.
 */
import { buildModel, compareLoads, CookerEvaluator, type Evaluation, type EvaluatorStats, type Load, type PBatch } from './model';
import { buildSlots, failureDetail } from './report';
import { getDefaultSimulate } from './simulator';
import type { PlannerProblem, PlannerResult, SimulateFn } from './types';
import { STEP_MS, validateProblem } from './validate';
import { loadValue } from './model';

export interface SlotMove {
  batchId: string;
  cookerId: string;
  potId: string;
  /** New start [epoch ms], on a whole minute. */
  startMs: number;
}

export interface SlotMoveCheck {
  ok: boolean;
  reason?: string;
  plan?: PlannerResult;
}

export async function checkSlotMove(
  problem: PlannerProblem,
  currentPlan: PlannerResult,
  move: SlotMove,
  deps: { simulate?: SimulateFn } = {},
): Promise<SlotMoveCheck> {
  const t0 = performance.now();
  validateProblem(problem);
  const m = buildModel(problem);
  const b = m.batches.find((x) => x.id === move.batchId);
  if (!b) throw new RangeError(`move.batchId "${move.batchId}" is not a batch of this problem`);
  const c = m.cookers.find((x) => x.id === move.cookerId);
  if (!c) throw new RangeError(`move.cookerId "${move.cookerId}" is not a cooker of this problem`);
  const pot = c.pots.find((x) => x.id === move.potId);
  if (!pot) throw new RangeError(`move.potId "${move.potId}" is not a pot of cooker ${c.id}`);
  if (!Number.isFinite(move.startMs) || move.startMs % STEP_MS !== 0) throw new RangeError('move.startMs must be an instant on a whole minute');
  if (b.fixed) return { ok: false, reason: `${b.raw.dishName} has already started; it cannot be moved` };
  if (pot.volumeL < b.raw.potVolumeNeededL) return { ok: false, reason: `pot ${pot.id} holds ${pot.volumeL} L; this batch needs ${b.raw.potVolumeNeededL} L` };
  if (move.startMs < b.earliest) return { ok: false, reason: `${b.raw.dishName} may not start before ${m.clock(b.earliest)}` };
  if (move.startMs < c.t0 || move.startMs >= c.tEnd) return { ok: false, reason: `there is no forecast for ${c.name} at ${m.clock(move.startMs)}` };
  const shiftEnd = m.shifts.find((s) => move.startMs >= s.startMs && move.startMs < s.endMs)?.endMs;
  if (shiftEnd === undefined) return { ok: false, reason: `nobody is on shift at ${m.clock(move.startMs)}` };
  if (move.startMs + b.holdMs > Math.min(shiftEnd, b.serveBy)) {
    return { ok: false, reason: `starting at ${m.clock(move.startMs)} leaves less than the ${Math.round(b.raw.holdS / 60)} min hold before ${m.clock(Math.min(shiftEnd, b.serveBy))}` };
  }

  // Sequences from the current plan's slots (batches done before the forecast are not loads).
  const byId = new Map(m.batches.map((x) => [x.id, x]));
  const loads: Load[][] = m.cookers.map(() => []);
  let fromCooker = -1;
  for (const s of currentPlan.slots) {
    const sb = byId.get(s.batchId);
    if (!sb) throw new RangeError(`currentPlan.slots: batch "${s.batchId}" is not a batch of this problem`);
    const sc = m.cookers.find((x) => x.id === s.cookerId);
    const sp = sc?.pots.find((x) => x.id === s.potId);
    if (!sc || !sp) throw new RangeError(`currentPlan.slots: cooker "${s.cookerId}" / pot "${s.potId}" not found`);
    if (sb.fixed?.done) continue;
    if (sb.idx === b.idx) {
      fromCooker = sc.idx;
      continue;
    }
    (loads[sc.idx] as Load[]).push({ b: sb.idx, p: sp.idx, s: Math.max(s.startMs, sc.t0) });
  }
  // The pot must be free: the batch before on that pot must be off (plus turnaround), the next one not yet on.
  for (const s of currentPlan.slots) {
    if (s.cookerId !== c.id || s.potId !== pot.id || s.batchId === b.id) continue;
    const busyTo = s.doneMs + m.turnMs;
    if (s.startMs <= move.startMs && busyTo > move.startMs) {
      const other = byId.get(s.batchId) as PBatch;
      return { ok: false, reason: `pot ${pot.id} on ${c.name} is busy with ${other.raw.dishName} until ${m.clock(busyTo)} (including turnaround)` };
    }
  }
  (loads[c.idx] as Load[]).push({ b: b.idx, p: pot.idx, s: move.startMs });
  for (const l of loads) l.sort(compareLoads);

  const simulate = deps.simulate ?? (await getDefaultSimulate());
  const stats: EvaluatorStats = { sims: 0, simSteps: 0, cacheHits: 0 };
  const evals = m.cookers.map((pc) => new CookerEvaluator(m, pc, simulate, stats));
  const touched = [...new Set([c.idx, fromCooker].filter((x) => x >= 0))].sort((a, z) => a - z);
  const newEvs = new Map<number, Evaluation>();
  for (const ci of touched) {
    const ev = (evals[ci] as CookerEvaluator).evaluateFull(loads[ci] as Load[]);
    if (!ev.ok) {
      const l = ev.loads[ev.failIdx] as Load;
      const fb = m.batches[l.b] as PBatch;
      const why = failureDetail(m, evals[ci] as CookerEvaluator, ev, ev.failIdx);
      return { ok: false, reason: fb.idx === b.idx ? `${fb.raw.dishName} would not finish: ${why}` : `${fb.raw.dishName} would no longer finish: ${why}` };
    }
    newEvs.set(ci, ev);
  }

  // Rebuild the plan: touched cookers from the new simulation, others keep their slots.
  const touchedIds = new Set(touched.map((ci) => (m.cookers[ci] as { id: string }).id));
  const kept = currentPlan.slots.filter((s) => !touchedIds.has(s.cookerId) || byId.get(s.batchId)?.fixed?.done);
  const fresh = buildSlots(
    m,
    m.cookers.map((pc) => newEvs.get(pc.idx) ?? { key: '', loads: [], maxEnd: [], out: [], ok: true, failIdx: -1, store: new Float64Array(0), validTo: -1, value: 0 }),
  ).filter((s) => !byId.get(s.batchId)?.fixed?.done);
  const slots = [...kept.filter((s) => s.batchId !== b.id), ...fresh];
  const cmp = (a: string, z: string) => (a < z ? -1 : a > z ? 1 : 0);
  slots.sort((a, z) => a.startMs - z.startMs || cmp(a.cookerId, z.cookerId) || cmp(a.potId, z.potId) || cmp(a.batchId, z.batchId));
  const placed = new Set(slots.map((s) => s.batchId));
  let servingsOnSun = 0;
  let objective = m.doneValue;
  for (const s of slots) {
    const sb = byId.get(s.batchId) as PBatch;
    servingsOnSun += sb.servings;
    if (!sb.fixed?.done) objective += loadValue(m, sb, s.doneMs);
  }
  const upperBound = Math.max(currentPlan.upperBound, servingsOnSun);
  return {
    ok: true,
    plan: {
      ...currentPlan,
      slots,
      backup: currentPlan.backup.filter((x) => !placed.has(x.batchId)),
      servingsOnSun,
      objective: Math.round(objective * 1e6) / 1e6,
      upperBound,
      gap: upperBound > 0 ? (upperBound - servingsOnSun) / upperBound : 0,
      solveTimeMs: performance.now() - t0,
      log: [...currentPlan.log, `manual move: ${b.raw.dishName} (${b.id}) to ${c.name} pot ${pot.id} at ${m.clock(move.startMs)}`],
    },
  };
}
