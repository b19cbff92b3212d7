/** The background worker: pg-boss queues on the app database. Stateless; run as many as you like. */
import { startBoss, QUEUES } from '../lib/jobs/boss';
import { registerWorkers } from '../lib/jobs/worker';

const boss = await startBoss();
await registerWorkers(boss);
// A forecast for every kitchen right away (then on the schedule); a second worker's send is stored once.
await boss.send(QUEUES.forecastRefresh, {});
console.log('[worker] ready');

const stop = async () => {
  await boss.stop({ graceful: true, wait: true });
  process.exit(0);
};
process.on('SIGINT', stop);
process.on('SIGTERM', stop);
