// The tuner in Chromium with a fake microphone: a generated WAV (silence, then a tone 5 cents sharp of E4 in the
// demo band's twelve pure fifths) that Chromium loops as its capture device. A guest opens it from a share link,
// a member from the designer and from the stage; each reads the tone in the "Tuner reading".
import { mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import type { Browser, Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, inject, it } from 'vitest';
import { demoBand } from '../../scripts/stack/demo-data';
import { writeToneWav } from '../support/tone-wav';
import { seriousViolations } from './axe';
import { launchChromium, newContext, screenshot } from './browser';

// Middle C at A = 440 Hz is 440 x 2^(-9/12) = 261.6256 Hz; E4 of a chain of pure fifths from C is 81/64 above
// it (degree 4 of twelve: C C# D Eb E), 331.1198 Hz; 5 cents above is x 2^(5/1200) (arithmetic).
const e4 = (440 * 2 ** (-9 / 12) * 81) / 64;
const toneHz = e4 * 2 ** (5 / 1200);
/** "+5.0 cents" within half a cent, the tuner's accuracy target: +4.5 to +5.5. */
const fiveCentsSharp = /^\+(4\.[5-9]|5\.[0-5]) cents$/;

let browser: Browser;
let folder: string;
beforeAll(async () => {
  folder = mkdtempSync(join(tmpdir(), 'keyloom-tuner-'));
  const wav = join(folder, 'e4-sharp.wav');
  writeToneWav(wav, { hz: toneHz, harmonics: 10, silenceSeconds: 0.6, toneSeconds: 1.4 });
  browser = await launchChromium([
    '--use-fake-device-for-media-stream',
    '--use-fake-ui-for-media-stream',
    `--use-file-for-fake-audio-capture=${wav}`,
  ]);
});
afterAll(async () => {
  await browser.close();
  rmSync(folder, { recursive: true, force: true });
});

/**
 * A fresh profile that may use the microphone, signed in as `login` when given; `forAxe` lets axe be injected past
 * the app's content policy, which the other profiles keep.
 */
async function visitor(login?: string, forAxe = false): Promise<Page> {
  const context = await newContext(browser, {
    bypassCSP: forAxe,
    viewport: { width: 1280, height: 900 },
  });
  await context.grantPermissions(['microphone'], { origin: inject('appUrl') });
  const page = await context.newPage();
  if (login) {
    await page.goto(`${inject('appUrl')}/auth/github?login=${login}&next=/design`);
    await page.getByRole('button', { name: /Signed in as/ }).waitFor();
  }
  return page;
}

async function post<T>(page: Page, path: string, data: unknown): Promise<T> {
  const cookies = await page.context().cookies();
  const token = cookies.find((cookie) => cookie.name === 'XSRF-TOKEN')?.value ?? '';
  const answer = await page.request.post(`${inject('appUrl')}${path}`, {
    data,
    headers: { 'X-XSRF-TOKEN': token },
  });
  expect(answer.status(), await answer.text()).toBe(201);
  return (await answer.json()) as T;
}

/** The demo band's Fen Fifths: twelve pure fifths from C (its second revision). */
async function fenFifths(page: Page): Promise<{ id: string }> {
  const list = await page.request.get(`${inject('appUrl')}/api/presets?bandId=${demoBand.id}`);
  const presets = ((await list.json()) as { items: { id: string; name: string }[] }).items;
  const found = presets.find((preset) => preset.name === 'Fen Fifths');
  expect(found, 'the demo preset Fen Fifths').toBeDefined();
  return found!;
}

/** Presses Start and waits for the reading of `key` and `degree` to come within half a cent of +5.0. */
async function readsFiveCentsSharp(page: Page, key: string, degree: number): Promise<void> {
  await page.getByRole('heading', { level: 1, name: 'Tuner' }).waitFor();
  await page.getByRole('button', { name: 'Start listening' }).click();
  const reading = page.getByRole('status', { name: 'Tuner reading' });
  const prefix = `${key} · degree ${degree} · `;
  await expect
    .poll(async () => {
      const text = (await reading.textContent())?.trim() ?? '';
      return text.startsWith(prefix) && fiveCentsSharp.test(text.slice(prefix.length));
    })
    .toBe(true);
}

describe('the tuner with a fake microphone', () => {
  it('reads the demo preset from a share link, signed out: E4 · degree 4 · +5.0 cents', async () => {
    const owner = await visitor('mira-vale');
    const preset = await fenFifths(owner);
    const share = await post<{ url: string; token: string }>(
      owner,
      `/api/presets/${preset.id}/shares`,
      {},
    );
    await owner.context().close();

    const guest = await visitor(undefined, true);
    await guest.goto(share.url);
    await guest.getByRole('link', { name: 'Sign in with GitHub', exact: true }).waitFor();
    await guest.getByRole('link', { name: 'Tune with a microphone' }).click();
    await guest.waitForURL(/\/tuner\?share=/);
    await readsFiveCentsSharp(guest, 'E4', 4);
    await expect.poll(() => guest.locator('.facts').textContent()).toContain('331.12 Hz');
    await screenshot(guest, 'tuner-shared');
    expect(await seriousViolations(guest)).toEqual([]);

    // The silence between the loops of the file reads as no clear pitch, never as a number.
    const reading = guest.getByRole('status', { name: 'Tuner reading' });
    await expect.poll(() => reading.textContent()).toContain('No clear pitch');
    await expect.poll(() => reading.textContent()).toContain('E4 · degree 4 ·');

    // Locked to the key it hears, for tuning one string; the help says how the reading is smoothed.
    await guest.getByRole('button', { name: 'Lock to E4' }).click();
    await expect
      .poll(() => guest.locator('.locked').textContent())
      .toContain('Locked to E4 (key 64)');
    await guest.getByRole('button', { name: 'How the tuner listens' }).click();
    await expect
      .poll(() => guest.getByText(/the average of the last 5 readings/).isVisible())
      .toBe(true);
    await screenshot(guest, 'tuner-shared-locked');

    await guest.setViewportSize({ width: 390, height: 844 });
    await expect
      .poll(() => guest.evaluate(() => document.documentElement.scrollWidth))
      .toBeLessThanOrEqual(390);
    await screenshot(guest, 'tuner-shared-390');
    await guest.emulateMedia({ colorScheme: 'dark' });
    await screenshot(guest, 'tuner-shared-390-dark');
    await guest.setViewportSize({ width: 1280, height: 900 });
    await screenshot(guest, 'tuner-shared-dark');
    await guest.getByRole('button', { name: 'Stop listening' }).click();
    await expect.poll(() => reading.textContent()).toContain('Not listening');
    await guest.goto(share.url);
    await guest.getByRole('link', { name: 'Tune with a microphone' }).waitFor();
    await screenshot(guest, 'tuner-shared-page-dark');
    await guest.context().close();
  });

  it('opens from the designer, a saved preset and a design of one’s own', async () => {
    const member = await visitor('mira-vale');
    const preset = await fenFifths(member);
    await member.goto(`${inject('appUrl')}/presets/${preset.id}`);
    await expect.poll(() => member.getByRole('status').first().textContent()).toContain('Revision');
    await member.setViewportSize({ width: 390, height: 844 });
    await expect
      .poll(() => member.evaluate(() => document.documentElement.scrollWidth))
      .toBeLessThanOrEqual(390);
    await screenshot(member, 'tuner-link-designer-390');
    await member.setViewportSize({ width: 1280, height: 900 });
    await member.getByRole('link', { name: /^Tuner/ }).click();
    await member.waitForURL(new RegExp(`/tuner\\?preset=${preset.id}&revision=\\d+`));
    await readsFiveCentsSharp(member, 'E4', 4);
    await member.context().close();

    // The designer's new design: seven degrees from C on the white keys, E being degree 2.
    const guest = await visitor();
    await guest.goto(`${inject('appUrl')}/design`);
    await guest.getByRole('link', { name: /^Tuner/ }).click();
    await guest.waitForURL(/\/tuner\?d=/);
    await readsFiveCentsSharp(guest, 'E4', 2);
    await guest.context().close();
  });

  it('opens from the stage at the entry on stage', async () => {
    const owner = await visitor('mira-vale');
    const preset = await fenFifths(owner);
    const setlist = await post<{ id: string }>(owner, `/api/bands/${demoBand.id}/setlists`, {
      name: 'Tuner test',
      entries: [{ presetId: preset.id }],
    });
    await owner.goto(`${inject('appUrl')}/stage/${setlist.id}`);
    await expect.poll(() => owner.locator('.current').textContent()).toContain('Fen Fifths');
    await screenshot(owner, 'tuner-link-stage');
    await owner.getByRole('link', { name: 'Tune with a microphone' }).click();
    await owner.waitForURL(new RegExp(`/tuner\\?preset=${preset.id}&revision=\\d+`));
    await readsFiveCentsSharp(owner, 'E4', 4);
    await screenshot(owner, 'tuner-stage');
    await owner.context().close();
  });
});
