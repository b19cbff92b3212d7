/**
 * Alert timing with a controllable clock. Tomorrow's plan for a fresh kitchen is published (its ready
 * alerts become delayed pg-boss jobs at each slot's predicted ready time); then, with the clock set to
 * tomorrow morning, a thermometer reading says the store is behind: the cooker's alerts move to the
 * re-simulated times (old jobs cancelled, new ones delayed to match). A skipped slot cancels its job.
 * An alert re-armed a few seconds before its time fires, and the cook's phone gets it. Re-publishing
 * the day cancels the old version's jobs and schedules the new one's.
 */
import { randomUUID } from 'node:crypto';
import type PgBoss from 'pg-boss';
import { decrypt } from 'http_ece';
import { afterAll, beforeAll, describe, expect, inject, it } from 'vitest';
import { AlertJobSchema, CheckInSchema, MembershipSchema, PushSubscriptionSchema, UserSchema, type AlertJob } from '../../entities';
import type { KitchenAccess } from '../../lib/auth/guard';
import { QUEUES, startBoss } from '../../lib/queues/boss';
import { registerWorkers } from '../../lib/jobs/worker';
import { stopBossClient } from '../../lib/queues/client';
import { rescheduleKitchenAlerts, type Clock } from '../../lib/alerts/schedule';
import { recordCheckIn } from '../../lib/cooks/check-ins';
import { recordManualReading } from '../../lib/cooks/readings';
import { getTodayPage } from '../../lib/cooks/today';
import { publishDraft, solveDraft } from '../../lib/drafts';
import type { Kitchen, PlanCookerView } from '../../entities';
import { addDays, localDateString, zonedDayBoundsMs, zonedTimeToUtcMs } from '../../lib/time';
import { closeTestOrm, createWorld, testOrm, type World } from '../helpers/fixtures';
import { fakeDeliveries, makeSubscription, publishPlanFor, waitUntil } from '../helpers/cooks';

const TZ = 'Africa/Ouagadougou'; // the world's kitchens (UTC+0)
let boss: PgBoss;
let w: World;
let planId: string;
let cookerId: string;
let date: string;
let slots: { batchId: string; readyMs: number; startMs: number }[];
let series: PlanCookerView['series'];
let kitchen: Kitchen;

const em = async () => (await testOrm()).em.fork();
const clockAt = (ms: number): Clock => ({ now: () => ms });
const alertsOf = async (): Promise<AlertJob[]> => (await em()).find(AlertJobSchema, { planId, kind: 'ready' }, { orderBy: { fireAt: 'asc' } });
const job = (id: string | null) => boss.getJobById<{ alertId: string }>(QUEUES.alert, id!);

/** The cook's access as the guard would give it, for calling lib/cooks directly with a chosen "now". */
async function cookAccess(): Promise<KitchenAccess> {
  const e = await em();
  const user = await e.findOneOrFail(UserSchema, { email: w.emails.cookA });
  const memberships = await e.find(MembershipSchema, { user }, { populate: ['user', 'organisation', 'kitchen'] });
  const kitchen = memberships[0]!.kitchen!;
  await e.populate(kitchen, ['organisation']);
  return { em: e, user, memberships, kitchen, role: 'cook' };
}

beforeAll(async () => {
  const e = await em();
  w = await createWorld(e);
  date = addDays(localDateString(Date.now(), TZ), 1);
  const p = await publishPlanFor(e, w.kitchenA.id, date);
  planId = p.plan.id;
  cookerId = p.cookerId;
  slots = p.slots;
  series = p.plan.cookers[0]!.series;
  kitchen = p.kitchen;
  boss = await startBoss(inject('databaseUrl'));
});
afterAll(async () => {
  // Leave no job of this plan to fire tomorrow in the test database.
  for (const a of await (await em()).find(AlertJobSchema, { planId, state: 'scheduled' })) if (a.jobId) await boss.cancel(QUEUES.alert, a.jobId);
  await boss?.unschedule(QUEUES.heartbeat);
  await boss?.unschedule(QUEUES.housekeeping);
  await boss?.stop({ graceful: false, wait: true });
  await stopBossClient();
  await closeTestOrm();
});

describe('ready alerts', () => {
  it('publishing schedules one delayed job per slot at its predicted ready time (pot ≥ the dish minimum)', async () => {
    const rows = await alertsOf();
    expect(rows.map((r) => r.batchId).sort()).toEqual(slots.map((s) => s.batchId).sort());
    for (const r of rows) {
      const s = slots.find((x) => x.batchId === r.batchId)!;
      expect(r.fireAt.getTime()).toBe(s.readyMs);
      expect(r.state).toBe('scheduled');
      const j = await job(r.jobId);
      expect(j?.state).toBe('created');
      // Sent with the system clock: startAfter is the ready time itself (pg-boss keeps ms; 1 s tolerance).
      expect(Math.abs(j!.startAfter.getTime() - s.readyMs)).toBeLessThanOrEqual(1000);
    }
    // Scheduling again changes nothing (idempotent).
    const again = await rescheduleKitchenAlerts({ em: await em(), boss }, kitchen, date);
    expect(again).toMatchObject({ scheduled: 0, moved: 0, cancelled: 0, kept: rows.length });
  });

  it('a reading showing the store behind moves the cooker’s alerts to the re-simulated times', async () => {
    const nowMs = zonedTimeToUtcMs(date, TZ, 6, 0);
    const i = series.t.findIndex((t) => t >= nowMs);
    const predicted = series.storeTempC[i]!;
    const before = await alertsOf();
    const later = before.filter((r) => r.fireAt.getTime() > nowMs);
    expect(later.length).toBeGreaterThan(0);
    const realBefore = Date.now();
    const r = await recordManualReading(await cookAccess(), { idempotencyKey: randomUUID(), cookerId, at: new Date(nowMs).toISOString(), storeC: predicted - 20 }, nowMs);
    expect(r.status).toBe(201);
    const view = await getTodayPage(await em(), (await cookAccess()).kitchen, 'cook', nowMs);
    const repredicted = new Map(view.cookers.flatMap((c) => c.slots).map((s) => [s.batchId, s]));
    const after = await alertsOf();
    let moved = 0;
    for (const old of later) {
      const s = repredicted.get(old.batchId!)!;
      expect(s.readySource).toBe('reading');
      const now = after.find((a) => a.id === old.id)!;
      if (s.readyMs === null) {
        // The store will not get this batch hot: no ready alert, the lead is told instead.
        expect(now.state).toBe('cancelled');
        continue;
      }
      expect(now.fireAt.getTime()).toBe(s.readyMs);
      if (Math.abs(s.readyMs - old.fireAt.getTime()) <= 60_000) continue;
      moved++;
      expect(s.readyMs).toBeGreaterThan(old.fireAt.getTime()); // behind → later
      expect(now.jobId).not.toBe(old.jobId);
      expect((await job(old.jobId))?.state).toBe('cancelled');
      const j = await job(now.jobId);
      expect(j?.state).toBe('created');
      // Delayed by what the test clock says is left: fireAt − now, from when it was sent (3 s tolerance).
      const expected = realBefore + (s.readyMs - nowMs);
      expect(Math.abs(j!.startAfter.getTime() - expected)).toBeLessThanOrEqual(3000);
    }
    expect(moved).toBeGreaterThan(0);
  });

  it('a skipped slot cancels its alert job', async () => {
    const nowMs = zonedTimeToUtcMs(date, TZ, 6, 30);
    const target = (await alertsOf()).filter((r) => r.state === 'scheduled').at(-1)!;
    const r = await recordCheckIn(await cookAccess(), { idempotencyKey: randomUUID(), planId, batchId: target.batchId!, kind: 'skipped' }, nowMs);
    expect(r.status).toBe(201);
    const row = (await alertsOf()).find((a) => a.id === target.id)!;
    expect(row.state).toBe('cancelled');
    expect((await job(target.jobId))?.state).toBe('cancelled');
    expect(await (await em()).count(AlertJobSchema, { planId, kind: 'skipped', batchId: target.batchId })).toBe(1);
  });

  it('fires at its time under the test clock, and the cook’s phone gets "Pot ready"', async () => {
    const sub = makeSubscription();
    const e = await em();
    const user = await e.findOneOrFail(UserSchema, { email: w.emails.cookA });
    e.create(PushSubscriptionSchema, { user, kitchen: w.kitchenA.id, endpoint: sub.endpoint, p256dh: sub.p256dh, auth: sub.auth, lastSuccessAt: null, failures: 0 });
    await e.flush();
    await registerWorkers(boss, { em, pollingIntervalSeconds: 0.5, pushCaPath: inject('pushFakeCa') });

    // Re-arm one alert (as after a store-low warning that recovered) with the clock 3 s before its time.
    const target = (await alertsOf()).find((r) => r.state === 'scheduled')!;
    await e.nativeUpdate(AlertJobSchema, { id: target.id }, { state: 'cancelled' });
    const sentAt = Date.now();
    const sum = await rescheduleKitchenAlerts({ em: await em(), boss, clock: clockAt(target.fireAt.getTime() - 3000) }, kitchen, date);
    // The target, and any alert the skipped slot's freed heat brought back within reach.
    expect(sum.scheduled).toBeGreaterThanOrEqual(1);
    expect((await alertsOf()).find((a) => a.id === target.id)?.state).toBe('scheduled');
    const d = await waitUntil('ready push', async () => (await fakeDeliveries(sub.id)).find((x) => x.status === 201), 20_000);
    const firedAfterMs = Date.parse(d.receivedAt) - sentAt;
    expect(firedAfterMs).toBeGreaterThanOrEqual(2500); // not before its time (0.5 s for rounding)
    expect(firedAfterMs).toBeLessThan(12_000); // and soon after it (polling every 0.5 s)
    const payload = JSON.parse(decrypt(Buffer.from(d.bodyBase64, 'base64'), { version: 'aes128gcm', privateKey: sub.ecdh, authSecret: sub.authSecret }).toString('utf8'));
    expect(payload).toMatchObject({ kind: 'ready', tag: `ready-${target.batchId}`, requireInteraction: true });
    expect(payload.title).toMatch(/^Pot ready: /);
    expect(payload.body).toMatch(/has reached 9\d °C/);
    const row = (await alertsOf()).find((a) => a.id === target.id)!;
    expect(row.state).toBe('sent');
    expect((await job(row.jobId))?.state).toBe('completed');
  });

  it('re-publishing the day moves every alert to the new version: the old jobs are cancelled', async () => {
    const e = await em();
    const kitchen = (await cookAccess()).kitchen;
    const before = await e.find(AlertJobSchema, { planId, state: 'scheduled' });
    expect(before.length).toBeGreaterThan(0);
    const draft = await solveDraft({ em: e, kitchen, actorId: null }, date, 1, zonedDayBoundsMs(date, TZ)[0] - 4 * 3600_000);
    const next = await publishDraft({ em: e, kitchen, actorId: null }, draft.id);
    expect(next.version).toBe(2);
    for (const old of before) {
      expect((await (await em()).findOneOrFail(AlertJobSchema, { id: old.id })).state).toBe('cancelled');
      expect((await job(old.jobId))?.state).toBe('cancelled');
    }
    const fresh = await (await em()).find(AlertJobSchema, { planId: next.id, kind: 'ready', state: 'scheduled' });
    const skipped = new Set((await (await em()).find(CheckInSchema, { kitchen: w.kitchenA.id, date, kind: 'skipped' })).map((c) => c.batchId));
    const expected = next.result.slots.filter((s) => !skipped.has(s.batchId));
    expect(fresh.map((r) => r.batchId).sort()).toEqual(expected.map((s) => s.batchId).sort());
    for (const r of fresh) expect((await job(r.jobId))?.state).toBe('created');
    planId = next.id; // afterAll cancels what is left of the new version
  });
});
