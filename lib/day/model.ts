/**
 * The read model of a kitchen's day: the published plan, the cooks' check-ins, each cooker's latest
 * reading and its re-prediction, and the clock → every slot's state, its predicted (or re-predicted)
 * ready time, the backup-fuel list and the warnings a lead must see. Pure: no database, no framework,
 * no clock of its own. The cook's Today page, the alert scheduler and the coordinator's overview all
 * read the day through `buildKitchenDay`; `lib/plans/day.ts` loads its inputs.
 */
import type { PlanCookerView, PlanFuelView, StoredBatch, StoredResult } from '@/lib/plan-records';
import { SMOKE_POINT_WARNING_MARGIN_K, type SafetyNote } from '@/lib/safety/notes';
import { slotSafetyNotes } from '@/lib/safety/plan-notes';
import { storeTempAt, type Reprediction } from './repredict';
import { markStatus, slotState, type CookMarks, type SlotState } from './slot-state';

export type { CookMarks, SlotState } from './slot-state';

/** A cooker's latest reading of the day. */
export interface LatestReading {
  id: string;
  cookerId: string;
  /** [epoch ms] */
  atMs: number;
  /** [°C] */
  storeC: number | null;
  potC: number | null;
  potId: string | null;
  source: 'manual' | 'sensor';
}

export interface DayCheckIn {
  batchId: string;
  kind: 'started' | 'done' | 'skipped';
  /** [epoch ms] */
  atMs: number;
  /** When the server received it [epoch ms] (an offline phone sends its marks late). */
  recordedAtMs: number;
  /** Who marked it (for the lead's "skipped by …" alert). */
  userName: string | null;
}

export interface DayPlan {
  id: string;
  version: number;
  publishedAt: string | null;
  batches: StoredBatch[];
  result: StoredResult;
  cookers: PlanCookerView[];
  fuel: PlanFuelView;
}

export interface DayInputs {
  kitchen: { id: string; name: string; timeZone: string };
  /** Kitchen-local date (YYYY-MM-DD). */
  date: string;
  /** [epoch ms] */
  nowMs: number;
  /** The day's latest published plan, or null. */
  plan: DayPlan | null;
  checkIns: readonly DayCheckIn[];
  readings: ReadonlyMap<string, LatestReading>;
  /** Each cooker's day re-predicted from its latest reading (lib/day/repredict.ts); absent: the plan's times stand. */
  repredicted: ReadonlyMap<string, Reprediction>;
  /** Backup fuel of the batches cooks skipped, on the kitchen's own stoves. */
  skippedFuel: PlanFuelView['perBatch'];
}

export interface DaySlot {
  batchId: string;
  cookerId: string;
  dishName: string;
  /** Batch number within its dish's line and how many (in cooking order). */
  index: number;
  of: number;
  servings: number;
  method: StoredBatch['method'];
  potId: string;
  potName: string;
  /** Planned start, or the real one once marked started [epoch ms]. */
  startMs: number;
  plannedStartMs: number;
  /** When the pot is predicted to reach the dish's minimum; null: it will not [epoch ms]. */
  readyMs: number | null;
  doneMs: number | null;
  plannedReadyMs: number;
  /** 'plan': the published times (shifted by a late or early start); 'reading': re-predicted from the latest reading. */
  readySource: 'plan' | 'reading';
  serveByMs: number;
  /** [°C] */
  minTempC: number;
  safeCoreTempC: number;
  storeAtStartC: number | null;
  potMaxC: number | null;
  /** The cooks' marks as a status, and the slot's state at `nowMs`. */
  status: 'planned' | 'started' | 'done' | 'skipped';
  state: SlotState;
  startedAt: number | null;
  doneAt: number | null;
  skippedAt: number | null;
  /** A batch already on the store when the plan was made (re-planning), not the cooks' to start. */
  fixed: boolean;
  safety: SafetyNote[];
}

export interface DayCooker {
  id: string;
  name: string;
  pots: { id: string; name: string }[];
  mediumName: string;
  mediumKind: 'oil' | 'pcm' | 'custom';
  smokePointC: number | null;
  maxSafeTempC: number;
  minUsefulTempC: number;
  latestReading: Omit<LatestReading, 'id' | 'cookerId'> | null;
  /** The predicted store temperature now [°C] (re-predicted from the latest reading when there is one). */
  storeNowC: number | null;
  /** When the re-prediction starts (the reading's step), or null for the plan's prediction [epoch ms]. */
  repredictedFromMs: number | null;
  slots: DaySlot[];
}

export type DayWarning =
  | { kind: 'store-low'; cookerId: string; batchId: string; dishName: string; neededC: number; storeC: number | null }
  | { kind: 'smoke-point'; cookerId: string; storeC: number; smokeC: number; measured: boolean; atMs: number }
  | { kind: 'ready-after-serve-by'; cookerId: string; batchId: string; dishName: string; readyMs: number; serveByMs: number };

export interface DayBackup {
  batchId: string;
  dishName: string;
  index: number;
  of: number;
  servings: number;
  /** 'skipped' by a cook, else the planner's reason code. */
  reason: string;
  detail: string | null;
  fuelId: string | null;
  amount: number | null;
  unit: string | null;
}

export interface KitchenDay {
  kitchen: DayInputs['kitchen'];
  date: string;
  nowMs: number;
  plan: { id: string; version: number; publishedAt: string | null } | null;
  cookers: DayCooker[];
  backup: DayBackup[];
  warnings: DayWarning[];
  /** The cooks' marks per batch (first of each kind). */
  marks: Record<string, CookMarks>;
  /** Who skipped each skipped batch, and when it became known: the later of the mark's time and its arrival [epoch ms]. */
  skippedBy: Record<string, { userName: string | null; recordedAtMs: number }>;
  servings: { total: number; onSun: number; backup: number };
}

/** The cooks' marks per batch: the first time each kind of mark was made. */
export function marksFromCheckIns(checkIns: readonly Pick<DayCheckIn, 'batchId' | 'kind' | 'atMs'>[]): Record<string, CookMarks> {
  const out: Record<string, CookMarks> = {};
  for (const c of [...checkIns].sort((a, b) => a.atMs - b.atMs)) {
    const s = (out[c.batchId] ??= {});
    if (c.kind === 'started') s.startedMs ??= c.atMs;
    else if (c.kind === 'done') s.doneMs ??= c.atMs;
    else s.skippedMs ??= c.atMs;
  }
  return out;
}

/**
 * The lead's warnings for one cooker: a batch still to cook that the re-predicted store will not bring
 * to its minimum; a store at (measured) or heading for (predicted) the smoke-point margin of its oil.
 */
function cookerWarnings(inputs: DayInputs, plan: DayPlan, cv: PlanCookerView, marks: Record<string, CookMarks>): DayWarning[] {
  const out: DayWarning[] = [];
  const r = inputs.repredicted.get(cv.id);
  const reading = inputs.readings.get(cv.id);
  if (r) {
    for (const s of plan.result.slots.filter((x) => x.cookerId === cv.id)) {
      const st = markStatus(marks[s.batchId]);
      if (st === 'skipped' || st === 'done') continue;
      const rs = r.slots[s.batchId];
      if (rs?.source === 'reading' && rs.readyMs === null) {
        const b = plan.batches.find((x) => x.id === s.batchId);
        if (b) out.push({ kind: 'store-low', cookerId: cv.id, batchId: s.batchId, dishName: b.dishName, neededC: b.minTempC, storeC: storeTempAt(r, Math.max(s.startMs, r.fromMs ?? 0)) });
      }
    }
  }
  const smoke = cv.medium.smokePointC;
  if (smoke != null && cv.medium.kind !== 'pcm') {
    const limit = smoke - SMOKE_POINT_WARNING_MARGIN_K;
    if (reading?.storeC != null && reading.storeC >= limit) out.push({ kind: 'smoke-point', cookerId: cv.id, storeC: reading.storeC, smokeC: smoke, measured: true, atMs: reading.atMs });
    else if (r && r.maxStoreTempC >= limit) {
      const i = r.series.storeTempC.findIndex((v) => v >= limit);
      out.push({ kind: 'smoke-point', cookerId: cv.id, storeC: r.maxStoreTempC, smokeC: smoke, measured: false, atMs: r.series.t[i] ?? inputs.nowMs });
    }
  }
  return out;
}

/** The day as everyone reads it. */
export function buildKitchenDay(inputs: DayInputs): KitchenDay {
  const { plan, nowMs } = inputs;
  const marks = marksFromCheckIns(inputs.checkIns);
  const skippedBy: KitchenDay['skippedBy'] = {};
  for (const c of [...inputs.checkIns].sort((a, b) => a.atMs - b.atMs)) if (c.kind === 'skipped' && !(c.batchId in skippedBy)) skippedBy[c.batchId] = { userName: c.userName, recordedAtMs: Math.max(c.atMs, c.recordedAtMs) };
  const base = { kitchen: inputs.kitchen, date: inputs.date, nowMs, marks, skippedBy };
  if (!plan) return { ...base, plan: null, cookers: [], backup: [], warnings: [], servings: { total: 0, onSun: 0, backup: 0 } };

  const safety = slotSafetyNotes(plan.batches, plan.result, plan.cookers);
  const byBatch = new Map(plan.batches.map((b) => [b.id, b]));
  const warnings: DayWarning[] = [];

  const cookers: DayCooker[] = plan.cookers.map((cv) => {
    const r = inputs.repredicted.get(cv.id);
    const reading = inputs.readings.get(cv.id);
    warnings.push(...cookerWarnings(inputs, plan, cv, marks));
    const planStoreNow = () => {
      const i = cv.series.t.findLastIndex((t) => t <= nowMs);
      return i >= 0 ? (cv.series.storeTempC[i] ?? null) : null;
    };
    const slots: DaySlot[] = plan.result.slots
      .filter((s) => s.cookerId === cv.id)
      .sort((a, b) => a.startMs - b.startMs)
      .flatMap((s) => {
        const b = byBatch.get(s.batchId);
        if (!b) return [];
        const m = marks[s.batchId];
        const rs = r?.slots[s.batchId];
        const storeAtStart = r && r.fromMs !== null && s.startMs >= r.fromMs ? storeTempAt(r, s.startMs) : s.predictedStoreTempAtStartC;
        // Without a reading, a batch started early or late keeps its planned heat-up time (as its alert does).
        const shift = !rs && m?.startedMs !== undefined ? m.startedMs - s.startMs : 0;
        const readyMs = rs ? rs.readyMs : s.readyMs + shift;
        const doneMs = rs ? rs.doneMs : s.doneMs + shift;
        const times = { startMs: s.startMs, readyMs, doneMs, serveByMs: b.serveByMs };
        return [
          {
            batchId: s.batchId,
            cookerId: cv.id,
            dishName: b.dishName,
            index: b.index,
            of: b.of,
            servings: b.servings,
            method: b.method,
            potId: s.potId,
            potName: cv.pots.find((p) => p.id === s.potId)?.name ?? '',
            startMs: m?.startedMs ?? s.startMs,
            plannedStartMs: s.startMs,
            readyMs,
            doneMs,
            plannedReadyMs: s.readyMs,
            readySource: rs?.source ?? 'plan',
            serveByMs: b.serveByMs,
            minTempC: b.minTempC,
            safeCoreTempC: b.safeCoreTempC,
            storeAtStartC: storeAtStart,
            potMaxC: s.predictedPotMaxC,
            status: markStatus(m),
            state: s.fixed && !m ? 'cooking' : slotState(times, m, nowMs),
            startedAt: m?.startedMs ?? null,
            doneAt: m?.doneMs ?? null,
            skippedAt: m?.skippedMs ?? null,
            fixed: s.fixed === true,
            safety: safety[s.batchId] ?? [],
          },
        ];
      });
    for (const s of slots) {
      if (s.status === 'done' || s.status === 'skipped' || s.state === 'missed' || s.readyMs === null || s.readyMs <= s.serveByMs) continue;
      warnings.push({ kind: 'ready-after-serve-by', cookerId: cv.id, batchId: s.batchId, dishName: s.dishName, readyMs: s.readyMs, serveByMs: s.serveByMs });
    }
    return {
      id: cv.id,
      name: cv.name,
      pots: cv.pots.map((p) => ({ id: p.id, name: p.name })),
      mediumName: cv.medium.name,
      mediumKind: cv.medium.kind,
      smokePointC: cv.medium.smokePointC,
      maxSafeTempC: cv.maxSafeTempC,
      minUsefulTempC: cv.minUsefulTempC,
      latestReading: reading ? { atMs: reading.atMs, storeC: reading.storeC, potC: reading.potC, potId: reading.potId, source: reading.source } : null,
      storeNowC: r ? (storeTempAt(r, nowMs) ?? reading?.storeC ?? null) : planStoreNow(),
      repredictedFromMs: r?.fromMs ?? null,
      slots,
    };
  });

  // Cookers with something still to cook first, by what comes first.
  const firstOpen = (c: DayCooker) => Math.min(...c.slots.filter((x) => x.status === 'planned' || x.status === 'started').map((x) => x.startMs));
  cookers.sort((a, b) => firstOpen(a) - firstOpen(b));

  // Backup fuel: the planner's backup batches, and the batches cooks skipped (on the kitchen's stoves).
  const skippedIds = plan.result.slots.filter((s) => marks[s.batchId]?.skippedMs !== undefined).map((s) => s.batchId);
  const fuelOf = (id: string) => plan.fuel.perBatch.find((f) => f.batchId === id) ?? inputs.skippedFuel.find((f) => f.batchId === id);
  const backupRow = (batchId: string, reason: string, detail: string | null): DayBackup[] => {
    const b = byBatch.get(batchId);
    if (!b) return [];
    const f = fuelOf(batchId);
    return [{ batchId, dishName: b.dishName, index: b.index, of: b.of, servings: b.servings, reason, detail, fuelId: f?.fuelId ?? null, amount: f?.amount ?? null, unit: f?.unit ?? null }];
  };
  const backup = [...plan.result.backup.flatMap((x) => backupRow(x.batchId, x.reason, x.detail)), ...skippedIds.flatMap((id) => backupRow(id, 'skipped', null))];

  const total = plan.batches.reduce((n, b) => n + b.servings, 0);
  const onBackup = backup.reduce((n, b) => n + b.servings, 0);
  return {
    ...base,
    plan: { id: plan.id, version: plan.version, publishedAt: plan.publishedAt },
    cookers,
    backup,
    warnings,
    servings: { total, onSun: total - onBackup, backup: onBackup },
  };
}
