// The stage in Chromium: an owner and an editor of the demo band follow one setlist, each with an
// instrument of their own on a recording stand-in for Web MIDI; the owner moves, and each port gets
// exactly the bytes the server exports for that instrument.
import type { Browser, Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, inject, it } from 'vitest';
import { demoBand } from '../../scripts/stack/demo-data';
import { launchChromium, newContext, screenshot } from './browser';

interface Recorded {
  sent: number[][];
}

/**
 * Runs in the page before the app: a Web MIDI access with one output, "Stage synth", that records
 * every message sent, and the synth's own output as an input of the same name, which answers the MTS
 * dump request with a dump of the program asked for. The ports carry what webmidi reads and sets on a
 * browser's.
 */
function standInMidi(): void {
  const page = window as unknown as Recorded;
  page.sent = [];
  type Handler = ((event: { port?: unknown; timeStamp: number }) => void) | null;
  const output = {
    id: 'stage-out',
    name: 'Stage synth',
    type: 'output',
    manufacturer: 'Stand-in',
    version: '1',
    state: 'connected',
    connection: 'closed',
    onstatechange: null as Handler,
    open: async () => ((output.connection = 'open'), output),
    close: async () => ((output.connection = 'closed'), output),
    send(bytes: Uint8Array | number[]) {
      page.sent.push(Array.from(bytes));
      // MIDI Tuning specification: the dump request F0 7E dev 08 00 tt F7 asks for program tt.
      if (bytes[0] === 0xf0 && bytes[3] === 0x08 && bytes[4] === 0x00) {
        const dump = dumpOf(bytes[5]);
        setTimeout(() => input.onmidimessage?.({ data: dump, timeStamp: performance.now() }), 20);
      }
    },
  };
  const input = {
    ...output,
    id: 'stage-in',
    type: 'input',
    onmidimessage: null as ((event: { data: Uint8Array; timeStamp: number }) => void) | null,
    open: async () => ((input.connection = 'open'), input),
    close: async () => ((input.connection = 'closed'), input),
  };
  /** A 12-tone equal bulk dump of `program`, by the layout and checksum rule of the MIDI Tuning specification. */
  const dumpOf = (program: number) => {
    const name = Array.from('STAGE SYNTH'.padEnd(16, ' '), (character) => character.charCodeAt(0));
    const body = [
      0x7e,
      0x7f,
      0x08,
      0x01,
      program,
      ...name,
      ...Array.from({ length: 128 }, (_, key) => [key, 0, 0]).flat(),
    ];
    return Uint8Array.from([0xf0, ...body, body.reduce((sum, byte) => sum ^ byte, 0) & 0x7f, 0xf7]);
  };
  const access = {
    sysexEnabled: true,
    inputs: new Map([[input.id, input]]),
    outputs: new Map([[output.id, output]]),
    onstatechange: null as Handler,
  };
  Object.defineProperty(Navigator.prototype, 'requestMIDIAccess', {
    configurable: true,
    value: () => Promise.resolve(access),
  });
}

let browser: Browser;
beforeAll(async () => {
  browser = await launchChromium();
});
afterAll(() => browser.close());

/** A member of the demo band, signed in through the GitHub stand-in, with Web MIDI stood in. */
async function member(login: string): Promise<Page> {
  const context = await newContext(browser, { viewport: { width: 1280, height: 900 } });
  const page = await context.newPage();
  await page.addInitScript(standInMidi);
  await page.goto(`${inject('appUrl')}/auth/github?login=${login}&next=/design`);
  await page.getByRole('button', { name: /Signed in as/ }).waitFor();
  return page;
}

async function post<T>(page: Page, path: string, data: unknown): Promise<T> {
  // The server asks every write for the XSRF-TOKEN cookie back in a header, as Angular sends it.
  const cookies = await page.context().cookies();
  const token = cookies.find((cookie) => cookie.name === 'XSRF-TOKEN')?.value ?? '';
  const headers = { 'X-XSRF-TOKEN': token };
  const answer = await page.request.post(`${inject('appUrl')}${path}`, { data, headers });
  expect(answer.status(), await answer.text()).toBe(201);
  return (await answer.json()) as T;
}

function sentBytes(page: Page): Promise<number[][]> {
  return page.evaluate(() => (window as unknown as Recorded).sent);
}

/**
 * Connects MIDI, follows, and agrees to the one question before the first send; with `backUp`, backs the
 * instrument up first and waits for the tuning to follow the dump request.
 */
async function follow(page: Page, setlistId: string, backUp = false): Promise<void> {
  await page.goto(`${inject('appUrl')}/stage/${setlistId}`);
  await page.getByRole('button', { name: 'Connect MIDI' }).click();
  await page.getByRole('switch', { name: 'Follow' }).click();
  await expect.poll(() => page.getByRole('status').filter({ hasText: 'In step' }).count()).toBe(1);
  const dialog = page.getByRole('dialog');
  await expect.poll(() => dialog.textContent()).toContain('Stage synth');
  if (backUp) {
    await dialog.getByRole('button', { name: 'Back up first' }).click();
    await expect.poll(() => dialog.locator('.outcome').textContent()).toContain('in your library');
    expect(await dialog.locator('.advice').textContent()).toContain(
      'Every instrument is backed up.',
    );
    // Nothing but the dump request has gone out yet (MIDI Tuning specification: F0 7E dev 08 00 tt F7).
    expect(await sentBytes(page)).toEqual([[0xf0, 0x7e, 16, 0x08, 0x00, 5, 0xf7]]);
    await screenshot(page, 'stage-backed-up');
  }
  await dialog.getByRole('button', { name: 'Send and replace' }).click();
  await expect.poll(async () => (await sentBytes(page)).length).toBeGreaterThan(backUp ? 1 : 0);
}

describe('the stage', () => {
  it('moves for the owner, and each follower’s port gets its own instrument’s bytes', async () => {
    const owner = await member('mira-vale');
    const editor = await member('tobias-reed');
    const ownerSynth = await post<{ id: string }>(owner, '/api/instruments', {
      name: 'Mira lead',
      receives: 'mts-bulk',
      deviceId: 16,
      program: 5,
      port: 'Stage synth',
    });
    const editorSynth = await post<{ id: string }>(editor, '/api/instruments', {
      name: 'Tobias keys',
      receives: 'mts-bulk-bank',
      deviceId: 3,
      program: 9,
      bank: 2,
      port: 'Stage synth',
    });
    const list = await owner.request.get(`${inject('appUrl')}/api/presets?bandId=${demoBand.id}`);
    const presets = ((await list.json()) as { items: { id: string; name: string }[] }).items;
    expect(presets.length).toBeGreaterThanOrEqual(2);
    const setlist = await post<{ id: string }>(owner, `/api/bands/${demoBand.id}/setlists`, {
      name: 'Stage test',
      entries: presets.slice(0, 2).map((preset) => ({ presetId: preset.id })),
    });

    await follow(owner, setlist.id, true);
    await follow(editor, setlist.id);
    await expect.poll(() => editor.locator('.current').textContent()).toContain(presets[0].name);
    await expect.poll(() => editor.getByRole('button', { name: 'Next' }).count()).toBe(1);
    const before = {
      owner: (await sentBytes(owner)).length,
      editor: (await sentBytes(editor)).length,
    };

    await owner.getByRole('button', { name: 'Next' }).click();
    await expect.poll(() => owner.locator('.place').textContent()).toContain('2 of 2');
    await expect.poll(() => editor.locator('.place').textContent()).toContain('2 of 2');
    await expect.poll(() => editor.locator('.current').textContent()).toContain(presets[1].name);

    for (const [page, instrument, form, count] of [
      [owner, ownerSynth, 'mts-bulk', before.owner],
      [editor, editorSynth, 'mts-bulk-bank', before.editor],
    ] as const) {
      const path = `/api/presets/${presets[1].id}/export/${form}?instrument=${instrument.id}`;
      const exported = await page.request.get(`${inject('appUrl')}${path}`);
      expect(exported.status()).toBe(200);
      const expected = Array.from(await exported.body());
      await expect.poll(async () => (await sentBytes(page)).slice(count).flat()).toEqual(expected);
    }
    // MIDI Tuning specification: F0 7E <device> 08 01 <program> (bulk dump) and
    // F0 7E <device> 08 04 <bank> <program> (key-based dump with bank).
    expect((await sentBytes(owner)).at(-1)!.slice(0, 6)).toEqual([0xf0, 0x7e, 16, 8, 1, 5]);
    expect((await sentBytes(editor)).at(-1)!.slice(0, 7)).toEqual([0xf0, 0x7e, 3, 8, 4, 2, 9]);

    await screenshot(owner, 'stage-owner');
    await owner.setViewportSize({ width: 390, height: 844 });
    await expect
      .poll(() => owner.evaluate(() => document.documentElement.scrollWidth))
      .toBeLessThanOrEqual(390);
    await screenshot(owner, 'stage-owner-390');
    await editor.emulateMedia({ colorScheme: 'dark' });
    await editor.setViewportSize({ width: 390, height: 844 });
    await screenshot(editor, 'stage-editor-390-dark');
  });
});
