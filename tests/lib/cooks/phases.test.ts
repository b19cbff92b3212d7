/** The Today page's grouping of a cooker's slots and the outbox overlay (components/today/phases.ts). */
import { describe, expect, it } from 'vitest';
import { duration, phases, withPending } from '@/components/today/phases';
import type { TodaySlot } from '@/lib/cooks/today';
import type { OutboxEntry } from '@/lib/client/outbox';

const H = 3_600_000;
const slot = (batchId: string, startH: number, over: Partial<TodaySlot> = {}): TodaySlot => ({
  batchId, cookerId: 'c1', dishName: 'Rice', index: 1, of: 1, servings: 100, method: 'boil', potId: 'p1', potName: 'Pot 1',
  startMs: startH * H, plannedStartMs: startH * H, readyMs: startH * H + 0.5 * H, doneMs: startH * H + H, plannedReadyMs: startH * H + 0.5 * H, readySource: 'plan',
  serveByMs: startH * H + 2 * H, minTempC: 90, safeCoreTempC: 74, storeAtStartC: 150, potMaxC: 96, status: 'planned', state: 'planned',
  startedAt: null, doneAt: null, skippedAt: null, fixed: false, safety: [], ...over,
});
const entry = (batchId: string, kind: string, state: OutboxEntry['state'] = 'pending'): OutboxEntry => ({
  id: `${batchId}-${kind}`, userId: 'u', kitchenId: 'k', kind: 'check-in', url: '/x', body: { batchId, kind, at: new Date(9 * H).toISOString() }, createdAt: 9 * H, attempts: 0, state,
});

describe('phases', () => {
  it('now: started or due on the store; next: the first due (and those within 15 min); later: the rest; finished: done or skipped', () => {
    const slots = [slot('a', 7), slot('b', 9), slot('c', 9.2), slot('d', 12), slot('e', 6, { status: 'done' }), slot('f', 10, { status: 'skipped' })].map((s) => ({ ...s, pending: false }));
    const p = phases(slots, 7.5 * H);
    expect(p.current.map((s) => s.batchId)).toEqual(['a']);
    expect(p.next.map((s) => s.batchId)).toEqual(['b', 'c']);
    expect(p.later.map((s) => s.batchId)).toEqual(['d']);
    expect(p.finished.map((s) => s.batchId).sort()).toEqual(['e', 'f']);
  });

  it('check-ins waiting in the outbox show at once; rejected ones do not', () => {
    const shown = withPending([slot('a', 7), slot('b', 9), slot('c', 10)], [entry('a', 'started'), entry('b', 'skipped'), entry('c', 'done', 'rejected')]);
    expect(shown.map((s) => [s.status, s.pending])).toEqual([['started', true], ['skipped', true], ['planned', false]]);
    expect(shown[0]!.startMs).toBe(9 * H);
  });

  it('durations read as minutes, then hours and minutes', () => {
    expect(duration(12 * 60_000)).toBe('12 min');
    expect(duration(65 * 60_000)).toBe('1 h 05 min');
    expect(duration(-5)).toBe('0 min');
  });
});
