import { EntitySchema } from '@mikro-orm/core';
import { baseProperties, type Base } from './base';
import type { Kitchen } from './kitchen';
import type { User } from './user';

export const PLAN_STATUSES = ['draft', 'published', 'superseded'] as const;
export type PlanStatus = (typeof PLAN_STATUSES)[number];

/**
 * A kitchen's plan for a day. Drafts change (slot moves, re-plans); publishing freezes a numbered
 * version: a published plan is never edited, a new one supersedes it.
 */
export interface Plan extends Base {
  kitchen: Kitchen;
  date: string;
  /** Draft number while a draft; the published version number once published. */
  version: number;
  status: PlanStatus;
  createdBy: User | null;
  publishedAt: Date | null;
  publishedBy: User | null;
  /** Where the weather came from when it was solved (forecast, clear-sky, …). */
  weatherSource: string;
  /** The batches as planned (dish, servings, temperatures, times), JSON. */
  batches: unknown;
  /** The planner's result (slots, backup, bound, gap, status, times), JSON. */
  result: unknown;
  /** Backup fuel report, JSON. */
  fuel: unknown;
  /** Cookers as they were (id, name, pots) and the store trajectory per cooker for the chart, JSON. */
  cookers: unknown;
}

export const PlanSchema = new EntitySchema<Plan>({
  name: 'Plan',
  tableName: 'plans',
  properties: {
    ...baseProperties,
    kitchen: { kind: 'm:1', entity: 'Kitchen', deleteRule: 'cascade' },
    date: { type: 'string', length: 10 },
    version: { type: 'integer' },
    status: { type: 'string', length: 16 },
    createdBy: { kind: 'm:1', entity: 'User', nullable: true, deleteRule: 'set null' },
    publishedAt: { type: 'Date', columnType: 'timestamptz', nullable: true },
    publishedBy: { kind: 'm:1', entity: 'User', nullable: true, deleteRule: 'set null' },
    weatherSource: { type: 'string', length: 32 },
    batches: { type: 'json' },
    result: { type: 'json' },
    fuel: { type: 'json' },
    cookers: { type: 'json' },
  },
  indexes: [{ properties: ['kitchen', 'date', 'status'] }],
});
