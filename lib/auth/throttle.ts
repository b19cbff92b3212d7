import { randomUUID } from 'node:crypto';
import type { EntityManager } from '@mikro-orm/postgresql';
import { LoginAttemptSchema } from '@/entities';
import { tooMany } from '@/lib/http/errors';

/** Sign-in attempts allowed per window before a 429 (OWASP Authentication Cheat Sheet: throttle per account and per source). */
export const THROTTLE = { windowS: 15 * 60, perAccount: 5, perAddress: 30 } as const;

const keys = (email: string, ip: string | null) => ({ account: `email:${email}`, address: ip ? `ip:${ip}` : null });

/**
 * Records this attempt FIRST, then counts the window (this attempt included), so a burst of parallel
 * requests cannot all pass a count taken before any of them was written. Throws 429 with Retry-After
 * beyond the limits; otherwise returns the attempt's row ids, which a successful sign-in removes.
 * Without a trusted client address (ip null) only the per-account limit applies.
 */
export async function beginAttempt(em: EntityManager, email: string, ip: string | null, now = new Date()): Promise<string[]> {
  const k = keys(email, ip);
  const ids = [randomUUID(), ...(k.address ? [randomUUID()] : [])];
  em.create(LoginAttemptSchema, { id: ids[0]!, key: k.account, createdAt: now, updatedAt: now });
  if (k.address) em.create(LoginAttemptSchema, { id: ids[1]!, key: k.address, createdAt: now, updatedAt: now });
  await em.flush();
  const since = new Date(now.getTime() - THROTTLE.windowS * 1000);
  const [account, address] = await Promise.all([
    em.find(LoginAttemptSchema, { key: k.account, createdAt: { $gt: since } }, { orderBy: { createdAt: 'asc' }, fields: ['createdAt'] }),
    k.address ? em.count(LoginAttemptSchema, { key: k.address, createdAt: { $gt: since } }) : Promise.resolve(0),
  ]);
  if (account.length > THROTTLE.perAccount || address > THROTTLE.perAddress) {
    const oldest = account[0]?.createdAt ?? now;
    const retry = Math.max(1, Math.ceil((oldest.getTime() + THROTTLE.windowS * 1000 - now.getTime()) / 1000));
    throw tooMany(retry, `Too many failed sign-ins. Wait ${Math.ceil(retry / 60)} minute(s) and try again, or reset your password.`);
  }
  return ids;
}

/** A successful sign-in: its own attempt rows and the account's earlier failures are forgotten. */
export async function endAttemptWithSuccess(em: EntityManager, email: string, ids: string[]): Promise<void> {
  await em.nativeDelete(LoginAttemptSchema, { id: { $in: ids } });
  await clearFailures(em, email);
}

export async function clearFailures(em: EntityManager, email: string): Promise<void> {
  await em.nativeDelete(LoginAttemptSchema, { key: `email:${email}` });
}
