/**
 * The push pipeline end to end: a cook skips a batch over HTTP → the web server queues the lead's
 * alert (pg-boss) → this file's worker sends it with web-push (VAPID, aes128gcm) over HTTPS to the push
 * fake, which verifies the VAPID JWT. The subscriptions are made here as a browser would (P-256 key
 * pair and auth secret: no real browser push service is reachable in the sandbox), so the payload is
 * decrypted with the subscription's private key (http_ece). 410 removes the subscription; 429 is
 * retried after Retry-After.
 */
import { randomUUID } from 'node:crypto';
import type PgBoss from 'pg-boss';
import { decrypt } from 'http_ece';
import { afterAll, beforeAll, describe, expect, inject, it } from 'vitest';
import { PushSubscriptionSchema } from '../../entities';
import { QUEUES, startBoss } from '../../lib/queues/boss';
import { registerWorkers } from '../../lib/jobs/worker';
import { stopBossClient } from '../../lib/queues/client';
import type { PushDelivery } from '../../lib/fakes/push';
import { Client } from '../helpers/http';
import { closeTestOrm, createWorld, PASSWORD, testOrm, type World } from '../helpers/fixtures';
import { fakeControl, fakeDeliveries, makeSubscription, publishPlanFor, waitUntil, type TestSubscription } from '../helpers/cooks';

let boss: PgBoss;
let w: World;
let cook: Client;
let lead: Client;
let planId: string;
let batches: string[];

beforeAll(async () => {
  const em = (await testOrm()).em.fork();
  w = await createWorld(em);
  const p = await publishPlanFor(em, w.kitchenA.id);
  planId = p.plan.id;
  batches = p.slots.map((s) => s.batchId);
  expect(batches.length).toBeGreaterThanOrEqual(3);
  cook = await new Client().signIn(w.emails.cookA, PASSWORD);
  lead = await new Client().signIn(w.emails.leadA, PASSWORD);
  boss = await startBoss(inject('databaseUrl'));
  await registerWorkers(boss, {
    em: async () => (await testOrm()).em.fork(),
    pollingIntervalSeconds: 0.5,
    pushRetry: { baseDelayS: 1, maxAttempts: 4, maxDelayS: 5 },
    pushCaPath: inject('pushFakeCa'),
  });
});
afterAll(async () => {
  await boss?.unschedule(QUEUES.heartbeat);
  await boss?.unschedule(QUEUES.housekeeping);
  await boss?.stop({ graceful: false, wait: true });
  await stopBossClient();
  await closeTestOrm();
});

async function subscribeLead(): Promise<TestSubscription & { rowId: string }> {
  const s = makeSubscription();
  const r = await lead.post(`/api/v1/kitchens/${w.kitchenA.id}/push-subscriptions`, s.json);
  expect(r.status).toBe(201);
  return { ...s, rowId: r.json.id };
}

const skip = async (batchId: string) => {
  const r = await cook.post(`/api/v1/kitchens/${w.kitchenA.id}/check-ins`, { idempotencyKey: randomUUID(), planId, batchId, kind: 'skipped' });
  expect(r.status).toBe(201);
};

const read = (s: TestSubscription, d: PushDelivery) => JSON.parse(decrypt(Buffer.from(d.bodyBase64, 'base64'), { version: 'aes128gcm', privateKey: s.ecdh, authSecret: s.authSecret }).toString('utf8')) as Record<string, unknown>;

describe('push alerts through the fake push service', () => {
  let s1: TestSubscription & { rowId: string };

  it('a skipped batch reaches the lead’s phone: VAPID-signed, aes128gcm, readable with the subscription’s keys', async () => {
    s1 = await subscribeLead();
    await skip(batches[0]!);
    const d = await waitUntil('delivery to s1', async () => (await fakeDeliveries(s1.id)).find((x) => x.status === 201));
    expect(d.contentEncoding).toBe('aes128gcm');
    expect(d.urgency).toBe('high');
    expect(d.ttl).toBe(3600);
    expect(d.vapid).toMatchObject({ aud: inject('pushFakeOrigin'), sub: expect.stringMatching(/^(mailto:|https:)/) });
    const payload = read(s1, d);
    expect(payload).toMatchObject({ kind: 'skipped', url: `/kitchens/${w.kitchenA.id}/today`, tag: `skipped-${batches[0]}` });
    expect(payload.title).toMatch(/^Batch skipped: (Maize porridge|Rice)$/);
    expect(payload.body).toMatch(/cookA skipped batch \d of \d/);
    // The worker marks the subscription as reachable.
    await waitUntil('lastSuccessAt', async () => (await (await testOrm()).em.fork().findOne(PushSubscriptionSchema, { id: s1.rowId }))?.lastSuccessAt);
  });

  it('410 Gone from the push service removes that subscription; the others still get the alert', async () => {
    const gone = await subscribeLead();
    await fakeControl('POST', `/_fake/subscriptions/${gone.id}/responses`, { statuses: [410], repeat: true });
    const before = (await fakeDeliveries(s1.id)).length;
    await skip(batches[1]!);
    await waitUntil('subscription removed', async () => (await (await testOrm()).em.fork().count(PushSubscriptionSchema, { id: gone.rowId })) === 0);
    expect((await fakeDeliveries(gone.id)).map((d) => d.status)).toEqual([410]);
    await waitUntil('s1 still served', async () => (await fakeDeliveries(s1.id)).length > before);
  });

  it('429 Too Many Requests is retried after Retry-After, then delivered once', async () => {
    const busy = await subscribeLead();
    await fakeControl('POST', `/_fake/subscriptions/${busy.id}/responses`, { statuses: [429], retryAfterS: 1 });
    await skip(batches[2]!);
    const list = await waitUntil('retried delivery', async () => {
      const l = await fakeDeliveries(busy.id);
      return l.some((d) => d.status === 201) ? l : undefined;
    });
    expect(list.map((d) => d.status)).toEqual([429, 201]);
    const gapMs = Date.parse(list[1]!.receivedAt) - Date.parse(list[0]!.receivedAt);
    expect(gapMs).toBeGreaterThanOrEqual(1000); // Retry-After: 1 (and the 1 s backoff base)
    expect(read(busy, list[1]!).kind).toBe('skipped');
    const row = await (await testOrm()).em.fork().findOneOrFail(PushSubscriptionSchema, { id: busy.rowId });
    expect(row.failures).toBe(0);
  });
});
