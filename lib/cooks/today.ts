import type { EntityManager } from '@mikro-orm/postgresql';
import type { Kitchen, Role } from '@/entities';
import { fuelView, slotSafetyNotes } from '@/lib/plans';
import { SMOKE_POINT_WARNING_MARGIN_K, type SafetyNote } from '@/lib/safety/notes';
import { getVapidKeys } from '@/lib/push/vapid';
import { roleCan } from '@/lib/auth/permissions';
import { loadDayState, steerDay, type DayState, type LatestReading } from './day';
import { storeTempAt, type SteerResult } from './steer';

export type SlotStatus = 'planned' | 'started' | 'done' | 'skipped';

export interface TodaySlot {
  batchId: string;
  dishName: string;
  index: number;
  of: number;
  servings: number;
  method: string;
  potId: string;
  potName: string;
  /** [epoch ms] */
  startMs: number;
  /** When the pot is predicted to reach the dish's minimum (from the latest reading when there is one); null: it will not. */
  readyMs: number | null;
  doneMs: number | null;
  plannedReadyMs: number;
  readySource: 'plan' | 'reading';
  serveByMs: number;
  /** [°C] */
  minTempC: number;
  safeCoreTempC: number;
  storeAtStartC: number | null;
  potMaxC: number | null;
  status: SlotStatus;
  startedAt: number | null;
  doneAt: number | null;
  skippedAt: number | null;
  safety: SafetyNote[];
}

export interface TodayCooker {
  id: string;
  name: string;
  pots: { id: string; name: string }[];
  mediumName: string;
  mediumKind: 'oil' | 'pcm' | 'custom';
  smokePointC: number | null;
  maxSafeTempC: number;
  minUsefulTempC: number;
  latestReading: { atMs: number; storeC: number | null; potC: number | null; potId: string | null; source: 'manual' | 'sensor' } | null;
  /** The predicted store temperature now [°C] (steered by the latest reading when there is one). */
  storeNowC: number | null;
  steeredFromMs: number | null;
  slots: TodaySlot[];
}

export type TodayWarning =
  | { kind: 'store-low'; cookerId: string; batchId: string; dishName: string; neededC: number; storeC: number | null }
  | { kind: 'smoke-point'; cookerId: string; storeC: number; smokeC: number; measured: boolean; atMs: number };

export interface TodayBackup {
  batchId: string;
  dishName: string;
  index: number;
  of: number;
  servings: number;
  /** 'skipped' by a cook, else the planner's reason. */
  reason: string;
  detail: string | null;
  fuelId: string | null;
  amount: number | null;
  unit: string | null;
}

export interface TodayView {
  kitchen: { id: string; name: string; timeZone: string };
  date: string;
  serverNowMs: number;
  role: Role;
  canLog: boolean;
  plan: { id: string; version: number; publishedAt: string | null } | null;
  cookers: TodayCooker[];
  backup: TodayBackup[];
  warnings: TodayWarning[];
  vapidPublicKey: string;
}

function slotStatus(s: DayState['status'][string] | undefined): SlotStatus {
  if (s?.skippedMs) return 'skipped';
  if (s?.doneMs) return 'done';
  if (s?.startedMs) return 'started';
  return 'planned';
}

/**
 * Lead warnings from a cooker's steered prediction: a batch still to cook that the store will not
 * bring to its minimum temperature, and a store at (measured) or heading for (predicted) the
 * smoke-point margin of its oil.
 */
export function cookerWarnings(state: DayState, cookerId: string, steer: SteerResult | undefined, reading: LatestReading | undefined): TodayWarning[] {
  const out: TodayWarning[] = [];
  const cv = state.cookers.find((c) => c.id === cookerId);
  if (!cv || !state.result) return out;
  if (steer) {
    for (const s of state.result.slots.filter((x) => x.cookerId === cookerId)) {
      const st = slotStatus(state.status[s.batchId]);
      if (st === 'skipped' || st === 'done') continue;
      const r = steer.slots[s.batchId];
      if (r?.source === 'reading' && r.readyMs === null) {
        const b = state.batches.find((x) => x.id === s.batchId);
        if (b) out.push({ kind: 'store-low', cookerId, batchId: s.batchId, dishName: b.dishName, neededC: b.minTempC, storeC: storeTempAt(steer, Math.max(s.startMs, steer.fromMs ?? 0)) });
      }
    }
  }
  const smoke = cv.medium?.smokePointC ?? null;
  if (smoke != null && (cv.medium?.kind ?? 'oil') !== 'pcm') {
    const limit = smoke - SMOKE_POINT_WARNING_MARGIN_K;
    if (reading?.storeC != null && reading.storeC >= limit) out.push({ kind: 'smoke-point', cookerId, storeC: reading.storeC, smokeC: smoke, measured: true, atMs: reading.atMs });
    else if (steer && steer.maxStoreTempC >= limit) {
      const i = steer.series.storeTempC.findIndex((v) => v >= limit);
      out.push({ kind: 'smoke-point', cookerId, storeC: steer.maxStoreTempC, smokeC: smoke, measured: false, atMs: steer.series.t[i] ?? state.nowMs });
    }
  }
  return out;
}

/** The Today page's data: today's published plan (kitchen-local date) as cooks need it, steered by the latest readings. */
export async function getTodayView(em: EntityManager, kitchen: Kitchen, role: Role, nowMs = Date.now()): Promise<TodayView> {
  const state = await loadDayState(em, kitchen, nowMs);
  const vapid = await getVapidKeys(em);
  const base = {
    kitchen: { id: kitchen.id, name: kitchen.name, timeZone: kitchen.timeZone },
    date: state.date,
    serverNowMs: nowMs,
    role,
    canLog: roleCan(role, 'log-cooking'),
    vapidPublicKey: vapid.publicKey,
  };
  if (!state.plan || !state.result) return { ...base, plan: null, cookers: [], backup: [], warnings: [] };
  const steered = await steerDay(em, state);
  const safety = slotSafetyNotes(state.batches, state.result, state.cookers);
  const byBatch = new Map(state.batches.map((b) => [b.id, b]));
  const warnings: TodayWarning[] = [];

  const cookers: TodayCooker[] = state.cookers.map((cv) => {
    const steer = steered.get(cv.id);
    const reading = state.readings.get(cv.id);
    warnings.push(...cookerWarnings(state, cv.id, steer, reading));
    const planStoreNow = () => {
      const i = cv.series.t.findLastIndex((t) => t <= nowMs);
      return i >= 0 ? (cv.series.storeTempC[i] ?? null) : null;
    };
    const slots: TodaySlot[] = state
      .result!.slots.filter((s) => s.cookerId === cv.id)
      .sort((a, b) => a.startMs - b.startMs)
      .flatMap((s) => {
        const b = byBatch.get(s.batchId);
        if (!b) return [];
        const st = state.status[s.batchId];
        const r = steer?.slots[s.batchId];
        const storeAtStart = steer && steer.fromMs !== null && s.startMs >= steer.fromMs ? storeTempAt(steer, s.startMs) : s.predictedStoreTempAtStartC;
        // Without a reading, a batch started early or late keeps its planned heat-up time (as its alert does).
        const shift = !r && st?.startedMs !== undefined ? st.startedMs - s.startMs : 0;
        return [
          {
            batchId: s.batchId,
            dishName: b.dishName,
            index: b.index,
            of: b.of,
            servings: b.servings,
            method: b.method,
            potId: s.potId,
            potName: cv.pots.find((p) => p.id === s.potId)?.name ?? s.potId,
            startMs: st?.startedMs ?? s.startMs,
            readyMs: r ? r.readyMs : s.readyMs + shift,
            doneMs: r ? r.doneMs : s.doneMs + shift,
            plannedReadyMs: s.readyMs,
            readySource: r?.source ?? 'plan',
            serveByMs: b.serveByMs,
            minTempC: b.minTempC,
            safeCoreTempC: b.safeCoreTempC,
            storeAtStartC: storeAtStart,
            potMaxC: s.predictedPotMaxC,
            status: slotStatus(st),
            startedAt: st?.startedMs ?? null,
            doneAt: st?.doneMs ?? null,
            skippedAt: st?.skippedMs ?? null,
            safety: safety[s.batchId] ?? [],
          },
        ];
      });
    return {
      id: cv.id,
      name: cv.name,
      pots: cv.pots.map((p) => ({ id: p.id, name: p.name })),
      mediumName: cv.medium?.name ?? '',
      mediumKind: cv.medium?.kind ?? 'oil',
      smokePointC: cv.medium?.smokePointC ?? null,
      maxSafeTempC: cv.maxSafeTempC,
      minUsefulTempC: cv.minUsefulTempC,
      latestReading: reading ? { atMs: reading.atMs, storeC: reading.storeC, potC: reading.potC, potId: reading.potId, source: reading.source } : null,
      storeNowC: steer ? (storeTempAt(steer, nowMs) ?? reading?.storeC ?? null) : planStoreNow(),
      steeredFromMs: steer?.fromMs ?? null,
      slots,
    };
  });

  // Cookers with something still to cook first, by what comes first.
  const firstOpen = (c: TodayCooker) => Math.min(...c.slots.filter((x) => x.status === 'planned' || x.status === 'started').map((x) => x.startMs));
  cookers.sort((a, b) => firstOpen(a) - firstOpen(b));

  // Backup fuel: the planner's backup batches, and the batches cooks skipped (on the kitchen's stoves).
  const skippedIds = state.result.slots.filter((s) => state.status[s.batchId]?.skippedMs).map((s) => s.batchId);
  const planFuel = (state.plan.fuel as ReturnType<typeof fuelView>).perBatch ?? [];
  const skippedFuel = skippedIds.length ? fuelView(kitchen, state.batches, skippedIds).perBatch : [];
  const fuelOf = (id: string) => planFuel.find((f) => f.batchId === id) ?? skippedFuel.find((f) => f.batchId === id);
  const backupRow = (batchId: string, reason: string, detail: string | null): TodayBackup[] => {
    const b = byBatch.get(batchId);
    if (!b) return [];
    const f = fuelOf(batchId);
    return [{ batchId, dishName: b.dishName, index: b.index, of: b.of, servings: b.servings, reason, detail, fuelId: f?.fuelId ?? null, amount: f?.amount ?? null, unit: f?.unit ?? null }];
  };
  const backup = [...state.result.backup.flatMap((x) => backupRow(x.batchId, x.reason, x.detail)), ...skippedIds.flatMap((id) => backupRow(id, 'skipped', null))];

  return {
    ...base,
    plan: { id: state.plan.id, version: state.plan.version, publishedAt: state.plan.publishedAt?.toISOString() ?? null },
    cookers,
    backup,
    warnings,
  };
}
