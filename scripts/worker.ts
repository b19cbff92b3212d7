/** The background worker: pg-boss queues on the app database. Stateless; run as many as you like. */
import { startBoss, QUEUES } from '../lib/queues/boss';
import { registerWorkers } from '../lib/jobs/worker';
import { reconcileAlerts } from '../lib/alerts/handlers';
import { closeOrm, getEm } from '../lib/db';
import { getVapidKeys } from '../lib/push/vapid';

const boss = await startBoss();
await registerWorkers(boss);
// A forecast for every kitchen right away (then on the schedule); a second worker's send is stored once.
await boss.send(QUEUES.forecastRefresh, {});
// The VAPID key pair is made on first start (and kept in the database) if it does not exist yet.
await getVapidKeys(await getEm());
// Alerts of plans published while no web process could reach pg-boss are scheduled now.
reconcileAlerts(await getEm(), boss)
  .then((n) => n && console.log(`[worker] ${n} alert(s) scheduled on start`))
  .catch((err: unknown) => console.error('[worker] could not reconcile alerts', err));
console.log('[worker] ready');

const stop = async () => {
  await boss.stop({ graceful: true, wait: true });
  await closeOrm();
  process.exit(0);
};
process.on('SIGINT', stop);
process.on('SIGTERM', stop);
