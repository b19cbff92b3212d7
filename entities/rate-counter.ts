import { EntitySchema } from '@mikro-orm/core';
import { baseProperties, type Base } from './base';

/** Requests counted per key and fixed window (rate limits kept in PostgreSQL, shared by every web process). */
export interface RateCounter extends Base {
  key: string;
  windowStart: Date;
  count: number;
}

export const RateCounterSchema = new EntitySchema<RateCounter>({
  name: 'RateCounter',
  tableName: 'rate_counters',
  properties: {
    ...baseProperties,
    key: { type: 'string', length: 200 },
    windowStart: { type: 'Date', columnType: 'timestamptz' },
    count: { type: 'integer', default: 0 },
  },
  uniques: [{ properties: ['key', 'windowStart'] }],
});
