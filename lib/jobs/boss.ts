import PgBoss from 'pg-boss';
import { getEnv } from '@/lib/env';

/** Queue names, one per kind of background work. */
export const QUEUES = {
  heartbeat: 'heartbeat',
  /** One alert of a day (ready, store low, smoke point, skipped batch), due at its time: fans out to push. */
  alert: 'alert',
  /** One Web Push message to one subscription (retried with backoff by sending a new delayed job). */
  push: 'push',
  /** Hourly clean-up of rate counters and old idempotency records. */
  housekeeping: 'housekeeping',
} as const;

/** Creates every queue (idempotent; pg-boss 10 refuses to send to a queue that does not exist). */
export async function createQueues(boss: PgBoss): Promise<void> {
  for (const name of Object.values(QUEUES)) await boss.createQueue(name);
}

/** A started pg-boss on the app database (its own schema "pgboss"). */
export async function startBoss(connectionString = getEnv().DATABASE_URL): Promise<PgBoss> {
  const boss = new PgBoss({ connectionString, schema: 'pgboss', max: 4 });
  boss.on('error', (err) => console.error('[boss]', err));
  await boss.start();
  await createQueues(boss);
  return boss;
}
