import type { EntityManager } from '@mikro-orm/postgresql';
import { consumeOrThrow, limiterFor, type LimitSpec } from '@/lib/rate-limit';

/** Sign-in attempts allowed per window before a 429 (OWASP Authentication Cheat Sheet: throttle per account and per source). */
export const THROTTLE = { windowS: 15 * 60, perAccount: 5, perAddress: 30 } as const;

const ACCOUNT: LimitSpec = { name: 'signin-account', points: THROTTLE.perAccount, durationS: THROTTLE.windowS };
const ADDRESS: LimitSpec = { name: 'signin-address', points: THROTTLE.perAddress, durationS: THROTTLE.windowS };

const message = (retryS: number) => `Too many failed sign-ins. Wait ${Math.ceil(retryS / 60)} minute(s) and try again, or reset your password.`;

/** What a sign-in counted, handed back to `endAttemptWithSuccess`. */
export interface Attempt {
  address: string | null;
}

/**
 * Counts this attempt FIRST, for the account and the address alike (one atomic upsert per key), then compares, so a burst of parallel requests cannot
 * all pass a count taken before any of them was written. Throws 429 with Retry-After beyond the limits.
 * Without a trusted client address (ip null) only the per-account limit applies.
 */
export async function beginAttempt(em: EntityManager, email: string, ip: string | null): Promise<Attempt> {
  const counted = await Promise.allSettled([consumeOrThrow(em, ACCOUNT, email, message), ip ? consumeOrThrow(em, ADDRESS, ip, message) : null]);
  for (const c of counted) if (c.status === 'rejected') throw c.reason;
  return { address: ip };
}

/** A successful sign-in: it does not count against its address, and the account's earlier failures are forgotten. */
export async function endAttemptWithSuccess(em: EntityManager, email: string, attempt: Attempt): Promise<void> {
  if (attempt.address) await limiterFor(em, ADDRESS).reward(attempt.address, 1);
  await clearFailures(em, email);
}

/** Forgets an account's failed sign-ins (after a sign-in or a password reset). */
export async function clearFailures(em: EntityManager, email: string): Promise<void> {
  await limiterFor(em, ACCOUNT).delete(email);
}
