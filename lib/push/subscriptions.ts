import { isUuid } from '@/lib/auth/guard';
import type { EntityManager } from '@mikro-orm/postgresql';
import { MembershipSchema, PushSubscriptionSchema, type PushSubscription } from '@/entities';
import type { KitchenAccess } from '@/lib/auth/guard';
import { getEnv } from '@/lib/env';
import { notFound, unprocessable } from '@/lib/http/errors';

/**
 * Push services of the browsers in use (Chrome/Android and Samsung via FCM, Firefox, Edge, Safari).
 * The worker POSTs to a subscription's endpoint, so endpoints are limited to these hosts (and to
 * loopback while the local push fake is trusted) rather than any address a client names.
 */
export const PUSH_SERVICE_HOST_SUFFIXES = ['fcm.googleapis.com', 'android.googleapis.com', 'push.services.mozilla.com', 'notify.windows.com', 'push.apple.com'];

export function isAllowedEndpoint(endpoint: string, fakeTrusted = Boolean(getEnv().PUSH_FAKE_CA)): boolean {
  let url: URL;
  try {
    url = new URL(endpoint);
  } catch {
    return false;
  }
  if (url.protocol !== 'https:') return false;
  const host = url.hostname.toLowerCase();
  if (fakeTrusted && (host === '127.0.0.1' || host === 'localhost' || host === '[::1]')) return true;
  return PUSH_SERVICE_HOST_SUFFIXES.some((s) => host === s || host.endsWith(`.${s}`));
}

export function describeSubscription(s: PushSubscription) {
  return { id: s.id, endpointHost: new URL(s.endpoint).host, createdAt: s.createdAt.toISOString(), lastSuccessAt: s.lastSuccessAt?.toISOString() ?? null };
}

/**
 * Saves the caller's subscription for this kitchen's alerts. One browser has one endpoint, so the same
 * endpoint may follow several kitchens (one row each); the same endpoint and kitchen again updates it.
 */
export async function saveSubscription(access: KitchenAccess, input: { endpoint: string; keys: { p256dh: string; auth: string } }) {
  if (!isAllowedEndpoint(input.endpoint)) throw unprocessable('This push service is not one we send to.', { endpoint: 'Use the subscription your browser made (an https address of its push service).' });
  const { em } = access;
  // The browser's keys belong to the endpoint: keep every kitchen's row of it up to date.
  await em.nativeUpdate(PushSubscriptionSchema, { endpoint: input.endpoint, kitchen: { $ne: access.kitchen.id } }, { p256dh: input.keys.p256dh, auth: input.keys.auth });
  const existing = await em.findOne(PushSubscriptionSchema, { endpoint: input.endpoint, kitchen: access.kitchen.id });
  if (existing) {
    existing.user = access.user;
    existing.kitchen = access.kitchen;
    existing.p256dh = input.keys.p256dh;
    existing.auth = input.keys.auth;
    existing.failures = 0;
    await em.flush();
    return { created: false, subscription: describeSubscription(existing) };
  }
  const s = em.create(PushSubscriptionSchema, { user: access.user, kitchen: access.kitchen, endpoint: input.endpoint, p256dh: input.keys.p256dh, auth: input.keys.auth, lastSuccessAt: null, failures: 0 });
  await em.flush();
  return { created: true, subscription: describeSubscription(s) };
}

export async function listOwnSubscriptions(access: KitchenAccess) {
  const rows = await access.em.find(PushSubscriptionSchema, { user: access.user.id, kitchen: access.kitchen.id }, { orderBy: { createdAt: 'asc' } });
  return rows.map(describeSubscription);
}

/**
 * Removes one of the caller's own subscriptions (someone else's is "not found"). Says whether the same
 * endpoint still follows another kitchen, so the phone keeps its browser subscription in that case.
 */
export async function removeSubscription(access: KitchenAccess, id: string): Promise<{ endpointStillUsed: boolean }> {
  const s = isUuid(id) ? await access.em.findOne(PushSubscriptionSchema, { id, user: access.user.id, kitchen: access.kitchen.id }) : null;
  if (!s) throw notFound('Subscription');
  const endpoint = s.endpoint;
  await access.em.removeAndFlush(s);
  return { endpointStillUsed: (await access.em.count(PushSubscriptionSchema, { endpoint })) > 0 };
}

export type Audience = 'kitchen' | 'leads';

/** Subscriptions an alert goes to: everyone subscribed to the kitchen, or only its leads. */
export async function audienceSubscriptions(em: EntityManager, kitchenId: string, audience: Audience): Promise<PushSubscription[]> {
  const subs = await em.find(PushSubscriptionSchema, { kitchen: kitchenId }, { populate: ['user'] });
  if (audience === 'kitchen') return subs;
  const leads = await em.find(MembershipSchema, { kitchen: kitchenId, role: 'lead' });
  const leadIds = new Set(leads.map((m) => m.user.id));
  return subs.filter((s) => leadIds.has(s.user.id));
}
