// Journey 6 and the send panel in Chromium, with a stand-in for Web MIDI that records every byte sent
// and can refuse permission, be missing, or lose its port in the middle of a send.
import { readFileSync } from 'node:fs';
import type { Browser, Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, inject, it } from 'vitest';
import { launchChromium, newContext, screenshot } from './browser';

type MidiMode =
  'grant' | 'refuse' | 'missing' | 'drop after one' | 'answers dump requests' | 'never answers';

interface Recorded {
  sent: number[][];
}

/** Runs in the page before the app: replaces `navigator.requestMIDIAccess` according to `mode`. */
function standInMidi(mode: MidiMode): void {
  const page = window as unknown as Recorded;
  page.sent = [];
  if (mode === 'missing') {
    delete (Navigator.prototype as Partial<Navigator>).requestMIDIAccess;
    return;
  }
  // The ports carry what the app's webmidi reads and sets on a browser's: id, name, type, state,
  // connection, manufacturer, version, open and close, and the onstatechange and onmidimessage
  // handlers it assigns.
  type Handler = ((event: { port?: unknown; data?: Uint8Array; timeStamp: number }) => void) | null;
  const portOf = (id: string, type: 'input' | 'output') => {
    const port = {
      id,
      name: 'Stand-in synth',
      type,
      manufacturer: 'Stand-in',
      version: '1',
      state: 'connected',
      connection: 'closed',
      onstatechange: null as Handler,
      open: async () => ((port.connection = 'open'), port),
      close: async () => ((port.connection = 'closed'), port),
    };
    return port;
  };
  // The instrument's own MIDI output, seen by the computer as an input of the same name.
  const input = Object.assign(portOf('stand-in-in', 'input'), { onmidimessage: null as Handler });
  /** A 12-tone equal dump of `program` by the layout and checksum rule of the MIDI Tuning
   * specification, named "STAND-IN". */
  const dumpOf = (program: number) => {
    const name = Array.from('STAND-IN'.padEnd(16, ' '), (character) => character.charCodeAt(0));
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
  const output = Object.assign(portOf('stand-in-out', 'output'), {
    send(bytes: Uint8Array | number[]) {
      if (output.state === 'disconnected')
        throw new DOMException('The port is closed', 'InvalidStateError');
      page.sent.push(Array.from(bytes));
      const isDumpRequest = bytes[0] === 0xf0 && bytes[3] === 0x08 && bytes[4] === 0x00;
      if (mode === 'answers dump requests' && isDumpRequest) {
        const dump = dumpOf(bytes[5]);
        setTimeout(() => input.onmidimessage?.({ data: dump, timeStamp: performance.now() }), 20);
      }
      if (mode === 'drop after one') {
        // Pulled out: the browser marks the open port disconnected and pending, and tells the
        // access and the port.
        output.state = 'disconnected';
        output.connection = 'pending';
        const event = { port: output, timeStamp: performance.now() };
        access.onstatechange?.(event);
        output.onstatechange?.(event);
      }
    },
  });
  const access = {
    sysexEnabled: true,
    inputs: new Map(
      mode === 'answers dump requests' || mode === 'never answers' ? [[input.id, input]] : [],
    ),
    outputs: new Map([[output.id, output]]),
    onstatechange: null as Handler,
  };
  Object.defineProperty(Navigator.prototype, 'requestMIDIAccess', {
    configurable: true,
    value: (options: { sysex?: boolean }) =>
      mode === 'refuse' || !options?.sysex
        ? Promise.reject(new DOMException('Permission denied', 'NotAllowedError'))
        : Promise.resolve(access),
  });
}

let browser: Browser;
beforeAll(async () => {
  browser = await launchChromium();
});
afterAll(() => browser.close());

async function designer(mode: MidiMode, width = 1280): Promise<Page> {
  const context = await newContext(browser, {
    acceptDownloads: true,
    viewport: { width, height: width > 600 ? 1000 : 844 },
  });
  const page = await context.newPage();
  await page.addInitScript(standInMidi, mode);
  await page.goto(`${inject('appUrl')}/design`);
  await page.getByLabel('Preset name').fill('Hardware Fifths');
  return page;
}

async function openSendPanel(page: Page): Promise<void> {
  await page.getByRole('tab', { name: 'Output' }).click();
  await page.getByRole('button', { name: 'Connect MIDI devices' }).click();
}

function sentBytes(page: Page): Promise<number[][]> {
  return page.evaluate(() => (window as unknown as Recorded).sent);
}

async function presetDocument(page: Page): Promise<Record<string, unknown>> {
  await page.getByRole('button', { name: 'Download', exact: true }).click();
  const [download] = await Promise.all([
    page.waitForEvent('download'),
    page.getByRole('menuitem', { name: /^Preset document \(\.json\)/ }).click(),
  ]);
  return JSON.parse(readFileSync((await download.path())!, 'utf8'));
}

async function preview(path: string, document: unknown): Promise<Response> {
  const answer = await fetch(`${inject('appUrl')}/api/preview/${path}`, {
    method: 'POST',
    headers: { 'content-type': 'application/json' },
    body: JSON.stringify(document),
  });
  expect(answer.status).toBe(200);
  return answer;
}

async function keyHz(document: unknown): Promise<(number | null)[]> {
  const table = (await (await preview('table', document)).json()) as {
    keys: { hz: number | null }[];
  };
  return table.keys.map((key) => key.hz);
}

describe('sending a tuning to an instrument over Web MIDI', () => {
  it('sends byte for byte what the server exports as the MTS bulk dump, after naming the program it replaces', async () => {
    const page = await designer('grant');
    await openSendPanel(page);
    await expect.poll(() => page.getByText(/1 message\(s\), 408 bytes/).count()).toBe(1);
    await screenshot(page, 'hardware-send-panel');
    await page.getByRole('button', { name: 'Send tuning' }).click();
    const dialog = page.getByRole('dialog');
    await expect.poll(() => dialog.textContent()).toContain('tuning program 0');
    expect(await dialog.textContent()).toContain('Back it up first');
    await screenshot(page, 'hardware-confirm');
    await dialog.getByRole('button', { name: 'Send and replace' }).click();
    await expect.poll(() => page.getByText('Sent 1 message (408 bytes).').count()).toBe(1);

    const exported = new Uint8Array(
      await (await preview('export/mts-bulk', await presetDocument(page))).arrayBuffer(),
    );
    const sent = await sentBytes(page);
    expect(sent.length).toBe(1);
    expect(sent[0]).toEqual([...exported]);
    await page.context().close();
  });

  it("Werckmeister's third, A4 = 415 on the A key, sent to an instrument", async () => {
    const page = await designer('grant');
    await page.getByRole('radio', { name: 'Temper link by link' }).click();
    await page.getByRole('button', { name: 'Werckmeister III' }).click();
    await expect.poll(() => page.locator('.closing').textContent()).toContain('The circle closes');
    await screenshot(page, 'werckmeister-chain');
    await page.getByRole('tab', { name: 'Keys' }).click();
    await page.getByRole('radio', { name: 'Tune one key' }).click();
    await page.getByRole('button', { name: 'A = 415' }).click();
    await expect
      .poll(() => page.locator('app-reference-pitch .summary').textContent())
      .toContain('Key 69 (A4) sounds 415 Hz');
    await screenshot(page, 'werckmeister-a415-keys');
    await openSendPanel(page);
    await page.getByRole('button', { name: 'Send tuning' }).click();
    await page.getByRole('dialog').getByRole('button', { name: 'Send and replace' }).click();
    await expect.poll(() => page.getByText('Sent 1 message (408 bytes).').count()).toBe(1);

    const document = await presetDocument(page);
    expect(document['mapping']).toMatchObject({ anchor: { key: 69, hz: 415 } });
    const [sent] = await sentBytes(page);
    expect(sent).toEqual([
      ...new Uint8Array(await (await preview('export/mts-bulk', document)).arrayBuffer()),
    ]);
    // MTS bulk dump: key k's frequency word at byte 22 + 3k, f = 440 * 2^((xx + (128 yy + zz) /
    // 16384 - 69) / 12). Key 69 sounds 415 Hz to within half a unit (0.003 cents).
    const word = (key: number) => sent.slice(22 + 3 * key, 25 + 3 * key);
    const hzOf = ([xx, yy, zz]: number[]) => 440 * 2 ** ((xx + (128 * yy + zz) / 16384 - 69) / 12);
    expect(Math.abs(1200 * Math.log2(hzOf(word(69)) / 415))).toBeLessThan(0.0031);
    // Werckmeister III from C: A is 888.270 c above C (Barbour, 1951; from memory), so C4 sounds 415 / 2^(888.27/1200).
    expect(hzOf(word(60))).toBeCloseTo(415 / 2 ** (888.27 / 1200), 2);
    await page.context().close();
  });

  it('live follow sends single-note changes for exactly the keys whose pitch an edit changed', async () => {
    const page = await designer('grant');
    await openSendPanel(page);
    const before = await presetDocument(page);
    await page.getByRole('switch', { name: /Live follow/ }).click();
    await page.getByRole('tab', { name: 'Scale' }).click();
    await page.getByLabel('Generator', { exact: true }).fill('696.578c');
    await expect.poll(async () => (await sentBytes(page)).length).toBeGreaterThan(0);

    const after = { ...before, scale: { ...(before['scale'] as object), generator: '696.578c' } };
    const [oldHz, newHz] = await Promise.all([keyHz(before), keyHz(after)]);
    const changed = newHz.flatMap((hz, key) => (hz !== null && hz !== oldHz[key] ? [key] : []));
    // MIDI Tuning specification: F0 7F dev 08 02 tt ll (kk xx yy zz)xll F7.
    const keysIn = (messages: number[][]) =>
      messages
        .flatMap((message) =>
          Array.from({ length: message[6] }, (_, index) => message[7 + 4 * index]),
        )
        .sort((a, b) => a - b);
    // The settled edit's changes have all gone out once the keys sent are the keys changed (extra ones never match).
    await expect.poll(async () => keysIn(await sentBytes(page))).toEqual(changed);
    const sent = await sentBytes(page);
    for (const message of sent) expect(message.slice(0, 5)).toEqual([0xf0, 0x7f, 0x7f, 0x08, 0x02]);
    const keys = keysIn(sent);
    expect(keys.length).toBeLessThan(newHz.filter((hz) => hz !== null).length);
    expect(keys).toEqual(changed);
    const bytes = sent.reduce((sum, message) => sum + message.length, 0);
    await page.getByRole('tab', { name: 'Output' }).click();
    await expect
      .poll(() => page.getByLabel('Live follow counter').textContent())
      .toContain(`${sent.length} messages, ${bytes} bytes sent`);
    await screenshot(page, 'hardware-live-follow');
    // Nothing else went out after the edit settled.
    expect(await sentBytes(page)).toEqual(sent);
    await page.context().close();
  });

  it("backs up the program it is about to overwrite with a dump request, then sends on the player's word", async () => {
    const page = await designer('answers dump requests');
    await openSendPanel(page);
    await expect
      .poll(() => page.getByLabel('Answers from (MIDI input)').textContent())
      .toContain('Stand-in synth');
    await page.getByRole('button', { name: 'Send tuning' }).click();
    const dialog = page.getByRole('dialog');
    const [download] = await Promise.all([
      page.waitForEvent('download'),
      dialog.getByRole('button', { name: "Back up the instrument's tuning first" }).click(),
    ]);
    expect(download.suggestedFilename()).toBe('backup-stand-in-synth-program-0.syx');
    const kept = readFileSync((await download.path())!);
    // MIDI Tuning specification: a bulk dump is 408 bytes, F0 7E dev 08 01 tt ...; its checksum is
    // the XOR of the bytes from 7E up to the last data byte, AND 7F.
    expect(kept.length).toBe(408);
    expect([...kept.subarray(0, 6)]).toEqual([0xf0, 0x7e, 0x7f, 0x08, 0x01, 0x00]);
    expect(kept[406]).toBe(kept.subarray(1, 406).reduce((sum, byte) => sum ^ byte, 0) & 0x7f);
    await expect
      .poll(() => dialog.textContent())
      .toContain('Backed up as backup-stand-in-synth-program-0.syx');
    await screenshot(page, 'hardware-backup-done');
    // Nothing is sent but the request until the player says so.
    expect(await sentBytes(page)).toEqual([[0xf0, 0x7e, 0x7f, 0x08, 0x00, 0x00, 0xf7]]);
    await dialog.getByRole('button', { name: 'Send and replace' }).click();
    await expect.poll(() => page.getByText('Sent 1 message (408 bytes).').count()).toBe(1);
    expect((await sentBytes(page)).length).toBe(2);
    await page.context().close();
  });

  it("says plainly when the instrument does not answer, and sends only on the player's word (phone width)", async () => {
    const page = await designer('never answers', 390);
    await openSendPanel(page);
    await page.locator('mat-label', { hasText: 'Answers from (MIDI input)' }).waitFor();
    // No hint under a field (Device id, Answers from, ...) runs into the field below or beside it.
    const collisions = await page.evaluate(() => {
      const fields = [...document.querySelectorAll('mat-form-field')];
      const hits: string[] = [];
      for (const hint of document.querySelectorAll('mat-hint')) {
        const own = hint.closest('mat-form-field');
        const box = hint.getBoundingClientRect();
        for (const field of fields) {
          if (field === own) continue;
          const other = field.querySelector('.mat-mdc-text-field-wrapper')!.getBoundingClientRect();
          const overlaps =
            box.left < other.right &&
            other.left < box.right &&
            box.top < other.bottom &&
            other.top < box.bottom;
          if (overlaps)
            hits.push(`${hint.textContent} / ${field.querySelector('mat-label')?.textContent}`);
        }
      }
      return hits;
    });
    expect(collisions).toEqual([]);
    await screenshot(page, 'hardware-send-panel-phone');
    await page.getByRole('button', { name: 'Send tuning' }).click();
    const dialog = page.getByRole('dialog');
    await dialog.getByRole('button', { name: "Back up the instrument's tuning first" }).click();
    await expect
      .poll(() => dialog.getByRole('alert').textContent())
      .toContain('Stand-in synth did not answer the dump request');
    expect(await dialog.getByRole('alert').textContent()).toContain('Nothing was backed up.');
    await screenshot(page, 'hardware-backup-no-answer-phone');
    expect((await sentBytes(page)).length).toBe(1);
    await dialog.getByRole('button', { name: 'Send without a backup' }).click();
    await expect.poll(() => page.getByText('Sent 1 message (408 bytes).').count()).toBe(1);
    await page.context().close();
  });

  it('says when the browser has no Web MIDI', async () => {
    const page = await designer('missing');
    await openSendPanel(page);
    await expect
      .poll(() => page.getByRole('alert').first().textContent())
      .toContain('This browser has no Web MIDI');
    await page.context().close();
  });

  it('says when the browser refuses MIDI access', async () => {
    const page = await designer('refuse');
    await openSendPanel(page);
    await expect
      .poll(() => page.getByRole('alert').first().textContent())
      .toContain('refused access to MIDI devices');
    await page.context().close();
  });

  it('says when the port disappears in the middle of a send', async () => {
    const page = await designer('drop after one');
    await openSendPanel(page);
    await page.getByLabel('Message form').click();
    await page.getByRole('option', { name: 'Single-note real-time changes' }).click();
    await page.getByRole('button', { name: 'Send tuning' }).click();
    await page.getByRole('dialog').getByRole('button', { name: 'Send and replace' }).click();
    await expect
      .poll(() => page.getByRole('alert').first().textContent())
      .toContain('The MIDI port disappeared while sending');
    expect((await sentBytes(page)).length).toBe(1);
    await screenshot(page, 'hardware-port-gone');
    await page.context().close();
  });
});

describe('the Play panel', () => {
  it('plays keys from the computer keyboard and shows the hearing caution the first time', async () => {
    const page = await designer('grant');
    expect(await page.getByText('Keep the volume low').count()).toBe(0);
    await page.locator('body').click({ position: { x: 5, y: 5 } });
    await page.keyboard.down('a');
    await expect.poll(() => page.getByText('Keep the volume low').count()).toBe(1);
    await page.keyboard.up('a');
    await page.getByRole('tab', { name: 'Keys' }).click();
    await screenshot(page, 'hardware-play-panel');
    await page.context().close();
  });
});
