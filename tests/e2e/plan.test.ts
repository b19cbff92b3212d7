/**
 * Planning end to end in headless Chromium: the lead sees tomorrow's draft (made by the demo
 * loader), re-solves it with progress shown, drags a slot where the store cannot serve it and reads
 * the refusal, publishes; the coordinator sees the day across kitchens.
 */
import { afterAll, beforeAll, describe, expect, it, inject } from 'vitest';
import path from 'node:path';
import type { Browser, Page } from 'playwright-core';
import { launchBrowser, SCREENSHOT_DIR, signInThroughPage } from '../helpers/browser';
import { DEMO_PASSWORD } from '../../lib/demo/seed';

let browser: Browser;
const baseUrl = inject('baseUrl');

beforeAll(async () => {
  browser = await launchBrowser();
});
afterAll(async () => {
  await browser?.close();
});

const signIn = (page: Page, email: string) => signInThroughPage(page, baseUrl, email, DEMO_PASSWORD);
describe('planning a day', () => {
  it('the lead re-solves tomorrow, a drag to the night is refused with a reason, then publishes', async () => {
    const page = await browser.newPage({ viewport: { width: 1280, height: 1000 } });
    await signIn(page, 'lead.tamarind@example.org');
    await page.locator('ul li h2 a').first().click();
    await page.getByRole('link', { name: 'Plan', exact: true }).click();
    await page.getByText('Slots by cooker').waitFor();
    await page.getByRole('button', { name: 'Solve again' }).click();
    await page.getByRole('status').filter({ hasText: 'Solving' }).waitFor();
    await page.locator('.fc-event').first().waitFor();
    await page.getByRole('button', { name: 'Solve again' }).and(page.locator(':enabled')).waitFor();
    const events = await page.locator('.fc-event').count();
    expect(events).toBeGreaterThan(0);
    await page.screenshot({ path: path.join(SCREENSHOT_DIR, 'lead-plan.png'), fullPage: false });

    // Drag the first slot to the top of the grid (before the shift starts): the server refuses it.
    const ev = page.locator('.fc-event').first();
    const box = (await ev.boundingBox())!;
    const top = (await page.locator('.fc-timegrid-slots tr').first().boundingBox())!;
    await page.mouse.move(box.x + box.width / 2, box.y + 5);
    await page.mouse.down();
    await page.mouse.move(box.x + box.width / 2, box.y - 20, { steps: 5 });
    await page.mouse.move(box.x + box.width / 2, top.y + 2, { steps: 10 });
    await page.mouse.up();
    await page.getByText(/^Refused: /).waitFor({ timeout: 15_000 });
    await page.screenshot({ path: path.join(SCREENSHOT_DIR, 'lead-plan-refused.png'), fullPage: false });

    await page.getByRole('button', { name: 'Publish', exact: true }).click();
    await page.getByRole('status').filter({ hasText: /Published version \d+/ }).waitFor();
    // A published version cannot change: its Publish button goes away once the page has reloaded the plan.
    await page.getByRole('button', { name: 'Publish', exact: true }).waitFor({ state: 'detached' });
    expect(await page.getByRole('button', { name: 'Publish', exact: true }).count()).toBe(0);
    await page.close();
  });

  it('the coordinator sees every kitchen, servings on the sun and on backup fuel', async () => {
    const page = await browser.newPage({ viewport: { width: 1280, height: 900 } });
    await signIn(page, 'coordinator@example.org');
    await page.getByRole('link', { name: 'Day overview' }).click();
    await page.getByRole('heading', { name: 'Day across kitchens' }).waitFor();
    await page.getByRole('row', { name: /Baobab Ridge School Kitchen/ }).waitFor();
    expect(await page.locator('tbody tr').count()).toBe(3);
    await page.screenshot({ path: path.join(SCREENSHOT_DIR, 'coordinator-overview.png'), fullPage: true });
    await page.close();
  });
});
