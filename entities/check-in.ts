import { EntitySchema } from '@mikro-orm/core';
import { baseProperties, type Base } from './base';
import type { Kitchen } from './kitchen';
import type { User } from './user';

import { CHECK_IN_KINDS } from './constants';
export { CHECK_IN_KINDS };
export type CheckInKind = (typeof CHECK_IN_KINDS)[number];

/**
 * A cook's mark on a batch of a published plan: started, done, or skipped (the batch goes to
 * backup fuel). `at` is when the cook tapped it, which may be well before it reached the server
 * when the phone was offline.
 */
export interface CheckIn extends Base {
  kitchen: Kitchen;
  /** The published plan (version) the cook was looking at. */
  planId: string;
  /** Local date of the plan, YYYY-MM-DD. */
  date: string;
  batchId: string;
  cookerId: string | null;
  kind: CheckInKind;
  at: Date;
  user: User | null;
}

export const CheckInSchema = new EntitySchema<CheckIn>({
  name: 'CheckIn',
  tableName: 'check_ins',
  properties: {
    ...baseProperties,
    kitchen: { kind: 'm:1', entity: 'Kitchen', deleteRule: 'cascade' },
    planId: { type: 'uuid' },
    date: { type: 'string', length: 10 },
    batchId: { type: 'string', length: 64 },
    cookerId: { type: 'uuid', nullable: true },
    kind: { type: 'string', length: 16 },
    at: { type: 'Date', columnType: 'timestamptz' },
    user: { kind: 'm:1', entity: 'User', nullable: true, deleteRule: 'set null' },
  },
  indexes: [{ properties: ['kitchen', 'date'] }],
});
