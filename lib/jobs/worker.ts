import type PgBoss from 'pg-boss';
import { QUEUES } from './boss';

export interface HeartbeatData {
  sentAt: string;
}

/** The trivial scheduled job: proves that scheduling, queueing and working are wired end to end. */
export async function handleHeartbeat(jobs: PgBoss.Job<HeartbeatData>[]): Promise<{ receivedAt: string; lagMs: number }[]> {
  return jobs.map((j) => {
    const sent = j.data?.sentAt ? Date.parse(j.data.sentAt) : Date.now();
    return { receivedAt: new Date().toISOString(), lagMs: Date.now() - sent };
  });
}

/** Registers every handler and schedule on a started boss. */
export async function registerWorkers(boss: PgBoss): Promise<void> {
  await boss.work<HeartbeatData>(QUEUES.heartbeat, async (jobs) => {
    const r = await handleHeartbeat(jobs);
    console.log(`[worker] heartbeat, lag ${r[0]?.lagMs ?? 0} ms`);
    return r;
  });
  // Every 5 minutes; pg-boss keeps one schedule per name however many workers run.
  await boss.schedule(QUEUES.heartbeat, '*/5 * * * *', { sentAt: new Date().toISOString() });
}
