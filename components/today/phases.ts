import type { TodaySlot } from '@/lib/cooks/today';
import type { OutboxEntry } from '@/lib/client/outbox';

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

/**
 * Splits a cooker's slots for the phone: cooking now (started, or due to be on the store), the next
 * one, the rest of the day, and those finished (done or skipped).
 */
export function phases(slots: ShownSlot[], nowMs: number) {
  const finished = slots.filter((s) => s.status === 'done' || s.status === 'skipped');
  const open = slots.filter((s) => s.status === 'started' || s.status === 'planned').sort((a, b) => a.startMs - b.startMs);
  const current = open.filter((s) => s.status === 'started' || (s.startMs <= nowMs && (s.doneMs ?? s.serveByMs) > nowMs));
  const rest = open.filter((s) => !current.includes(s));
  // "Next" is everything due at about the same time as the first (two pots going on together).
  const first = rest[0]?.startMs ?? Infinity;
  const next = rest.filter((s) => s.startMs <= first + 15 * 60_000);
  return { current, next, later: rest.filter((s) => !next.includes(s)), finished };
}

/** "12 min" / "1 h 05 min" until an instant (0 when past). */
export function duration(ms: number): string {
  const min = Math.max(0, Math.round(ms / 60_000));
  if (min < 60) return `${min} min`;
  return `${Math.floor(min / 60)} h ${String(min % 60).padStart(2, '0')} min`;
}
