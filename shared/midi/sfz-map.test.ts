import * as fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { keyTables, pureFifthsOnWhiteKeys, twelveEqualKeys } from './key-tables.testing';
import { sfzMap } from './sfz-map';

interface Region {
  key: number;
  centre: number;
  tune: number;
}

const regionLine = /^<region> lokey=(\d+) hikey=(\d+) pitch_keycenter=(\d+) tune=(-?\d+)$/gm;

/** Reads the regions back from the text, as a sampler would. */
function regionsOf(text: string): Region[] {
  return [...text.matchAll(regionLine)].map((match) => {
    expect(match[1]).toBe(match[2]);
    return { key: Number(match[1]), centre: Number(match[3]), tune: Number(match[4]) };
  });
}

/** The pitch a region plays: the middle C sample moved by (key - centre) semitones + tune cents. */
function soundingHz(region: Region): number {
  // MIDI convention: key 60 = 261.6255653006 Hz (MIDI convention)
  return 261.6255653006 * 2 ** (((region.key - region.centre) * 100 + region.tune) / 1200);
}

describe('SFZ sampler maps', () => {
  it('maps equal temperament with no fine tune and states its precision', () => {
    const { text, warnings } = sfzMap(twelveEqualKeys, { name: '12 equal' });
    const regions = regionsOf(text);
    expect(regions).toHaveLength(128);
    expect(regions.every((region) => region.centre === 60 && region.tune === 0)).toBe(true);
    const precision = 'Precision: tune holds whole cents, so every key sounds within 0.5 cent';
    expect(text.split('\n')).toContain(`// ${precision} of the tuning.`);
    expect(text).toMatch(/^sample=middle-c\.wav pitch_keytrack=100$/m);
    expect(warnings).toEqual([]);
  });

  it('writes one region per mapped key: the just fifth G4 is 2 cents sharp', () => {
    const regions = regionsOf(sfzMap(pureFifthsOnWhiteKeys, { name: 'fifths' }).text);
    expect(regions.map((region) => region.key)).not.toContain(61);
    // arithmetic (MIDI convention): pure fifths from equal-tempered C4, G = 392.4383 Hz, 1.955
    // cents above equal-tempered G (391.9954 Hz)
    expect(regions.find((region) => region.key === 67)).toEqual({ key: 67, centre: 60, tune: 2 });
  });

  it('keeps every mapped key of any scale within half a cent, or reports it', () => {
    fc.assert(
      fc.property(keyTables, (keys) => {
        const { text, warnings } = sfzMap(keys, { name: 'any' });
        const regions = regionsOf(text);
        const mapped = keys.filter((entry) => entry.hz !== null).map((entry) => entry.key);
        expect(regions.map((region) => region.key)).toEqual(mapped);
        const errorCents = (region: Region) =>
          Math.abs(1200 * Math.log2((keys[region.key].hz ?? 0) / soundingHz(region)));
        // from memory: SFZ 1.0 takes tune from -100 to 100 cents and pitch_keycenter from 0 to 127
        const valid = (region: Region) =>
          Math.abs(region.tune) <= 100 && region.centre >= 0 && region.centre <= 127;
        expect(regions.every(valid)).toBe(true);
        const beyond = regions.filter((region) => errorCents(region) > 0.5 + 1e-9);
        expect(warnings.length).toBe(beyond.length > 0 ? 1 : 0);
      }),
      { numRuns: 300 },
    );
  });

  it('keeps a preset name on one comment line', () => {
    const { text } = sfzMap(twelveEqualKeys, { name: 'two\nlines' });
    expect(text.split('\n')[0]).toBe('// Keyloom sampler map: two lines');
  });
});

describe('SFZ sampler maps from several samples', () => {
  const samples = [
    { file: 'piano-c2.wav', key: 36 },
    { file: 'piano-c4.wav', key: 60 },
    { file: 'piano-c6.wav', key: 84 },
  ];
  const multiRegion =
    /^<region> sample=(\S+) lokey=(\d+) hikey=\d+ pitch_keycenter=(\d+) tune=(-?\d+)$/gm;

  it('plays each key from the sample recorded nearest its pitch, each region within half a cent', () => {
    const text = sfzMap(twelveEqualKeys, { name: 'piano', samples }).text;
    const regions = [...text.matchAll(multiRegion)].map(([, file, key, centre, tune]) => ({
      file,
      key: Number(key),
      centre: Number(centre),
      tune: Number(tune),
    }));
    expect(regions).toHaveLength(128);
    const sampleOf = (key: number) => regions.find((region) => region.key === key)!.file;
    expect([
      sampleOf(30),
      sampleOf(48),
      sampleOf(49),
      sampleOf(72),
      sampleOf(73),
      sampleOf(120),
    ]).toEqual([
      'piano-c2.wav',
      'piano-c2.wav',
      'piano-c4.wav',
      'piano-c4.wav',
      'piano-c6.wav',
      'piano-c6.wav',
    ]);
    // Each sample sounds its key's equal-tempered pitch (MIDI convention): moved by (key - centre)
    // semitones plus tune cents from its own key, every key of twelve equal sounds exactly.
    for (const region of regions) {
      const sampleKey = samples.find((sample) => sample.file === region.file)!.key;
      const sounding =
        440 * 2 ** ((sampleKey - 69 + (region.key - region.centre) + region.tune / 100) / 12);
      expect(Math.abs(1200 * Math.log2(sounding / twelveEqualKeys[region.key].hz!))).toBeLessThan(
        0.5,
      );
    }
    expect(text).toContain(
      'piano-c2.wav at key 36, piano-c4.wav at key 60, piano-c6.wav at key 84',
    );
  });
});
