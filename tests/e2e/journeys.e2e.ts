// The product's five user journeys in Chromium, as a person drives the app: by labels and roles. Each saves
// screenshots under tests/e2e/screenshots/.
import { readFileSync } from 'node:fs';
import { type MidiEvent, parseMidi, writeMidi } from 'midi-file';
import type { Browser, BrowserContext, Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, inject, it } from 'vitest';
import { launchChromium, newContext, screenshot } from './browser';

let browser: Browser;
beforeAll(async () => {
  browser = await launchChromium();
});
afterAll(() => browser.close());

/** A fresh browser profile, signed in through the GitHub stand-in as `login` when given. */
async function visitor(login?: string): Promise<{ context: BrowserContext; page: Page }> {
  const context = await newContext(browser, {
    acceptDownloads: true,
    viewport: { width: 1280, height: 900 },
  });
  const page = await context.newPage();
  if (login) {
    await page.goto(`${inject('appUrl')}/auth/github?login=${login}&next=/design`);
    await page.getByRole('button', { name: /Signed in as/ }).waitFor();
  }
  return { context, page };
}

async function downloaded(
  page: Page,
  start: () => Promise<void>,
): Promise<{ name: string; bytes: Buffer }> {
  const [download] = await Promise.all([page.waitForEvent('download'), start()]);
  return { name: download.suggestedFilename(), bytes: readFileSync((await download.path())!) };
}

/** Screenshots at the desktop width and at a phone's 390 px, where the page must not scroll. */
async function rollScreenshots(page: Page, name: string): Promise<void> {
  await screenshot(page, name);
  await page.setViewportSize({ width: 390, height: 844 });
  await expect
    .poll(() => page.evaluate(() => document.documentElement.scrollWidth))
    .toBeLessThanOrEqual(390);
  await screenshot(page, `${name}-390`);
  await page.setViewportSize({ width: 1280, height: 900 });
}

describe('journey 1: a composer designs signed out and downloads an MTS bulk dump', () => {
  it('builds 5 fifths up and 1 down from C, sees the degrees, keeps the design in the address, and downloads it', async () => {
    const { context, page } = await visitor();
    await page.goto(`${inject('appUrl')}/design`);
    await page.getByLabel('Preset name').fill('Journey Fifths');
    const generator = page.getByLabel('Generator', { exact: true });
    await generator.fill('1.5');
    await expect.poll(() => page.getByText('needs a unit').count()).toBeGreaterThan(0);
    await generator.fill('3/2');
    await page.getByLabel('Generators up').fill('5');
    await page.getByLabel('Generators down').fill('1');
    const column = (n: number) =>
      page.locator('table').first().locator(`tbody tr td:nth-child(${n})`);
    await expect
      .poll(async () => (await column(3).allTextContents()).map((text) => text.trim()))
      .toEqual(['1/1', '9/8', '81/64', '4/3', '3/2', '27/16', '243/128']);
    // Each degree named along the chain of fifths from C (common practice).
    expect((await column(2).allTextContents()).map((name) => name.trim())).toEqual([
      'C',
      'D',
      'E',
      'F',
      'G',
      'A',
      'B',
    ]);
    await screenshot(page, 'journey-1-design');

    // The page's own signal that the design is kept: the address holds it, name and chain as typed (the `d`
    // parameter is "1." and the design's JSON, short field names, in base64url).
    const addressed = () => {
      const d = new URL(page.url()).searchParams.get('d');
      if (!d?.startsWith('1.')) return null;
      const design = JSON.parse(Buffer.from(d.slice(2), 'base64url').toString('utf8'));
      return { name: design.n, up: design.s?.u, down: design.s?.d };
    };
    await expect.poll(addressed).toEqual({ name: 'Journey Fifths', up: 5, down: 1 });
    await page.reload();
    await expect.poll(() => page.getByLabel('Preset name').inputValue()).toBe('Journey Fifths');

    await page.getByRole('button', { name: 'Download', exact: true }).click();
    const file = await downloaded(page, () =>
      page.getByRole('menuitem', { name: /^MTS bulk dump \(\.syx\)/ }).click(),
    );
    expect(file.name).toBe('journey-fifths.syx');
    // MIDI Tuning specification: a bulk dump is 408 bytes, F0 7E dev 08 01 ... F7, its checksum the
    // XOR of bytes 1-405 AND 7F.
    expect(file.bytes.length).toBe(408);
    expect([...file.bytes.subarray(0, 5)]).toEqual([0xf0, 0x7e, 0x7f, 0x08, 0x01]);
    let checksum = 0;
    for (let i = 1; i < 406; i++) checksum ^= file.bytes[i];
    expect(file.bytes[406]).toBe(checksum & 0x7f);
    await context.close();
  });
});

describe('journeys 2 to 4: a band saves, invites, shares', () => {
  let presetPath = '';

  it("journey 2: saves the design into the band's library as revision 1", async () => {
    const { context, page } = await visitor('mira-vale');
    await page.goto(`${inject('appUrl')}/design`);
    await page.getByLabel('Preset name').fill('Journey Twelve');
    await page.getByLabel('Generators up').fill('8');
    await page.getByLabel('Generators down').fill('3');
    await page.getByRole('button', { name: 'Save', exact: true }).click();
    const dialog = page.getByRole('dialog');
    await dialog.getByLabel('Library').click();
    await page.getByRole('option', { name: 'Copper Fen (band)' }).click();
    await dialog.getByLabel('Note on this change').fill('Twelve fifths for the reed set');
    await dialog.getByRole('button', { name: 'Save' }).click();
    await page.waitForURL(/\/presets\/[0-9a-f-]{36}/);
    await expect.poll(() => page.getByRole('status').first().textContent()).toContain('Revision 1');
    presetPath = new URL(page.url()).pathname;
    await screenshot(page, 'journey-2-saved');
    await context.close();
  });

  it('journey 3: invites a bandmate by e-mail; he follows the link from the mailbox, signs in and joins', async () => {
    const owner = await visitor('mira-vale');
    await owner.page.goto(`${inject('appUrl')}/bands`);
    await owner.page
      .getByRole('link', { name: /Copper Fen/ })
      .first()
      .click();
    const inviteForm = owner.page
      .locator('form')
      .filter({ has: owner.page.getByLabel('E-mail address') });
    await inviteForm.getByLabel('E-mail address').fill('ada.quill@example.org');
    await inviteForm.getByRole('combobox', { name: 'Role' }).click();
    await owner.page.getByRole('option', { name: /editor/i }).click();
    await inviteForm.getByRole('button', { name: /Send/ }).click();
    await owner.page
      .getByRole('button', { name: 'Revoke the invite to ada.quill@example.org' })
      .waitFor();
    await screenshot(owner.page, 'journey-3-invited');
    await owner.context.close();

    const guest = await visitor();
    await guest.page.goto(inject('mailboxUrl'));
    await guest.page
      .getByRole('link', { name: /invites you to the band Copper Fen/ })
      .first()
      .click();
    const link = await guest.page
      .getByRole('link', { name: /\/invites\// })
      .first()
      .getAttribute('href');
    await guest.page.goto(link!);
    await guest.page.getByRole('link', { name: /Sign in to join/ }).click();
    await guest.page.waitForURL((url) => url.origin === inject('githubUrl'));
    await guest.page.getByRole('button', { name: /Ada Quill/ }).click();
    await guest.page.getByRole('button', { name: /Join Copper Fen/ }).click();
    await guest.page.waitForURL(/\/bands\/[0-9a-f-]{36}/);
    await expect.poll(() => guest.page.getByText('ada-quill').count()).toBeGreaterThan(0);
    await screenshot(guest.page, 'journey-3-joined');

    await guest.page.goto(`${inject('appUrl')}${presetPath}`);
    const bundle = await downloaded(guest.page, async () => {
      await guest.page.getByRole('button', { name: 'Download', exact: true }).click();
      await guest.page.getByRole('menuitem', { name: /^Bundle of everything/ }).click();
    });
    expect(bundle.name).toMatch(/\.zip$/);
    expect(bundle.bytes.subarray(0, 2).toString()).toBe('PK');
    await guest.context.close();
  });

  it('journey 4: shares a read-only link that opens without an account, then revokes it', async () => {
    const owner = await visitor('mira-vale');
    await owner.page.goto(`${inject('appUrl')}/library`);
    await owner.page.getByRole('button', { name: 'Actions for Journey Twelve' }).click();
    await owner.page.getByRole('menuitem', { name: /Share/ }).click();
    const dialog = owner.page.getByRole('dialog');
    await dialog.getByRole('button', { name: 'Create link' }).click();
    const url = await dialog.getByLabel('New link').inputValue();
    expect(url).toMatch(/\/s\/[\w-]{43}$/);
    await screenshot(owner.page, 'journey-4-share-dialog');

    const guest = await visitor();
    await guest.page.goto(url);
    await expect
      .poll(() => guest.page.getByRole('heading', { level: 1 }).textContent())
      .toContain('Journey Twelve');
    await expect.poll(() => guest.page.getByText('2187/2048').count()).toBeGreaterThan(0);
    await screenshot(guest.page, 'journey-4-shared-signed-out');

    await dialog
      .getByRole('button', { name: /^Revoke the link/ })
      .first()
      .click();
    await expect
      .poll(() => dialog.getByRole('button', { name: /^Revoke the link/ }).count())
      .toBe(0);
    await guest.page.reload();
    await expect
      .poll(() => guest.page.getByText(/no longer|revoked|not found|cannot/i).count())
      .toBeGreaterThan(0);
    await owner.context.close();
    await guest.context.close();
  });
});

describe('journey 5: a producer retunes a song', () => {
  it('uploads a song, retunes it one note per channel, reads the report and downloads the result', async () => {
    const events: MidiEvent[] = [];
    for (const key of [60, 62, 64, 65, 67]) {
      events.push({
        deltaTime: 0,
        channel: 0,
        type: 'noteOn',
        noteNumber: key,
        velocity: 90,
      } as MidiEvent);
      events.push({
        deltaTime: 240,
        channel: 0,
        type: 'noteOff',
        noteNumber: key,
        velocity: 0,
      } as MidiEvent);
    }
    events.push({ deltaTime: 0, meta: true, type: 'endOfTrack' } as MidiEvent);
    const song = Buffer.from(
      writeMidi({ header: { format: 0, numTracks: 1, ticksPerBeat: 480 }, tracks: [events] }),
    );

    const { context, page } = await visitor('mira-vale');
    await page.goto(`${inject('appUrl')}/retune`);
    await page
      .locator('input[type=file]')
      .first()
      .setInputFiles({ name: 'little-tune.mid', mimeType: 'audio/midi', buffer: song });
    // The roll of the song as written, read in the browser, before any tuning is chosen.
    const roll = page.getByRole('img', {
      name: /^Piano roll of the song: 5 notes in 1 track, keys 60–67/,
    });
    await roll.waitFor();
    await page.getByRole('radio', { name: 'A saved preset' }).check();
    await page.getByRole('combobox', { name: 'Saved preset' }).click();
    await page
      .getByRole('option', { name: /Fen Fifths/ })
      .first()
      .click();
    // Fen Fifths' latest revision maps all twelve keys of the octave: no note on an unmapped key.
    await expect
      .poll(() => roll.getAttribute('aria-label'))
      .toContain(', 0 on keys the tuning leaves unmapped');
    await rollScreenshots(page, 'journey-5-roll-before');
    await page.getByRole('radio', { name: /One note per channel/ }).check();
    await page.getByLabel('Lead-in before the first note').fill('250');
    await page.getByRole('button', { name: /^Retune/ }).click();
    await expect
      .poll(() => page.getByText(/5 notes? retuned|retuned 5|Notes retuned/i).count())
      .toBeGreaterThan(0);
    await expect
      .poll(() => page.locator('.lead-in-note').textContent())
      .toContain('The song starts 250 ms (240 ticks) later');
    await screenshot(page, 'journey-5-report');
    // The roll of the retuned song: each note against 12-tone equal temperament (in pure fifths
    // from C, E4 is 81/64, 407.820 cents: 7.8 cents sharp; from memory).
    const retunedRoll = page.getByRole('img', {
      name: /^Piano roll of the retuned song: 5 notes, keys 60–67/,
    });
    await retunedRoll.waitFor();
    expect(await retunedRoll.getAttribute('aria-label')).toContain(
      'to +7.8¢ from 12-tone equal temperament',
    );
    await rollScreenshots(page, 'journey-5-roll-after');
    // Hear it first: the page's own signal that sound began is the hearing caution and a moving clock.
    await page.getByRole('button', { name: 'Hear it first' }).click();
    await page.getByText('Keep the volume low').waitFor();
    await page.getByRole('button', { name: 'Stop' }).waitFor();
    await screenshot(page, 'journey-5-hearing');
    await page.getByRole('button', { name: 'Stop' }).click();
    const file = await downloaded(page, () =>
      page
        .getByRole('link', { name: /Download/ })
        .first()
        .click(),
    );
    const tuned = parseMidi(file.bytes);
    const notes = tuned.tracks.flat().filter((e) => e.type === 'noteOn' && e.velocity > 0);
    expect(notes).toHaveLength(5);
    expect(new Set(notes.map((n) => (n as { channel: number }).channel)).size).toBeGreaterThan(1);
    // SMF 1.0 at the default 120 a minute and 480 ticks a quarter: 960 ticks a second, so 250 ms is 240 ticks.
    const firstNoteTick = Math.min(
      ...tuned.tracks.map((track) => {
        let tick = 0;
        for (const event of track) {
          tick += event.deltaTime;
          if (event.type === 'noteOn' && event.velocity > 0) return tick;
        }
        return Infinity;
      }),
    );
    expect(firstNoteTick).toBe(240);
    await context.close();
  });
});
