/**
 * The safety notes of every slot of a stored plan: from the dish's method, the cooker's store medium
 * and the store's predicted peak during the slot (lib/safety/notes.ts chooses and explains the rules).
 */
import type { PlanCookerView, StoredBatch, StoredResult } from '@/lib/plan-records';
import { meltingRangeForMediumName, safetyNotesForSlot, type SafetyNote } from './notes';

/** Before and after a slot, the store's predicted peak is looked for this much further [ms]. */
const PEAK_MARGIN_MS = 10 * 60_000;

export function slotSafetyNotes(batches: readonly StoredBatch[], result: Pick<StoredResult, 'slots'>, cookers: readonly PlanCookerView[]): Record<string, SafetyNote[]> {
  const out: Record<string, SafetyNote[]> = {};
  for (const s of result.slots) {
    const b = batches.find((x) => x.id === s.batchId);
    const c = cookers.find((x) => x.id === s.cookerId);
    if (!b || !c) continue;
    let peak = -Infinity;
    c.series.t.forEach((t, i) => {
      if (t >= s.startMs - PEAK_MARGIN_MS && t <= s.doneMs + PEAK_MARGIN_MS) peak = Math.max(peak, c.series.storeTempC[i] ?? -Infinity);
    });
    out[s.batchId] = safetyNotesForSlot({
      method: b.method,
      mediumKind: c.medium.kind,
      smokePointC: c.medium.smokePointC,
      predictedStoreMaxC: Number.isFinite(peak) ? peak : null,
      melting: c.medium.kind === 'pcm' ? meltingRangeForMediumName(c.medium.name) : null,
      maxSafeTempC: c.maxSafeTempC,
      safeCoreTempC: b.safeCoreTempC,
    });
  }
  return out;
}
