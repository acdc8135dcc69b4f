// Debian's Chromium through playwright-core, as root, headless, with no network of its own.
import { mkdirSync } from 'node:fs';
import { join } from 'node:path';
import { chromium, type Browser, type Page } from 'playwright-core';
import { repoRoot } from '../../scripts/stack/postgres';

export const screenshotDir = join(repoRoot, 'tests/e2e/screenshots');

export function launchChromium(): Promise<Browser> {
  return chromium.launch({
    executablePath: process.env['CHROME_BIN'] ?? '/usr/bin/chromium',
    args: [
      '--no-sandbox', '--headless', '--disable-gpu', '--disable-background-networking', '--disable-component-update',
      '--disable-sync', '--no-first-run', '--disable-quic', '--disable-dev-shm-usage',
    ],
  });
}

/** Saves a full-page screenshot under tests/e2e/screenshots/ for a person to look at. */
export async function screenshot(page: Page, name: string): Promise<void> {
  mkdirSync(screenshotDir, { recursive: true });
  await page.screenshot({ path: join(screenshotDir, `${name}.png`), fullPage: true });
}

export function isLoopback(url: string): boolean {
  const { protocol, hostname } = new URL(url);
  if (protocol === 'data:' || protocol === 'blob:' || protocol === 'about:') return true;
  return hostname === '127.0.0.1' || hostname === 'localhost' || hostname === '[::1]';
}
