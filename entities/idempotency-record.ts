import { EntitySchema } from '@mikro-orm/core';
import { baseProperties, type Base } from './base';

/**
 * The first answer to a write sent with an idempotency key, kept so that a retry with the same key
 * (a phone re-sending its offline queue, a sensor repeating a batch) gets that answer back instead
 * of writing twice. Unique per kitchen and key.
 */
export interface IdempotencyRecord extends Base {
  kitchenId: string;
  key: string;
  /** What the key was used for, e.g. "check-in", "reading", "sensor-readings". */
  scope: string;
  /** SHA-256 of the canonical request, to refuse a key reused for a different request. */
  requestHash: string;
  status: number;
  response: unknown;
}

export const IdempotencyRecordSchema = new EntitySchema<IdempotencyRecord>({
  name: 'IdempotencyRecord',
  tableName: 'idempotency_records',
  properties: {
    ...baseProperties,
    kitchenId: { type: 'uuid' },
    key: { type: 'string', length: 64 },
    scope: { type: 'string', length: 32 },
    requestHash: { type: 'string', length: 64 },
    status: { type: 'integer' },
    response: { type: 'json' },
  },
  uniques: [{ properties: ['kitchenId', 'key'] }],
});
