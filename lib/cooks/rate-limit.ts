import type { EntityManager } from '@mikro-orm/postgresql';
import { consumeOrThrow } from '@/lib/rate-limit';

/**
 * Sensor requests per API key, counted in PostgreSQL (`lib/rate-limit.ts`): at most `limit` per window of
 * `windowS` seconds from the key's first request; throws 429 with Retry-After beyond it.
 */
export async function enforceRateLimit(em: EntityManager, key: string, limit: number, windowS: number): Promise<void> {
  await consumeOrThrow(em, { name: 'sensor', points: limit, durationS: windowS }, key, (retryAfterS) => `More than ${limit} requests in ${windowS} s with this key; try again in ${retryAfterS} s.`);
}
