/**
 * Planning settings in headless Chromium: the form arrives filled in (rendered on the server); a lead is
 * told at the field what the route's schema refuses, changes a setting, and finds it saved after a reload.
 * The setting is put back at the end (the demo kitchen's plans use it).
 */
import { afterAll, beforeAll, describe, expect, it, inject } from 'vitest';
import path from 'node:path';
import type { Browser, Page } from 'playwright-core';
import { launchBrowser, SCREENSHOT_DIR, signInThroughPage } from '../helpers/browser';
import { DEMO_PASSWORD } from '../../lib/demo/seed';

let browser: Browser;
const baseUrl = inject('baseUrl');
const LEAD = 'lead.saltbush@example.org';

beforeAll(async () => {
  browser = await launchBrowser();
});
afterAll(async () => {
  await browser?.close();
});

async function openSettings(page: Page) {
  await signInThroughPage(page, baseUrl, LEAD, DEMO_PASSWORD);
  await page.locator('ul li h2 a').first().click();
  // The kitchen's tab (the main navigation has the person's own settings).
  await page.locator('nav').filter({ has: page.getByRole('link', { name: 'Dishes', exact: true }) }).getByRole('link', { name: 'Settings', exact: true }).click();
  await page.getByRole('heading', { name: 'Planning settings', level: 1 }).waitFor();
}
const turnaround = (page: Page) => page.getByLabel('Turnaround between batches (min)');
const save = (page: Page) => page.getByRole('button', { name: 'Save', exact: true }).click();

describe('planning settings', () => {
  it('a lead fixes refused values, changes the turnaround and finds it saved after a reload', async () => {
    const page = await browser.newPage({ viewport: { width: 1280, height: 900 } });
    await openSettings(page);
    const url = page.url();
    const before = await turnaround(page).inputValue();
    // Only this tab is marked as the current page (not "Plan", whose path /plan begins /planning).
    expect(await page.locator('nav a[aria-current="page"]').allTextContents()).toEqual(['Settings']);
    expect(before).toMatch(/^\d+$/);

    // Rendered on the server: the same values with JavaScript off.
    const context = await browser.newContext({ javaScriptEnabled: false });
    await context.addCookies(await page.context().cookies());
    const plain = await context.newPage();
    await plain.goto(url);
    expect(await plain.getByLabel('Turnaround between batches (min)').inputValue()).toBe(before);
    await context.close();

    const saves: string[] = [];
    page.on('request', (r) => r.method() === 'PUT' && saves.push(r.url()));
    await page.getByLabel('Currency (3 letters)').fill('K1');
    await page.getByLabel('Shift ends (HH:MM)').fill('05:00');
    await turnaround(page).fill('500');
    await save(page);
    await page.locator('.field-error', { hasText: 'Use a three-letter currency code, e.g. KES or XOF.' }).waitFor();
    await page.locator('.field-error', { hasText: 'At most 240 min.' }).waitFor();
    await page.getByRole('alert').filter({ hasText: 'Turnaround between batches (min): At most 240 min.' }).waitFor();
    expect(saves).toEqual([]);
    await page.screenshot({ path: path.join(SCREENSHOT_DIR, 'lead-planning-error-desktop.png'), fullPage: true });

    await turnaround(page).fill('30');
    await page.getByLabel('Currency (3 letters)').fill('inr');
    await save(page);
    // The shift rule is a refinement: it speaks once the fields themselves are right.
    await page.locator('.field-error', { hasText: 'The shift must end after it starts.' }).waitFor();
    expect(saves).toEqual([]);

    const changed = before === '17' ? '18' : '17';
    await page.reload();
    await turnaround(page).fill(changed);
    await save(page);
    await page.getByRole('status').filter({ hasText: 'Saved.' }).waitFor();
    expect(saves).toHaveLength(1);
    await page.reload();
    await expect.poll(() => turnaround(page).inputValue()).toBe(changed);

    await turnaround(page).fill(before);
    await save(page);
    await page.getByRole('status').filter({ hasText: 'Saved.' }).waitFor();
    await page.close();
  });

  it('fits a phone at 360 px', async () => {
    const page = await browser.newPage({ viewport: { width: 360, height: 740 }, isMobile: true });
    await openSettings(page);
    await turnaround(page).fill('');
    await save(page);
    await page.locator('.field-error', { hasText: 'Enter a number.' }).waitFor();
    expect(await page.evaluate(() => document.documentElement.scrollWidth)).toBeLessThanOrEqual(360);
    await page.screenshot({ path: path.join(SCREENSHOT_DIR, 'lead-planning-phone.png'), fullPage: true });
    await page.close();
  });
});
