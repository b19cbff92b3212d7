/**
 * How long a pot may stay on the store: the one rule the planner, the plan's store chart and the
 * day's re-prediction all use to turn slots into the simulator's pot loads (lib/thermal PotLoad).
 *
 * A pot comes off at the earliest of: the batch's serve-by time, the end of the weather the cooker is
 * simulated on, the end of the shift it started in (cooks are not there afterwards; a batch already
 * started or done — "fixed" — is exempt, it is where it is), and the start of the next batch on the
 * same pot less the turnaround. Common practice, no source: it is the project's planning rule.
 */
import type { PotLoad } from '@/lib/thermal/types';
import type { PlannerBatch, Shift } from './types';

/** Overlapping or touching shifts as one [epoch ms], sorted by start. */
export function mergeShifts(shifts: readonly Shift[]): Shift[] {
  const s = shifts.map((x) => ({ startMs: x.startMs, endMs: x.endMs })).sort((a, b) => a.startMs - b.startMs);
  const out: Shift[] = [];
  for (const x of s) {
    const last = out[out.length - 1];
    if (last && x.startMs <= last.endMs) last.endMs = Math.max(last.endMs, x.endMs);
    else out.push(x);
  }
  return out;
}

/** End of the merged shift containing t [epoch ms], or −1 when t is outside every shift. */
export function shiftEndOf(mergedShifts: readonly Shift[], t: number): number {
  for (const s of mergedShifts) if (t >= s.startMs && t < s.endMs) return s.endMs;
  return -1;
}

/**
 * Latest time the pot of a load may stay on the store [epoch ms].
 * @param shiftEndMs end of the shift the load starts in, −1 when it starts outside every shift
 *   (it may not run: the end is its start), or null for a fixed load (not clipped by a shift).
 * @param nextStartOnPotMs start of the next load on the same pot, if any [epoch ms].
 */
export function potLoadEndMs(startMs: number, serveByMs: number, weatherEndMs: number, shiftEndMs: number | null, nextStartOnPotMs: number | undefined, turnaroundMs: number): number {
  let e = Math.min(serveByMs, weatherEndMs);
  if (shiftEndMs !== null) e = shiftEndMs < 0 ? startMs : Math.min(e, shiftEndMs);
  if (nextStartOnPotMs !== undefined) e = Math.min(e, nextStartOnPotMs - turnaroundMs);
  return e;
}

export type PotLoadBatch = Pick<PlannerBatch, 'foodKg' | 'foodCpJPerKgK' | 'waterKg' | 'lidOn' | 'minTempC' | 'holdS' | 'serveByMs'>;

export interface PotLoadSlot {
  batchId: string;
  potId: string;
  /** When the pot goes on [epoch ms]. */
  startMs: number;
  /** Already started (or done): not clipped by its shift's end. */
  fixed?: boolean;
  /** Optional earlier hard stop [epoch ms] (e.g. when a cook marked the batch done). */
  stopMs?: number;
  /** Temperature of the contents at startMs [°C], when known. */
  initialTempC?: number;
}

export interface PotLoadContext {
  shifts: readonly Shift[];
  turnaroundS: number;
  /** End of the simulated weather: the last step's time plus one step [epoch ms]. */
  weatherEndMs: number;
}

/** The simulator's loads for one cooker's slots, in start order, under the rule above. */
export function potLoadsForSlots(slots: readonly PotLoadSlot[], batches: ReadonlyMap<string, PotLoadBatch>, ctx: PotLoadContext): PotLoad[] {
  const merged = mergeShifts(ctx.shifts);
  const live = slots.filter((s) => batches.has(s.batchId)).sort((a, b) => a.startMs - b.startMs);
  return live.map((s) => {
    const b = batches.get(s.batchId)!;
    const next = live.find((o) => o.potId === s.potId && o.startMs > s.startMs);
    const end = potLoadEndMs(s.startMs, b.serveByMs, ctx.weatherEndMs, s.fixed ? null : shiftEndOf(merged, s.startMs), next?.startMs, ctx.turnaroundS * 1000);
    return {
      id: s.batchId,
      potId: s.potId,
      startMs: s.startMs,
      foodKg: b.foodKg,
      foodCpJPerKgK: b.foodCpJPerKgK,
      waterKg: b.waterKg,
      ...(s.initialTempC !== undefined ? { initialTempC: s.initialTempC } : {}),
      lidOn: b.lidOn,
      minTempC: b.minTempC,
      holdS: b.holdS,
      maxEndMs: Math.min(end, s.stopMs ?? Infinity),
    };
  });
}
