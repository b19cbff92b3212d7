import { randomUUID } from 'node:crypto';
import type { EntityManager } from '@mikro-orm/postgresql';
import { tooMany } from '@/lib/http/errors';

/**
 * Fixed-window request counting in PostgreSQL (one row per key and window, incremented atomically by
 * an upsert), so every web process shares the same counts. A fixed window lets through at most twice
 * the limit across a window edge; for sensors sending a batch a minute that is good enough.
 */
export async function countRequest(em: EntityManager, key: string, windowS: number, nowMs = Date.now()): Promise<{ count: number; resetMs: number }> {
  const windowMs = windowS * 1000;
  const start = Math.floor(nowMs / windowMs) * windowMs;
  const rows = await em.execute<{ count: number }[]>(
    `insert into rate_counters (id, created_at, updated_at, key, window_start, count) values (?, now(), now(), ?, ?, 1)
     on conflict (key, window_start) do update set count = rate_counters.count + 1, updated_at = now() returning count`,
    [randomUUID(), key, new Date(start)],
  );
  return { count: Number(rows[0]?.count ?? 1), resetMs: start + windowMs };
}

/** Throws 429 with Retry-After once `limit` requests were counted in the current window. */
export async function enforceRateLimit(em: EntityManager, key: string, limit: number, windowS: number, nowMs = Date.now()): Promise<void> {
  const { count, resetMs } = await countRequest(em, key, windowS, nowMs);
  if (count > limit) {
    const retryAfterS = Math.max(1, Math.ceil((resetMs - nowMs) / 1000));
    throw tooMany(retryAfterS, `More than ${limit} requests in ${windowS} s with this key; try again in ${retryAfterS} s.`);
  }
}

/** Drops counters of windows that ended long ago (worker housekeeping). */
export async function pruneRateCounters(em: EntityManager, olderThanMs = 3_600_000, nowMs = Date.now()): Promise<number> {
  const r = await em.execute<{ id: string }[]>(`delete from rate_counters where window_start < ? returning id`, [new Date(nowMs - olderThanMs)]);
  return r.length;
}
