/**
 * Dish library in headless Chromium: the page arrives with its dishes (rendered on the server, so it
 * shows them even without JavaScript); a lead adds a dish, is told at the field what the route's schema
 * refuses before anything is sent, then edits the dish and finds the change after a reload.
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

/** Signs in and opens the lead's kitchen tab of that name; returns the tab's URL. */
async function openTab(page: Page, tab: string, heading: string): Promise<string> {
  await signInThroughPage(page, baseUrl, LEAD, DEMO_PASSWORD);
  await page.locator('ul li h2 a').first().click();
  await page.getByRole('link', { name: tab, exact: true }).first().click();
  await page.getByRole('heading', { name: heading, level: 1 }).waitFor();
  return page.url();
}

describe('dish library', () => {
  it('is rendered with its dishes on the server (readable with JavaScript off)', async () => {
    const page = await browser.newPage({ viewport: { width: 1280, height: 900 } });
    const url = await openTab(page, 'Dishes', 'Dishes');
    const rows = await page.locator('tbody tr').count();
    expect(rows).toBeGreaterThan(0);
    const cookies = await page.context().cookies();
    await page.close();
    const context = await browser.newContext({ javaScriptEnabled: false, viewport: { width: 1280, height: 900 } });
    await context.addCookies(cookies);
    const plain = await context.newPage();
    await plain.goto(url);
    expect(await plain.locator('tbody tr').count()).toBe(rows);
    expect(await plain.getByText('Loading…').count()).toBe(0);
    await context.close();
  });

  it('a lead adds a dish, fixing what the schema refuses at its field, then edits it', async () => {
    const name = `Test lentil stew ${Date.now().toString(36)}`;
    const page = await browser.newPage({ viewport: { width: 1280, height: 900 } });
    await openTab(page, 'Dishes', 'Dishes');
    const sent: string[] = [];
    page.on('request', (r) => r.method() !== 'GET' && r.url().includes('/dishes') && sent.push(r.method()));

    await page.getByRole('button', { name: 'Add a dish' }).click();
    const form = page.locator('form').filter({ has: page.getByRole('button', { name: 'Save the dish' }) });
    await form.getByLabel('Name', { exact: true }).fill(name);
    await form.getByLabel('Hold time (min)').fill('0');
    await form.getByLabel('Servings per batch').fill('');
    await form.getByRole('button', { name: 'Save the dish' }).click();
    // The schema's own words (lib/validations/dishes.ts) at each field, and where the first one is.
    await form.locator('.field-error', { hasText: 'Hold time is at least 1 min.' }).waitFor();
    await form.locator('.field-error', { hasText: 'Servings per batch is a whole number.' }).waitFor();
    await form.getByRole('alert').filter({ hasText: 'Servings per batch: Servings per batch is a whole number.' }).waitFor();
    expect(await form.getByLabel('Hold time (min)').getAttribute('aria-invalid')).toBe('true');
    expect(sent).toEqual([]); // nothing went to the server
    await page.screenshot({ path: path.join(SCREENSHOT_DIR, 'lead-dish-form-error.png'), fullPage: true });

    await form.getByLabel('Hold time (min)').fill('25');
    await form.getByLabel('Servings per batch').fill('120');
    await form.getByRole('button', { name: 'Save the dish' }).click();
    await page.getByRole('status').filter({ hasText: 'Dish saved.' }).waitFor();
    const row = page.getByRole('row', { name: new RegExp(name) });
    await row.waitFor();
    expect(await row.locator('td').nth(1).textContent()).toBe('120');
    expect(sent).toEqual(['POST']);

    await row.getByRole('button', { name: 'Edit' }).click();
    await form.getByLabel('Servings per batch').fill('150');
    await form.getByRole('button', { name: 'Save the dish' }).click();
    await page.getByRole('status').filter({ hasText: 'Dish saved.' }).waitFor();
    await expect.poll(() => row.locator('td').nth(1).textContent()).toBe('150');
    expect(sent).toEqual(['POST', 'PATCH']);

    await page.reload();
    await expect.poll(() => page.getByRole('row', { name: new RegExp(name) }).locator('td').nth(1).textContent()).toBe('150');
    await page.screenshot({ path: path.join(SCREENSHOT_DIR, 'lead-dishes-desktop.png'), fullPage: true });
    await page.close();
  });

  it('fits a phone: the form and its messages at 360 px', async () => {
    const page = await browser.newPage({ viewport: { width: 360, height: 740 }, isMobile: true });
    await openTab(page, 'Dishes', 'Dishes');
    // Nothing wider than the phone (the CSV column list and the table's hidden header text once were: the page zoomed out and the form's buttons slid under others).
    expect(await page.evaluate(() => document.documentElement.scrollWidth)).toBeLessThanOrEqual(360);
    await page.getByRole('button', { name: 'Add a dish' }).click();
    const form = page.locator('form').filter({ has: page.getByRole('button', { name: 'Save the dish' }) });
    await form.getByLabel('Minimum pot temperature (°C)').fill('60');
    await form.getByRole('button', { name: 'Save the dish' }).click();
    // A refinement of the schema (the pot must reach the food's safe core temperature, 74 °C by default).
    await form.locator('.field-error', { hasText: 'The pot must reach at least the safe core temperature of the food.' }).waitFor();
    expect(await page.evaluate(() => document.documentElement.scrollWidth)).toBeLessThanOrEqual(360);
    await page.screenshot({ path: path.join(SCREENSHOT_DIR, 'lead-dishes-phone.png'), fullPage: true });
    await page.close();
  });
});
