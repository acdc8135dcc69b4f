// Every page and tab checked with axe-core, the general-purpose accessibility checker: no serious or critical
// violation anywhere. axe is injected into the page, so the browser profile bypasses the app's content policy.
import type { Browser, Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, inject, it } from 'vitest';
import { type Violation, axeSource, seriousViolations } from './axe';
import { launchChromium, newContext } from './browser';

let browser: Browser;
beforeAll(async () => {
  browser = await launchChromium();
});
afterAll(() => browser.close());

async function opened(path: string, heading: string, login?: string): Promise<Page> {
  const context = await newContext(browser, {
    bypassCSP: true,
    viewport: { width: 1280, height: 1000 },
  });
  const page = await context.newPage();
  // Signing in through the GitHub stand-in's shortcut comes back to the page asked for.
  const address = login ? `/auth/github?login=${login}&next=${encodeURIComponent(path)}` : path;
  await page.goto(`${inject('appUrl')}${address}`);
  await page.getByRole('heading', { level: 1, name: heading, exact: true }).waitFor();
  return page;
}

describe('accessibility of every page and tab (axe-core)', () => {
  it('finds no moderate, serious or critical violation of landmarks: every part of the shell is in one', async () => {
    const page = await opened('/design', 'Design a scale');
    await page.addScriptTag({ path: axeSource });
    const region = await page.evaluate(async () => {
      const axe = (
        window as unknown as {
          axe: { run(context: Document, options: object): Promise<{ violations: Violation[] }> };
        }
      ).axe;
      return (await axe.run(document, { runOnly: ['region'] })).violations.flatMap((v) =>
        v.nodes.map((n) => n.target.join(' ')),
      );
    });
    expect(region).toEqual([]);
    await page.context().close();
  });

  for (const [path, heading] of [
    ['/library', 'Library'],
    ['/bands', 'Bands'],
  ]) {
    it(`finds no serious or critical violation on ${path}, signed in`, async () => {
      const page = await opened(path, heading, 'mira-vale');
      await page.getByRole('button', { name: /Signed in as/ }).waitFor();
      expect(await seriousViolations(page)).toEqual([]);
      await page.context().close();
    });
  }

  it('finds no serious or critical violation in the designer, on any of its tabs', async () => {
    const page = await opened('/design', 'Design a scale');
    expect(await seriousViolations(page)).toEqual([]);
    for (const tab of ['Keys', 'Output']) {
      await page.getByRole('tab', { name: tab }).click();
      await page.getByRole('tab', { name: tab, selected: true }).waitFor();
      expect(await seriousViolations(page), tab).toEqual([]);
    }
    await page.context().close();
  });

  for (const [path, heading] of [
    ['/library', 'Library'],
    ['/retune', 'Retune a song'],
    ['/bands', 'Bands'],
    ['/import', 'Import a tuning'],
    ['/temperaments', 'Generator search'],
    ['/instruments', 'My instruments'],
    ['/tuner', 'Tuner'],
    ['/no/such/page', 'Nothing plays on this key'],
  ]) {
    it(`finds no serious or critical violation on ${path}`, async () => {
      const page = await opened(path, heading);
      expect(await seriousViolations(page)).toEqual([]);
      await page.context().close();
    });
  }
});
