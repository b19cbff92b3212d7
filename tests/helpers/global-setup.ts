/**
 * Starts what the API and end-to-end tests need, once per run: the SMTP, forecast and push fakes on
 * free ports and the production build served by `next start` against the test database (migrated,
 * demo loaded with today's published plan and tomorrow's draft in each demo kitchen), pointed at the fakes.
 */
import { spawn, type ChildProcess } from 'node:child_process';
import { mkdtemp } from 'node:fs/promises';
import { existsSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import net from 'node:net';
import { randomBytes } from 'node:crypto';
import type { TestProject } from 'vitest/node';
import { MikroORM } from '@mikro-orm/postgresql';
import { startSmtpFake } from '../../lib/fakes/smtp';
import { startForecastFake } from '../../lib/fakes/forecast';
import { startPushFake } from '../../lib/fakes/push';

declare module 'vitest' {
  export interface ProvidedContext {
    baseUrl: string;
    mailboxDir: string;
    databaseUrl: string;
    /** Base URL of the forecast fake (Open-Meteo API); POST /__control sets its failure mode. */
    forecastUrl: string;
    /** The push fake: its origin (https://127.0.0.1:port), its certificate (PUSH_FAKE_CA) and where it keeps deliveries. */
    pushFakeOrigin: string;
    pushFakeCa: string;
    pushFakeDir: string;
  }
}

async function freePort(): Promise<number> {
  return new Promise((resolve, reject) => {
    const s = net.createServer();
    s.listen(0, '127.0.0.1', () => {
      const a = s.address();
      const port = typeof a === 'object' && a ? a.port : 0;
      s.close(() => resolve(port));
    });
    s.on('error', reject);
  });
}

async function waitFor(url: string, timeoutMs: number): Promise<void> {
  const until = Date.now() + timeoutMs;
  while (Date.now() < until) {
    try {
      const r = await fetch(url);
      if (r.ok) return;
    } catch {
      /* not up yet */
    }
    await new Promise((r) => setTimeout(r, 200));
  }
  throw new Error(`server at ${url} did not become ready in ${timeoutMs} ms`);
}

export default async function setup(project: TestProject) {
  const databaseUrl = process.env.DATABASE_URL?.endsWith('_test') ? process.env.DATABASE_URL : `postgres://postgres@127.0.0.1:${process.env.PGPORT ?? 54329}/hearthcast_test`;
  process.env.DATABASE_URL = databaseUrl;

  // Migrations and the demo scenario in the test database (both idempotent).
  const config = (await import('../../mikro-orm.config')).default;
  const orm = await MikroORM.init({ ...config, clientUrl: databaseUrl });
  await orm.getMigrator().up();
  const { seedDemo, seedDemoPlans } = await import('../../lib/demo/seed');
  const demo = await seedDemo(orm.em.fork());
  // Today's published plan and tomorrow's draft (kept when present); publishing schedules their alerts.
  const { KitchenSchema } = await import('../../entities');
  const em = orm.em.fork();
  const kitchens = await em.find(KitchenSchema, { id: { $in: Object.values(demo.kitchens).map((k) => k.id) } }, { populate: ['organisation'] });
  await seedDemoPlans(em, Object.fromEntries(Object.entries(demo.kitchens).map(([slug, k]) => [slug, kitchens.find((x) => x.id === k.id)!])), { timeLimitS: 1 });
  await (await import('../../lib/queues/client')).stopBossClient();
  // Failed sign-ins count for 15 minutes (lib/auth/throttle.ts): left over from a run a few minutes
  // ago, they would make the fixed addresses of the throttling tests answer 429 too early.
  await orm.em.getConnection().execute('delete from rate_limits');
  await orm.close(true);

  const mailboxDir = await mkdtemp(path.join(tmpdir(), 'hearthcast-mail-'));
  const smtp = await startSmtpFake({ port: 0, dir: mailboxDir });
  const forecast = await startForecastFake({ port: 0 });
  const pushFakeDir = await mkdtemp(path.join(tmpdir(), 'hearthcast-push-'));
  const push = await startPushFake({ port: 0, dir: pushFakeDir });
  // The test files' own workers (tests/jobs) send through the same fake.
  process.env.PUSH_FAKE_CA = push.caPath;

  if (!existsSync(path.resolve('.next/BUILD_ID'))) throw new Error('No production build: run `npx next build` (npm test does) before the tests.');
  const port = await freePort();
  const baseUrl = `http://127.0.0.1:${port}`;
  const server: ChildProcess = spawn(path.resolve('node_modules/.bin/next'), ['start', '-H', '127.0.0.1', '-p', String(port)], {
    env: {
      ...process.env,
      NODE_ENV: 'production',
      DATABASE_URL: databaseUrl,
      APP_URL: baseUrl,
      SMTP_URL: `smtp://127.0.0.1:${smtp.port}`,
      MAILBOX_DIR: mailboxDir,
      FORECAST_URL: forecast.url,
      PUSH_FAKE_CA: push.caPath,
      PUSH_FAKE_DIR: pushFakeDir,
      DEV_TOOLS: '1',
      // The tests play a reverse proxy: each client sends its own X-Forwarded-For (tests/helpers/http.ts).
      TRUST_PROXY: '1',
      SESSION_SECRET: randomBytes(32).toString('base64url'),
      NEXT_TELEMETRY_DISABLED: '1',
    },
    stdio: ['ignore', 'pipe', 'pipe'],
  });
  const logs: string[] = [];
  server.stdout?.on('data', (d: Buffer) => logs.push(d.toString()));
  server.stderr?.on('data', (d: Buffer) => logs.push(d.toString()));
  try {
    await waitFor(`${baseUrl}/api/v1/health`, 60_000);
  } catch (err) {
    console.error(logs.join(''));
    throw err;
  }

  project.provide('baseUrl', baseUrl);
  project.provide('mailboxDir', mailboxDir);
  project.provide('databaseUrl', databaseUrl);
  project.provide('forecastUrl', forecast.url);
  project.provide('pushFakeOrigin', push.origin);
  project.provide('pushFakeCa', push.caPath);
  project.provide('pushFakeDir', pushFakeDir);

  return async () => {
    server.kill('SIGTERM');
    await smtp.close();
    await forecast.close();
    await push.close();
    if (process.env.SHOW_SERVER_LOG === '1') console.log(logs.join(''));
  };
}
