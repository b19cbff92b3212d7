/**
 * POST /api/v1/password-resets answers before it looks at the address: for a registered and an unknown address
 * alike, the look-up, the token and the mail run in Next's `after()` (after the response is sent), so the
 * answer's timing cannot tell them apart. Checked on the code path, not with a stopwatch: a shared machine
 * makes wall-clock medians flaky. The timing itself is printed by tests/bench/password-reset.bench.ts.
 */
import { beforeEach, describe, expect, it, vi } from 'vitest';

const deferred: (() => Promise<unknown> | unknown)[] = [];
const requestPasswordReset = vi.fn(async (_em: unknown, _email: string) => undefined);

vi.mock('next/server', async (importOriginal) => ({
  ...(await importOriginal<typeof import('next/server')>()),
  after: (task: () => Promise<unknown> | unknown) => void deferred.push(task),
}));
vi.mock('@/lib/accounts', () => ({ requestPasswordReset }));
vi.mock('@/lib/db', () => ({ getEm: async () => ({ fake: 'em' }) }));

const { POST } = await import('@/app/api/v1/password-resets/route');
const { NextRequest } = await import('next/server');

const post = (email: string) =>
  POST(new NextRequest('http://127.0.0.1/api/v1/password-resets', { method: 'POST', headers: { 'content-type': 'application/json' }, body: JSON.stringify({ email }) }), {
    params: Promise.resolve({}),
  } as never);

beforeEach(() => {
  deferred.length = 0;
  requestPasswordReset.mockClear();
});

describe('POST /api/v1/password-resets', () => {
  it.each(['cook.a@example.org', 'nobody.here@example.org'])('answers 202 for %s before any look-up, then does the work after the answer', async (email) => {
    const res = await post(email);
    expect(res.status).toBe(202);
    expect(await res.json()).toEqual({ message: 'If this address has an account, a reset link is on its way.' });
    expect(requestPasswordReset).not.toHaveBeenCalled(); // nothing about the address ran before the answer
    expect(deferred).toHaveLength(1);
    await deferred[0]!();
    expect(requestPasswordReset).toHaveBeenCalledTimes(1);
    expect(requestPasswordReset.mock.calls[0]![1]).toBe(email);
  });

  it('a failing reset after the answer is logged, not thrown into the finished response', async () => {
    requestPasswordReset.mockRejectedValueOnce(new Error('smtp down'));
    const log = vi.spyOn(console, 'error').mockImplementation(() => undefined);
    expect((await post('cook.a@example.org')).status).toBe(202);
    await expect(deferred[0]!()).resolves.toBeUndefined();
    expect(log).toHaveBeenCalledWith('[password-reset] could not start a reset', expect.any(Error));
    log.mockRestore();
  });
});
