import type { Browser } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, inject, it } from 'vitest';
import { isLoopback, launchChromium, newPage, screenshot } from './browser';

let browser: Browser;
beforeAll(async () => {
  browser = await launchChromium();
});
afterAll(() => browser.close());

describe('the app shell in Chromium', () => {
  it('loads with every non-loopback request aborted, attempts none, and has both fonts loaded', async () => {
    const page = await newPage(browser);
    const outside: string[] = [];
    await page.route('**/*', (route) => {
      const url = route.request().url();
      if (isLoopback(url)) return route.continue();
      outside.push(url);
      return route.abort();
    });
    const failures: string[] = [];
    page.on('requestfailed', (r) => failures.push(`${r.url()} ${r.failure()?.errorText}`));
    page.on('pageerror', (e) => failures.push(e.message));
    // The server's content security policy allows no inline script: the app must run without tripping it.
    page.on('console', (m) => {
      if (/Content Security Policy/i.test(m.text())) failures.push(m.text());
    });

    const answer = await page.goto(inject('appUrl'));
    expect(answer?.headers()['content-security-policy']).toContain("script-src 'self'");
    await page.getByRole('link', { name: 'Sign in with GitHub' }).waitFor();
    const fonts = await page.evaluate(async () => {
      await document.fonts.ready;
      const loaded = (family: string) =>
        [...document.fonts].some(
          (face) => face.family.replace(/"/g, '') === family && face.status === 'loaded',
        );
      return {
        roboto: loaded('Roboto') && document.fonts.check('16px Roboto'),
        symbols:
          loaded('Material Symbols Outlined') &&
          document.fonts.check('24px "Material Symbols Outlined"'),
      };
    });
    await screenshot(page, 'shell-signed-out');

    expect(outside).toEqual([]);
    expect(failures).toEqual([]);
    expect(fonts).toEqual({ roboto: true, symbols: true });
    // The redirect from / may land after the shell has drawn its toolbar.
    await expect.poll(() => new URL(page.url()).pathname).toBe('/design');
    await page.close();
  });

  it('navigates between the main destinations, and shows a clear page for an unknown address', async () => {
    const page = await newPage(browser);
    await page.goto(`${inject('appUrl')}/design`);
    const title = page.getByRole('heading', { level: 1 });
    for (const [label, heading] of [
      ['Library', 'Library'],
      ['Retune', 'Retune a song'],
      ['Bands', 'Bands'],
    ]) {
      await page
        .getByRole('navigation', { name: 'Main' })
        .getByRole('link', { name: label })
        .click();
      // Each destination is a lazy route: its heading appears once its code has loaded, however long that takes.
      await page.getByRole('heading', { level: 1, name: heading, exact: true }).waitFor();
      expect(await title.textContent()).toBe(heading);
    }
    await expect.poll(() => page.title()).toBe('Bands · Keyloom');

    await page.goto(`${inject('appUrl')}/no/such/page`);
    await page
      .getByRole('heading', { level: 1, name: 'Nothing plays on this key', exact: true })
      .waitFor();
    expect(await title.textContent()).toBe('Nothing plays on this key');
    await screenshot(page, 'not-found');
    await page.close();
  });

  it('fits a 390 px wide screen without sideways scrolling', async () => {
    const page = await newPage(browser, { viewport: { width: 390, height: 844 } });
    await page.goto(`${inject('appUrl')}/design`);
    await page.getByRole('link', { name: 'Sign in with GitHub' }).waitFor();
    // Measure the designer itself, not the shell alone while the route's code is still loading.
    await page.getByLabel('Preset name').waitFor();
    const overflow = await page.evaluate(
      () => document.documentElement.scrollWidth - document.documentElement.clientWidth,
    );
    await screenshot(page, 'shell-390px');
    expect(overflow).toBeLessThanOrEqual(0);

    // Twelve degrees: the offset chart fits the phone's width whole, and the degree table keeps its first columns
    // in view while it scrolls sideways.
    await page.getByLabel('Generators up').fill('8');
    await page.getByLabel('Generators down').fill('3');
    await page.locator('app-offset-chart text.note').nth(11).waitFor();
    const chart = await page
      .locator('app-offset-chart .scroller')
      .evaluate((s) => s.scrollWidth - s.clientWidth);
    expect(chart).toBeLessThanOrEqual(0);
    const table = page.locator('app-degree-table .scroller');
    await table.evaluate((s) => (s.scrollLeft = s.scrollWidth));
    const [firstCell, frame] = await Promise.all([
      page.locator('app-degree-table tbody tr').first().locator('td').first().boundingBox(),
      table.boundingBox(),
    ]);
    expect(firstCell!.x).toBeGreaterThanOrEqual(frame!.x - 1);
    await screenshot(page, 'degrees-390px-scrolled');
    await page.close();
  });
});
