/**
 * Where a slot of the day stands at a given moment, from the plan's times, the cooks' marks and the
 * clock. Tiny and dependency-free: the server's read model and the cook's phone (which ticks on its
 * own between refreshes) use the same rule.
 *
 * The windows are kitchen practice, no source: a pot is "due" from 10 minutes before its start, and
 * "late" once it is 15 minutes past its start without a "started" mark; a batch is "missed" once it can
 * no longer be done by its serve-by time even if it went on now (the plan's cooking time from now).
 */

/** What the cooks marked, per batch [epoch ms]. */
export interface CookMarks {
  startedMs?: number;
  doneMs?: number;
  skippedMs?: number;
}

export type SlotState = 'planned' | 'due' | 'late' | 'missed' | 'cooking' | 'ready' | 'done' | 'skipped';

/** A pot counts as due from this long before its planned start [ms]. */
export const DUE_BEFORE_MS = 10 * 60_000;
/** A pot not marked started this long after its planned start is late [ms]. */
export const LATE_AFTER_MS = 15 * 60_000;

export interface SlotTimes {
  /** Planned start [epoch ms]. */
  startMs: number;
  /** When the pot reaches (reached) the dish's minimum [epoch ms]; null when the prediction says it will not. */
  readyMs: number | null;
  /** When the hold completes [epoch ms]; null when it will not before the pot must come off. */
  doneMs: number | null;
  serveByMs: number;
}

/** The marks as a check-in status: the latest kind of mark that counts. */
export function markStatus(m: CookMarks | undefined): 'planned' | 'started' | 'done' | 'skipped' {
  if (m?.skippedMs !== undefined) return 'skipped';
  if (m?.doneMs !== undefined) return 'done';
  if (m?.startedMs !== undefined) return 'started';
  return 'planned';
}

/** The slot's state at nowMs. */
export function slotState(s: SlotTimes, marks: CookMarks | undefined, nowMs: number): SlotState {
  const status = markStatus(marks);
  if (status === 'skipped' || status === 'done') return status;
  if (status === 'started') return s.readyMs !== null && nowMs >= s.readyMs ? 'ready' : 'cooking';
  // Not on the store yet: the plan's cooking time, counted from now, must still end by serve-by.
  const cookingMs = Math.max(0, (s.doneMs ?? s.serveByMs) - s.startMs);
  if (nowMs + cookingMs > s.serveByMs && nowMs > s.startMs) return 'missed';
  if (nowMs >= s.startMs + LATE_AFTER_MS) return 'late';
  if (nowMs >= s.startMs - DUE_BEFORE_MS) return 'due';
  return 'planned';
}
