/** Day planner for stored-heat solar cookers: greedy + local search + HiGHS set-packing master, full re-check. */
export { planDay, warmPlanner } from './plan';
export { checkSlotMove } from './check-slot';
export type * from './types';
