import { renderExport } from '@shared/export/export-catalogue';
import { parsePresetDocument, type ResolvedPreset } from '@shared/preset/preset-document';
import { newDraft } from '../design/draft-document';
import {
  cableMs,
  changedKeyMessages,
  keyPitches,
  splitSystemExclusive,
  tuningMessages,
} from './tuning-messages';

function preset(
  edit: (draft: ReturnType<typeof newDraft>) => void = () => undefined,
): ResolvedPreset {
  const draft = newDraft();
  edit(draft);
  const parsed = parsePresetDocument(draft);
  if (!parsed.ok) throw new Error(JSON.stringify(parsed.errors));
  return parsed.value;
}

function joined(messages: Uint8Array[]): number[] {
  return messages.flatMap((message) => [...message]);
}

describe('tuning messages', () => {
  it('takes 0.32 ms a byte on a 31,250-baud cable', () => {
    // MIDI 1.0 specification: 31.25 kBaud, 10 bits a byte (start, 8 data, stop), so 320 us a byte.
    expect(cableMs(1)).toBeCloseTo(0.32, 10);
    expect(cableMs(408)).toBeCloseTo(130.56, 10);
  });

  it('splits a .syx file into its whole F0…F7 messages', () => {
    const bytes = new Uint8Array([0xf0, 1, 2, 0xf7, 0xf0, 3, 0xf7]);
    expect(splitSystemExclusive(bytes).map((message) => [...message])).toEqual([
      [0xf0, 1, 2, 0xf7],
      [0xf0, 3, 0xf7],
    ]);
  });

  it('sends exactly the bytes of the export for each form', () => {
    // Scale/octave tuning fits 12-key layouts only: eleven fifths up make twelve degrees.
    const design = preset(
      (draft) =>
        (draft.scale = { kind: 'generated', generator: '3/2', period: '2/1', up: 11, down: 0 }),
    );
    for (const form of [
      'mts-bulk',
      'mts-notes',
      'mts-octave-1',
      'mts-octave-2',
      'mts-bulk-bank',
    ] as const) {
      const sent = tuningMessages(design, form, design.output);
      const exported = renderExport(design, form);
      if (!sent.ok || !exported.ok) fail(`${form} did not render`);
      else
        expect(joined(sent.value))
          .withContext(form)
          .toEqual([...exported.value.bytes]);
    }
  });

  it('aims a bulk dump at the chosen device, program and bank', () => {
    const sent = tuningMessages(preset(), 'mts-bulk-bank', { deviceId: 3, program: 9, bank: 2 });
    // MIDI Tuning specification: F0 7E dev 08 04 bb tt name[16] (xx yy zz)x128 cs F7, 409 bytes.
    expect(sent.ok && [...sent.value[0].subarray(0, 7)]).toEqual([0xf0, 0x7e, 3, 0x08, 0x04, 2, 9]);
    expect(sent.ok && sent.value[0].length).toBe(409);
  });

  it('sends single-note changes for only the keys whose pitch changed', () => {
    const before = keyPitches(preset())!;
    const after = keyPitches(
      preset((draft) => (draft.mapping = { ...draft.mapping, rootKey: 60, rootHz: 262 })),
    )!;
    expect(changedKeyMessages(before, before, { deviceId: 127, program: 0, bank: 0 })).toEqual([]);
    const tweaked = before.map((entry) =>
      entry.key === 64 ? { ...entry, hz: entry.hz! * 1.001 } : entry,
    );
    const [message, ...rest] = changedKeyMessages(before, tweaked, {
      deviceId: 127,
      program: 5,
      bank: 0,
    });
    // MIDI Tuning specification: F0 7F dev 08 02 tt ll (kk xx yy zz)xll F7, 8 + 4ll bytes.
    expect(rest).toEqual([]);
    expect([...message.subarray(0, 8)]).toEqual([0xf0, 0x7f, 0x7f, 0x08, 0x02, 5, 1, 64]);
    expect(message.length).toBe(12);
    const everyKey = changedKeyMessages(before, after, { deviceId: 127, program: 0, bank: 0 });
    expect(everyKey.reduce((count, changes) => count + changes[6], 0)).toBe(
      after.filter((entry) => entry.hz !== null).length,
    );
  });
});
