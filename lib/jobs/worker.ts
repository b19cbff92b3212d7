import type { EntityManager } from '@mikro-orm/postgresql';
import type PgBoss from 'pg-boss';
import { getEm } from '@/lib/db';
import { handleAlertJob, handleHousekeeping, handlePushJob, type AlertJobData, type PushJobData, type PushRetryPolicy } from '@/lib/alerts/handlers';
import { QUEUES } from './boss';
import { forecastRefreshCron, handleForecastRefresh, type ForecastRefreshData } from './forecast-refresh';

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

export interface WorkerOptions {
  /** Entity manager per job; default the app's ORM (lib/db). */
  em?: () => Promise<EntityManager>;
  /** How often idle workers look for jobs [s]; pg-boss's default is 2. */
  pollingIntervalSeconds?: number;
  pushRetry?: PushRetryPolicy;
  /** Certificate of the local push fake to trust (default PUSH_FAKE_CA). */
  pushCaPath?: string;
}

/** Registers every handler and schedule on a started boss. */
export async function registerWorkers(boss: PgBoss, opts: WorkerOptions = {}): Promise<void> {
  const em = opts.em ?? getEm;
  const poll = opts.pollingIntervalSeconds !== undefined ? { pollingIntervalSeconds: opts.pollingIntervalSeconds } : {};
  await boss.work<HeartbeatData>(QUEUES.heartbeat, async (jobs) => {
    const r = await handleHeartbeat(jobs);
    console.log(`[worker] heartbeat, lag ${r[0]?.lagMs ?? 0} ms`);
    return r;
  });
  // Every 5 minutes; pg-boss keeps one schedule per name however many workers run.
  await boss.schedule(QUEUES.heartbeat, '*/5 * * * *', { sentAt: new Date().toISOString() });

  await boss.work<ForecastRefreshData>(QUEUES.forecastRefresh, async (jobs) => {
    const out = [];
    for (const job of jobs) {
      const s = await handleForecastRefresh(await getEm(), job.data);
      const count = (k: string) => s.outcomes.filter((o) => o.status === k).length;
      console.log(`[worker] forecast-refresh: ${count('stored')} stored, ${count('unchanged')} unchanged, ${count('failed')} failed, ${s.pruned} pruned`);
      out.push({ stored: count('stored'), unchanged: count('unchanged'), failed: count('failed'), pruned: s.pruned });
    }
    // pg-boss stores the result as the job's output when the batch holds one job (the default batch size).
    return out.length === 1 ? out[0] : out;
  });
  await boss.schedule(QUEUES.forecastRefresh, forecastRefreshCron(), {});
  await boss.work<AlertJobData>(QUEUES.alert, poll, async ([job]) => (job ? handleAlertJob(await em(), boss, job.id, job.data) : null));
  await boss.work<PushJobData>(QUEUES.push, poll, async ([job]) =>
    job ? handlePushJob(await em(), boss, job.data, { ...(opts.pushRetry ? { retry: opts.pushRetry } : {}), ...(opts.pushCaPath ? { caPath: opts.pushCaPath } : {}) }) : null,
  );
  await boss.work(QUEUES.housekeeping, async () => handleHousekeeping(await em()));
  await boss.schedule(QUEUES.housekeeping, '17 * * * *', {});
}
