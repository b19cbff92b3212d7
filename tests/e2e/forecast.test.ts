/**
 * The forecast page in headless Chromium against the production build: a kitchen lead sees today and the next
 * two days from the forecast fake with their source and age, the chart, and uploads a file whose problems are
 * listed by line; a cook sees the forecast but no upload form. Screenshots in tests/e2e/screenshots.
 */
import { afterAll, beforeAll, describe, expect, inject, it } from 'vitest';
import path from 'node:path';
import { writeFile } from 'node:fs/promises';
import { tmpdir } from 'node:os';
import type { Browser, Page } from 'playwright-core';
import { KitchenSchema } from '../../entities';
import { refreshKitchenForecast } from '../../lib/forecast/refresh';
import { DEMO_KITCHENS, DEMO_PASSWORD } from '../../lib/demo/seed';
import { launchBrowser, SCREENSHOT_DIR, signInThroughPage } from '../helpers/browser';
import { closeTestOrm, testOrm } from '../helpers/fixtures';

let browser: Browser;
const baseUrl = inject('baseUrl');
let kitchenId = '';

beforeAll(async () => {
  browser = await launchBrowser();
  const em = (await testOrm()).em.fork();
  const k = await em.findOneOrFail(KitchenSchema, { name: DEMO_KITCHENS[0].name });
  kitchenId = k.id;
  await refreshKitchenForecast(em, k, { baseUrl: inject('forecastUrl') });
});
afterAll(async () => {
  await browser?.close();
  await closeTestOrm();
});

const signIn = (page: Page, email: string) => signInThroughPage(page, baseUrl, email, DEMO_PASSWORD);
describe('forecast page', () => {
  it('a kitchen lead sees the forecast for three days and the chart, and a bad file is explained line by line', async () => {
    const page = await browser.newPage({ viewport: { width: 1280, height: 900 } });
    await signIn(page, 'lead.baobab@example.org');
    await page.goto(`${baseUrl}/kitchens/${kitchenId}`);
    // The kitchen's tabs carry its sections (the navigation is named after the kitchen).
    await page.getByRole('navigation', { name: 'Baobab Ridge School Kitchen' }).getByRole('link', { name: 'Forecast' }).click();
    await page.getByRole('heading', { name: 'Forecast', level: 1 }).waitFor();
    await page.locator('canvas').waitFor();
    const days = page.locator('section', { hasText: 'Weather in use' }).locator('li');
    await expect(days.count()).resolves.toBe(3);
    for (const text of await days.allTextContents()) expect(text).toMatch(/Forecast.*fetched/);
    await page.screenshot({ path: path.join(SCREENSHOT_DIR, 'forecast-lead.png'), fullPage: true });

    const bad = path.join(tmpdir(), 'hearthcast-bad.csv');
    await writeFile(bad, 'time,ghi_w_m2\n2026-12-03T10:00+03:00,1800\n2026-12-03T11:00,500\n');
    await page.getByLabel(/Weather file/).setInputFiles(bad);
    await page.getByRole('button', { name: 'Upload' }).click();
    await page.getByText('The file has 2 problems; nothing was saved.').waitFor();
    await page.getByText('Line 2, ghi_w_m2:').waitFor();
    await page.getByText('Line 3, time:').waitFor();
    await page.screenshot({ path: path.join(SCREENSHOT_DIR, 'forecast-upload-errors.png'), fullPage: true });
    await page.close();
  });

  it('a cook on a phone sees the forecast but no upload form, and nothing is wider than the phone', async () => {
    const page = await browser.newPage({ viewport: { width: 360, height: 740 }, isMobile: true, hasTouch: true });
    await signIn(page, 'cook1.baobab@example.org');
    await page.goto(`${baseUrl}/kitchens/${kitchenId}/forecast`);
    await page.locator('canvas').waitFor();
    await expect(page.getByRole('heading', { name: 'Upload weather for a day' }).count()).resolves.toBe(0);
    expect(await page.evaluate(() => document.documentElement.scrollWidth)).toBeLessThanOrEqual(360);
    await page.screenshot({ path: path.join(SCREENSHOT_DIR, 'forecast-cook-phone.png'), fullPage: true });
    await page.close();
  });
});
