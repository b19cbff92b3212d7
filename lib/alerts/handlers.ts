import type { EntityManager } from '@mikro-orm/postgresql';
import type PgBoss from 'pg-boss';
import { AlertJobSchema, KitchenSchema, PushSubscriptionSchema, type Kitchen } from '@/entities';
import { QUEUES } from '@/lib/queues/boss';
import { kitchenDate, loadMarks } from '@/lib/plans/day';
import { getPublishedPlan } from '@/lib/plans/queries';
import { audienceSubscriptions } from '@/lib/push/subscriptions';
import { ALERT_TTL_S, alertPayload } from '@/lib/push/messages';
import { sendWebPush, type PushOutcome, type PushPayload } from '@/lib/push/send';
import { getVapidKeys } from '@/lib/push/vapid';
import { pushAgent } from '@/lib/push/agent';
import { pruneRateLimits } from '@/lib/rate-limit';
import { addDays } from '@/lib/time';
import { rescheduleKitchenAlerts, type Clock } from './schedule';

export interface AlertJobData {
  alertId: string;
}

export interface PushJobData {
  subscriptionId: string;
  payload: PushPayload;
  ttlS: number;
  urgency: 'normal' | 'high';
  /** 0 for the first try. */
  attempt: number;
}

export interface PushRetryPolicy {
  /** First retry delay [s]; doubled each time (or the service's Retry-After when longer). */
  baseDelayS: number;
  maxAttempts: number;
  /** Longest delay between tries [s]. */
  maxDelayS: number;
}
export const DEFAULT_PUSH_RETRY: PushRetryPolicy = { baseDelayS: 10, maxAttempts: 6, maxDelayS: 3600 };

/**
 * An alert is due: check it still stands (the job is the row's current one, the slot was not skipped
 * or finished, the plan not superseded), then queue one push per subscription of its audience
 * (everyone subscribed to the kitchen for ready alerts; its leads for the others).
 */
export async function handleAlertJob(em: EntityManager, boss: PgBoss, jobId: string, data: AlertJobData): Promise<{ sent: number } | { skipped: string }> {
  const row = await em.findOne(AlertJobSchema, { id: data.alertId }, { populate: ['kitchen'] });
  if (!row) return { skipped: 'no such alert' };
  if (row.state !== 'scheduled' || row.jobId !== jobId) return { skipped: `alert is ${row.state}${row.jobId !== jobId ? ' (moved)' : ''}` };
  const kitchen = row.kitchen;
  if (row.kind === 'ready' || row.kind === 'store-low') {
    const latest = await getPublishedPlan(em, kitchen.id, row.date);
    const marks = latest?.id === row.planId ? await loadMarks(em, kitchen.id, row.date) : null;
    const st = row.batchId ? marks?.[row.batchId] : undefined;
    if (!marks || st?.skippedMs !== undefined || st?.doneMs !== undefined) {
      row.state = 'cancelled';
      await em.flush();
      return { skipped: !marks ? 'plan superseded' : 'batch skipped or done' };
    }
  }
  const subs = await audienceSubscriptions(em, kitchen.id, row.kind === 'ready' ? 'kitchen' : 'leads');
  for (const s of subs) {
    const payload = alertPayload({ id: row.id, kind: row.kind, kitchenId: kitchen.id, batchId: row.batchId, cookerId: row.cookerId, params: row.params }, s.user, kitchen.timeZone);
    await boss.send(QUEUES.push, { subscriptionId: s.id, payload, ttlS: ALERT_TTL_S[row.kind], urgency: 'high', attempt: 0 } satisfies PushJobData, { retryLimit: 0 });
  }
  row.state = 'sent';
  await em.flush();
  return { sent: subs.length };
}

/**
 * One push message to one subscription. 404/410 remove the subscription; 429, 5xx and network
 * failures are tried again later by a new delayed job (Retry-After when the service gives one, else
 * exponential backoff), up to the policy's number of attempts; other refusals are logged and dropped.
 */
export async function handlePushJob(
  em: EntityManager,
  boss: PgBoss,
  data: PushJobData,
  opts: { retry?: PushRetryPolicy; caPath?: string } = {},
): Promise<{ outcome: PushOutcome['kind']; status: number | null; retryInS?: number }> {
  const policy = opts.retry ?? DEFAULT_PUSH_RETRY;
  const sub = await em.findOne(PushSubscriptionSchema, { id: data.subscriptionId });
  if (!sub) return { outcome: 'gone', status: null };
  const vapid = await getVapidKeys(em);
  const outcome = await sendWebPush(sub, data.payload, vapid, { ttlS: data.ttlS, urgency: data.urgency, agent: pushAgent(opts.caPath) });
  switch (outcome.kind) {
    case 'delivered':
      sub.lastSuccessAt = new Date();
      sub.failures = 0;
      await em.flush();
      return { outcome: outcome.kind, status: outcome.status };
    case 'gone':
      // The endpoint itself is dead: every kitchen's row of it goes.
      await em.nativeDelete(PushSubscriptionSchema, { endpoint: sub.endpoint });
      return { outcome: outcome.kind, status: outcome.status };
    case 'failed':
      sub.failures += 1;
      await em.flush();
      console.warn(`[push] ${new URL(sub.endpoint).host} refused (${outcome.status}): ${outcome.message}`);
      return { outcome: outcome.kind, status: outcome.status };
    case 'retry': {
      sub.failures += 1;
      await em.flush();
      if (data.attempt + 1 >= policy.maxAttempts) {
        console.warn(`[push] giving up on ${new URL(sub.endpoint).host} after ${data.attempt + 1} attempts: ${outcome.message}`);
        return { outcome: outcome.kind, status: outcome.status };
      }
      const retryInS = Math.min(policy.maxDelayS, Math.max(outcome.retryAfterS ?? 0, policy.baseDelayS * 2 ** data.attempt));
      await boss.send(QUEUES.push, { ...data, attempt: data.attempt + 1 } satisfies PushJobData, { startAfter: retryInS, retryLimit: 0 });
      return { outcome: outcome.kind, status: outcome.status, retryInS };
    }
  }
}

/** Hourly clean-up: old rate counters, idempotency records a phone will not retry any more, old alert rows. */
export async function handleHousekeeping(em: EntityManager): Promise<{ counters: number; idempotency: number; alerts: number }> {
  const counters = await pruneRateLimits(em);
  const idem = await em.execute<{ id: string }[]>(`delete from idempotency_records where created_at < now() - interval '14 days' returning id`);
  const alerts = await em.execute<{ id: string }[]>(`delete from alert_jobs where fire_at < now() - interval '30 days' returning id`);
  return { counters, idempotency: idem.length, alerts: alerts.length };
}

/**
 * On worker start: make sure every kitchen's published plans for today and tomorrow (local dates)
 * have their alerts, in case a web process could not schedule them when the plan was published.
 */
export async function reconcileAlerts(em: EntityManager, boss: PgBoss, clock?: Clock): Promise<number> {
  const nowMs = clock?.now() ?? Date.now();
  const kitchens: Kitchen[] = await em.find(KitchenSchema, {});
  let n = 0;
  for (const k of kitchens) {
    const today = kitchenDate(k, nowMs);
    for (const date of [today, addDays(today, 1)]) {
      const plan = await getPublishedPlan(em, k.id, date);
      if (!plan) continue;
      const sum = await rescheduleKitchenAlerts({ em: em.fork(), boss, ...(clock ? { clock } : {}) }, k, date);
      n += sum.scheduled + sum.moved;
    }
  }
  return n;
}
