/**
 * The cooks' Today page in headless Chromium on a 360×740 phone: a cook lands on today's slots with
 * their safety notes, checks a batch in and logs a reading; the service worker takes over; with the
 * network cut the page still opens from its cache, and a check-in made offline reaches the server
 * once the connection is back, exactly once. Also measures the page's first-load JavaScript.
 */
import { gzipSync } from 'node:zlib';
import path from 'node:path';
import { afterAll, beforeAll, describe, expect, inject, it } from 'vitest';
import type { Browser, BrowserContext, Page } from 'playwright-core';
import { CheckInSchema, ReadingSchema } from '../../entities';
import { stopBossClient } from '../../lib/queues/client';
import { launchBrowser, SCREENSHOT_DIR } from '../helpers/browser';
import { closeTestOrm, createWorld, PASSWORD, testOrm, type World } from '../helpers/fixtures';
import { publishPlanFor, waitUntil } from '../helpers/cooks';

let browser: Browser;
let ctx: BrowserContext;
let page: Page;
let w: World;
let cookerId: string;
const baseUrl = inject('baseUrl');
const shot = (name: string) => page.screenshot({ path: path.join(SCREENSHOT_DIR, name), fullPage: false });
const count = async (schema: typeof CheckInSchema | typeof ReadingSchema, where: Record<string, unknown>) => (await testOrm()).em.fork().count(schema as typeof CheckInSchema, where);

beforeAll(async () => {
  const em = (await testOrm()).em.fork();
  w = await createWorld(em);
  cookerId = (await publishPlanFor(em, w.kitchenA.id)).cookerId;
  browser = await launchBrowser();
  ctx = await browser.newContext({ viewport: { width: 360, height: 740 }, isMobile: true, hasTouch: true });
  page = await ctx.newPage();
});
afterAll(async () => {
  await browser?.close();
  await stopBossClient();
  await closeTestOrm();
});

/** Entries left in the phone's outbox (IndexedDB "hearthcast"/"outbox", lib/client/outbox.ts). */
const outboxSize = () =>
  page.evaluate(
    () =>
      new Promise<number>((resolve, reject) => {
        const open = indexedDB.open('hearthcast', 1);
        open.onerror = () => reject(open.error);
        open.onsuccess = () => {
          const db = open.result;
          const req = db.transaction('outbox', 'readonly').objectStore('outbox').count();
          req.onsuccess = () => {
            resolve(req.result);
            db.close();
          };
          req.onerror = () => reject(req.error);
        };
      }),
  );

/** The first slot card that still has a "Mark started" button (the "now" or "next" one). */
const firstOpenCard = () => page.locator('article[data-batch]').filter({ has: page.getByRole('button', { name: 'Mark started' }) }).first();

describe('Today page on a phone', () => {
  let batchId: string;

  it('a cook signs in and lands on today’s slots: actions first, each safety note once where it applies', async () => {
    await page.goto(`${baseUrl}/sign-in`);
    await page.getByLabel('E-mail address').fill(w.emails.cookA);
    await page.getByLabel('Password').fill(PASSWORD);
    await page.getByRole('button', { name: 'Sign in' }).click();
    await page.waitForURL(`${baseUrl}/`);
    await page.locator('ul li h2 a').first().click(); // a cook's kitchen card opens Today
    await page.waitForURL(`${baseUrl}/kitchens/${w.kitchenA.id}/today`);
    await page.getByRole('heading', { name: 'Today', level: 1 }).waitFor();
    await page.getByText(/^Last synced \d\d:\d\d$/).waitFor();
    const cards = page.locator('article[data-batch]');
    expect(await cards.count()).toBeGreaterThanOrEqual(3);
    await expect.poll(() => cards.first().getByRole('heading').textContent()).toMatch(/^(Maize porridge|Rice) · batch \d of \d$/);
    // The cooker's own cautions are said once above its slots: the dangers in sight, the rest one tap away.
    const safety = page.getByTestId('cooker-safety').first();
    await expect.poll(() => safety.getByText(/Oil fire: never use water/).isVisible()).toBe(true);
    expect(await safety.getByText('Follow your local codes and trained practice.').isVisible()).toBe(false);
    await safety.locator('summary').click();
    await expect.poll(() => safety.getByText('Follow your local codes and trained practice.').isVisible()).toBe(true);
    // Each card points to them, says no shared note again, and shows its state.
    for (let i = 0; i < (await cards.count()); i++) {
      const card = cards.nth(i);
      expect(await card.getByText("Also follow this cooker's safety notes above.").isVisible()).toBe(true);
      expect(await card.getByText(/Oil fire: never use water/).count()).toBe(0);
      expect(await card.getByTestId('slot-state').textContent()).toMatch(/^(Planned|Due now|Late|Missed|Cooking|Hot enough|Done|Skipped)$/);
    }
    // The action comes before the card's details; large touch targets (≥ 48 CSS px).
    const open = firstOpenCard();
    const button = await open.getByRole('button', { name: 'Mark started' }).boundingBox();
    const details = await open.getByText(/servings · Pot:/).boundingBox();
    expect(button!.y).toBeLessThan(details!.y);
    expect(button!.height).toBeGreaterThanOrEqual(48);
    await shot('today-cook-phone.png');
  });

  it('checks a batch in and logs a reading', async () => {
    const card = firstOpenCard();
    batchId = (await card.getAttribute('data-batch'))!;
    await card.getByRole('button', { name: 'Mark started' }).click();
    await page.getByText('Saved.', { exact: true }).waitFor();
    await expect.poll(() => page.locator(`article[data-batch="${batchId}"]`).getByText(/^Started at \d\d:\d\d/).isVisible()).toBe(true);
    expect(await count(CheckInSchema, { kitchen: w.kitchenA.id, batchId, kind: 'started' })).toBe(1);

    const section = page.locator('section').filter({ has: page.getByRole('heading', { name: 'Dish 1 (sunflower store)', level: 2 }) });
    await section.getByLabel('Store (°C)').fill('152');
    await section.getByLabel('Pot (°C)').fill('64');
    await section.getByRole('button', { name: 'Save reading' }).click();
    await waitUntil('reading stored', async () => (await count(ReadingSchema, { cooker: cookerId, source: 'manual' })) === 1);
    await expect.poll(() => section.getByText(/Last reading \d\d:\d\d: store 152 °C, pot 64 °C/).isVisible(), { timeout: 10_000 }).toBe(true);
    await expect.poll(() => section.getByText(/predicted from the reading at/).isVisible()).toBe(true);
    await shot('today-after-checkin.png');
  });

  it('the service worker takes over and keeps the page and today’s plan', async () => {
    await page.waitForFunction(() => navigator.serviceWorker.controller !== null, null, { timeout: 15_000 });
    await expect
      .poll(
        () =>
          page.evaluate(async (kitchenId) => {
            const shell = await (await caches.open('hc-1-shell')).keys();
            const data = await (await caches.open('hc-1-data')).keys();
            return shell.some((r) => r.url.endsWith(`/kitchens/${kitchenId}/today`)) && data.length > 0;
          }, w.kitchenA.id),
        { timeout: 15_000 },
      )
      .toBe(true);
  });

  it('offline: the page still opens with the plan, and a check-in made offline is sent once when back online', async () => {
    await ctx.setOffline(true);
    await page.reload();
    await page.getByText(/^No connection: showing what this phone saved at \d\d:\d\d/).waitFor({ timeout: 15_000 });
    const card = page.locator(`article[data-batch="${batchId}"]`);
    await card.getByRole('heading').waitFor();
    expect(await card.getByText("Also follow this cooker's safety notes above.").isVisible()).toBe(true);
    await shot('today-offline.png');

    await card.getByRole('button', { name: 'Mark done' }).click();
    await page.getByText('1 entry waiting to be sent').waitFor();
    await page.getByText(/^Saved on this phone; it will be sent when the connection returns\.$/).first().waitFor();
    expect(await count(CheckInSchema, { kitchen: w.kitchenA.id, batchId, kind: 'done' })).toBe(0);
    await shot('today-offline-checkin.png');

    await ctx.setOffline(false);
    // Sent on the `online` event, or else by the outbox's retry timer (2 s doubling, lib/client/outbox.ts): the
    // time-out is a ceiling for both, the wait ends as soon as the row is there.
    await waitUntil('offline check-in reached the server', async () => (await count(CheckInSchema, { kitchen: w.kitchenA.id, batchId, kind: 'done' })) === 1, 30_000);
    await expect.poll(() => page.getByText(/waiting to be sent/).count(), { timeout: 10_000 }).toBe(0);
    // A later page load flushes again: the entry is gone from the phone's outbox, so nothing can double.
    await page.reload();
    await page.getByText(/^Last synced \d\d:\d\d$/).waitFor();
    await expect.poll(() => outboxSize()).toBe(0);
    expect(await count(CheckInSchema, { kitchen: w.kitchenA.id, batchId, kind: 'done' })).toBe(1);
    expect(await count(CheckInSchema, { kitchen: w.kitchenA.id, batchId })).toBe(2);
    await shot('today-back-online.png');
  });

  it('a reading whose send fails while the phone still counts as online (no `online` event) is sent by the retry timer', async () => {
    // A phone coming out of a tunnel: its requests failed, but the browser never went offline, so no `online`
    // event will come. The page's own minute poll is slower than this test's ceiling; the outbox's retry is not.
    const readings = `${baseUrl}/api/v1/kitchens/${w.kitchenA.id}/readings`;
    let refused = 0;
    await ctx.route(readings, (route) => (refused++, route.abort('internetdisconnected')));
    const section = page.locator('section').filter({ has: page.getByRole('heading', { name: 'Dish 1 (sunflower store)', level: 2 }) });
    await section.getByLabel('Store (°C)').fill('141');
    await section.getByLabel('Pot (°C)').fill('70');
    await section.getByRole('button', { name: 'Save reading' }).click();
    await page.getByText('1 entry waiting to be sent').waitFor();
    expect(await page.evaluate(() => navigator.onLine)).toBe(true);
    await expect.poll(() => refused).toBeGreaterThanOrEqual(1);
    const before = await count(ReadingSchema, { cooker: cookerId, source: 'manual' });
    await ctx.unroute(readings);
    await waitUntil('retried reading reached the server', async () => (await count(ReadingSchema, { cooker: cookerId, source: 'manual' })) === before + 1, 30_000);
    await expect.poll(() => page.getByText(/waiting to be sent/).count(), { timeout: 10_000 }).toBe(0);
    await expect.poll(() => outboxSize()).toBe(0);
    expect(await count(ReadingSchema, { cooker: cookerId, source: 'manual' })).toBe(before + 1);
  });

  it('first-load JavaScript: what the Today page adds to the signed-in app is small, and no chart library loads', async () => {
    // Next.js 16 no longer prints "First Load JS" in `next build`; this measures what Chromium downloads on a
    // cold load (fresh context with the session only: no service worker, no cache), gzip level 9 per file.
    const scriptsOf = async (url: string, ready: RegExp) => {
      const fresh = await browser.newContext({ viewport: { width: 360, height: 740 }, isMobile: true, storageState: { cookies: await ctx.cookies(), origins: [] } });
      const p = await fresh.newPage();
      const list: { url: string; gz: number }[] = [];
      p.on('response', async (r) => {
        if (r.request().resourceType() === 'script') list.push({ url: r.url().replace(baseUrl, ''), gz: gzipSync(await r.body(), { level: 9 }).length });
      });
      await p.goto(`${baseUrl}${url}`);
      await p.getByText(ready).first().waitFor();
      await p.waitForLoadState('networkidle');
      await fresh.close();
      return list;
    };
    const kb = (l: { gz: number }[]) => l.reduce((s, x) => s + x.gz, 0) / 1024;
    const home = await scriptsOf('/', /Today's cooking/);
    const today = await scriptsOf(`/kitchens/${w.kitchenA.id}/today`, /^Last synced/);
    const own = today.filter((s) => !home.some((h) => h.url === s.url));
    console.log(`[today] first-load JS ${kb(today).toFixed(1)} kB gzip (${today.length} files); the signed-in home page ${kb(home).toFixed(1)} kB; the Today page's own ${kb(own).toFixed(1)} kB:`);
    for (const s of today) console.log(`  ${(s.gz / 1024).toFixed(1).padStart(6)} kB ${s.url}`);
    expect(today.some((s) => /chart|fullcalendar/i.test(s.url))).toBe(false);
    // The budget is 150 kB gzip (cooks are on cheap phones and weak links). The Today page lives outside the
    // app shell and formats its messages with components/mini-intl.tsx, so next-intl's client runtime and
    // the shell do not load here (see DEVELOPERS.md).
    expect(kb(today)).toBeLessThan(150);
    expect(today.some((s) => /next-intl/i.test(s.url))).toBe(false);
  });
});
