/**
 * The forecast-refresh job against the test database and the forecast fake (started by the global setup):
 * idempotent (run twice → one forecast), failures recorded and nothing stored from a bad answer, retention,
 * and the job end to end through pg-boss.
 */
import { afterAll, beforeAll, beforeEach, describe, expect, inject, it } from 'vitest';
import type PgBoss from 'pg-boss';
import { ForecastPointSchema, ForecastSchema, KitchenSchema, type Kitchen } from '../../entities';
import { createWorld, closeTestOrm, testOrm, type World } from '../helpers/fixtures';

const forecastUrl = inject('forecastUrl');
// The worker reads FORECAST_URL through lib/env: point it at the fake before anything reads the environment.
process.env.FORECAST_URL = forecastUrl;
process.env.DATABASE_URL = inject('databaseUrl');

const { handleForecastRefresh, forecastRefreshCron } = await import('../../lib/jobs/forecast-refresh');
const { refreshKitchenForecast } = await import('../../lib/forecast/refresh');
const { recordFailedFetch, saveForecast } = await import('../../lib/forecast/store');

const H = 3_600_000;
let w: World;

async function control(mode: string, times?: number) {
  const r = await fetch(`${forecastUrl}/__control`, { method: 'POST', body: JSON.stringify({ mode, times }) });
  expect(r.status).toBe(200);
}
const fast = (nowMs: number) => ({ baseUrl: forecastUrl, timeoutMs: 300, backoffMs: 5, now: () => nowMs, retentionDays: 14 });
async function rows(k: Kitchen) {
  const em = (await testOrm()).em.fork();
  const forecasts = await em.find(ForecastSchema, { kitchen: k.id }, { orderBy: { fetchedAt: 'asc' } });
  const points = await em.count(ForecastPointSchema, { forecast: { kitchen: k.id } });
  return { forecasts, points };
}

beforeAll(async () => {
  w = await createWorld();
});
beforeEach(() => control('ok'));
afterAll(async () => {
  await control('ok');
  await closeTestOrm();
});

describe('forecast-refresh', () => {
  it('runs twice in the same hour and stores one forecast', async () => {
    const em = (await testOrm()).em.fork();
    // Ten minutes into the current hour, so "five minutes later" stays in the same hour.
    const now = Math.floor(Date.now() / H) * H + 10 * 60_000;
    const a = await handleForecastRefresh(em, { kitchenId: w.kitchenA.id }, fast(now));
    const b = await handleForecastRefresh(em, { kitchenId: w.kitchenA.id }, fast(now + 5 * 60_000));
    expect(a.outcomes.map((o) => o.status)).toEqual(['stored']);
    expect(b.outcomes.map((o) => o.status)).toEqual(['unchanged']);
    const { forecasts, points } = await rows(w.kitchenA);
    expect(forecasts).toHaveLength(1);
    expect(forecasts[0]!.status).toBe('ok');
    expect(forecasts[0]!.issuedAt!.getTime()).toBe(Math.floor(now / H) * H);
    // Yesterday and four GMT days: 5 × 24 stamps → 119 hours.
    expect(points).toBe(119);
  });

  it('two workers at once store the issue once (unique kitchen, source, issue time)', async () => {
    const now = Date.now() + 2 * H;
    const orm = await testOrm();
    const [x, y] = await Promise.all([refreshKitchenForecast(orm.em.fork(), w.kitchenA, fast(now)), refreshKitchenForecast(orm.em.fork(), w.kitchenA, fast(now))]);
    expect([x.status, y.status].sort()).toEqual(['stored', 'unchanged']);
    const { forecasts } = await rows(w.kitchenA);
    expect(forecasts.filter((f) => f.issuedAt?.getTime() === Math.floor(now / H) * H)).toHaveLength(1);
  });

  it('HTTP 500: retried by the adapter, recorded as failed, and the job throws so pg-boss retries it', async () => {
    await control('500');
    const em = (await testOrm()).em.fork();
    await expect(handleForecastRefresh(em, { kitchenId: w.kitchenB.id }, fast(Date.now()))).rejects.toThrow(/HTTP 500.*after 3 tries/);
    const { forecasts, points } = await rows(w.kitchenB);
    expect(forecasts.map((f) => f.status)).toEqual(['failed']);
    expect(forecasts[0]!.error).toMatch(/HTTP 500/);
    expect(forecasts[0]!.issuedAt).toBeNull();
    expect(points).toBe(0);
    const state = (await (await fetch(`${forecastUrl}/__control`)).json()) as { requests: number };
    expect(state.requests).toBeGreaterThanOrEqual(3);
  });

  it('timeout: recorded, retried by pg-boss', async () => {
    await control('timeout');
    const em = (await testOrm()).em.fork();
    await expect(handleForecastRefresh(em, { kitchenId: w.kitchenB.id }, fast(Date.now()))).rejects.toThrow(/did not answer/);
    expect((await rows(w.kitchenB)).forecasts.at(-1)!.error).toMatch(/did not answer within 0.3 s/);
  });

  it.each([
    ['malformed', /not valid JSON/],
    ['schema', /cannot use/],
    ['gap', /gap or a repeat/],
  ])('%s answer: rejected, recorded, nothing stored, not retried', async (mode, message) => {
    await control(mode);
    const em = (await testOrm()).em.fork();
    const before = await rows(w.kitchenB);
    const s = await handleForecastRefresh(em, { kitchenId: w.kitchenB.id }, fast(Date.now()));
    expect(s.outcomes[0]).toMatchObject({ status: 'failed', retryable: false });
    const after = await rows(w.kitchenB);
    expect(after.forecasts).toHaveLength(before.forecasts.length + 1);
    expect(after.forecasts.at(-1)!.status).toBe('failed');
    expect(after.forecasts.at(-1)!.error).toMatch(message);
    expect(after.points).toBe(0);
  });

  it('prunes forecasts whose hours ended before the retention, and old failures', async () => {
    const orm = await testOrm();
    const em = orm.em.fork();
    const k = w.otherKitchen;
    const old = Date.now() - 20 * 24 * H;
    await saveForecast(em, k, { source: 'service', issuedAtMs: old, fetchedAtMs: old, hours: [{ t: Math.floor(old / H) * H, ghiWm2: 1, tAirC: 20 }] });
    await recordFailedFetch(em, k, 'old failure', old);
    const recent = Date.now() - 2 * 24 * H;
    await saveForecast(em, k, { source: 'upload', issuedAtMs: recent, fetchedAtMs: recent, hours: [{ t: Math.floor(recent / H) * H, ghiWm2: 1, tAirC: 20 }] });
    expect((await rows(k)).forecasts).toHaveLength(3);
    const s = await handleForecastRefresh(em, { kitchenId: k.id }, fast(Date.now()));
    expect(s.pruned).toBeGreaterThanOrEqual(2);
    const left = await rows(k);
    expect(left.forecasts.map((f) => f.source).sort()).toEqual(['service', 'upload']); // today's fetch and the recent upload
    expect(left.forecasts.some((f) => f.error === 'old failure')).toBe(false);
  });

  it('the schedule: every 3 hours and at the afternoon hour (UTC)', () => {
    expect(forecastRefreshCron(13)).toBe('0 0-23/3,13 * * *');
  });
});

describe('through pg-boss', () => {
  let boss: PgBoss;
  afterAll(async () => {
    await boss?.stop({ graceful: false, wait: true });
    const { closeOrm } = await import('../../lib/db');
    await closeOrm();
  });

  it('a job sent twice stores one forecast; the queue retries with back-off', async () => {
    const { startBoss, QUEUES } = await import('../../lib/queues/boss');
    const { registerWorkers } = await import('../../lib/jobs/worker');
    boss = await startBoss(inject('databaseUrl'));
    const queue = await boss.getQueue(QUEUES.forecastRefresh);
    expect(queue).toMatchObject({ retryLimit: 4, retryDelay: 60, retryBackoff: true });
    await registerWorkers(boss);
    // A kitchen of its own, with no forecast yet.
    const e = (await testOrm()).em.fork();
    const k = e.create(KitchenSchema, { organisation: w.otherOrg.id, name: `Boss kitchen ${Date.now()}`, latitude: 26.24, longitude: 73.02, altitudeM: 231, timeZone: 'Asia/Kolkata', locale: 'en' });
    await e.flush();
    const ids = [await boss.send(QUEUES.forecastRefresh, { kitchenId: k.id }), await boss.send(QUEUES.forecastRefresh, { kitchenId: k.id })];
    const until = Date.now() + 30_000;
    let outputs: { stored: number; unchanged: number }[] = [];
    for (;;) {
      const jobs = await Promise.all(ids.map((id) => boss.getJobById(QUEUES.forecastRefresh, id!)));
      if (jobs.every((j) => j?.state === 'completed')) {
        outputs = jobs.map((j) => j!.output as unknown as { stored: number; unchanged: number });
        break;
      }
      if (Date.now() > until) throw new Error(`jobs not completed: ${jobs.map((j) => j?.state).join(', ')}`);
      await new Promise((r) => setTimeout(r, 250));
    }
    const hour = Math.floor(Date.now() / H) * H;
    const { forecasts } = await rows(k);
    const thisHour = forecasts.filter((f) => f.source === 'service' && f.status === 'ok' && f.issuedAt!.getTime() >= hour - H);
    expect(thisHour).toHaveLength(1);
    expect(outputs.map((o) => [o.stored, o.unchanged]).sort()).toEqual([
      [0, 1],
      [1, 0],
    ]);
  });
});
