// "For my instrument" in Chromium: a guest on a share link sets up an instrument without an account and
// downloads the tuning in that instrument's own form; a member downloads from the library and retunes a song for
// instruments kept in the account. Saves screenshots under tests/e2e/screenshots/.
import { readFileSync } from 'node:fs';
import { type MidiEvent, parseMidi, writeMidi } from 'midi-file';
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

  it('a member downloads from the library and retunes a song for instruments of their own, each in its own form', async () => {
    const context = await newContext(browser, {
      acceptDownloads: true,
      viewport: { width: 1280, height: 900 },
    });
    const page = await context.newPage();
    await page.goto(`${inject('appUrl')}/auth/github?login=mira-vale&next=/library`);
    await page.getByRole('button', { name: /Signed in as/ }).waitFor();
    const name = `Studio Gear Fifths ${Date.now().toString(36)}`;
    const preset = await post<{ id: string }>(page, '/api/presets', {
      document: fifthsPreset(name, 8, 3),
    });
    const ondes = await post<{ id: string }>(page, '/api/instruments', {
      name: 'Studio Ondes',
      receives: 'mts-bulk',
      deviceId: 16,
      program: 5,
    });
    await post(page, '/api/instruments', {
      name: 'Studio Lattice',
      receives: 'mpe',
      bendRange: 48,
      memberChannels: [2, 9],
    });

    // The library: the row's menu, then the instrument's own download.
    await page.goto(`${inject('appUrl')}/library?q=${encodeURIComponent(name)}`);
    await page.getByRole('button', { name: `Actions for ${name}` }).click();
    await page.getByRole('menuitem', { name: /Download for my instrument/ }).click();
    const item = page.getByRole('menuitem', { name: 'For Studio Ondes: MTS bulk dump .syx' });
    await item.waitFor();
    await screenshot(page, 'instruments-library-menu');
    const [download] = await Promise.all([page.waitForEvent('download'), item.click()]);
    const bytes = readFileSync((await download.path())!);
    const served = await page.request.get(
      `${inject('appUrl')}/api/presets/${preset.id}/export/mts-bulk?instrument=${ondes.id}`,
    );
    expect(served.status()).toBe(200);
    expect(Buffer.compare(bytes, await served.body())).toBe(0);
    // MIDI Tuning specification: a bulk dump is F0 7E <device> 08 01 <program> ..., 408 bytes in all; the
    // instrument's device 16 and program 5 stand in for the preset's own.
    expect(bytes.length).toBe(408);
    expect([...bytes.subarray(0, 6)]).toEqual([0xf0, 0x7e, 0x10, 0x08, 0x01, 5]);

    // The retune page: the MPE instrument sets the mode, its bend range and its member channels.
    const events: MidiEvent[] = [];
    for (const key of [60, 64, 67]) {
      events.push({ deltaTime: 0, channel: 0, type: 'noteOn', noteNumber: key, velocity: 90 });
      events.push({ deltaTime: 0, channel: 0, type: 'noteOn', noteNumber: key + 12, velocity: 90 });
      events.push({ deltaTime: 480, channel: 0, type: 'noteOff', noteNumber: key, velocity: 0 });
      events.push({ deltaTime: 0, channel: 0, type: 'noteOff', noteNumber: key + 12, velocity: 0 });
    }
    events.push({ deltaTime: 0, meta: true, type: 'endOfTrack' });
    const song = Buffer.from(
      writeMidi({ header: { format: 0, numTracks: 1, ticksPerBeat: 480 }, tracks: [events] }),
    );
    await page.goto(`${inject('appUrl')}/retune`);
    await page
      .locator('input[type=file]')
      .first()
      .setInputFiles({ name: 'studio-tune.mid', mimeType: 'audio/midi', buffer: song });
    await page.getByRole('radio', { name: 'A saved preset' }).check();
    await page.getByRole('combobox', { name: 'Saved preset' }).click();
    await page.getByRole('option', { name }).first().click();
    await page.getByRole('combobox', { name: 'For my instrument' }).click();
    await page.getByRole('option', { name: 'Studio Lattice' }).click();
    await expect
      .poll(() => page.getByRole('radio', { name: /One note per channel/ }).isChecked())
      .toBe(true);
    await page.getByRole('button', { name: /^Retune/ }).click();
    const link = page.getByRole('link', { name: /Download/ }).first();
    await link.waitFor();
    await screenshot(page, 'instruments-retune-report');
    const [retuned] = await Promise.all([page.waitForEvent('download'), link.click()]);
    const tuned = parseMidi(readFileSync((await retuned.path())!));
    const all = tuned.tracks.flat();
    const notes = all.filter((event) => event.type === 'noteOn' && event.velocity > 0);
    expect(notes).toHaveLength(6);
    // MPE specification: member channels 2 to 9 are 1 to 8 counted from zero, as SMF 1.0 stores them.
    const channels = new Set(notes.map((note) => (note as { channel: number }).channel));
    expect(Math.min(...channels)).toBeGreaterThanOrEqual(1);
    expect(Math.max(...channels)).toBeLessThanOrEqual(8);
    // MIDI 1.0 Detailed Specification: RPN 0 (pitch bend sensitivity) is set with controllers 101 = 0, 100 = 0,
    // then data entry (6) = semitones: the instrument's 48, not the preset's own.
    const dataEntries = all.filter(
      (event) =>
        event.type === 'controller' && event.controllerType === 6 && channels.has(event.channel),
    );
    expect(dataEntries.length).toBeGreaterThan(0);
    expect(new Set(dataEntries.map((event) => (event as { value: number }).value))).toEqual(
      new Set([48]),
    );
    await context.close();
  });
});
