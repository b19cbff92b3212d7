/**
 * Alert scheduling: each alert of a day is a row in `alert_jobs` and a delayed pg-boss job in the
 * `alert` queue (`startAfter` = when it is due). Scheduling is idempotent: the desired alerts are
 * computed from the day's state and compared with the rows; a moved alert cancels its job and sends a
 * new one; an alert no longer wanted (slot skipped or done, plan superseded) cancels its job.
 *
 * "Now" comes from an injectable clock. pg-boss runs on the database's real clock, so a job is sent
 * with the same delay the injected clock gives (fireAt − clock.now()); with the system clock this
 * is exactly fireAt. Tests use a clock set to the plan's day and watch jobs fire after that delay.
 */
import { randomUUID } from 'node:crypto';
import type { EntityManager } from '@mikro-orm/postgresql';
import type PgBoss from 'pg-boss';
import { AlertJobSchema, PlanSchema, type AlertJob, type AlertKind, type Kitchen } from '@/entities';
import { QUEUES } from '@/lib/jobs/boss';
import { SMOKE_POINT_WARNING_MARGIN_K } from '@/lib/safety/notes';
import { kitchenDate, loadDayState, steerDay, type DayState } from '@/lib/cooks/day';
import type { SteerResult } from '@/lib/cooks/steer';
import { cookerWarnings } from '@/lib/cooks/today';

export interface Clock {
  now(): number;
}
export const systemClock: Clock = { now: () => Date.now() };

export interface AlertDeps {
  em: EntityManager;
  boss: PgBoss;
  clock?: Clock;
}

export interface DesiredAlert {
  kind: AlertKind;
  dedupeKey: string;
  batchId: string | null;
  cookerId: string | null;
  /** When it is due [epoch ms]. */
  fireAtMs: number;
  params: Record<string, string | number>;
}

/** An alert due more than this long ago is not sent late (a stale "pot ready" misleads) [ms]. */
export const MISSED_AFTER_MS = 5 * 60_000;
/** A scheduled alert is moved only when its time changes by more than this [ms]. */
export const MOVE_THRESHOLD_MS = 60_000;

/**
 * The ready alerts a day calls for: one per slot still to cook, at the time its pot reaches the dish's
 * minimum temperature: re-simulated from the cooker's latest reading when there is one; else the
 * plan's readyMs, shifted by how late (or early) the cook actually started the batch.
 */
export function desiredReadyAlerts(state: DayState, steered: Map<string, SteerResult>, nowMs: number): DesiredAlert[] {
  if (!state.plan || !state.result) return [];
  const out: DesiredAlert[] = [];
  for (const s of state.result.slots) {
    const st = state.status[s.batchId];
    if (st?.skippedMs || st?.doneMs || s.fixed) continue;
    const b = state.batches.find((x) => x.id === s.batchId);
    const cv = state.cookers.find((c) => c.id === s.cookerId);
    if (!b || !cv) continue;
    const r = steered.get(s.cookerId)?.slots[s.batchId];
    const fireAtMs = r ? r.readyMs : s.readyMs + (st?.startedMs !== undefined ? st.startedMs - s.startMs : 0);
    if (fireAtMs === null || fireAtMs < nowMs - MISSED_AFTER_MS) continue;
    out.push({
      kind: 'ready',
      dedupeKey: `ready:${state.plan.id}:${s.batchId}`,
      batchId: s.batchId,
      cookerId: s.cookerId,
      fireAtMs,
      params: { dish: b.dishName, index: b.index, of: b.of, servings: b.servings, cooker: cv.name, pot: cv.pots.find((p) => p.id === s.potId)?.name ?? s.potId, minTempC: b.minTempC },
    });
  }
  return out;
}

/** Lead alerts where the plan's predicted store crosses the smoke-point margin of its oil (at the first crossing). */
export function desiredPredictedSmokeAlerts(state: DayState, nowMs: number): DesiredAlert[] {
  if (!state.plan) return [];
  const out: DesiredAlert[] = [];
  for (const cv of state.cookers) {
    const smoke = cv.medium?.smokePointC;
    if (smoke == null || cv.medium?.kind === 'pcm') continue;
    const i = cv.series.storeTempC.findIndex((v) => v >= smoke - SMOKE_POINT_WARNING_MARGIN_K);
    const at = cv.series.t[i];
    if (i < 0 || at === undefined || at < nowMs - MISSED_AFTER_MS) continue;
    out.push({ kind: 'smoke-point', dedupeKey: `smoke-point:${state.plan.id}:${cv.id}`, batchId: null, cookerId: cv.id, fireAtMs: at, params: { cooker: cv.name, storeC: Math.round(Math.max(...cv.series.storeTempC)), smokeC: smoke, measured: 0, atMs: at } });
  }
  return out;
}

async function sendAlertJob(deps: AlertDeps, alertId: string, fireAtMs: number): Promise<string> {
  const clock = deps.clock ?? systemClock;
  const delayMs = Math.max(0, fireAtMs - clock.now());
  const id = await deps.boss.send(QUEUES.alert, { alertId }, { startAfter: new Date(Date.now() + delayMs), retryLimit: 3, retryDelay: 5, expireInMinutes: 5 });
  if (!id) throw new Error(`pg-boss did not accept the alert job of ${alertId}`);
  return id;
}

async function cancelJob(deps: AlertDeps, row: AlertJob): Promise<void> {
  if (row.jobId) await deps.boss.cancel(QUEUES.alert, row.jobId).catch((err: unknown) => console.warn(`[alerts] cancel ${row.jobId}:`, err));
}

export interface ScheduleSummary {
  scheduled: number;
  moved: number;
  kept: number;
  cancelled: number;
}

/** Brings one alert to its desired time: creates it, moves it, or leaves it (sent alerts are not sent again). */
async function upsertAlert(deps: AlertDeps, kitchen: Kitchen, state: DayState, d: DesiredAlert, sum: ScheduleSummary): Promise<AlertJob> {
  const { em } = deps;
  let row = await em.findOne(AlertJobSchema, { dedupeKey: d.dedupeKey });
  if (!row) {
    row = em.create(AlertJobSchema, { id: randomUUID(), kitchen, date: state.date, planId: state.plan!.id, kind: d.kind, dedupeKey: d.dedupeKey, batchId: d.batchId, cookerId: d.cookerId, fireAt: new Date(d.fireAtMs), jobId: null, state: 'scheduled', params: d.params });
    row.jobId = await sendAlertJob(deps, row.id, d.fireAtMs);
    sum.scheduled++;
  } else if (row.state === 'sent') {
    sum.kept++;
  } else if (row.state === 'cancelled' || Math.abs(row.fireAt.getTime() - d.fireAtMs) > MOVE_THRESHOLD_MS) {
    await cancelJob(deps, row);
    if (row.state === 'cancelled') sum.scheduled++;
    else sum.moved++;
    row.fireAt = new Date(d.fireAtMs);
    row.params = d.params;
    row.state = 'scheduled';
    row.jobId = await sendAlertJob(deps, row.id, d.fireAtMs);
  } else {
    sum.kept++;
  }
  await em.flush();
  return row;
}

async function cancelRows(deps: AlertDeps, rows: AlertJob[], sum: ScheduleSummary): Promise<void> {
  for (const row of rows) {
    await cancelJob(deps, row);
    row.state = 'cancelled';
    sum.cancelled++;
  }
  await deps.em.flush();
}

/**
 * After a plan is published: its day's alerts are scheduled and those of the version it supersedes
 * are cancelled. Safe to call again (e.g. by the worker on start): it only changes what differs.
 */
export async function scheduleAlertsForPlan(deps: AlertDeps, planId: string): Promise<ScheduleSummary> {
  const { em } = deps;
  const nowMs = (deps.clock ?? systemClock).now();
  const sum: ScheduleSummary = { scheduled: 0, moved: 0, kept: 0, cancelled: 0 };
  const plan = await em.findOne(PlanSchema, { id: planId }, { populate: ['kitchen', 'kitchen.organisation'] });
  if (!plan || plan.status !== 'published') return sum;
  const kitchen = plan.kitchen;
  const state = await loadDayState(em, kitchen, nowMs, plan.date);
  if (state.plan?.id !== plan.id) return sum; // a newer version exists; it has its own alerts
  const stale = await em.find(AlertJobSchema, { kitchen: kitchen.id, date: plan.date, planId: { $ne: plan.id }, state: 'scheduled' });
  await cancelRows(deps, stale, sum);
  const steered = state.date === kitchenDate(kitchen, nowMs) ? await steerDay(em, state) : new Map<string, SteerResult>();
  const desired = [...desiredReadyAlerts(state, steered, nowMs), ...desiredPredictedSmokeAlerts(state, nowMs)];
  for (const d of desired) await upsertAlert(deps, kitchen, state, d, sum);
  const wanted = new Set(desired.map((d) => d.dedupeKey));
  const unwanted = await em.find(AlertJobSchema, { planId: plan.id, state: 'scheduled', kind: { $in: ['ready', 'smoke-point'] } });
  await cancelRows(deps, unwanted.filter((r) => !wanted.has(r.dedupeKey)), sum);
  return sum;
}

/** Sends a lead alert now (once per dedupe key). */
async function alertNow(deps: AlertDeps, kitchen: Kitchen, state: DayState, d: Omit<DesiredAlert, 'fireAtMs'>, sum: ScheduleSummary): Promise<void> {
  const existing = await deps.em.findOne(AlertJobSchema, { dedupeKey: d.dedupeKey });
  if (existing && existing.state !== 'cancelled') return;
  await upsertAlert(deps, kitchen, state, { ...d, fireAtMs: (deps.clock ?? systemClock).now() }, sum);
}

/**
 * After a reading of a cooker: its ready alerts move to the re-simulated times; a batch the store will
 * no longer bring to temperature loses its ready alert and the lead is told ("store below what the
 * next batch needs"); a store at the smoke-point margin tells the lead at once.
 */
export async function rescheduleAfterReading(deps: AlertDeps, kitchen: Kitchen, cookerId: string): Promise<ScheduleSummary> {
  const { em } = deps;
  const nowMs = (deps.clock ?? systemClock).now();
  const sum: ScheduleSummary = { scheduled: 0, moved: 0, kept: 0, cancelled: 0 };
  const state = await loadDayState(em, kitchen, nowMs);
  if (!state.plan || !state.result) return sum;
  const steered = await steerDay(em, state, [cookerId]);
  const desired = desiredReadyAlerts(state, steered, nowMs).filter((d) => d.cookerId === cookerId);
  for (const d of desired) await upsertAlert(deps, kitchen, state, d, sum);
  const wanted = new Set(desired.map((d) => d.dedupeKey));
  const mine = await em.find(AlertJobSchema, { planId: state.plan.id, cookerId, kind: 'ready', state: 'scheduled' });
  await cancelRows(deps, mine.filter((r) => !wanted.has(r.dedupeKey)), sum);

  const cv = state.cookers.find((c) => c.id === cookerId);
  for (const w of cookerWarnings(state, cookerId, steered.get(cookerId), state.readings.get(cookerId))) {
    if (w.kind === 'store-low') {
      const b = state.batches.find((x) => x.id === w.batchId);
      await alertNow(deps, kitchen, state, { kind: 'store-low', dedupeKey: `store-low:${state.plan.id}:${w.batchId}`, batchId: w.batchId, cookerId, params: { dish: w.dishName, index: b?.index ?? 1, of: b?.of ?? 1, cooker: cv?.name ?? '', minTempC: w.neededC, ...(w.storeC !== null ? { storeC: Math.round(w.storeC) } : {}), ...(b ? { serveByMs: b.serveByMs } : {}) } }, sum);
    } else if (w.measured) {
      await alertNow(deps, kitchen, state, { kind: 'smoke-point', dedupeKey: `smoke-measured:${kitchen.id}:${state.date}:${cookerId}`, batchId: null, cookerId, params: { cooker: cv?.name ?? '', storeC: Math.round(w.storeC), smokeC: w.smokeC, measured: 1, atMs: w.atMs } }, sum);
    }
  }
  return sum;
}

/**
 * After a check-in: a skipped or finished batch loses its ready alert; a skipped batch tells the lead
 * (it goes to backup fuel); a started batch's alert follows the real start.
 */
export async function rescheduleAfterCheckIn(deps: AlertDeps, kitchen: Kitchen, check: { planDate: string; batchId: string; kind: 'started' | 'done' | 'skipped'; who: string; fuel: string }): Promise<ScheduleSummary> {
  const { em } = deps;
  const nowMs = (deps.clock ?? systemClock).now();
  const sum: ScheduleSummary = { scheduled: 0, moved: 0, kept: 0, cancelled: 0 };
  const state = await loadDayState(em, kitchen, nowMs, check.planDate);
  if (!state.plan || !state.result) return sum;
  const slot = state.result.slots.find((s) => s.batchId === check.batchId);
  if (check.kind === 'started') {
    const steered = slot && state.readings.has(slot.cookerId) ? await steerDay(em, state, [slot.cookerId]) : new Map<string, SteerResult>();
    for (const d of desiredReadyAlerts(state, steered, nowMs).filter((x) => x.batchId === check.batchId)) await upsertAlert(deps, kitchen, state, d, sum);
    return sum;
  }
  const rows = await em.find(AlertJobSchema, { kitchen: kitchen.id, date: check.planDate, batchId: check.batchId, kind: { $in: ['ready', 'store-low'] }, state: 'scheduled' });
  await cancelRows(deps, rows, sum);
  if (check.kind === 'skipped') {
    const b = state.batches.find((x) => x.id === check.batchId);
    const cv = state.cookers.find((c) => c.id === slot?.cookerId);
    await alertNow(deps, kitchen, state, { kind: 'skipped', dedupeKey: `skipped:${state.plan.id}:${check.batchId}`, batchId: check.batchId, cookerId: slot?.cookerId ?? null, params: { dish: b?.dishName ?? check.batchId, index: b?.index ?? 1, of: b?.of ?? 1, servings: b?.servings ?? 0, cooker: cv?.name ?? '', who: check.who, fuel: check.fuel } }, sum);
  }
  return sum;
}
