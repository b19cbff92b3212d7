import PgBoss from 'pg-boss';
import { getEnv } from '@/lib/env';

/** Queue names, one per kind of background work. */
export const QUEUES = {
  heartbeat: 'heartbeat',
} as const;

/** A started pg-boss on the app database (its own schema "pgboss"). */
export async function startBoss(connectionString = getEnv().DATABASE_URL): Promise<PgBoss> {
  const boss = new PgBoss({ connectionString, schema: 'pgboss', max: 4 });
  boss.on('error', (err) => console.error('[boss]', err));
  await boss.start();
  for (const name of Object.values(QUEUES)) await boss.createQueue(name);
  return boss;
}
