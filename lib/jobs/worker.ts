import type { EntityManager } from '@mikro-orm/postgresql';
import type PgBoss from 'pg-boss';
import { getEm } from '@/lib/db';
import { handleAlertJob, handleHousekeeping, handlePushJob, type AlertJobData, type PushJobData, type PushRetryPolicy } from '@/lib/alerts/handlers';
import { QUEUES } from '@/lib/queues/boss';
import { forecastRefreshCron, handleForecastRefresh, type ForecastRefreshData } from './forecast-refresh';

export interface HeartbeatData {
  /** When a caller sent it by hand; the scheduled runs carry none (their queue row's creation time counts). */
  sentAt?: string;
}

/**
 * The trivial scheduled job: proves that scheduling, queueing and working are wired end to end, and how long a
 * job waited. The sent time is the job's own queue row (`createdOn`, set by pg-boss when the cron or a caller
 * sends it), else the `sentAt` a caller put in the data; a schedule's data is fixed when the schedule is saved,
 * so it must not carry the time itself.
 */
export async function handleHeartbeat(
  jobs: (PgBoss.Job<HeartbeatData> & { createdOn?: Date })[],
  nowMs: () => number = Date.now,
): Promise<{ sentAt: string | null; receivedAt: string; lagMs: number | null }[]> {
  return jobs.map((j) => {
    const received = nowMs();
    const sent = j.createdOn ? j.createdOn.getTime() : j.data?.sentAt ? Date.parse(j.data.sentAt) : Number.NaN;
    const known = Number.isFinite(sent);
    return { sentAt: known ? new Date(sent).toISOString() : null, receivedAt: new Date(received).toISOString(), lagMs: known ? received - sent : null };
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
  await boss.work<HeartbeatData>(QUEUES.heartbeat, { includeMetadata: true }, async (jobs) => {
    const r = await handleHeartbeat(jobs);
    console.log(`[worker] heartbeat, lag ${r[0]?.lagMs ?? '?'} ms`);
    return r;
  });
  // Every 5 minutes; pg-boss keeps one schedule per name however many workers run. No time in the data: it
  // would be this start's time in every run (see handleHeartbeat).
  await boss.schedule(QUEUES.heartbeat, '*/5 * * * *', {});

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
