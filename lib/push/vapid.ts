import { randomUUID } from 'node:crypto';
import type { EntityManager } from '@mikro-orm/postgresql';
import webpush from 'web-push';
import { SettingSchema } from '@/entities';
import { getEnv } from '@/lib/env';

export interface VapidKeys {
  /** Uncompressed P-256 public key, base64url (the browser's applicationServerKey). */
  publicKey: string;
  privateKey: string;
  /** Contact for the push services (RFC 8292 "sub"). */
  subject: string;
}

const SETTING_KEY = 'vapid';
let cached: VapidKeys | null = null;

function subject(): string {
  const env = getEnv();
  if (env.VAPID_SUBJECT) return env.VAPID_SUBJECT;
  return env.APP_URL.startsWith('https:') ? env.APP_URL : 'mailto:no-reply@example.org';
}

/**
 * The VAPID key pair (RFC 8292): from the environment when given, else made on first use and kept in
 * the `settings` table, so every web and worker process signs with the same pair and browsers'
 * subscriptions stay valid across restarts. Two processes starting together agree: the first insert
 * wins and both read it back.
 */
export async function getVapidKeys(em: EntityManager): Promise<VapidKeys> {
  if (cached) return cached;
  const env = getEnv();
  if (env.VAPID_PUBLIC_KEY && env.VAPID_PRIVATE_KEY) {
    cached = { publicKey: env.VAPID_PUBLIC_KEY, privateKey: env.VAPID_PRIVATE_KEY, subject: subject() };
    return cached;
  }
  let row = await em.findOne(SettingSchema, { key: SETTING_KEY });
  if (!row) {
    const keys = webpush.generateVAPIDKeys();
    await em
      .getConnection()
      .execute(`insert into settings (id, created_at, updated_at, key, value) values (?, now(), now(), ?, ?::jsonb) on conflict (key) do nothing`, [randomUUID(), SETTING_KEY, JSON.stringify(keys)]);
    row = await em.fork().findOneOrFail(SettingSchema, { key: SETTING_KEY });
  }
  const v = row.value as { publicKey: string; privateKey: string };
  cached = { publicKey: v.publicKey, privateKey: v.privateKey, subject: subject() };
  return cached;
}
