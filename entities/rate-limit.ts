import { EntitySchema } from '@mikro-orm/core';

/**
 * A request counter of rate-limiter-flexible's PostgreSQL store (`lib/rate-limit.ts`), in the columns that store
 * reads and writes: never loaded through the ORM, listed so the schema tools know the table.
 */
export interface RateLimit {
  /** "<limit name>:<key>", e.g. "signin-account:<e-mail>" */
  key: string;
  /** requests counted in the window */
  points: number;
  /** end of the window [epoch ms] */
  expire: string | null;
}

export const RateLimitSchema = new EntitySchema<RateLimit>({
  name: 'RateLimit',
  tableName: 'rate_limits',
  properties: {
    key: { type: 'text', primary: true },
    points: { type: 'integer', default: 0 },
    expire: { type: 'bigint', nullable: true, index: true },
  },
});
