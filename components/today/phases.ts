import type { TodaySlot } from '@/lib/cooks/today';
import type { OutboxEntry } from '@/lib/client/outbox';
import { slotState, type SlotState } from '@/lib/day/slot-state';
import type { SafetyNote } from '@/lib/safety/notes';

/** A slot as the phone shows it: the server's status, overlaid with check-ins still waiting in the outbox. */
export type ShownSlot = TodaySlot & { pending: boolean };

/** Applies check-ins not yet sent (the cook's own taps) on top of what the server said. */
export function withPending(slots: TodaySlot[], outbox: OutboxEntry[]): ShownSlot[] {
  return slots.map((s) => {
    const mine = outbox.filter((e) => e.kind === 'check-in' && e.state === 'pending' && e.body.batchId === s.batchId);
    let shown: ShownSlot = { ...s, pending: mine.length > 0 };
    for (const e of mine) {
      const at = typeof e.body.at === 'string' ? Date.parse(e.body.at) : e.createdAt;
      if (e.body.kind === 'skipped') shown = { ...shown, status: 'skipped', skippedAt: at };
      else if (e.body.kind === 'done' && shown.status !== 'skipped') shown = { ...shown, status: 'done', doneAt: at };
      else if (e.body.kind === 'started' && shown.status === 'planned') {
        // As the server does without a reading: the planned heat-up time from the real start.
        const shift = shown.readySource === 'plan' ? at - shown.startMs : 0;
        shown = { ...shown, status: 'started', startedAt: at, startMs: at, readyMs: shown.readyMs === null ? null : shown.readyMs + shift, doneMs: shown.doneMs === null ? null : shown.doneMs + shift };
      }
    }
    return shown;
  });
}

/** The slot's state on this phone's clock (the same rule as the server's, lib/day/slot-state.ts). */
export function stateAt(s: ShownSlot, nowMs: number): SlotState {
  if (s.fixed && s.status === 'planned') return 'cooking';
  const at = (ms: number | null) => ms ?? nowMs;
  const marks = s.status === 'skipped' ? { skippedMs: at(s.skippedAt) } : s.status === 'done' ? { doneMs: at(s.doneAt) } : s.status === 'started' ? { startedMs: at(s.startedAt) } : undefined;
  return slotState({ startMs: s.plannedStartMs, readyMs: s.readyMs, doneMs: s.doneMs, serveByMs: s.serveByMs }, marks, nowMs);
}

/**
 * Splits a cooker's slots for the phone by their state at nowMs: what needs the cook now (due, late,
 * cooking, ready, missed), the next planned one (and those within 15 min of it), the rest of the day,
 * and those finished (done or skipped).
 */
export function phases(slots: ShownSlot[], nowMs: number) {
  const withState = slots.map((s) => ({ ...s, state: stateAt(s, nowMs) }));
  const finished = withState.filter((s) => s.state === 'done' || s.state === 'skipped');
  const current = withState.filter((s) => s.state === 'due' || s.state === 'late' || s.state === 'cooking' || s.state === 'ready' || s.state === 'missed').sort((a, b) => a.startMs - b.startMs);
  const rest = withState.filter((s) => s.state === 'planned').sort((a, b) => a.startMs - b.startMs);
  // "Next" is everything due at about the same time as the first (two pots going on together).
  const first = rest[0]?.startMs ?? Infinity;
  const next = rest.filter((s) => s.startMs <= first + 15 * 60_000);
  return { current, next, later: rest.filter((s) => !next.includes(s)), finished };
}

/**
 * Safety notes said once where they apply: those every slot of a cooker shares (the store's cautions,
 * the reminders) go at the top of the cooker; each slot keeps only what is its own (its dish's core
 * temperature, frying, steam).
 */
export function shareNotes(slots: readonly { safety: SafetyNote[] }[]): { shared: SafetyNote[]; own: (s: { safety: SafetyNote[] }) => SafetyNote[] } {
  const key = (n: SafetyNote) => `${n.code}|${JSON.stringify(n.params ?? {})}`;
  const first = slots[0]?.safety ?? [];
  const shared = slots.length ? first.filter((n) => slots.every((s) => s.safety.some((m) => key(m) === key(n)))) : [];
  const sharedKeys = new Set(shared.map(key));
  return { shared, own: (s) => s.safety.filter((n) => !sharedKeys.has(key(n))) };
}

/** "12 min" / "1 h 05 min" until an instant (0 when past). */
export function duration(ms: number): string {
  const min = Math.max(0, Math.round(ms / 60_000));
  if (min < 60) return `${min} min`;
  return `${Math.floor(min / 60)} h ${String(min % 60).padStart(2, '0')} min`;
}
