/**
 * Compile-time checks that what the planner and the fuel estimate return fits the stored plan records
 * (entities/plan-records.ts), so the two cannot drift apart: a field added to the planner's result or a
 * batch without its schema fails `tsc` here.
 */
import type { StoredBatch, StoredResult } from '@/entities';
import type { PlannerBatch, PlannerResult } from '@/lib/planner';

type Assignable<From, To> = [From] extends [To] ? true : false;
const check = <T extends true>(): T => true as T;

/** A planner result is stored as it is. */
export const resultFitsRecord = check<Assignable<PlannerResult, StoredResult>>();
/** A stored batch is a planner batch (it is planned as it is). */
export const batchIsPlannerBatch = check<Assignable<StoredBatch, PlannerBatch>>();
