/**
 * What a solved plan stores beside its result (lib/plans/views.ts): batch numbers in cooking order
 * (regression: "3/3 at 06:15, 1/3 at 10:15"), and the stored plan records refusing a row that does
 * not match their schema with a clear message (entities/plan-records.ts).
 */
import { describe, expect, it } from 'vitest';
import { numberInCookingOrder } from '@/lib/plans/views';
import { PlanRecordError, storedResultSchema } from '@/lib/plan-records';

describe('numberInCookingOrder', () => {
  it('numbers the batches of one line by start time; backup batches come last in menu order', () => {
    const b = (id: string, index: number) => ({ id, lineId: 'stew', index, of: 4 });
    const batches = [b('s1', 1), b('s2', 2), b('s3', 3), b('s4', 4)];
    const slots = [
      { batchId: 's3', startMs: 6 },
      { batchId: 's1', startMs: 10 },
      { batchId: 's2', startMs: 8 },
    ];
    const out = numberInCookingOrder(batches, { slots: slots.map((s) => ({ ...s, cookerId: 'c', potId: 'p', readyMs: 0, doneMs: 0, predictedStoreTempAtStartC: null, predictedPotMaxC: null })) });
    expect(out.map((x) => [x.id, x.index])).toEqual([
      ['s1', 3],
      ['s2', 2],
      ['s3', 1],
      ['s4', 4],
    ]);
  });
});

describe('stored plan records', () => {
  it('a result that does not match is named by its field, not cast', () => {
    const r = storedResultSchema.safeParse({ status: 'optimal', slots: [{ batchId: 'a' }] });
    expect(r.success).toBe(false);
    const e = new PlanRecordError('result', r.success ? [] : r.error.issues);
    expect(e.message).toMatch(/^The stored plan's result does not match its schema \(slots\.0\.cookerId: /);
  });
});
