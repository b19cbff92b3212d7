/**
 * Turning simulated sequences into what cooks and leads read: slots and reasons.
 */
import { ceilToGrid, nextShiftStart, shiftEndAt, type CookerEvaluator, type Evaluation, type Load, type LoadOut, type PBatch, type PModel } from './model';
import type { Relaxation } from './relaxation';
import { placedOf, type State } from './search';
import type { BackupBatch, PlannedSlot } from './types';
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

/**
 * Every batch without a slot in the final plan `st`, with its reason: the re-check's failure, the
 * relaxation's (possible nowhere, even alone), or whyNotPlaced against the final plan.
 */
export function backupReasons(m: PModel, relax: Relaxation, evals: CookerEvaluator[], st: State, failed: ReadonlyMap<number, string>): BackupBatch[] {
  const where = placedOf(m, st);
  const backup: BackupBatch[] = [];
  for (const b of m.batches) {
    if ((where[b.idx] as number) >= 0) continue;
    const f = failed.get(b.idx);
    if (f !== undefined) backup.push({ batchId: b.id, reason: 'failed-recheck', detail: f });
    else {
      const imp = relax.impossible[b.idx];
      backup.push(imp ? { batchId: b.id, reason: imp.reason, detail: imp.detail } : whyNotPlaced(m, relax, evals, st, b));
    }
  }
  return backup;
}

/** Reason for a batch that could run alone somewhere but has no place in the final plan. */
export function whyNotPlaced(m: PModel, relax: Relaxation, evals: CookerEvaluator[], st: State, b: PBatch): BackupBatch {
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
