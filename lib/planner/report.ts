/**
 * Turning simulated sequences into what cooks and leads read: slots and reasons.
 */
import type { CookerEvaluator, Evaluation, Load, LoadOut, PBatch, PModel } from './model';
import type { PlannedSlot } from './types';
import { STEP_MS } from './validate';

function round2(x: number): number {
  return Math.round(x * 100) / 100;
}

/** Slots of all cookers' sequences (ok loads) plus fixed batches already done, sorted by start, cooker, pot. */
export function buildSlots(m: PModel, evs: readonly Evaluation[]): PlannedSlot[] {
  const slots: PlannedSlot[] = [];
  evs.forEach((ev, c) => {
    const pc = m.cookers[c];
    if (!pc) return;
    ev.loads.forEach((l, j) => {
      const o = ev.out[j] as LoadOut;
      if (!o.ok) return;
      const b = m.batches[l.b] as PBatch;
      slots.push({
        batchId: b.id,
        cookerId: pc.id,
        potId: (pc.pots[l.p] as { id: string }).id,
        startMs: b.fixed ? (b.raw.fixed?.startMs ?? l.s) : l.s,
        readyMs: o.reachedMs as number,
        doneMs: o.doneMs as number,
        predictedStoreTempAtStartC: round2(ev.store[Math.round((l.s - pc.t0) / STEP_MS)] as number),
        predictedPotMaxC: round2(o.maxPotC),
        ...(b.fixed ? { fixed: true } : {}),
      });
    });
  });
  for (const b of m.batches) {
    if (b.fixed?.done) {
      const pc = m.cookers[b.fixed.c];
      const f = b.raw.fixed;
      if (!pc || !f) continue;
      slots.push({
        batchId: b.id,
        cookerId: pc.id,
        potId: (pc.pots[b.fixed.p] as { id: string }).id,
        startMs: f.startMs,
        readyMs: (f.doneMs as number) - b.holdMs,
        doneMs: f.doneMs as number,
        predictedStoreTempAtStartC: null,
        predictedPotMaxC: null,
        fixed: true,
      });
    }
  }
  const cmp = (a: string, z: string) => (a < z ? -1 : a > z ? 1 : 0);
  slots.sort((a, z) => a.startMs - z.startMs || cmp(a.cookerId, z.cookerId) || cmp(a.potId, z.potId) || cmp(a.batchId, z.batchId));
  return slots;
}

/** A sentence for a cook: why the batch at load j fails in this simulated sequence. */
export function failureDetail(m: PModel, e: CookerEvaluator, ev: Evaluation, j: number): string {
  const l = ev.loads[j] as Load;
  const b = m.batches[l.b] as PBatch;
  const o = ev.out[j] as LoadOut;
  const need = Math.round(b.raw.minTempC);
  const holdMin = Math.round(b.raw.holdS / 60);
  const maxEnd = ev.maxEnd[j] as number;
  // Is the deadline set by the next batch on the same pot?
  let next: Load | undefined;
  for (let k = j + 1; k < ev.loads.length; k++) {
    const lk = ev.loads[k] as Load;
    if (lk.p === l.p) {
      next = lk;
      break;
    }
  }
  const byNext = next !== undefined && next.s - m.turnMs === maxEnd;
  const deadline = byNext && next
    ? `${m.clock(maxEnd)}, when the pot must be free for ${(m.batches[next.b] as PBatch).raw.dishName} at ${m.clock(next.s)}`
    : `${m.clock(maxEnd)}`;
  if (ev.store.length === 0) return `there is no time to hold ${holdMin} min between ${m.clock(l.s)} and ${deadline}`;
  const i0 = Math.round((l.s - e.c.t0) / STEP_MS);
  const i1 = Math.min(e.c.n, Math.round((maxEnd - e.c.t0) / STEP_MS));
  let iMin = i0;
  for (let i = i0; i <= i1; i++) if (e.storeAt(ev, i) < e.storeAt(ev, iMin)) iMin = i;
  const low = Math.round(e.storeAt(ev, iMin));
  const lowAt = m.clock(e.c.t0 + iMin * STEP_MS);
  if (o.reachedMs === null) {
    const potMax = Number.isFinite(o.maxPotC) ? `${Math.round(o.maxPotC)} °C` : 'less';
    return `the pot would reach only ${potMax} before ${m.clock(maxEnd)} and the store would be ${low} °C at ${lowAt} (${e.c.name}); this dish needs ${need} °C`;
  }
  return `the pot reaches ${need} °C at ${m.clock(o.reachedMs)} but could not hold it ${holdMin} min before ${deadline}; the store would be ${low} °C at ${lowAt} (${e.c.name})`;
}
