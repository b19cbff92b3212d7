/**
 * End to end in headless Chromium against the production build: each demo role signs in through
 * the page, sees what the role allows, and a screenshot of each is saved in tests/e2e/screenshots.
 */
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { inject } from 'vitest';
import path from 'node:path';
import type { Browser, Page } from 'playwright-core';
import { launchBrowser, SCREENSHOT_DIR, signInThroughPage } from '../helpers/browser';
import { DEMO_KITCHENS, DEMO_PASSWORD } from '../../lib/demo/seed';

let browser: Browser;
const baseUrl = inject('baseUrl');

beforeAll(async () => {
  browser = await launchBrowser();
});
afterAll(async () => {
  await browser?.close();
});

async function signIn(page: Page, email: string) {
  await signInThroughPage(page, baseUrl, email, DEMO_PASSWORD);
  await page.getByRole('heading', { name: 'Your kitchens' }).waitFor();
  await page.locator('ul li h2').first().waitFor();
}

const kitchenNames = DEMO_KITCHENS.map((k) => k.name);

describe('signing in as each role', () => {
  it('a visitor is sent to the sign-in page, and a wrong password is explained', async () => {
    const page = await browser.newPage({ viewport: { width: 360, height: 740 } });
    await page.goto(`${baseUrl}/`);
    await page.waitForURL(/\/sign-in$/);
    await page.getByLabel('E-mail address').fill('coordinator@example.org');
    await page.getByLabel('Password').fill('not-the-password');
    await page.getByRole('button', { name: 'Sign in' }).click();
    await page.getByRole('alert').filter({ hasText: 'The e-mail address or the password is not right.' }).waitFor();
    await page.screenshot({ path: path.join(SCREENSHOT_DIR, 'sign-in-phone.png'), fullPage: true });
    await page.close();
  });

  it('the coordinator sees all three kitchens and the organisation and people pages', async () => {
    const page = await browser.newPage({ viewport: { width: 1280, height: 800 } });
    await signIn(page, 'coordinator@example.org');
    const names = await page.locator('ul li h2').allTextContents();
    expect(names.sort()).toEqual([...kitchenNames].sort());
    const nav = page.getByRole('navigation', { name: 'Main navigation' });
    await expect(nav.getByRole('link', { name: 'Organisation' }).count()).resolves.toBe(1);
    await expect(nav.getByRole('link', { name: 'People' }).count()).resolves.toBe(1);
    await page.screenshot({ path: path.join(SCREENSHOT_DIR, 'coordinator-home.png'), fullPage: true });
    await nav.getByRole('link', { name: 'Organisation' }).click();
    await page.getByRole('heading', { name: 'Add a kitchen' }).waitFor();
    await page.screenshot({ path: path.join(SCREENSHOT_DIR, 'coordinator-organisation.png'), fullPage: true });
    await page.close();
  });

  it('a kitchen lead sees only their kitchen, can invite, and cannot open the organisation page', async () => {
    const page = await browser.newPage({ viewport: { width: 1280, height: 800 } });
    await signIn(page, 'lead.baobab@example.org');
    expect(await page.locator('ul li h2').allTextContents()).toEqual(['Baobab Ridge School Kitchen']);
    const nav = page.getByRole('navigation', { name: 'Main navigation' });
    await expect(nav.getByRole('link', { name: 'Organisation' }).count()).resolves.toBe(0);
    await expect(nav.getByRole('link', { name: 'People' }).count()).resolves.toBe(1);
    const res = await page.goto(`${baseUrl}/organisation`);
    expect(res?.status()).toBe(404);
    await page.goto(`${baseUrl}/people`);
    await page.getByRole('heading', { name: 'Invite someone' }).waitFor();
    await page.screenshot({ path: path.join(SCREENSHOT_DIR, 'lead-people.png'), fullPage: true });
    await page.close();
  });

  it('a cook on a phone sees only their kitchen, no people or organisation links, and can switch to French', async () => {
    const page = await browser.newPage({ viewport: { width: 360, height: 740 }, isMobile: true, hasTouch: true });
    await signIn(page, 'cook1.tamarind@example.org');
    expect(await page.locator('ul li h2').allTextContents()).toEqual(['Tamarind Court Shelter Canteen']);
    await page.getByRole('button', { name: 'Menu' }).click();
    const nav = page.getByRole('navigation', { name: 'Main navigation' });
    await expect(nav.getByRole('link', { name: 'People' }).count()).resolves.toBe(0);
    await expect(nav.getByRole('link', { name: 'Organisation' }).count()).resolves.toBe(0);
    await page.screenshot({ path: path.join(SCREENSHOT_DIR, 'cook-home-phone-menu.png'), fullPage: true });
    await page.getByLabel('Language').selectOption('fr');
    await page.getByRole('heading', { name: 'Vos cuisines' }).waitFor();
    await page.screenshot({ path: path.join(SCREENSHOT_DIR, 'cook-home-phone-fr.png'), fullPage: true });
    // The page is no wider than the phone: nothing forces horizontal scrolling.
    const width = await page.evaluate(() => document.documentElement.scrollWidth);
    expect(width).toBeLessThanOrEqual(360);
    // Back to English for the other tests that share the account.
    await page.getByLabel('Langue').first().selectOption('en');
    await page.getByRole('heading', { name: 'Your kitchens' }).waitFor();
    await page.close();
  });
});
