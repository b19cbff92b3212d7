/**
 * Which alerts a kitchen's day calls for, read from the day's model (lib/day/model.ts). Pure: the
 * scheduler (schedule.ts) compares this list with the stored alerts and moves, sends or cancels jobs.
 *
 * - ready: one per slot still to cook, at the time its pot reaches the dish's minimum (re-predicted
 *   from the cooker's latest reading when there is one; else the plan's time, shifted by how late or
 *   early the cook really started);
 * - smoke-point (predicted): where the plan's store crosses its oil's smoke-point margin, at the first crossing;
 * - store-low, smoke-point (measured), skipped: the lead is told at once, once each.
 */
import type { AlertKind } from '@/entities/alert-job';
import type { KitchenDay } from '@/lib/day/model';
import { SMOKE_POINT_WARNING_MARGIN_K } from '@/lib/safety/notes';

export interface DesiredAlert {
  kind: AlertKind;
  dedupeKey: string;
  batchId: string | null;
  cookerId: string | null;
  /** When it is due [epoch ms]; `null`: now (a lead alert about something that just happened). */
  fireAtMs: number | null;
  params: Record<string, string | number>;
}

/** An alert due more than this long ago is not sent late (a stale "pot ready" misleads) [ms]. */
export const MISSED_AFTER_MS = 5 * 60_000;

/** What the plan's store trajectory needs: the cookers' series as stored with the plan. */
export interface PlannedSeries {
  cookerId: string;
  t: number[];
  storeTempC: number[];
}

export function chooseReadyAlerts(day: KitchenDay): DesiredAlert[] {
  if (!day.plan) return [];
  const out: DesiredAlert[] = [];
  for (const c of day.cookers) {
    for (const s of c.slots) {
      if (s.status === 'skipped' || s.status === 'done' || s.fixed) continue;
      if (s.readyMs === null || s.readyMs < day.nowMs - MISSED_AFTER_MS) continue;
      out.push({
        kind: 'ready',
        dedupeKey: `ready:${day.plan.id}:${s.batchId}`,
        batchId: s.batchId,
        cookerId: c.id,
        fireAtMs: s.readyMs,
        params: { dish: s.dishName, index: s.index, of: s.of, servings: s.servings, cooker: c.name, pot: s.potName, minTempC: s.minTempC },
      });
    }
  }
  return out;
}

/** Predicted smoke-point crossings of the plan's store (oil and custom media with a smoke point). */
export function choosePredictedSmokeAlerts(day: KitchenDay, series: readonly PlannedSeries[]): DesiredAlert[] {
  if (!day.plan) return [];
  const out: DesiredAlert[] = [];
  for (const c of day.cookers) {
    const smoke = c.smokePointC;
    const ser = series.find((x) => x.cookerId === c.id);
    if (smoke == null || c.mediumKind === 'pcm' || !ser) continue;
    const i = ser.storeTempC.findIndex((v) => v >= smoke - SMOKE_POINT_WARNING_MARGIN_K);
    const at = ser.t[i];
    if (i < 0 || at === undefined || at < day.nowMs - MISSED_AFTER_MS) continue;
    out.push({ kind: 'smoke-point', dedupeKey: `smoke-point:${day.plan.id}:${c.id}`, batchId: null, cookerId: c.id, fireAtMs: at, params: { cooker: c.name, storeC: Math.round(Math.max(...ser.storeTempC)), smokeC: smoke, measured: 0, atMs: at } });
  }
  return out;
}

/** Lead alerts sent at once: a store that will not bring a batch to temperature, a measured store at the smoke-point margin, a batch a cook skipped. */
export function chooseLeadAlertsNow(day: KitchenDay): DesiredAlert[] {
  if (!day.plan) return [];
  const out: DesiredAlert[] = [];
  const cookerName = (id: string) => day.cookers.find((c) => c.id === id)?.name ?? '';
  const slotOf = (batchId: string) => day.cookers.flatMap((c) => c.slots).find((s) => s.batchId === batchId);
  for (const w of day.warnings) {
    if (w.kind === 'store-low') {
      const s = slotOf(w.batchId);
      out.push({
        kind: 'store-low',
        dedupeKey: `store-low:${day.plan.id}:${w.batchId}`,
        batchId: w.batchId,
        cookerId: w.cookerId,
        fireAtMs: null,
        params: { dish: w.dishName, index: s?.index ?? 1, of: s?.of ?? 1, cooker: cookerName(w.cookerId), minTempC: w.neededC, ...(w.storeC !== null ? { storeC: Math.round(w.storeC) } : {}), ...(s ? { serveByMs: s.serveByMs } : {}) },
      });
    } else if (w.kind === 'smoke-point' && w.measured) {
      out.push({ kind: 'smoke-point', dedupeKey: `smoke-measured:${day.kitchen.id}:${day.date}:${w.cookerId}`, batchId: null, cookerId: w.cookerId, fireAtMs: null, params: { cooker: cookerName(w.cookerId), storeC: Math.round(w.storeC), smokeC: w.smokeC, measured: 1, atMs: w.atMs } });
    }
  }
  for (const b of day.backup) {
    if (b.reason !== 'skipped') continue;
    const s = slotOf(b.batchId);
    // A skip heard of long ago (e.g. before a re-publication) is not news any more.
    const heard = day.skippedBy[b.batchId]?.recordedAtMs ?? 0;
    if (heard < day.nowMs - MISSED_AFTER_MS) continue;
    const fuel = b.fuelId && b.amount !== null && b.unit ? `${b.fuelId}:${Math.round(b.amount * 10) / 10}:${b.unit}` : '';
    out.push({
      kind: 'skipped',
      dedupeKey: `skipped:${day.kitchen.id}:${day.date}:${b.batchId}`,
      batchId: b.batchId,
      cookerId: s?.cookerId ?? null,
      fireAtMs: null,
      params: { dish: b.dishName, index: b.index, of: b.of, servings: b.servings, cooker: s ? cookerName(s.cookerId) : '', who: day.skippedBy[b.batchId]?.userName ?? '', fuel },
    });
  }
  return out;
}
