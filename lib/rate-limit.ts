import type { EntityManager } from '@mikro-orm/postgresql';
import { RateLimiterPostgres, RateLimiterRes } from 'rate-limiter-flexible';
import { tooMany } from '@/lib/http/errors';

/**
 * Request limits counted in PostgreSQL with rate-limiter-flexible's `RateLimiterPostgres`, so every web process
 * shares the same counts. One row per key in `rate_limits` (made by a migration, hence `tableCreated`):
 * points used and the window's end (epoch ms); an atomic upsert counts, and a window starts at the key's first
 * request after the previous one ended (fixed window per key). Expired rows are deleted by the worker's
 * housekeeping (`pruneRateLimits`), not by a timer in each web process.
 */
export const RATE_LIMIT_TABLE = 'rate_limits';

export interface LimitSpec {
  /** Names the limit; part of each row's key. */
  name: string;
  /** Requests allowed per window. */
  points: number;
  /** Window [s]. */
  durationS: number;
}

type Knex = ReturnType<EntityManager['getKnex']>;
const limiters = new WeakMap<Knex, Map<string, RateLimiterPostgres>>();

/** The limiter for a spec over the ORM's own connection pool (one per pool and spec). */
export function limiterFor(em: EntityManager, spec: LimitSpec): RateLimiterPostgres {
  const knex = em.getKnex();
  let byKey = limiters.get(knex);
  if (!byKey) limiters.set(knex, (byKey = new Map()));
  const id = `${spec.name}/${spec.points}/${spec.durationS}`;
  let limiter = byKey.get(id);
  if (!limiter) {
    limiter = new RateLimiterPostgres({
      storeClient: knex,
      storeType: 'knex',
      tableName: RATE_LIMIT_TABLE,
      tableCreated: true,
      clearExpiredByTimeout: false,
      keyPrefix: spec.name,
      points: spec.points,
      duration: spec.durationS,
    });
    byKey.set(id, limiter);
  }
  return limiter;
}

/**
 * Counts one request for `key`; beyond the limit throws 429 with Retry-After [s] (the time until the window
 * ends, at least 1) and the message `message(retryAfterS)`.
 */
export async function consumeOrThrow(em: EntityManager, spec: LimitSpec, key: string, message: (retryAfterS: number) => string): Promise<void> {
  try {
    await limiterFor(em, spec).consume(key);
  } catch (e) {
    if (!(e instanceof RateLimiterRes)) throw e; // the store failed: not a limit
    const retryAfterS = Math.max(1, Math.ceil(e.msBeforeNext / 1000));
    throw tooMany(retryAfterS, message(retryAfterS));
  }
}

/** Deletes rows whose window ended more than `olderThanMs` ago; returns how many. */
export async function pruneRateLimits(em: EntityManager, olderThanMs = 3_600_000, nowMs = Date.now()): Promise<number> {
  const r = await em.execute<{ key: string }[]>(`delete from ${RATE_LIMIT_TABLE} where expire < ? returning key`, [nowMs - olderThanMs]);
  return r.length;
}
