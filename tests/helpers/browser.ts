import { chromium, type Browser, type Page } from 'playwright-core';
import { mkdir } from 'node:fs/promises';
import path from 'node:path';

export const SCREENSHOT_DIR = path.resolve('tests/e2e/screenshots');

/** Debian's Chromium, headless, with a fresh profile (Playwright makes a temporary one) and no background networking (closed network). */
export async function launchBrowser(): Promise<Browser> {
  await mkdir(SCREENSHOT_DIR, { recursive: true });
  return chromium.launch({
    executablePath: process.env.CHROMIUM_PATH ?? '/usr/bin/chromium',
    headless: true,
    args: [
      '--no-sandbox',
      '--disable-gpu',
      '--disable-quic',
      '--no-first-run',
      '--disable-background-networking',
      '--disable-component-update',
      '--disable-sync',
    ],
  });
}

/** Signs in through the sign-in page as a person would and waits for the home page. */
export async function signInThroughPage(page: Page, baseUrl: string, email: string, password: string): Promise<void> {
  await page.goto(`${baseUrl}/sign-in`);
  await page.getByLabel('E-mail address').fill(email);
  await page.getByLabel('Password').fill(password);
  await page.getByRole('button', { name: 'Sign in' }).click();
  await page.waitForURL(`${baseUrl}/`);
}
