import { describe, expect, it } from 'vitest';
import { tuningOfPreset } from '../export/preset-tuning';
import type { KeyPitch } from '../midi/frequency-word';
import { encodeBulkDump } from '../midi/mts-bulk-dump';
import { decodeMtsStream } from '../midi/mts-decode';
import { parsePresetDocument, type PresetDocument } from '../preset/preset-document';
import { presetFromKeys } from './tuning-from-keys';

const target = { deviceId: 0x7f, program: 0, tuningName: 'IMPORT TEST' };

/** The bulk dump an export would send for a document, read back as a key table. */
function dumpedKeys(document: object): KeyPitch[] {
  const parsed = parsePresetDocument(document);
  if (!parsed.ok) throw new Error(parsed.errors[0].message);
  const tuning = tuningOfPreset(parsed.value);
  if (!tuning.ok) throw new Error(tuning.errors[0].message);
  const [dump] = encodeBulkDump(tuning.value.keys, target).messages;
  const decoded = decodeMtsStream(dump);
  if (!decoded.ok) throw new Error(decoded.errors[0].message);
  return decoded.value.keys;
}

function importAndDumpAgain(keys: KeyPitch[]) {
  const imported = presetFromKeys(keys, 'Imported');
  if (!imported.ok) throw new Error(imported.errors[0].message);
  return { imported: imported.value, again: dumpedKeys(imported.value.document) };
}

const doc = (scale: object, mapping: object = { rootKey: 60 }): PresetDocument =>
  ({ format: 'keyloom.preset', version: 1, name: 'Source', scale, mapping }) as PresetDocument;

describe('presetFromKeys', () => {
  it('finds twelve equal steps in a 12-tone equal dump, with the octave as period', () => {
    // MIDI convention: key n = 440 * 2^((n-69)/12).
    const keys = Array.from({ length: 128 }, (_, key) => ({
      key,
      hz: 440 * 2 ** ((key - 69) / 12),
    }));
    const imported = presetFromKeys(keys, 'Equal');
    expect(imported.ok).toBe(true);
    if (!imported.ok) return;
    expect(imported.value.repeats).toBe(true);
    const scale = imported.value.document.scale as { degrees: string[]; period: string };
    expect(scale.period).toBe('2/1');
    expect(scale.degrees.map((d) => Number.parseFloat(d))).toEqual([
      100, 200, 300, 400, 500, 600, 700, 800, 900, 1000, 1100,
    ]);
    expect(imported.value.document.mapping.rootKey).toBe(60);
  });

  for (const [label, source] of [
    [
      'twelve pure fifths',
      doc({ kind: 'generated', generator: '3/2', period: '2/1', up: 8, down: 3 }),
    ],
    [
      'seven fifths on the white keys',
      doc(
        { kind: 'generated', generator: '3/2', period: '2/1', up: 5, down: 1 },
        {
          rootKey: 60,
          keysPerPeriod: 12,
          layout: [0, null, 1, null, 2, 3, null, 4, null, 5, null, 6],
        },
      ),
    ],
    [
      'harmonics 8 to 16 with the root off concert pitch',
      doc({ kind: 'harmonic', from: 8, to: 16 }, { rootKey: 48, rootHz: 128 }),
    ],
  ] as const) {
    it(`gives back the same 128-key dump for ${label}`, () => {
      const original = dumpedKeys(source);
      const { again } = importAndDumpAgain(original);
      expect(again).toEqual(original);
    });
  }

  it('gives back a tritave of thirteen equal steps to within one MTS unit on every key', () => {
    const original = dumpedKeys(
      doc({ kind: 'equal', divisions: 13, period: '3/1' }, { rootKey: 57 }),
    );
    const { imported, again } = importAndDumpAgain(original);
    expect((imported.document.scale as { period: string }).period).toBe('3/1');
    // MIDI Tuning specification: a frequency word counts 100/16384 cents; 3/1 is no whole number of
    // them, so a period read back from rounded words can land one unit off (arithmetic).
    const unit = 100 / 16384;
    for (const { key, hz } of original) {
      const back = again[key].hz;
      expect(
        back === null || hz === null
          ? back === hz
          : Math.abs(1200 * Math.log2(back / hz)) <= unit + 1e-9,
      ).toBe(true);
    }
  });

  it('keeps a table that does not repeat as a list over the keys it tunes, unmapping the rest', () => {
    const keys: KeyPitch[] = Array.from({ length: 128 }, (_, key) => ({
      key,
      hz: key >= 50 && key <= 70 ? 220 * 2 ** ((key - 50) / 12 + ((key * 7) % 5) / 1000) : null,
    }));
    const { imported, again } = importAndDumpAgain(
      dumpedKeys(doc({ kind: 'equal', divisions: 12, period: '2/1' })).map((k) => keys[k.key]),
    );
    expect(imported.repeats).toBe(false);
    expect(imported.document.notes).toContain('does not repeat');
    expect(again.filter((k) => k.hz !== null).map((k) => k.key)).toEqual(
      Array.from({ length: 21 }, (_, i) => 50 + i),
    );
  });

  it('refuses a table that tunes no key', () => {
    const result = presetFromKeys(
      Array.from({ length: 128 }, (_, key) => ({ key, hz: null })),
      'Empty',
    );
    expect(result.ok ? 'accepted' : result.errors[0].message).toMatch(/^file: .*no key/);
  });
});
