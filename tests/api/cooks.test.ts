/**
 * The cooks' API over HTTP: today's plan, check-ins and readings with idempotency keys, sensor keys and
 * the sensor readings route (Bearer key, rate limit, refused rows named), push subscriptions. Each
 * part runs against a fresh world with a published plan for today in kitchen A.
 */
import { randomUUID } from 'node:crypto';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { CheckInSchema, CookerSchema, ReadingSchema, AlertJobSchema } from '../../entities';
import { stopBossClient } from '../../lib/queues/client';
import { Client } from '../helpers/http';
import { closeTestOrm, createWorld, PASSWORD, testOrm, type World } from '../helpers/fixtures';
import { makeSubscription, publishPlanFor } from '../helpers/cooks';

let w: World;
let cook: Client;
let lead: Client;
let coordinator: Client;
let cookB: Client;
let leadB: Client;
let planId: string;
let cookerId: string;
let batchIds: string[];
let slots: { batchId: string; readyMs: number }[];
let otherCookerId: string;

beforeAll(async () => {
  const em = (await testOrm()).em.fork();
  w = await createWorld(em);
  const p = await publishPlanFor(em, w.kitchenA.id);
  planId = p.plan.id;
  cookerId = p.cookerId;
  batchIds = p.slots.map((s) => s.batchId);
  slots = p.slots;
  const other = em.create(CookerSchema, { ...(await em.findOneOrFail(CookerSchema, { id: cookerId })), id: randomUUID(), kitchen: w.otherKitchen, name: 'Other kitchen cooker', createdAt: new Date(), updatedAt: new Date() });
  await em.flush();
  otherCookerId = other.id;
  const signIn = (who: keyof World['emails']) => new Client().signIn(w.emails[who], PASSWORD);
  [cook, lead, coordinator, cookB, leadB] = await Promise.all([signIn('cookA'), signIn('leadA'), signIn('coordinator'), signIn('cookB'), signIn('leadB')]);
});
afterAll(async () => {
  await stopBossClient();
  await closeTestOrm();
});

const rows = async (schema: typeof CheckInSchema | typeof ReadingSchema, where: Record<string, unknown>) => (await testOrm()).em.fork().count(schema as typeof CheckInSchema, where);

describe('GET /api/v1/kitchens/{kitchenId}/today', () => {
  it("gives today's published slots per cooker, each with its safety notes ending with the local-codes reminder", async () => {
    const r = await cook.get(`/api/v1/kitchens/${w.kitchenA.id}/today`);
    expect(r.status).toBe(200);
    expect(r.json.plan.id).toBe(planId);
    expect(r.json.canLog).toBe(true);
    expect(r.json.vapidPublicKey).toMatch(/^[A-Za-z0-9_-]{87}$/);
    const slots = r.json.cookers.flatMap((c: { slots: unknown[] }) => c.slots) as { batchId: string; safety: { code: string }[]; readyMs: number; plannedReadyMs: number; status: string }[];
    expect(slots.map((s) => s.batchId).sort()).toEqual([...batchIds].sort());
    for (const s of slots) {
      expect(s.safety.at(-1)?.code).toBe('local-codes');
      expect(s.safety.map((n) => n.code)).toEqual(expect.arrayContaining(['oil-fire', 'no-water-in-oil', 'core-temp', 'hold-hot']));
      expect(s.readyMs).toBe(s.plannedReadyMs);
      expect(s.status).toBe('planned');
    }
  });

  it('a kitchen without a plan today says so (plan null); another kitchen is not found', async () => {
    const none = await cookB.get(`/api/v1/kitchens/${w.kitchenB.id}/today`);
    expect(none.status).toBe(200);
    expect(none.json.plan).toBeNull();
    expect(none.json.cookers).toEqual([]);
    expect((await cookB.get(`/api/v1/kitchens/${w.kitchenA.id}/today`)).status).toBe(404);
    expect((await new Client().get(`/api/v1/kitchens/${w.kitchenA.id}/today`)).status).toBe(401);
  });
});

describe('POST /api/v1/kitchens/{kitchenId}/check-ins', () => {
  const url = () => `/api/v1/kitchens/${w.kitchenA.id}/check-ins`;

  it('records once per idempotency key: 201, then 200 with the same answer; one row', async () => {
    const body = { idempotencyKey: randomUUID(), planId, batchId: batchIds[0], kind: 'started' };
    const first = await cook.post(url(), body);
    expect(first.status).toBe(201);
    const again = await cook.post(url(), body);
    expect(again.status).toBe(200);
    expect(again.json).toEqual(first.json);
    expect(await rows(CheckInSchema, { kitchen: w.kitchenA.id, batchId: batchIds[0] })).toBe(1);
    const today = await cook.get(`/api/v1/kitchens/${w.kitchenA.id}/today`);
    const slot = today.json.cookers.flatMap((c: { slots: { batchId: string; status: string }[] }) => c.slots).find((s: { batchId: string }) => s.batchId === batchIds[0]);
    expect(slot.status).toBe('started');
  });

  it('the same key for a different request is refused (409); the first record stands', async () => {
    const key = randomUUID();
    expect((await cook.post(url(), { idempotencyKey: key, planId, batchId: batchIds[1], kind: 'started' })).status).toBe(201);
    const clash = await cook.post(url(), { idempotencyKey: key, planId, batchId: batchIds[1], kind: 'done' });
    expect(clash.status).toBe(409);
    expect(clash.json.error.fields).toHaveProperty('idempotencyKey');
  });

  it('unknown plan or batch → 404; bad kind, bad key, future time → 422 naming the field', async () => {
    expect((await cook.post(url(), { idempotencyKey: randomUUID(), planId: randomUUID(), batchId: batchIds[0], kind: 'done' })).status).toBe(404);
    const nb = await cook.post(url(), { idempotencyKey: randomUUID(), planId, batchId: 'no-such-batch', kind: 'done' });
    expect([nb.status, nb.json.error.message]).toEqual([404, 'Batch not found.']);
    const kind = await cook.post(url(), { idempotencyKey: randomUUID(), planId, batchId: batchIds[0], kind: 'burnt' });
    expect([kind.status, Object.keys(kind.json.error.fields)]).toEqual([422, ['kind']]);
    const key = await cook.post(url(), { idempotencyKey: 'not-a-uuid', planId, batchId: batchIds[0], kind: 'done' });
    expect(Object.keys(key.json.error.fields)).toEqual(['idempotencyKey']);
    const future = await cook.post(url(), { idempotencyKey: randomUUID(), planId, batchId: batchIds[0], kind: 'done', at: new Date(Date.now() + 3_600_000).toISOString() });
    expect([future.status, Object.keys(future.json.error.fields)]).toEqual([422, ['at']]);
  });

  it('cooks and leads log; a coordinator may not (403); another kitchen’s cook sees nothing (404)', async () => {
    const body = () => ({ idempotencyKey: randomUUID(), planId, batchId: batchIds[0], kind: 'done' });
    expect((await coordinator.post(url(), body())).status).toBe(403);
    expect((await cookB.post(url(), body())).status).toBe(404);
    expect((await lead.post(url(), body())).status).toBe(201);
  });

  it('a skipped batch goes to backup fuel: its ready alert is cancelled and the lead is told', async () => {
    const batchId = batchIds.at(-1)!;
    const r = await cook.post(url(), { idempotencyKey: randomUUID(), planId, batchId, kind: 'skipped' });
    expect(r.status).toBe(201);
    const today = await cook.get(`/api/v1/kitchens/${w.kitchenA.id}/today`);
    const backup = today.json.backup.find((b: { batchId: string }) => b.batchId === batchId);
    expect(backup).toMatchObject({ reason: 'skipped', fuelId: expect.any(String), amount: expect.any(Number) });
    const em = (await testOrm()).em.fork();
    const alerts = await em.find(AlertJobSchema, { planId, batchId });
    expect(alerts.find((a) => a.kind === 'skipped')?.state).toMatch(/scheduled|sent/);
    // A slot whose ready time is still ahead had a ready alert; it is cancelled now (one already past had none).
    const readyMs = slots.find((s) => s.batchId === batchId)!.readyMs;
    const ready = alerts.find((a) => a.kind === 'ready');
    if (readyMs > Date.now() + 5 * 60_000) expect(ready?.state).toBe('cancelled');
    else expect(ready?.state ?? 'cancelled').toBe('cancelled');
  });
});

describe('POST /api/v1/kitchens/{kitchenId}/readings (typed by a cook)', () => {
  const url = () => `/api/v1/kitchens/${w.kitchenA.id}/readings`;

  it('records once per key and re-predicts the cooker’s day from the measured store', async () => {
    const body = { idempotencyKey: randomUUID(), cookerId, storeC: 150.5, potC: 60, potId: 'p1', at: new Date(Date.now() - 60_000).toISOString() };
    const first = await cook.post(url(), body);
    expect(first.status).toBe(201);
    expect(first.json).toMatchObject({ cookerId, storeC: 150.5, potC: 60, potId: 'p1', source: 'manual' });
    expect((await cook.post(url(), body)).status).toBe(200);
    expect(await rows(ReadingSchema, { cooker: cookerId, source: 'manual' })).toBe(1);
    const today = await cook.get(`/api/v1/kitchens/${w.kitchenA.id}/today`);
    const c = today.json.cookers.find((x: { id: string }) => x.id === cookerId);
    expect(c.latestReading).toMatchObject({ storeC: 150.5, potC: 60, source: 'manual' });
    expect(c.repredictedFromMs).toEqual(expect.any(Number));
  });

  it('refuses out-of-range values, no value, an unknown pot (422 naming the field) and another kitchen’s cooker (404)', async () => {
    const base = () => ({ idempotencyKey: randomUUID(), cookerId });
    const hot = await cook.post(url(), { ...base(), storeC: 401 });
    expect([hot.status, hot.json.error.fields.storeC]).toEqual([422, expect.stringMatching(/400/)]);
    expect(Object.keys((await cook.post(url(), { ...base(), potC: -21 })).json.error.fields)).toEqual(['potC']);
    expect(Object.keys((await cook.post(url(), base())).json.error.fields)).toEqual(['storeC']);
    expect(Object.keys((await cook.post(url(), { ...base(), potC: 80, potId: 'p9' })).json.error.fields)).toEqual(['potId']);
    const foreign = await cook.post(url(), { ...base(), cookerId: otherCookerId, storeC: 120 });
    expect([foreign.status, foreign.json.error.message]).toEqual([404, 'Cooker not found.']);
  });
});

describe('sensor keys and POST /api/v1/readings', () => {
  let key: string;
  let keyId: string;
  const send = (body: unknown, k: string | null = key) => new Client().request('POST', '/api/v1/readings', body, { headers: k === null ? {} : { authorization: `Bearer ${k}` } });
  const at = (minAgo: number) => new Date(Date.now() - minAgo * 60_000).toISOString();
  const keysUrl = () => `/api/v1/kitchens/${w.kitchenA.id}/cookers/${cookerId}/api-keys`;

  beforeAll(async () => {
    const r = await lead.post(keysUrl(), { label: 'store thermocouple' });
    expect(r.status).toBe(201);
    key = r.json.key;
    keyId = r.json.id;
  });

  it('the key is shown once; the list shows its prefix only; only leads of the kitchen manage keys', async () => {
    expect(key).toMatch(/^hck_[A-Za-z0-9_-]{43}$/);
    const list = await lead.get(keysUrl());
    expect(list.json.keys).toEqual([expect.objectContaining({ id: keyId, label: 'store thermocouple', prefix: key.slice(0, 10), revokedAt: null })]);
    expect(list.text).not.toContain(key);
    expect((await cook.post(keysUrl(), { label: 'x' })).status).toBe(403);
    expect((await leadB.get(keysUrl())).status).toBe(404);
    expect((await lead.get(`/api/v1/kitchens/${w.kitchenA.id}/cookers/${otherCookerId}/api-keys`)).status).toBe(404);
    expect(Object.keys((await lead.post(keysUrl(), { label: ' ' })).json.error.fields)).toEqual(['label']);
  });

  it('missing, malformed, unknown or revoked key → 401 with WWW-Authenticate', async () => {
    const body = { idempotencyKey: randomUUID(), readings: [{ at: at(5), storeC: 120 }] };
    for (const k of [null, 'nonsense', `hck_${'A'.repeat(43)}`]) {
      const r = await send(body, k);
      expect(r.status, String(k)).toBe(401);
      expect(r.headers.get('www-authenticate')).toMatch(/^Bearer/);
    }
    const extra = await lead.post(keysUrl(), { label: 'to revoke' });
    expect((await lead.del(`${keysUrl()}/${extra.json.id}`)).status).toBe(204);
    expect((await send(body, extra.json.key)).status).toBe(401);
  });

  it('a batch is stored once per idempotency key (201, then 200 with the same answer)', async () => {
    const body = { idempotencyKey: randomUUID(), readings: [{ at: at(30), storeC: 140, potC: 30, potId: 'p1' }, { at: at(29), storeC: 141 }, { at: at(28), potC: 35 }] };
    const first = await send(body);
    expect(first.status).toBe(201);
    expect(first.json).toMatchObject({ accepted: 3, cookerId });
    const again = await send(body);
    expect([again.status, again.json]).toEqual([200, first.json]);
    expect(await rows(ReadingSchema, { apiKeyId: keyId })).toBe(3);
    const clash = await send({ ...body, readings: [{ at: at(27), storeC: 150 }] });
    expect(clash.status).toBe(409);
    const list = await cook.get(`/api/v1/kitchens/${w.kitchenA.id}/cookers/${cookerId}/readings`);
    expect(list.json.readings.filter((r: { source: string }) => r.source === 'sensor')).toHaveLength(3);
  });

  it('refused rows are named: out of range, out of order, repeated time, older than the last, in the future, unknown pot', async () => {
    const fields = async (readings: unknown[]) => {
      const r = await send({ idempotencyKey: randomUUID(), readings });
      expect(r.status).toBe(422);
      return Object.keys(r.json.error.fields);
    };
    expect(await fields([{ at: at(20), storeC: 120 }, { at: at(19), storeC: 121 }, { at: at(18), storeC: 400.5 }])).toEqual(['readings.2.storeC']);
    expect(await fields([{ at: at(20), storeC: 120 }, { at: at(19), potC: -20.5 }])).toEqual(['readings.1.potC']);
    expect(await fields([{ at: at(20), storeC: 120 }, { at: at(18), storeC: 121 }, { at: at(17), storeC: 122 }, { at: at(19), storeC: 123 }])).toEqual(['readings.3.at']);
    expect(await fields([{ at: at(20), storeC: 120 }, { at: at(20), storeC: 121 }])).toEqual(['readings.1.at']);
    expect(await fields([{ at: at(20) }])).toEqual(['readings.0.storeC']);
    expect(await fields([{ at: at(40), storeC: 120 }])).toEqual(['readings.0.at']); // before what this key already sent
    expect(await fields([{ at: new Date(Date.now() + 3_600_000).toISOString(), storeC: 120 }])).toEqual(['readings.0.at']);
    expect(await fields([{ at: at(10), potC: 50, potId: 'p7' }])).toEqual(['readings.0.potId']);
    expect(await fields([])).toEqual(['readings']);
    const empty = await send({});
    expect(Object.keys(empty.json.error.fields).sort()).toEqual(['idempotencyKey', 'readings']);
    expect((await send('not json' as unknown as object)).status).toBe(422);
  });

  it('an archived cooker’s key is refused (404)', async () => {
    const em = (await testOrm()).em.fork();
    const c = await em.findOneOrFail(CookerSchema, { id: cookerId });
    const spare = em.create(CookerSchema, { ...c, id: randomUUID(), name: 'Spare cooker', createdAt: new Date(), updatedAt: new Date() });
    await em.flush();
    const k = await lead.post(`/api/v1/kitchens/${w.kitchenA.id}/cookers/${spare.id}/api-keys`, { label: 'spare' });
    expect((await lead.del(`/api/v1/kitchens/${w.kitchenA.id}/cookers/${spare.id}`)).status).toBe(204);
    const r = await send({ idempotencyKey: randomUUID(), readings: [{ at: at(1), storeC: 100 }] }, k.json.key);
    expect([r.status, r.json.error.message]).toEqual([404, 'Cooker not found.']);
  });

  it('60 requests a minute per key; the 61st → 429 with Retry-After', async () => {
    const k = await lead.post(keysUrl(), { label: 'rate' });
    // Counted before the body is read: empty bodies keep this fast.
    const statuses: number[] = [];
    for (let i = 0; i < 61; i++) statuses.push((await send({}, k.json.key)).status);
    // The minute starts at the key's first request (lib/rate-limit.ts), so 61 requests sent well within a
    // minute always reach the limit.
    expect(statuses.slice(0, 60).every((s) => s === 422)).toBe(true);
    expect(statuses[60]).toBe(429);
    const r = await send({}, k.json.key);
    expect(r.status).toBe(429);
    expect(Number(r.headers.get('retry-after'))).toBeGreaterThanOrEqual(1);
    expect(Number(r.headers.get('retry-after'))).toBeLessThanOrEqual(60);
    expect(r.json.error.message).toMatch(/try again in \d+ s/);
  });
});

describe('push subscriptions', () => {
  const url = () => `/api/v1/kitchens/${w.kitchenA.id}/push-subscriptions`;

  it('saves a browser subscription (201, then 200 for the same endpoint), lists it, removes it (200, then 404)', async () => {
    const s = makeSubscription();
    const first = await cook.post(url(), s.json);
    expect(first.status).toBe(201);
    expect(first.json.endpointHost).toBe(new URL(s.endpoint).host);
    expect((await cook.post(url(), s.json)).status).toBe(200);
    expect((await cook.get(url())).json.subscriptions.map((x: { id: string }) => x.id)).toContain(first.json.id);
    expect((await lead.del(`${url()}/${first.json.id}`)).status).toBe(404); // not the lead's own
    const removed = await cook.del(`${url()}/${first.json.id}`);
    expect(removed.status).toBe(200);
    expect(removed.json.endpointStillUsed).toBe(false);
    expect((await cook.del(`${url()}/${first.json.id}`)).status).toBe(404);
  });

  it('one phone follows two kitchens: one row each, and turning one off keeps the other', async () => {
    const s = makeSubscription();
    const urlB = `/api/v1/kitchens/${w.kitchenB.id}/push-subscriptions`;
    const a = await coordinator.post(url(), s.json);
    const b = await coordinator.post(urlB, s.json);
    expect([a.status, b.status]).toEqual([201, 201]);
    expect(a.json.id).not.toBe(b.json.id);
    const offA = await coordinator.del(`${url()}/${a.json.id}`);
    expect(offA.json.endpointStillUsed).toBe(true); // kitchen B still uses this phone's endpoint
    expect((await coordinator.get(urlB)).json.subscriptions.map((x: { id: string }) => x.id)).toContain(b.json.id);
    expect((await coordinator.del(`${urlB}/${b.json.id}`)).json.endpointStillUsed).toBe(false);
  });

  it('refuses a plain-http endpoint, a host that is no push service, and malformed keys (422 naming them)', async () => {
    const s = makeSubscription();
    expect(Object.keys((await cook.post(url(), { ...s.json, endpoint: s.endpoint.replace('https:', 'http:') })).json.error.fields)).toEqual(['endpoint']);
    expect(Object.keys((await cook.post(url(), { ...s.json, endpoint: 'https://attacker.example.org/push/1' })).json.error.fields)).toEqual(['endpoint']);
    expect(Object.keys((await cook.post(url(), { ...s.json, keys: { p256dh: 'short', auth: s.auth } })).json.error.fields)).toEqual(['keys.p256dh']);
  });
});

describe('the OpenAPI document of these routes', () => {
  it('each body’s `required` list is what the route names as missing for {} (sent by a lead, who may call them all)', async () => {
    const doc = (await new Client().get('/api/v1/openapi.json')).json as { paths: Record<string, Record<string, { requestBody?: { content: { 'application/json': { schema: { required: string[] } } } }; security: unknown[] }>> };
    const mine = ['/api/v1/kitchens/{kitchenId}/check-ins', '/api/v1/kitchens/{kitchenId}/readings', '/api/v1/kitchens/{kitchenId}/cookers/{cookerId}/api-keys', '/api/v1/kitchens/{kitchenId}/push-subscriptions'];
    for (const p of mine) {
      const op = doc.paths[p]!.post!;
      expect(op.security, p).toEqual([{ session: [] }]);
      const r = await lead.post(p.replace('{kitchenId}', w.kitchenA.id).replace('{cookerId}', cookerId), {});
      expect(r.status, p).toBe(422);
      expect(Object.keys(r.json.error.fields).sort(), p).toEqual([...op.requestBody!.content['application/json'].schema.required].sort());
    }
    expect(doc.paths['/api/v1/readings']!.post!.security).toEqual([{ cookerKey: [] }]);
    expect(doc.paths['/api/v1/readings']!.post!.requestBody!.content['application/json'].schema.required.sort()).toEqual(['idempotencyKey', 'readings']);
  });
});
