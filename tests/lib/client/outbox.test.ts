/**
 * The outbox's retry timing (lib/client/outbox.ts): exponential back-off with equal jitter after failed flushes,
 * at once on a sign that the network works, and no timer once a flush got through.
 * Back-off with "equal jitter": M. Brooker, "Exponential Backoff And Jitter", AWS Architecture Blog, 2015
 * (delay = base/2 + random(0, base/2), base = min(cap, first · 2^(n−1))).
 */
import { afterEach, beforeEach, describe, expect, it, vi } from 'vitest';
import { RETRY, retryDelayMs, retrySchedule, type FlushResult } from '@/lib/client/outbox';

describe('retryDelayMs', () => {
  it('doubles from 2 s to the 60 s cap, between half and all of the base', () => {
    const bases = [2_000, 4_000, 8_000, 16_000, 32_000, 60_000, 60_000];
    bases.forEach((base, i) => {
      expect(retryDelayMs(i + 1, () => 0)).toBe(base / 2);
      expect(retryDelayMs(i + 1, () => 0.999999)).toBeCloseTo(base, -1); // within 5 ms
    });
    expect(retryDelayMs(50, () => 0.5)).toBe(0.75 * RETRY.maxMs);
  });
});

describe('retrySchedule', () => {
  beforeEach(() => vi.useFakeTimers());
  afterEach(() => vi.useRealTimers());

  const OFFLINE: FlushResult = { sent: 0, stopped: 'offline' };
  const SENT: FlushResult = { sent: 1, stopped: null };

  /** A page whose flushes fail until `online` is set; each result comes back through noteResult as in the page. */
  function page(random = () => 0) {
    const state = { online: false, runs: [] as number[] };
    const s = retrySchedule(
      async () => {
        state.runs.push(Date.now());
        const r = state.online ? SENT : OFFLINE;
        s.noteResult(r);
        return r;
      },
      { setTimer: (fn, ms) => setTimeout(fn, ms), clearTimer: (h) => clearTimeout(h as ReturnType<typeof setTimeout>), random },
    );
    return { s, state };
  }

  it('retries on a timer with growing delays, without any online event, until a flush gets through', async () => {
    const { s, state } = page();
    const t0 = Date.now();
    s.noteResult(OFFLINE); // the cook's own send failed
    await vi.advanceTimersByTimeAsync(1_000); // first retry after 2 s / 2
    await vi.advanceTimersByTimeAsync(2_000); // then 4 s / 2
    await vi.advanceTimersByTimeAsync(4_000); // then 8 s / 2
    expect(state.runs.map((t) => t - t0)).toEqual([1_000, 3_000, 7_000]);
    state.online = true; // out of the tunnel, and no `online` event
    await vi.advanceTimersByTimeAsync(8_000);
    expect(state.runs).toHaveLength(4);
    expect(s.failures).toBe(0);
    await vi.advanceTimersByTimeAsync(10 * RETRY.maxMs);
    expect(state.runs).toHaveLength(4); // nothing left to send: no timer
  });

  it('a successful request elsewhere retries at once instead of waiting for the timer', async () => {
    const { s, state } = page(() => 0.999);
    for (let i = 0; i < 6; i++) s.noteResult(OFFLINE); // long offline: the next try is about a minute away
    state.online = true;
    s.networkOk();
    await vi.advanceTimersByTimeAsync(0);
    expect(state.runs).toHaveLength(1);
    expect(s.failures).toBe(0);
  });

  it('no retry without a failure, after a sign-out, or once stopped', async () => {
    const { s, state } = page();
    s.networkOk();
    s.noteResult({ sent: 0, stopped: 'signed-out' });
    await vi.advanceTimersByTimeAsync(10 * RETRY.maxMs);
    expect(state.runs).toHaveLength(0);
    s.noteResult({ sent: 0, stopped: 'server' });
    s.stop();
    await vi.advanceTimersByTimeAsync(10 * RETRY.maxMs);
    expect(state.runs).toHaveLength(0);
  });
});
