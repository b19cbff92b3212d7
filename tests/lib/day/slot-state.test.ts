/**
 * A slot's state on the clock (lib/day/slot-state.ts). The windows are the product's own rules
 * (common practice, no source): due from 10 min before the start, late 15 min after it without a
 * "started" mark, missed once the plan's cooking time from now no longer ends by serve-by.
 */
import { describe, expect, it } from 'vitest';
import { DUE_BEFORE_MS, LATE_AFTER_MS, markStatus, slotState } from '@/lib/day/slot-state';

const MIN = 60_000;
const slot = { startMs: 600 * MIN, readyMs: 660 * MIN, doneMs: 690 * MIN, serveByMs: 780 * MIN };

describe('slotState', () => {
  it('walks planned → due → late → missed for a pot nobody put on', () => {
    expect(slotState(slot, undefined, slot.startMs - DUE_BEFORE_MS - MIN)).toBe('planned');
    expect(slotState(slot, undefined, slot.startMs - DUE_BEFORE_MS)).toBe('due');
    expect(slotState(slot, undefined, slot.startMs + LATE_AFTER_MS - MIN)).toBe('due');
    expect(slotState(slot, undefined, slot.startMs + LATE_AFTER_MS)).toBe('late');
    // 90 min of cooking from now must end by serve-by (13:00): from 11:30 on it cannot.
    expect(slotState(slot, undefined, 690 * MIN)).toBe('late');
    expect(slotState(slot, undefined, 691 * MIN)).toBe('missed');
  });

  it('a started pot is cooking until its ready time, then hot enough; it is never "hot enough" unstarted', () => {
    const marks = { startedMs: slot.startMs };
    expect(slotState(slot, marks, slot.readyMs - MIN)).toBe('cooking');
    expect(slotState(slot, marks, slot.readyMs)).toBe('ready');
    expect(slotState(slot, undefined, slot.readyMs)).not.toBe('ready');
    expect(slotState({ ...slot, readyMs: null }, marks, 900 * MIN)).toBe('cooking');
  });

  it('done and skipped marks win over the clock; skipped over done', () => {
    expect(slotState(slot, { startedMs: 1, doneMs: 2 }, 0)).toBe('done');
    expect(slotState(slot, { doneMs: 2, skippedMs: 3 }, 0)).toBe('skipped');
    expect(markStatus({ startedMs: 1 })).toBe('started');
    expect(markStatus(undefined)).toBe('planned');
  });
});
