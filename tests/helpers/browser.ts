import { chromium, type Browser } from 'playwright-core';
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
