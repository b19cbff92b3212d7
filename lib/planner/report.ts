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
  if (ev.store.length === 0) return `there is no time to hold ${Math.round(b.raw.holdS / 60)} min between ${m.clock(l.s)} and ${m.clock(ev.maxEnd[j] as number)} on this pot`;
  const i0 = Math.round((l.s - e.c.t0) / STEP_MS);
  const i1 = Math.min(e.c.n, Math.ceil(((ev.maxEnd[j] as number) - e.c.t0) / STEP_MS));
  let iMax = i0;
  for (let i = i0; i <= i1; i++) if ((e.storeAt(ev, i) as number) > (e.storeAt(ev, iMax) as number)) iMax = i;
  const hot = e.storeAt(ev, iMax);
  const at = e.c.t0 + iMax * STEP_MS;
  if (o.reachedMs === null) {
    return `the store would be at most ${Math.round(hot)} °C at ${m.clock(at)} (${e.c.name}); this dish needs ${need} °C in the pot by ${m.clock((ev.maxEnd[j] as number) - b.holdMs)}`;
  }
  const iEnd = Math.min(e.c.n, Math.round(((ev.maxEnd[j] as number) - e.c.t0) / STEP_MS));
  return `the pot reaches ${need} °C at ${m.clock(o.reachedMs)} but cannot hold it ${Math.round(b.raw.holdS / 60)} min before ${m.clock(ev.maxEnd[j] as number)}: the store would be ${Math.round(e.storeAt(ev, iEnd))} °C at ${m.clock(e.c.t0 + iEnd * STEP_MS)} (${e.c.name})`;
}

