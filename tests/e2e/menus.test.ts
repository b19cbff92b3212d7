/**
 * A day's menu in headless Chromium: the page arrives with the day's lines and batches (rendered on the
 * server); a lead picks another day, enters a line with a bad value and reads the field's message (never
 * an internal path such as lines.0.servings), in English and in French, then saves and finds it after a reload.
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

/** A day far from the demo's today and tomorrow (whose menus the plan tests use), different on each run. */
function freshDay(): string {
  const d = new Date(Date.now() + (200 + (Date.now() % 3000)) * 86_400_000);
  return d.toISOString().slice(0, 10);
}

async function openMenu(page: Page) {
  await signInThroughPage(page, baseUrl, LEAD, DEMO_PASSWORD);
  await page.locator('ul li h2 a').first().click();
  await page.getByRole('link', { name: 'Menu', exact: true }).first().click();
  await page.getByRole('heading', { name: 'Menu', level: 1 }).waitFor();
}

describe('menu editor', () => {
  it('is rendered with the day’s lines on the server (readable with JavaScript off)', async () => {
    const page = await browser.newPage({ viewport: { width: 1280, height: 900 } });
    await openMenu(page);
    // The demo's tomorrow has a menu, split into batches.
    await page.getByRole('heading', { name: 'Batches' }).waitFor();
    const lines = await page.locator('form fieldset').count();
    expect(lines).toBeGreaterThan(0);
    const url = page.url();
    const cookies = await page.context().cookies();
    await page.close();
    const context = await browser.newContext({ javaScriptEnabled: false });
    await context.addCookies(cookies);
    const plain = await context.newPage();
    await plain.goto(url);
    expect(await plain.locator('form fieldset').count()).toBe(lines);
    expect(await plain.locator('section[aria-labelledby="batches"] li').count()).toBeGreaterThan(0);
    await context.close();
  });

  it('a lead enters a line with bad values, reads each field’s message, then saves the day', async () => {
    const day = freshDay();
    const page = await browser.newPage({ viewport: { width: 1280, height: 900 } });
    await openMenu(page);
    await page.getByLabel('Day').fill(day);
    await page.getByText("No dishes on this day's menu yet.").waitFor();

    await page.getByRole('button', { name: 'Add a dish' }).click();
    const line = page.locator('form fieldset').first();
    await line.getByLabel('Servings').fill('0');
    await page.getByRole('button', { name: 'Save the menu' }).click();
    await line.locator('.field-error', { hasText: 'At least 1 serving.' }).waitFor();
    await page.getByRole('alert').filter({ hasText: 'Line 1, Servings: At least 1 serving.' }).waitFor();
    expect(await page.locator('main').textContent()).not.toMatch(/lines\.\d/);
    expect(await line.getByLabel('Servings').getAttribute('aria-invalid')).toBe('true');

    await line.getByLabel('Servings').fill('120');
    await line.getByLabel('Earliest start').fill('13:00');
    await page.getByRole('button', { name: 'Save the menu' }).click();
    await line.locator('.field-error', { hasText: 'The earliest start must be before the serving time.' }).waitFor();
    await page.screenshot({ path: path.join(SCREENSHOT_DIR, 'lead-menu-error-desktop.png'), fullPage: true });

    await line.getByLabel('Earliest start').fill('09:00');
    await page.getByRole('button', { name: 'Save the menu' }).click();
    await page.getByRole('status').filter({ hasText: 'Menu saved.' }).waitFor();
    expect(await line.locator('.field-error').count()).toBe(0);
    // The batches are read again after the change.
    await page.locator('section[aria-labelledby="batches"] li').first().waitFor();

    await page.goto(`${page.url().split('?')[0]}?date=${day}`);
    await expect.poll(() => page.locator('form fieldset').first().getByLabel('Servings').inputValue()).toBe('120');
    expect(await page.locator('form fieldset').count()).toBe(1);
    await page.close();
  });

  it('words the same message in French on a phone', async () => {
    const page = await browser.newPage({ viewport: { width: 360, height: 740 }, isMobile: true });
    await openMenu(page);
    await page.context().addCookies([{ name: 'hc_locale', value: 'fr', url: baseUrl }]);
    await page.goto(`${page.url().split('?')[0]}?date=${freshDay()}`);
    await page.getByRole('heading', { name: 'Menu', level: 1 }).waitFor();
    await page.getByRole('button', { name: 'Ajouter un plat' }).click();
    const line = page.locator('form fieldset').last();
    await line.getByLabel('Portions').fill('0');
    await page.getByRole('button', { name: 'Enregistrer le menu' }).click();
    await line.locator('.field-error', { hasText: 'Au moins 1.' }).waitFor();
    await page.getByRole('alert').filter({ hasText: /^Ligne \d+, Portions : Au moins 1\.$/ }).waitFor();
    expect(await page.evaluate(() => document.documentElement.scrollWidth)).toBeLessThanOrEqual(360);
    await page.screenshot({ path: path.join(SCREENSHOT_DIR, 'lead-menu-error-phone-fr.png'), fullPage: true });
    await page.close();
  });
});
