/**
 * The planner thread (lib/planner-thread/index.ts): plans made on a worker thread are the planner's own
 * plans, refusals keep their kind, several problems queue without mixing, and the calling thread's
 * event loop keeps running while a plan is made.
 */
import { mkdirSync, mkdtempSync, rmSync } from 'node:fs';
import path from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { planDay, warmPlanner } from '@/lib/planner';
import { planDayOffThread, plannerThreadEnabled, stopPlannerThread } from '@/lib/planner-thread';
// @ts-expect-error — a plain ES module script without type declarations.
import { bundlePlannerThread } from '../../../scripts/build-planner-thread.mjs';
import { makeInstance, makeSmall } from '../planner/fixtures';

let dir = '';
let file = '';
const before = process.env.PLANNER_THREAD;

beforeAll(async () => {
  // Inside the project, so that the bundle finds HiGHS in node_modules as the one in .next does.
  const cache = path.resolve('node_modules/.cache');
  mkdirSync(cache, { recursive: true });
  dir = mkdtempSync(path.join(cache, 'hc-thread-'));
  file = await (bundlePlannerThread as (out: string) => Promise<string>)(path.join(dir, 'planner-thread.mjs'));
  process.env.PLANNER_THREAD = '1';
  // As in plan.test.ts: HiGHS loaded and the code compiled, so the exact enumeration of the small
  // instance finishes inside its time share here as it does in the (self-warming) thread.
  await warmPlanner();
}, 60_000);

afterAll(async () => {
  await stopPlannerThread();
  if (before === undefined) delete process.env.PLANNER_THREAD;
  else process.env.PLANNER_THREAD = before;
  rmSync(dir, { recursive: true, force: true });
});

describe('planner thread', () => {
  it('is used only with its bundle, and PLANNER_THREAD=0 turns it off', () => {
    expect(plannerThreadEnabled(file)).toBe(true);
    expect(plannerThreadEnabled(path.join(dir, 'missing.mjs'))).toBe(false);
    process.env.PLANNER_THREAD = '0';
    try {
      expect(plannerThreadEnabled(file)).toBe(false);
    } finally {
      process.env.PLANNER_THREAD = '1';
    }
  });

  it('gives the same optimum as planDay here on a small instance the planner solves exactly', async () => {
    // A generous limit (as in plan.test.ts), so the exact enumeration is never cut by the clock.
    const p = { ...makeSmall(3), timeLimitS: 30 };
    const here = await planDay(p);
    const there = await planDayOffThread(p, file);
    expect(here.status).toBe('optimal');
    expect(there.status).toBe('optimal');
    expect(there.servingsOnSun).toBe(here.servingsOnSun);
    expect(there.upperBound).toBe(here.upperBound);
    expect(there.backup.map((b) => b.batchId).sort()).toEqual(here.backup.map((b) => b.batchId).sort());
  }, 60_000);

  it('a refused problem stays a RangeError with the planner’s message', async () => {
    const err = await planDayOffThread({ ...makeSmall(1), timeLimitS: -1 }, file).catch((e: unknown) => e);
    expect(err).toBeInstanceOf(RangeError);
    expect((err as Error).message).toMatch(/timeLimitS/);
  }, 60_000);

  it('problems posted together to a fresh thread each get their own plan and their whole time limit', async () => {
    // A fresh thread is still warming up when both arrive: they must still run one after the other.
    await stopPlannerThread();
    // 12 × 60 instances: their plans always run to the time limit (never at the bound).
    const a = makeInstance(12, 60, 3, 1);
    const b = makeInstance(12, 60, 4, 1);
    b.batches = b.batches.map((x) => ({ ...x, id: `other-${x.id}` }));
    const [ra, rb] = await Promise.all([planDayOffThread(a, file), planDayOffThread(b, file)]);
    const ids = (r: typeof ra) => [...r.slots.map((s) => s.batchId), ...r.backup.map((x) => x.batchId)].sort();
    expect(ids(ra)).toEqual(a.batches.map((x) => x.id).sort());
    expect(ids(rb)).toEqual(b.batches.map((x) => x.id).sort());
    // Had the second plan shared the first one's second, its search would have had no time left.
    for (const r of [ra, rb]) {
      expect(r.iterations).toBeGreaterThan(10);
      expect(r.solveTimeMs).toBeGreaterThan(700);
    }
  }, 60_000);

  it('the calling thread keeps answering while a plan is made', async () => {
    let ticks = 0;
    const timer = setInterval(() => ticks++, 20);
    try {
      const t0 = performance.now();
      await planDayOffThread(makeInstance(6, 30, 2, 1.5), file);
      const ms = performance.now() - t0;
      // Inline, the search loop would hold the event loop for the whole 1.5 s (hardly a tick);
      // here a 20-ms timer fires through the plan — at least a third of the ticks it could.
      expect(ms).toBeGreaterThan(1000);
      expect(ticks).toBeGreaterThan(ms / 20 / 3);
    } finally {
      clearInterval(timer);
    }
  }, 60_000);
});
