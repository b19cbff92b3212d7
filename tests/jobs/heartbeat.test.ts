/**
 * The background-job wiring end to end: pg-boss on the test database, the app's workers
 * registered, one heartbeat job sent and worked to completion.
 */
import type PgBoss from 'pg-boss';
import { afterAll, beforeAll, describe, expect, inject, it } from 'vitest';
import { QUEUES, startBoss } from '../../lib/queues/boss';
import { handleHeartbeat, registerWorkers, type HeartbeatData } from '../../lib/jobs/worker';

let boss: PgBoss;
beforeAll(async () => {
  boss = await startBoss(inject('databaseUrl'));
  await registerWorkers(boss);
});
afterAll(async () => {
  // registerWorkers also installs the 5-minute schedule; leave the test database without it.
  await boss?.unschedule(QUEUES.heartbeat);
  await boss?.stop({ graceful: false, wait: true });
});

/** Polls a job until it reaches a final state (pg-boss workers poll every 2 s by default). */
async function waitForJob(name: string, id: string, timeoutMs = 15_000) {
  const until = Date.now() + timeoutMs;
  for (;;) {
    const job = await boss.getJobById<HeartbeatData>(name, id);
    if (job && ['completed', 'failed', 'cancelled'].includes(job.state)) return job;
    if (Date.now() > until) throw new Error(`job ${id} still ${job?.state ?? 'missing'} after ${timeoutMs} ms`);
    await new Promise((r) => setTimeout(r, 100));
  }
}

describe('heartbeat job', () => {
  it('is worked to completion with a finite, non-negative lag', async () => {
    const sentAt = new Date().toISOString();
    const id = await boss.send(QUEUES.heartbeat, { sentAt } satisfies HeartbeatData);
    expect(id).toEqual(expect.any(String));
    const job = await waitForJob(QUEUES.heartbeat, id!);
    expect(job.state).toBe('completed');
    expect(job.data).toEqual({ sentAt });

    // The handler answers a batch with one result per job; pg-boss stores an array result of a
    // one-job batch wrapped as { value: [...] } (it keeps only objects as they are).
    const output = job.output as { value?: unknown } | null;
    const results = Array.isArray(output?.value) ? (output.value as { lagMs: unknown; receivedAt: unknown }[]) : [output as { lagMs: unknown; receivedAt: unknown }];
    expect(results).toHaveLength(1);
    const { lagMs, receivedAt } = results[0]!;
    expect(typeof lagMs).toBe('number');
    expect(Number.isFinite(lagMs)).toBe(true);
    expect(lagMs as number).toBeGreaterThanOrEqual(0);
    // Worked within the polling timeout above; 15 s is the bound, not a performance claim.
    expect(lagMs as number).toBeLessThan(15_000);
    expect(Date.parse(receivedAt as string)).toBeGreaterThanOrEqual(Date.parse(sentAt));
  });

  it('a scheduled run is timed from its own queue row, not from when the worker saved the schedule', async () => {
    // pg-boss's cron sends each run with the data saved by boss.schedule(), so that data is the same in every
    // run (pg-boss 10 README, "schedule()": "data" is sent with each job). A time in it would be a stale one.
    const schedule = (await boss.getSchedules()).find((x) => x.name === QUEUES.heartbeat);
    expect(schedule).toBeDefined();
    expect((schedule!.data as HeartbeatData | undefined)?.sentAt).toBeUndefined();

    // A run as the cron makes it: the schedule's data, sent now.
    const id = await boss.send(QUEUES.heartbeat, (schedule!.data ?? {}) as object);
    const job = await waitForJob(QUEUES.heartbeat, id!);
    expect(job.state).toBe('completed');
    const output = job.output as { value?: unknown } | null;
    const [result] = (Array.isArray(output?.value) ? output.value : [output]) as { sentAt: string; receivedAt: string; lagMs: number }[];
    expect(result!.sentAt).toBe(job.createdOn.toISOString());
    expect(result!.lagMs).toBe(Date.parse(result!.receivedAt) - job.createdOn.getTime());
    expect(result!.lagMs).toBeGreaterThanOrEqual(0);
    expect(result!.lagMs).toBeLessThan(15_000); // the polling bound above, not a performance claim
  });

  it('lag = clock at work − the creation of the job row, with an injected clock', async () => {
    const createdOn = new Date(Date.UTC(2026, 11, 4, 12, 0, 0));
    const now = createdOn.getTime() + 90_000;
    const job = { id: 'j', name: QUEUES.heartbeat, data: {}, createdOn } as unknown as Parameters<typeof handleHeartbeat>[0][number];
    expect(await handleHeartbeat([job], () => now)).toEqual([{ sentAt: '2026-12-04T12:00:00.000Z', receivedAt: '2026-12-04T12:01:30.000Z', lagMs: 90_000 }]);
    // Without a queue row time, the caller's sentAt; without either, no lag rather than a made-up 0.
    const byHand = { ...job, createdOn: undefined, data: { sentAt: '2026-12-04T12:01:00.000Z' } };
    expect((await handleHeartbeat([byHand], () => now))[0]!.lagMs).toBe(30_000);
    expect((await handleHeartbeat([{ ...job, createdOn: undefined }], () => now))[0]!.lagMs).toBeNull();
  });
});
