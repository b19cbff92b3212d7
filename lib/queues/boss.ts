import PgBoss from 'pg-boss';
import { getEnv } from '@/lib/env';

/** Queue names, one per kind of background work. */
export const QUEUES = {
  heartbeat: 'heartbeat',
  forecastRefresh: 'forecast-refresh',
  /** One alert of a day (ready, store low, smoke point, skipped batch), due at its time: fans out to push. */
  alert: 'alert',
  /** One Web Push message to one subscription (retried with backoff by sending a new delayed job). */
  push: 'push',
  /** Hourly clean-up of rate counters and old idempotency records. */
  housekeeping: 'housekeeping',
} as const;

/**
 * Per-queue options. forecast-refresh: a failed refresh (the service down after the adapter's own 3 tries) is
 * retried by pg-boss 4 times with exponential back-off from 60 s (about 1, 2, 4, 8 min), then left failed
 * until the next scheduled run; each attempt's failure is recorded as a failed Forecast row.
 */
export const QUEUE_OPTIONS: Partial<Record<(typeof QUEUES)[keyof typeof QUEUES], Omit<PgBoss.Queue, 'name'>>> = {
  [QUEUES.forecastRefresh]: { retryLimit: 4, retryDelay: 60, retryBackoff: true, expireInSeconds: 15 * 60 },
};

/** Creates every queue with its options (idempotent; pg-boss 10 refuses to send to a queue that does not exist). */
export async function createQueues(boss: PgBoss): Promise<void> {
  for (const name of Object.values(QUEUES)) {
    const options = QUEUE_OPTIONS[name];
    await boss.createQueue(name, { name, ...options });
    // createQueue leaves an existing queue as it was: bring its options up to date.
    if (options) await boss.updateQueue(name, { name, ...options });
  }
}

/** A started pg-boss on the app database (its own schema "pgboss"). */
export async function startBoss(connectionString = getEnv().DATABASE_URL): Promise<PgBoss> {
  const boss = new PgBoss({ connectionString, schema: 'pgboss', max: 4 });
  boss.on('error', (err) => console.error('[boss]', err));
  await boss.start();
  await createQueues(boss);
  return boss;
}
