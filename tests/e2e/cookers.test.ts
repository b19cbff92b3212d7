/**
 * Cooker register in headless Chromium: a lead registers a cooker through the form (a bad value is
 * explained next to its field), sees the predicted day as a chart; a cook sees the chart, not the form.
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
async function openFirstKitchenCookers(page: Page) {
  await page.locator('ul li h2 a').first().click();
  await page.getByRole('link', { name: 'Cookers' }).first().click();
  await page.getByRole('heading', { name: 'Cookers', level: 1 }).waitFor();
}

describe('cooker register', () => {
  it('a lead registers a cooker, fixing a bad value the form explains, then sees its predicted day', async () => {
    const page = await browser.newPage({ viewport: { width: 1280, height: 900 } });
    await signIn(page, 'lead.saltbush@example.org');
    await openFirstKitchenCookers(page);
    await page.getByRole('link', { name: 'Register a cooker' }).click();
    await page.getByLabel('Name', { exact: true }).fill('Test box cooker');
    await page.getByLabel('Kind').selectOption('box');
    await page.getByLabel('Aperture (m²)').fill('-1');
    await page.getByLabel('Store mass (kg)').fill('40');
    await page.getByRole('button', { name: 'Save the cooker' }).click();
    await page.getByText('Aperture area is at least 0.05 m².').first().waitFor();
    await page.screenshot({ path: path.join(SCREENSHOT_DIR, 'lead-cooker-form-error.png'), fullPage: true });
    await page.getByLabel('Aperture (m²)').fill('1.5');
    await page.getByRole('button', { name: 'Save the cooker' }).click();
    await page.waitForURL(/\/cookers\/[0-9a-f-]{36}$/);
    await page.getByRole('heading', { name: 'Test box cooker' }).waitFor();
    await page.getByText('Store at midnight').waitFor();
    expect(await page.locator('canvas').count()).toBe(1);
    await page.screenshot({ path: path.join(SCREENSHOT_DIR, 'lead-cooker-prediction.png'), fullPage: true });
    await page.close();
  });

  it('a cook sees the predicted day of a demo cooker but no form', async () => {
    const page = await browser.newPage({ viewport: { width: 360, height: 740 }, isMobile: true });
    await signIn(page, 'cook2.tamarind@example.org');
    // A cook's kitchen card opens Today; its header links to the kitchen, whose tabs lead to the cookers.
    await page.locator('ul li h2 a').first().click();
    await page.waitForURL(/\/today$/);
    await page.getByRole('link', { name: 'Tamarind Court Shelter Canteen' }).click();
    await page.getByRole('link', { name: 'Cookers' }).first().click();
    await page.getByRole('heading', { name: 'Cookers', level: 1 }).waitFor();
    await page.getByRole('link', { name: /Open Trough/ }).click();
    await page.getByText('Store at midnight').waitFor();
    expect(await page.getByRole('button', { name: 'Save the cooker' }).count()).toBe(0);
    expect(await page.locator('canvas').count()).toBe(1);
    await page.screenshot({ path: path.join(SCREENSHOT_DIR, 'cook-cooker-phone.png'), fullPage: true });
    await page.close();
  });
});
