import { normalisePots } from '../../lib/cookers/spec';
import { randomUUID, createECDH, randomBytes, type ECDH } from 'node:crypto';
import { request as httpsRequest } from 'node:https';
import { readFileSync } from 'node:fs';
import type { EntityManager } from '@mikro-orm/postgresql';
import { inject } from 'vitest';
import { CookerSchema, DishSchema, KitchenSchema, MenuLineSchema, type Kitchen, type Plan } from '../../entities';
import { DEMO_COOKERS } from '../../lib/demo/cookers';
import { DEMO_DISHES } from '../../lib/demo/menus';
import { publishDraft, solveDraft } from '../../lib/drafts';
import type { PlannerResult } from '../../lib/planner';
import { localDateString, zonedDayBoundsMs } from '../../lib/time';
import type { PushDelivery } from '../../lib/fakes/push';

/**
 * A published plan for a world kitchen: the demo's dish cooker (two 40 L pots on a sunflower store),
 * maize porridge and rice on the menu. Publishing schedules its alerts (lib/alerts) through a pg-boss
 * client of this process: call stopBossClient() in afterAll.
 */
export async function publishPlanFor(em: EntityManager, kitchenId: string, date = localDateString(Date.now(), 'Africa/Ouagadougou')): Promise<{ kitchen: Kitchen; plan: Plan; cookerId: string; date: string; slots: PlannerResult['slots'] }> {
  const kitchen = await em.findOneOrFail(KitchenSchema, { id: kitchenId }, { populate: ['organisation'] });
  // No forecast is stored for a test kitchen: plan under a clear sky all year (not a monthly clearness),
  // so the day has the sun these tests count on.
  kitchen.clearness = Array<number>(12).fill(1);
  let cooker = await em.findOne(CookerSchema, { kitchen, name: 'Dish 1 (sunflower store)' });
  if (!cooker) {
    const { customMediumId: _c, pots, ...rest } = DEMO_COOKERS.baobab![0]!;
    cooker = em.create(CookerSchema, { ...rest, pots: normalisePots(pots), kitchen, customMedium: null, archived: false });
  }
  const dishes = [];
  for (const name of ['Maize porridge', 'Rice']) {
    const d = DEMO_DISHES.find((x) => x.name === name)!;
    dishes.push((await em.findOne(DishSchema, { organisation: kitchen.organisation, name })) ?? em.create(DishSchema, { ...d, notes: d.notes ?? null, organisation: kitchen.organisation, archived: false }));
  }
  await em.nativeDelete(MenuLineSchema, { kitchen, date });
  em.create(MenuLineSchema, { kitchen, date, dish: dishes[0]!, servings: 300, serveBy: '10:30', earliestStart: '07:00', position: 0 });
  em.create(MenuLineSchema, { kitchen, date, dish: dishes[1]!, servings: 260, serveBy: '13:00', earliestStart: null, position: 1 });
  await em.flush();
  // Solved as a lead would have done it, the evening before (a same-day solve plans from "now" on).
  const draft = await solveDraft({ em, kitchen, actorId: null }, date, 1, zonedDayBoundsMs(date, kitchen.timeZone)[0] - 4 * 3600_000);
  const plan = await publishDraft({ em, kitchen, actorId: null }, draft.id);
  return { kitchen, plan, cookerId: cooker.id, date, slots: plan.result.slots };
}

/** A browser-like push subscription on the push fake, with the keys to read what arrives. */
export interface TestSubscription {
  id: string;
  endpoint: string;
  p256dh: string;
  auth: string;
  ecdh: ECDH;
  authSecret: Buffer;
  json: { endpoint: string; expirationTime: null; keys: { p256dh: string; auth: string } };
}

/**
 * The e2e and job tests cannot reach a real browser push service (none in the sandbox), so they make
 * the subscription the browser would: a P-256 key pair and a 16-byte auth secret (RFC 8291 §2),
 * with an endpoint on the local push fake.
 */
export function makeSubscription(): TestSubscription {
  const ecdh = createECDH('prime256v1');
  ecdh.generateKeys();
  const authSecret = randomBytes(16);
  const id = randomUUID();
  const endpoint = `${inject('pushFakeOrigin')}/push/${id}`;
  const p256dh = ecdh.getPublicKey().toString('base64url');
  const auth = authSecret.toString('base64url');
  return { id, endpoint, p256dh, auth, ecdh, authSecret, json: { endpoint, expirationTime: null, keys: { p256dh, auth } } };
}

/** Talks to the push fake's control API over HTTPS, trusting its self-signed certificate. */
export async function fakeControl<T>(method: 'GET' | 'POST', path: string, body?: unknown): Promise<T> {
  const url = new URL(path, inject('pushFakeOrigin'));
  const ca = readFileSync(inject('pushFakeCa'));
  return new Promise((resolve, reject) => {
    const req = httpsRequest(url, { method, ca, headers: body ? { 'content-type': 'application/json' } : {} }, (res) => {
      const chunks: Buffer[] = [];
      res.on('data', (c: Buffer) => chunks.push(c));
      res.on('end', () => resolve(JSON.parse(Buffer.concat(chunks).toString('utf8')) as T));
    });
    req.on('error', reject);
    req.end(body ? JSON.stringify(body) : undefined);
  });
}

export const fakeDeliveries = async (subscriptionId: string) => (await fakeControl<{ deliveries: PushDelivery[] }>('GET', `/_fake/deliveries?subscription=${subscriptionId}`)).deliveries;

/** Polls until `check` returns a value (not undefined/false) or the time is up. */
export async function waitUntil<T>(what: string, check: () => Promise<T | undefined | false | null>, timeoutMs = 20_000, everyMs = 150): Promise<T> {
  const until = Date.now() + timeoutMs;
  for (;;) {
    const v = await check();
    if (v !== undefined && v !== false && v !== null) return v;
    if (Date.now() > until) throw new Error(`${what}: not within ${timeoutMs} ms`);
    await new Promise((r) => setTimeout(r, everyMs));
  }
}
