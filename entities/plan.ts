import { EntitySchema } from '@mikro-orm/core';
import { baseProperties, type Base } from './base';
import type { Kitchen } from './kitchen';
import type { User } from './user';
import { planCookerSchema, planFuelSchema, storedBatchSchema, storedResultSchema, type PlanCookerView, type PlanFuelView, type StoredBatch, type StoredResult } from '@/lib/plan-records';
import { planRecordType } from './plan-record-type';

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
  /** The batches as planned (dish, servings, temperatures, times). */
  batches: StoredBatch[];
  /** The planner's result (slots, backup, bound, gap, status, times). */
  result: StoredResult;
  /** Backup fuel report. */
  fuel: PlanFuelView;
  /** Cookers as they were (id, name, pots, medium) and the store trajectory per cooker for the chart. */
  cookers: PlanCookerView[];
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
    // JSON columns parsed with their schema when read (entities/plan-records.ts).
    batches: { type: planRecordType(storedBatchSchema.array(), 'batches') },
    result: { type: planRecordType(storedResultSchema, 'result') },
    fuel: { type: planRecordType(planFuelSchema, 'fuel') },
    cookers: { type: planRecordType(planCookerSchema.array(), 'cookers') },
  },
  indexes: [{ properties: ['kitchen', 'date', 'status'] }],
});
