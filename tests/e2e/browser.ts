// Debian's Chromium through playwright-core, as root, headless, with no network of its own.
import { mkdirSync } from 'node:fs';
import { join } from 'node:path';
import {
  chromium,
  type Browser,
  type BrowserContext,
  type BrowserContextOptions,
  type Page,
} from 'playwright-core';
import { repoRoot } from '../../scripts/stack/postgres';

export const screenshotDir = join(repoRoot, 'tests/e2e/screenshots');

/** Chromium with the project's flags, and `extraArgs` (a fake microphone, say) after them. */
export function launchChromium(extraArgs: string[] = []): Promise<Browser> {
  return chromium.launch({
    executablePath: process.env['CHROME_BIN'] ?? '/usr/bin/chromium',
    args: [
      '--no-sandbox',
      '--headless',
      '--disable-gpu',
      '--disable-background-networking',
      '--disable-component-update',
      '--disable-sync',
      '--no-first-run',
      '--disable-quic',
      '--disable-dev-shm-usage',
      ...extraArgs,
    ],
  });
}

/**
 * How long a step may wait for the page's own signal (an element, a navigation, a download) on a machine that is
 * busy with other work: a lazy route's chunk, a server answer. Polls get as long (expect.poll in vitest.config.ts).
 */
const pageWait = 60_000;

/** A browser profile of its own whose pages wait as long as a slow machine needs; open every test's pages here. */
export async function newContext(
  browser: Browser,
  options: BrowserContextOptions = {},
): Promise<BrowserContext> {
  const context = await browser.newContext(options);
  context.setDefaultTimeout(pageWait);
  context.setDefaultNavigationTimeout(pageWait);
  return context;
}

/** One page in a fresh profile of its own (as `browser.newPage()`), waiting as long as a slow machine needs. */
export async function newPage(
  browser: Browser,
  options: BrowserContextOptions = {},
): Promise<Page> {
  const page = await browser.newPage(options);
  page.setDefaultTimeout(pageWait);
  page.setDefaultNavigationTimeout(pageWait);
  return page;
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
