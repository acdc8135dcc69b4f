// "For my instrument" in Chromium: a guest on a share link sets up an instrument without an account and
// downloads the tuning in that instrument's own form. Saves screenshots under tests/e2e/screenshots/.
import { readFileSync } from 'node:fs';
import type { Browser, Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, inject, it } from 'vitest';
import { fifthsPreset } from '../../shared/preset/presets.testing';
import { launchChromium, newContext, screenshot } from './browser';

let browser: Browser;
beforeAll(async () => {
  browser = await launchChromium();
});
afterAll(() => browser.close());

async function post<T>(page: Page, path: string, data: unknown): Promise<T> {
  // The server asks every write for the XSRF-TOKEN cookie back in a header, as Angular sends it.
  const cookies = await page.context().cookies();
  const token = cookies.find((cookie) => cookie.name === 'XSRF-TOKEN')?.value ?? '';
  const headers = { 'X-XSRF-TOKEN': token };
  const answer = await page.request.post(`${inject('appUrl')}${path}`, { data, headers });
  expect(answer.status(), await answer.text()).toBe(201);
  return (await answer.json()) as T;
}

describe('for my instrument', () => {
  it('a guest on a share link sets up an MTS bulk instrument in the browser and downloads its dump', async () => {
    // The owner saves a preset and shares it through the API, as the share dialog does.
    const ownerContext = await newContext(browser);
    const owner = await ownerContext.newPage();
    await owner.goto(`${inject('appUrl')}/auth/github?login=mira-vale&next=/design`);
    await owner.getByRole('button', { name: /Signed in as/ }).waitFor();
    const preset = await post<{ id: string }>(owner, '/api/presets', {
      document: fifthsPreset('Guest Gear Fifths', 8, 3),
    });
    const share = await post<{ url: string }>(owner, `/api/presets/${preset.id}/shares`, {});
    await ownerContext.close();

    const context = await newContext(browser, {
      acceptDownloads: true,
      viewport: { width: 1280, height: 900 },
    });
    const page = await context.newPage();
    await page.goto(share.url);
    await expect
      .poll(() => page.getByRole('heading', { level: 1 }).textContent())
      .toContain('Guest Gear Fifths');

    await page.getByRole('button', { name: 'Set up an instrument' }).click();
    const dialog = page.getByRole('dialog');
    await dialog.getByText('No account needed: it is kept in this browser only.').waitFor();
    await dialog.getByLabel('Instrument name').fill('Guest synth');
    await dialog.getByRole('combobox', { name: 'Takes a tuning as' }).click();
    await page.getByRole('option', { name: 'MTS bulk dump', exact: true }).click();
    await dialog.getByLabel('Device id').fill('16');
    await dialog.getByLabel('Tuning program').fill('5');
    await dialog.getByRole('button', { name: 'Add instrument' }).click();
    await dialog.waitFor({ state: 'detached' });

    const link = page.getByRole('link', { name: /MTS bulk dump \(\.syx\) for Guest synth/ });
    await link.waitFor();
    const stored = await page.evaluate(() => localStorage.getItem('keyloom.instruments'));
    expect(JSON.parse(stored!)).toEqual([
      expect.objectContaining({ name: 'Guest synth', deviceId: 16, program: 5 }),
    ]);
    await screenshot(page, 'instruments-guest-share');
    await page.setViewportSize({ width: 390, height: 844 });
    await expect
      .poll(() => page.evaluate(() => document.documentElement.scrollWidth))
      .toBeLessThanOrEqual(390);
    await screenshot(page, 'instruments-guest-share-390');
    await page.setViewportSize({ width: 1280, height: 900 });

    const [download] = await Promise.all([page.waitForEvent('download'), link.click()]);
    const bytes = readFileSync((await download.path())!);
    // MIDI Tuning specification: a bulk dump is F0 7E <device> 08 01 <program> ..., 408 bytes in all,
    // ending in a checksum (the XOR of bytes 1-405, AND 7F) and F7.
    expect(bytes.length).toBe(408);
    expect([...bytes.subarray(0, 6)]).toEqual([0xf0, 0x7e, 0x10, 0x08, 0x01, 5]);
    expect(bytes[2]).toBe(0x10);
    expect(bytes[5]).toBe(5);
    let checksum = 0;
    for (let i = 1; i < 406; i++) checksum ^= bytes[i];
    expect(bytes[406]).toBe(checksum & 0x7f);
    expect(bytes[407]).toBe(0xf7);
    await context.close();
  });
});
