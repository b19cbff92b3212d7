import PgBoss from 'pg-boss';
import { getEnv } from '@/lib/env';
import { createQueues } from './boss';

/**
 * A sending-only pg-boss for processes that schedule jobs but do not work them (the web server,
 * scripts): no supervision, no cron, a small pool of its own. Started on first use and kept per
 * process (on globalThis, so dev reloads reuse it). The worker (`npm run worker`) does the work.
 */
type G = typeof globalThis & { __hearthcastBossClient?: Promise<PgBoss> };
const g = globalThis as G;

export function getBossClient(connectionString = getEnv().DATABASE_URL): Promise<PgBoss> {
  g.__hearthcastBossClient ??= (async () => {
    const boss = new PgBoss({ connectionString, schema: 'pgboss', max: 2, supervise: false, schedule: false });
    boss.on('error', (err) => console.error('[boss client]', err));
    await boss.start();
    await createQueues(boss);
    return boss;
  })().catch((err: unknown) => {
    g.__hearthcastBossClient = undefined;
    throw err;
  });
  return g.__hearthcastBossClient;
}

/** Stops the client if one was started (scripts call this before exiting). */
export async function stopBossClient(): Promise<void> {
  const p = g.__hearthcastBossClient;
  g.__hearthcastBossClient = undefined;
  if (p) await (await p.catch(() => null))?.stop({ graceful: false, wait: true });
}
