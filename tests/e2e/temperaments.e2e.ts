// Generator search in Chromium against the real `POST /api/temperaments`: from "temper out 81/80" to a playable
// 12-note and 19-note scale in two steps (search, then open a size), refusals beside their field, suggested commas,
// and the page at a phone's width in both themes. Screenshots land in tests/e2e/screenshots/.
import type { Browser, Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, inject, it } from 'vitest';
import { launchChromium, newContext, screenshot } from './browser';

let browser: Browser;
beforeAll(async () => {
  browser = await launchChromium();
});
afterAll(() => browser.close());

async function searchPage(
  viewport = { width: 1280, height: 900 },
  colorScheme: 'light' | 'dark' = 'light',
): Promise<Page> {
  const context = await newContext(browser, { viewport, colorScheme });
  const page = await context.newPage();
  await page.goto(`${inject('appUrl')}/temperaments`);
  await page.getByRole('heading', { level: 1, name: 'Generator search', exact: true }).waitFor();
  return page;
}

/** Step one: the commas typed, Enter pressed, the answer's table waited for. */
async function temperOut(page: Page, commas: string): Promise<void> {
  const field = page.getByLabel('Commas to temper out');
  await field.fill(commas);
  await field.press('Enter');
  await page.locator('app-temperament-table table').waitFor();
}

/** The figures of the row of one tuning: period, generator, then the errors. */
async function rowOf(page: Page, tuning: string): Promise<string[]> {
  const row = page.locator('app-temperament-table tbody tr', {
    has: page.locator('th .short', { hasText: new RegExp(`^${tuning}$`) }),
  });
  return (await row.locator('td').allTextContents()).map((cell) => cell.trim());
}

const cents = (text: string) => Number(text.replace('−', '-').replace('¢', ''));

describe('generator search', () => {
  for (const size of [12, 19]) {
    it(`goes from "temper out 81/80" to a playable ${size}-note scale in two steps`, async () => {
      const page = await searchPage();
      await temperOut(page, '81/80');
      expect(await page.locator('app-temperament-table .mapping').textContent()).toContain(
        // Meantone's mapping with the fourth as generator, the fifth's complement within half an octave: 3/1 is
        // two octaves less a fourth, 5/1 four octaves less four fourths (from memory).
        '[⟨1 2 4], ⟨0 -1 -4]⟩',
      );
      const [period, generator] = await rowOf(page, 'POTE');
      expect(cents(period)).toBe(1200);
      // The POTE fifth of meantone is about 696.24 cents (from memory), so its fourth is 503.76.
      expect(Math.abs(1200 - cents(generator) - 696.24)).toBeLessThan(0.01);

      const sizes = page.getByRole('listbox', { name: 'MOS sizes of the POTE tuning' });
      // 12 and 19 are among meantone's well-formed scale sizes (from memory).
      await sizes.getByRole('option', { name: String(size), exact: true }).click();
      const open = page.getByRole('link', { name: `Open ${size} notes in the designer` });
      await open.waitFor();
      const pattern = (await page.locator('.opening .pattern').textContent())!.trim();
      expect(pattern).toMatch(new RegExp(`^[Ls]{${size}}$`));
      expect(await page.locator('.opening .badge').textContent()).toContain('MOS');
      await screenshot(page, `temperaments-meantone-${size}`);

      await open.click();
      await page.getByRole('heading', { level: 1, name: 'Design a scale', exact: true }).waitFor();
      const summary = page.locator('app-scale-summary');
      await expect.poll(() => summary.textContent()).toContain(`${size} in a period of 2/1`);
      expect(await summary.locator('.pattern').textContent()).toBe(pattern);
      expect(await page.getByLabel('Generator', { exact: true }).inputValue()).toMatch(
        /^503\.7\d*c$/,
      );
      await screenshot(page, `temperaments-meantone-${size}-designer`);
      await page.context().close();
    });
  }

  it('shows a refused comma beside the commas field, and takes the composer there', async () => {
    const page = await searchPage();
    const field = page.getByLabel('Commas to temper out');
    await field.fill('81/80 81/8x');
    await field.press('Enter');
    const fault = page.locator('mat-form-field', { has: field }).locator('mat-error');
    await fault.waitFor();
    expect((await fault.textContent())!.trim()).not.toBe('');
    expect(await field.getAttribute('aria-invalid')).toBe('true');
    expect(await field.evaluate((input) => input === document.activeElement)).toBe(true);
    expect(await page.locator('.actions .fault').count()).toBe(0);
    await screenshot(page, 'temperaments-refusal');
    await page.context().close();
  });

  it('suggests commas for twelve notes and adds the one chosen to the commas', async () => {
    const page = await searchPage();
    await page.getByRole('radio', { name: 'Suggest some' }).click();
    const count = page.getByLabel('Notes per octave');
    await count.fill('12');
    await count.press('Enter');
    const first = page.locator('.suggestions button.suggestion').first();
    await first.waitFor();
    const ratio = /^Add (\S+) to the commas$/.exec((await first.getAttribute('aria-label'))!)?.[1];
    expect(ratio).toMatch(/^\d+\/\d+$/);
    await screenshot(page, 'temperaments-suggestions');
    await first.click();
    const commas = page.getByLabel('Commas to temper out');
    await expect.poll(() => commas.inputValue()).toBe(ratio);
    await commas.press('Enter');
    await page.locator('app-temperament-table table').waitFor();
    expect(await page.locator('app-temperament-table .commas').first().textContent()).toContain(
      ratio,
    );
    await page.context().close();
  });

  for (const colorScheme of ['light', 'dark'] as const) {
    it(`fits a 390 px wide screen in the ${colorScheme} theme, results included`, async () => {
      const page = await searchPage({ width: 390, height: 844 }, colorScheme);
      await temperOut(page, '81/80');
      await page.getByRole('link', { name: /^Open \d+ notes in the designer$/ }).waitFor();
      const overflow = await page.evaluate(
        () => document.documentElement.scrollWidth - document.documentElement.clientWidth,
      );
      await screenshot(page, `temperaments-390-${colorScheme}`);
      expect(overflow).toBeLessThanOrEqual(0);
      await page.context().close();
    });
  }
});
