/**
 * Alert scheduling: each alert of a day is a row in `alert_jobs` and a delayed pg-boss job in the
 * `alert` queue (`startAfter` = when it is due). `rescheduleKitchenAlerts` is the one step every
 * command (publish, check-in, reading) runs after its transaction: it reads the kitchen's day
 * (lib/plans/day.ts → lib/day/model.ts), chooses the alerts the day calls for (choose.ts), and brings
 * the rows to them — a moved alert cancels its job and sends a new one; an alert no longer wanted
 * (slot skipped or done, plan superseded) cancels its job; a sent alert is never sent again.
 *
 * "Now" comes from an injectable clock. pg-boss runs on the database's real clock, so a job is sent
 * with the same delay the injected clock gives (fireAt − clock.now()); with the system clock this
 * is exactly fireAt. Tests use a clock set to the plan's day and watch jobs fire after that delay.
 */
import { randomUUID } from 'node:crypto';
import type { EntityManager } from '@mikro-orm/postgresql';
import type PgBoss from 'pg-boss';
import { AlertJobSchema, type AlertJob, type Kitchen } from '@/entities';
import { QUEUES } from '@/lib/queues/boss';
import { kitchenDate, loadKitchenDayWithPlan } from '@/lib/plans/day';
import { chooseLeadAlertsNow, choosePredictedSmokeAlerts, chooseReadyAlerts, type DesiredAlert } from './choose';

export { MISSED_AFTER_MS, type DesiredAlert } from './choose';

export interface Clock {
  now(): number;
}
export const systemClock: Clock = { now: () => Date.now() };

export interface AlertDeps {
  em: EntityManager;
  boss: PgBoss;
  clock?: Clock;
}

/** A scheduled alert is moved only when its time changes by more than this [ms]. */
export const MOVE_THRESHOLD_MS = 60_000;

export interface ScheduleSummary {
  scheduled: number;
  moved: number;
  kept: number;
  cancelled: number;
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

/** Brings one timed alert to its desired time: creates it, moves it, or leaves it (sent alerts are not sent again). */
async function upsertAlert(deps: AlertDeps, kitchen: Kitchen, date: string, planId: string, d: DesiredAlert & { fireAtMs: number }, sum: ScheduleSummary): Promise<void> {
  const { em } = deps;
  const row = await em.findOne(AlertJobSchema, { dedupeKey: d.dedupeKey });
  if (!row) {
    const created = em.create(AlertJobSchema, { id: randomUUID(), kitchen, date, planId, kind: d.kind, dedupeKey: d.dedupeKey, batchId: d.batchId, cookerId: d.cookerId, fireAt: new Date(d.fireAtMs), jobId: null, state: 'scheduled', params: d.params });
    created.jobId = await sendAlertJob(deps, created.id, d.fireAtMs);
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
}

/** Sends a lead alert now, once per dedupe key (again only if it was cancelled). */
async function alertNow(deps: AlertDeps, kitchen: Kitchen, date: string, planId: string, d: DesiredAlert, sum: ScheduleSummary): Promise<void> {
  const existing = await deps.em.findOne(AlertJobSchema, { dedupeKey: d.dedupeKey });
  if (existing && existing.state !== 'cancelled') return;
  await upsertAlert(deps, kitchen, date, planId, { ...d, fireAtMs: (deps.clock ?? systemClock).now() }, sum);
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
 * Brings a kitchen's alerts for one local day (default: today at the clock) in line with the day as it
 * now stands. Safe to call again at any time (e.g. by the worker on start): it only changes what differs.
 */
export async function rescheduleKitchenAlerts(deps: AlertDeps, kitchen: Kitchen, date?: string): Promise<ScheduleSummary> {
  const { em } = deps;
  const nowMs = (deps.clock ?? systemClock).now();
  const day = date ?? kitchenDate(kitchen, nowMs);
  const sum: ScheduleSummary = { scheduled: 0, moved: 0, kept: 0, cancelled: 0 };
  const { day: kd, plan } = await loadKitchenDayWithPlan(em, kitchen, nowMs, day);

  // Alerts of another version of the day (superseded, or no plan any more) are cancelled.
  const stale = await em.find(AlertJobSchema, { kitchen: kitchen.id, date: day, state: 'scheduled', ...(plan ? { planId: { $ne: plan.id } } : {}) });
  await cancelRows(deps, stale, sum);
  if (!plan) return sum;

  const series = plan.cookers.map((c) => ({ cookerId: c.id, t: c.series.t, storeTempC: c.series.storeTempC }));
  const timed = [...chooseReadyAlerts(kd), ...choosePredictedSmokeAlerts(kd, series)];
  for (const d of timed) await upsertAlert(deps, kitchen, day, plan.id, { ...d, fireAtMs: d.fireAtMs! }, sum);
  const now = chooseLeadAlertsNow(kd);
  for (const d of now) await alertNow(deps, kitchen, day, plan.id, d, sum);

  // What the day no longer calls for: ready and predicted smoke alerts, and store-low warnings that recovered.
  const wanted = new Set([...timed, ...now].map((d) => d.dedupeKey));
  const open = await em.find(AlertJobSchema, { planId: plan.id, state: 'scheduled', kind: { $in: ['ready', 'smoke-point', 'store-low'] } });
  await cancelRows(deps, open.filter((r) => !wanted.has(r.dedupeKey) && !r.dedupeKey.startsWith('smoke-measured:')), sum);
  return sum;
}
