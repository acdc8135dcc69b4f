import * as fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { hzOfFrequencyWord, writeFrequencyWord } from './frequency-word';
import { centsBetween } from './key-tables.testing';

function wordOf(hz: number | null): number[] {
  const bytes = new Uint8Array(3);
  writeFrequencyWord(bytes, 0, hz);
  return [...bytes];
}

// MIDI Tuning specification, frequency word table (exact values from the
// formula)
const specificationTable: [number[], number][] = [
  [[0x00, 0x00, 0x00], 8.1758],
  [[0x01, 0x00, 0x00], 8.662],
  [[0x0c, 0x00, 0x00], 16.3516],
  [[0x3c, 0x00, 0x00], 261.6256],
  [[0x3d, 0x00, 0x00], 277.1826],
  [[0x44, 0x7f, 0x7f], 439.9984],
  [[0x45, 0x00, 0x00], 440],
  [[0x45, 0x00, 0x01], 440.0016],
  [[0x78, 0x00, 0x00], 8372.0181],
  [[0x7f, 0x00, 0x00], 12543.854],
  [[0x7f, 0x7f, 0x7e], 13289.6566],
];

describe('MTS frequency words', () => {
  it.each(specificationTable)('reads the specification table entry %j as %d Hz', (word, hz) => {
    expect(hzOfFrequencyWord(word[0], word[1], word[2])).toBeCloseTo(hz, 4);
  });

  it.each(specificationTable)('writes the table entry %j for %d Hz', (word, printedHz) => {
    // Printed to 4 decimals, 8.6620 Hz lies 1.4 units above 01 00 00; whole-key words are written
    // from the key's exact pitch instead (MIDI convention, 440 * 2^((n-69)/12)).
    const wholeKey = word[1] === 0 && word[2] === 0;
    expect(wordOf(wholeKey ? 440 * 2 ** ((word[0] - 69) / 12) : printedHz)).toEqual(word);
  });

  it('encodes a just fifth above equal-tempered C4 as 43 02 40', () => {
    // MIDI Tuning specification: a just fifth above equal-tempered C4, 392.4383 Hz, encodes as 43
    // 02 40
    expect(wordOf(261.6255653006 * 1.5)).toEqual([0x43, 0x02, 0x40]);
    expect(wordOf(392.4383)).toEqual([0x43, 0x02, 0x40]);
  });

  it('writes 7F 7F 7F ("no change") for an unmapped key and reads it back as null', () => {
    // MIDI Tuning specification, 7F 7F 7F means "no change"
    expect(wordOf(null)).toEqual([0x7f, 0x7f, 0x7f]);
    expect(hzOfFrequencyWord(0x7f, 0x7f, 0x7f)).toBeNull();
  });

  it('rounds to the nearest unit rather than truncating', () => {
    // MIDI Tuning specification: one unit is 100/16384 cents; 0.7 of a unit above 440 Hz rounds up
    // to 45 00 01
    expect(wordOf(440 * 2 ** ((0.7 * 100) / 16384 / 1200))).toEqual([0x45, 0x00, 0x01]);
    expect(wordOf(440 * 2 ** ((0.3 * 100) / 16384 / 1200))).toEqual([0x45, 0x00, 0x00]);
  });

  it('clamps pitches outside 8.1758-13289.6566 Hz to the ends of the range and says so', () => {
    const clamped = (hz: number) => writeFrequencyWord(new Uint8Array(3), 0, hz);
    // MIDI Tuning specification, the highest usable value is 7F 7F 7E
    expect(wordOf(20000)).toEqual([0x7f, 0x7f, 0x7e]);
    expect(wordOf(5)).toEqual([0x00, 0x00, 0x00]);
    expect(wordOf(0)).toEqual([0x00, 0x00, 0x00]);
    expect([20000, 5, 0, 13289.7].map(clamped)).toEqual([true, true, true, true]);
    expect([440, 8.1758, 13289.6566].map(clamped)).toEqual([false, false, false]);
  });

  it('leaves at most half a unit, 0.0030518 cents, of error anywhere in the range', () => {
    fc.assert(
      fc.property(fc.double({ min: 8.1758, max: 13289.65, noNaN: true }), (hz) => {
        const word = wordOf(hz);
        const decoded = hzOfFrequencyWord(word[0], word[1], word[2]);
        // MIDI Tuning specification: rounding to the nearest unit leaves at most 0.0030517578125
        // cents of error
        expect(Math.abs(centsBetween(hz, decoded ?? 0))).toBeLessThanOrEqual(0.0030518);
      }),
      { numRuns: 5000 },
    );
  });
});
