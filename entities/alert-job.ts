import { EntitySchema } from '@mikro-orm/core';
import { baseProperties, type Base } from './base';
import type { Kitchen } from './kitchen';

export const ALERT_KINDS = ['ready', 'store-low', 'smoke-point', 'skipped'] as const;
export type AlertKind = (typeof ALERT_KINDS)[number];
export const ALERT_STATES = ['scheduled', 'sent', 'cancelled'] as const;
export type AlertState = (typeof ALERT_STATES)[number];

/**
 * One alert of a day and the pg-boss job that will send it. A ready alert per slot of the published
 * plan; lead alerts when the store falls behind or nears the smoke point. Moving or cancelling the
 * alert cancels its job (the job id is kept here).
 */
export interface AlertJob extends Base {
  kitchen: Kitchen;
  date: string;
  planId: string;
  kind: AlertKind;
  /** One row per alert, e.g. "ready:<planId>:<batchId>", "smoke-point:<kitchenId>:<date>:<cookerId>". */
  dedupeKey: string;
  batchId: string | null;
  cookerId: string | null;
  /** When it is due [domain time] and the job sending it. */
  fireAt: Date;
  jobId: string | null;
  state: AlertState;
  /** Values the message is worded from (dish, temperatures, …). */
  params: Record<string, string | number>;
}

export const AlertJobSchema = new EntitySchema<AlertJob>({
  name: 'AlertJob',
  tableName: 'alert_jobs',
  properties: {
    ...baseProperties,
    kitchen: { kind: 'm:1', entity: 'Kitchen', deleteRule: 'cascade' },
    date: { type: 'string', length: 10 },
    planId: { type: 'uuid' },
    kind: { type: 'string', length: 16 },
    dedupeKey: { type: 'string', length: 200, unique: true },
    batchId: { type: 'string', length: 64, nullable: true },
    cookerId: { type: 'uuid', nullable: true },
    fireAt: { type: 'Date', columnType: 'timestamptz' },
    jobId: { type: 'uuid', nullable: true },
    state: { type: 'string', length: 16 },
    params: { type: 'json' },
  },
  indexes: [{ properties: ['kitchen', 'date'] }],
});
