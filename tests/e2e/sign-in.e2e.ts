import type { Browser } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, inject, it } from 'vitest';
import { launchChromium, newPage, screenshot } from './browser';

let browser: Browser;
beforeAll(async () => {
  browser = await launchChromium();
});
afterAll(() => browser.close());

describe('signing in through the GitHub stand-in', () => {
  it('picks a demo member on the provider page, comes back signed in, and signs out', async () => {
    const page = await newPage(browser);
    await page.goto(`${inject('appUrl')}/design`);
    await page.getByRole('link', { name: 'Sign in with GitHub' }).click();

    await page.waitForURL((url) => url.origin === inject('githubUrl'));
    await screenshot(page, 'provider-page');
    await page.getByRole('button', { name: /Mira Vale/ }).click();

    await page.waitForURL((url) => url.origin === inject('appUrl'));
    const member = page.getByRole('button', { name: /Signed in as Mira Vale/ });
    await member.waitFor();
    expect(await member.locator('img').getAttribute('src')).toMatch(/\/avatars\/mira-vale\.svg$/);
    // The avatar is a file of its own: it may still be on its way when the button shows.
    await expect
      .poll(() =>
        member
          .locator('img')
          .evaluate((img: HTMLImageElement) => img.complete && img.naturalWidth > 0),
      )
      .toBe(true);
    await screenshot(page, 'signed-in');

    await member.click();
    await page.getByRole('menuitem', { name: 'Sign out' }).click();
    await page.getByRole('link', { name: 'Sign in with GitHub' }).waitFor();
    const me = await page.evaluate(() => fetch('/api/me').then((r) => r.json()));
    expect(me).toEqual({ user: null });
    await page.close();
  });
});
