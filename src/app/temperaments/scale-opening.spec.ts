import type { TemperamentResult } from '@shared/api/temperaments';
import { buildScale } from '@shared/tuning/scale';
import { decodeDesign } from '../design/design-address';
import type { DraftDocument } from '../design/draft-document';
import { scaleOpening } from './scale-opening';

/** Meantone (81/80 tempered out) with its POTE fifth of about 696.24 cents (from memory). */
const meantone: TemperamentResult = {
  tuning: 'POTE',
  primes: [2, 3, 5],
  mapping: [
    [1, 1, 0],
    [0, 1, 4],
  ],
  commas: ['81/80'],
  periodsPerOctave: 1,
  period: 1200,
  generator: 696.238659035547,
  errors: [],
  mosSizes: [2, 3, 5, 7, 12, 19, 31, 50, 81],
};

function opened(result: TemperamentResult, size: number) {
  const opening = scaleOpening(result, size);
  if (typeof opening === 'string') throw new Error(opening);
  const design = decodeDesign(opening.address) as DraftDocument;
  if (design.scale.kind !== 'generated') throw new Error('not a generated scale');
  return { opening, design, scale: design.scale };
}

/** The degrees, in cents, that a generated design's scale builds. */
function degreesOf(scale: { generator: string; period: string; up?: unknown; down?: unknown }) {
  const built = buildScale({
    kind: 'generated',
    generator: scale.generator,
    period: scale.period,
    up: Number(scale.up),
    down: Number(scale.down),
  });
  if (!built.ok) throw new Error(built.errors[0].message);
  return built.value.degrees.map((degree) => Number(degree.cents.toFixed(4)));
}

describe('Opening a tempered result as a scale', () => {
  it('writes twelve notes of meantone as its generator in cents over a pure octave, E-flat to G-sharp', () => {
    const { opening, design, scale } = opened(meantone, 12);
    expect(scale).toEqual({
      kind: 'generated',
      generator: '696.238659c',
      period: '2/1',
      // Three fifths below C and eight above: E-flat to G-sharp (common practice).
      up: 8,
      down: 3,
    });
    expect(design.name).toBe('12 notes tempering out 81/80 (POTE)');
    expect(design.output.tuningName).toBe('12 POTE 81/80');
    expect(design.mapping).toEqual({ rootKey: 60, concertA: 440 });
    // Seven diatonic semitones (3 octaves less 5 fifths) and five chromatic ones (7 fifths less 4 octaves):
    // arithmetic on the fifth of 696.239 cents.
    expect(opening.pattern.isMos).toBeTrue();
    expect(opening.pattern.sizes.map((size) => [size.letter, size.count])).toEqual([
      ['L', 7],
      ['s', 5],
    ]);
    expect(opening.pattern.sizes[0].cents).toBeCloseTo(3600 - 5 * 696.238659035547, 6);
    expect(opening.pattern.sizes[1].cents).toBeCloseTo(7 * 696.238659035547 - 4800, 6);
    expect(opening.perPeriod).toBe(12);
  });

  it('lays a scale of fewer than twelve notes in a pure octave on its nearest keys, as the designer does', () => {
    const { design, opening } = opened(meantone, 7);
    // Two fifths below C and four above: B-flat, F, C, G, D, A, E.
    expect([opening.down, opening.up]).toEqual([2, 4]);
    expect(design.mapping.layout).toEqual([0, null, 1, null, 2, 3, null, 4, null, 5, 6, null]);
    expect(opening.pattern.pattern).toBe('LLsLLsL');
  });

  it('keeps a tempered period in cents, and lays its keys one after another', () => {
    const te = {
      ...meantone,
      tuning: 'TE' as const,
      period: 1201.39685136,
      generator: 697.04911064,
    };
    const { scale, design } = opened(te, 19);
    expect(scale.period).toBe('1201.396851c');
    expect(scale.generator).toBe('697.049111c');
    expect([scale.down, scale.up]).toEqual([6, 12]);
    expect(design.mapping.layout).toBeUndefined();
  });

  it('gives the same notes whichever way the generator is written: the fifth, the fourth, or below the tonic', () => {
    const fifth = opened(meantone, 12).scale;
    const fourth = opened({ ...meantone, generator: 1200 - meantone.generator }, 12).scale;
    const downward = opened({ ...meantone, generator: -(1200 - meantone.generator) }, 12).scale;
    expect(fourth.generator).toBe('503.761341c');
    expect([fourth.up, fourth.down]).toEqual([3, 8]);
    expect(downward.generator).toBe('696.238659c');
    expect(degreesOf(fourth)).toEqual(degreesOf(fifth));
    expect(degreesOf(downward)).toEqual(degreesOf(fifth));
  });

  it('counts the notes of an octave when the period divides it', () => {
    // Half-octave period: 2048/2025 tempered out in the 5-limit (from memory), generator near a fifth less the period.
    const halfOctave = {
      ...meantone,
      commas: ['2048/2025'],
      periodsPerOctave: 2,
      period: 600,
      generator: 105.21,
      // Sizes are notes an octave: two periods of 1, 2, 3, 5, 6, 11 and 17 notes.
      mosSizes: [2, 4, 6, 10, 12, 22, 34],
    };
    const { opening, scale } = opened(halfOctave, 12);
    expect(scale.period).toBe('600c');
    expect(opening.perPeriod).toBe(6);
    expect(opening.pattern.pattern.length).toBe(6);
  });

  it('says in words when the generator makes no scale, rather than opening one', () => {
    expect(scaleOpening({ ...meantone, generator: 1200 }, 12)).toContain('spans whole periods');
    expect(scaleOpening({ ...meantone, generator: 0 }, 12)).toContain('spans whole periods');
  });
});
