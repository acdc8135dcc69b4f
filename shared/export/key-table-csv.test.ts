import { parse } from 'csv-parse/sync';
import { describe, expect, it } from 'vitest';
import { parsePresetDocument } from '../preset/preset-document';
import { renderExport } from './export-catalogue';

function csvOf(document: object): string[][] {
  const parsed = parsePresetDocument({
    format: 'keyloom.preset',
    version: 1,
    name: 'Keys',
    ...document,
  });
  if (!parsed.ok) throw new Error(parsed.errors[0].message);
  const file = renderExport(parsed.value, 'key-csv');
  if (!file.ok) throw new Error(file.errors[0].message);
  expect(file.value.fileName).toBe('keys-keys.csv');
  // Read back with csv-parse, a CSV reader independent of Keyloom.
  return parse(new TextDecoder().decode(file.value.bytes));
}

describe('the key-csv export', () => {
  it('lists all 128 keys with note, degree, Hz and cents from 12-TET', () => {
    const rows = csvOf({ scale: { kind: 'equal', divisions: 12 }, mapping: { rootKey: 60 } });
    expect(rows[0]).toEqual(['key', 'note', 'degree', 'hz', 'cents_from_12tet', 'mapped']);
    expect(rows).toHaveLength(129);
    // MIDI convention: key 69 = 440 Hz, key 60 = 261.6255653006 Hz, key 0 = 8.1757989156 Hz.
    expect(rows[70]).toEqual(['69', 'A4', '9', '440.000000', '0.0000', 'yes']);
    expect(rows[61]).toEqual(['60', 'C4', '0', '261.625565', '0.0000', 'yes']);
    expect(Number(rows[1][3])).toBeCloseTo(8.1757989156, 6);
  });

  it('leaves unmapped keys without a degree or a pitch, and gives pure fifths their offsets', () => {
    const rows = csvOf({
      scale: { kind: 'generated', generator: '3/2', up: 5, down: 1 },
      mapping: { rootKey: 60, layout: [0, null, 1, null, 2, 3, null, 4, null, 5, null, 6] },
    });
    expect(rows[62]).toEqual(['61', 'C#4', '', '', '', 'no']);
    // arithmetic (MIDI convention): pure G above equal-tempered C4 is 392.4383 Hz, 1.955 cents
    // above equal-tempered G.
    expect(rows[68].slice(0, 3)).toEqual(['67', 'G4', '4']);
    expect(Number(rows[68][3])).toBeCloseTo(392.4383, 4);
    expect(Number(rows[68][4])).toBeCloseTo(1.955, 3);
  });
});
