import type { EntityManager } from '@mikro-orm/postgresql';
import { LoginAttemptSchema } from '@/entities';
import { tooMany } from '@/lib/http/errors';

/** Failed sign-ins allowed per window before a 429 (OWASP Authentication Cheat Sheet: throttle per account and per source). */
export const THROTTLE = { windowS: 15 * 60, perAccount: 5, perAddress: 30 } as const;

const keys = (email: string, ip: string) => ({ account: `email:${email}`, address: `ip:${ip}` });

/** Throws 429 with Retry-After when the account or the address has failed too often. */
export async function assertNotThrottled(em: EntityManager, email: string, ip: string, now = new Date()): Promise<void> {
  const since = new Date(now.getTime() - THROTTLE.windowS * 1000);
  const k = keys(email, ip);
  const [account, address] = await Promise.all([
    em.find(LoginAttemptSchema, { key: k.account, createdAt: { $gt: since } }, { orderBy: { createdAt: 'asc' }, fields: ['createdAt'] }),
    em.count(LoginAttemptSchema, { key: k.address, createdAt: { $gt: since } }),
  ]);
  if (account.length >= THROTTLE.perAccount || address >= THROTTLE.perAddress) {
    const oldest = account[0]?.createdAt ?? now;
    const retry = Math.max(1, Math.ceil((oldest.getTime() + THROTTLE.windowS * 1000 - now.getTime()) / 1000));
    throw tooMany(retry, `Too many failed sign-ins. Wait ${Math.ceil(retry / 60)} minute(s) and try again, or reset your password.`);
  }
}

export async function recordFailure(em: EntityManager, email: string, ip: string): Promise<void> {
  const k = keys(email, ip);
  em.create(LoginAttemptSchema, { key: k.account });
  em.create(LoginAttemptSchema, { key: k.address });
  await em.flush();
}

export async function clearFailures(em: EntityManager, email: string): Promise<void> {
  await em.nativeDelete(LoginAttemptSchema, { key: `email:${email}` });
}
