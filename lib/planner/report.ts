/**
 * Turning simulated sequences into what cooks and leads read: slots and reasons.
 *
 * A backup reason is a claim about the final plan, and each is checked against it before it is
 * given: 'no-free-pot' only when no pot large enough is free for the hold in a shift; 'no-cooker-hot-enough'
 * only when the store is below the dish minimum whenever such a pot is free, or when every free start
 * that passes the necessary tests was simulated with the full simulator and failed; 'not-placed' when
 * one of them works (the search stopped before it found it).
 */
import { gridStartsInShifts, insertLoad, type CookerEvaluator, type Evaluation, type Load, type LoadOut, type PBatch, type PCooker, type PModel } from './model';
import type { Relaxation } from './relaxation';
import type { PotScreen } from './screen';
import { placedOf, Search, type State } from './search';
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

/** Simulations whyNotPlaced may spend on one batch to show that no free start works. Project choice. */
export const REASON_MAX_SIMULATIONS = 24;

/**
 * Every batch without a slot in the final plan `st`, with its reason: the re-check's failure, the
 * relaxation's (possible nowhere, even alone), or whyNotPlaced against the final plan.
 * @param evals evaluators with the full simulator (those of the re-check)
 */
export function backupReasons(m: PModel, relax: Relaxation, evals: CookerEvaluator[], screens: PotScreen[], st: State, failed: ReadonlyMap<number, string>): BackupBatch[] {
  const where = placedOf(m, st);
  // Search.starts and evaluateOn draw no random numbers: the generator is never called.
  const probe = new Search(m, evals, relax, screens, () => 0, Infinity);
  const backup: BackupBatch[] = [];
  for (const b of m.batches) {
    if ((where[b.idx] as number) >= 0) continue;
    const f = failed.get(b.idx);
    const imp = relax.impossible[b.idx];
    if (imp?.reason === 'above-boiling-point') backup.push({ batchId: b.id, reason: imp.reason, detail: imp.detail });
    else if (f !== undefined) backup.push({ batchId: b.id, reason: 'failed-recheck', detail: f });
    else backup.push(imp ? { batchId: b.id, reason: imp.reason, detail: imp.detail } : whyNotPlaced(m, relax, probe, st, b));
  }
  return backup;
}

/** A grid start where a pot is free for a batch, and the time the batch must be off it by [ms]. */
export interface FreeWindow {
  c: number;
  p: number;
  s: number;
  maxEnd: number;
}

/**
 * Free windows of pot p of cooker c for batch b next to the sequence `ev`: grid starts from b's
 * earliest start inside a shift, the pot not occupied at s (an earlier batch off and its turnaround
 * over), and at least b's hold before its hard stop (serve-by, end of shift, end of the forecast, the
 * next batch on the pot less turnaround).
 */
export function freeWindows(m: PModel, c: PCooker, ev: Evaluation, p: number, b: PBatch): FreeWindow[] {
  const out: FreeWindow[] = [];
  for (const start of gridStartsInShifts(m, c, b)) {
    const s = start.s;
    let maxEnd = start.maxEnd;
    let free = true;
    ev.loads.forEach((l, j) => {
      if (l.p !== p) return;
      const end = (ev.out[j] as LoadOut).endMs;
      if (l.s <= s && end + m.turnMs > s) free = false;
      if (l.s > s) maxEnd = Math.min(maxEnd, l.s - m.turnMs);
    });
    if (free && s + b.holdMs <= maxEnd) out.push({ c: c.idx, p, s, maxEnd });
  }
  return out;
}

/**
 * Reason for a batch that could run alone somewhere but has no place in the final plan `st`, each
 * claim checked against that plan (file comment). `probe` is a Search over the full-simulator
 * evaluators of `st`.
 */
export function whyNotPlaced(m: PModel, relax: Relaxation, probe: Search, st: State, b: PBatch): BackupBatch {
  const need = Math.round(b.raw.minTempC);
  const holdMin = Math.round(b.raw.holdS / 60);
  const windows: FreeWindow[] = [];
  for (const c of m.cookers) for (const pot of c.pots) if (m.fits[b.idx]?.[c.idx]?.[pot.idx]) windows.push(...freeWindows(m, c, st.evs[c.idx] as Evaluation, pot.idx, b));
  if (windows.length === 0) {
    return {
      batchId: b.id,
      reason: 'no-free-pot',
      detail: `no pot large enough is free for the ${holdMin}-min hold within a shift between ${m.clock(b.earliest)} and ${m.clock(b.serveBy)}: other batches occupy them`,
    };
  }
  // The hottest store while a pot is free and the hold could still fit after it.
  let hottest = -Infinity;
  let hottestAt = 0;
  let hottestCooker = '';
  for (const w of windows) {
    const c = m.cookers[w.c] as PCooker;
    const e = probe.evals[w.c] as CookerEvaluator;
    const ev = st.evs[w.c] as Evaluation;
    const i1 = Math.floor((w.maxEnd - b.holdMs - c.t0) / STEP_MS);
    for (let i = Math.round((w.s - c.t0) / STEP_MS); i <= i1; i++) {
      const v = e.storeAt(ev, i);
      if (v > hottest) {
        hottest = v;
        hottestAt = c.t0 + i * STEP_MS;
        hottestCooker = c.name;
      }
    }
  }
  const hot = `${Math.round(hottest)} °C at ${m.clock(hottestAt)} (${hottestCooker})`;
  if (hottest < b.raw.minTempC) {
    return {
      batchId: b.id,
      reason: 'no-cooker-hot-enough',
      detail: `with the other batches drawing heat, the hottest store while a pot large enough is free would be ${hot}; this dish needs ${need} °C`,
    };
  }
  const tried = tryFreeStarts(m, relax, probe, st, b);
  if (tried.works) {
    const c = m.cookers[tried.works.c] as PCooker;
    return {
      batchId: b.id,
      reason: 'not-placed',
      detail: `the search stopped before placing it; it would fit on pot ${(c.pots[tried.works.p] as { id: string }).id} of ${c.name} at ${m.clock(tried.works.s)} — planning again may place it`,
    };
  }
  const scope = tried.capped ? `none of the first ${tried.simulated} free starts that pass the quick heat test works alongside the other batches` : 'no free start works alongside the other batches';
  const why = tried.selfOk
    ? `where the pot would reach ${need} °C and hold it ${holdMin} min before ${m.clock(b.serveBy)}, another batch on that cooker would then fail (the store cannot heat both); elsewhere the pot would not get there`
    : `the pot would not reach ${need} °C and hold it ${holdMin} min before ${m.clock(b.serveBy)}, as the store cools when the pot draws its heat`;
  return {
    batchId: b.id,
    reason: 'no-cooker-hot-enough',
    detail: `${scope}: ${why}; the hottest store while a pot large enough is free is ${hot}`,
  };
}

/**
 * Simulates batch b at the free starts that pass the necessary tests (Search.starts: pot free for
 * its quickest occupation, store at the dish minimum, pot screen), on every (cooker, pot) where it
 * is possible alone, up to REASON_MAX_SIMULATIONS. The starts it skips cannot work.
 */
function tryFreeStarts(m: PModel, relax: Relaxation, probe: Search, st: State, b: PBatch): { works: { c: number; p: number; s: number } | null; simulated: number; capped: boolean; selfOk: boolean } {
  let simulated = 0;
  let selfOk = false;
  for (const c of m.cookers)
    for (const pot of c.pots) {
      if (!relax.possible[b.idx]?.[c.idx]?.[pot.idx]) continue;
      const ev = st.evs[c.idx] as Evaluation;
      for (const s of probe.starts(ev, b, c.idx, pot.idx)) {
        if (simulated >= REASON_MAX_SIMULATIONS) return { works: null, simulated, capped: true, selfOk };
        simulated++;
        const load: Load = { b: b.idx, p: pot.idx, s };
        const next = probe.evaluateOn(c.idx, insertLoad(ev.loads, load), ev);
        if (next.ok) return { works: { c: c.idx, p: pot.idx, s }, simulated, capped: false, selfOk };
        const j = next.loads.findIndex((l) => l.b === b.idx);
        if ((next.out[j] as LoadOut | undefined)?.ok) selfOk = true;
      }
    }
  return { works: null, simulated, capped: false, selfOk };
}
