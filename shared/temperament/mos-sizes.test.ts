import * as fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { mosSizes } from './mos-sizes';

/**
 * MOS sizes from the continued fraction of generator / period: the denominators of the convergents and
 * semiconvergents (from memory: the classic account of moments of symmetry and the three-gap theorem), written
 * apart from the implementation, which counts the step sizes.
 */
function sizesFromContinuedFraction(ratio: number, largest: number): number[] {
  const sizes = new Set<number>();
  let [previous, current] = [0, 1];
  let x = ratio;
  for (let depth = 0; depth < 40; depth++) {
    const whole = Math.floor(x);
    if (depth > 0) {
      for (let j = 1; j <= whole; j++) {
        const size = previous + j * current;
        if (size > largest) break;
        sizes.add(size);
      }
      [previous, current] = [current, previous + whole * current];
      if (current > largest) break;
    }
    const rest = x - whole;
    if (rest < 1e-9) break;
    x = 1 / rest;
  }
  return [...sizes].filter((size) => size >= 2).sort((a, b) => a - b);
}

describe('MOS sizes', () => {
  it('lists the diatonic and chromatic sizes of meantone', () => {
    // from memory (published temperament tables): meantone's MOS sizes run 5, 7, 12, 19, 31, 50, 81
    expect(mosSizes(1200, 1200 - 696.239, 1, 100)).toEqual([2, 3, 5, 7, 12, 19, 31, 50, 81]);
  });

  it('stops at an equal division: 500-cent fourths close after 12 notes of one size', () => {
    // arithmetic: 12 fourths of 500 c return to the start, so 12 notes have one step and more repeat notes;
    // 11 notes have ten steps of 100 c and one of 200 c; 8 notes have two sizes, unevenly spread
    // (100 200 200 100 200 200 100 100 c from the start: three steps in a row hold no large step where the last
    // two meet the first, and two large steps elsewhere)
    expect(mosSizes(1200, 500, 1, 100)).toEqual([2, 3, 5, 7, 11]);
  });

  it('counts every period of the octave', () => {
    // arithmetic: with two periods an octave, each size counts the notes of both
    expect(mosSizes(600, 104.9, 2, 100).every((size) => size % 2 === 0)).toBe(true);
  });

  it('agrees with the continued fraction of generator / period', () => {
    fc.assert(
      fc.property(fc.double({ min: 5, max: 595, noNaN: true }), (generator) => {
        const period = 1200;
        // Two step sizes closer than the tolerance in cents would count as one: keep clear of near-equal ones.
        fc.pre(
          Array.from({ length: 101 }, (_, n) => n).every(
            (n) =>
              n < 2 ||
              Math.abs((n * generator) / period - Math.round((n * generator) / period)) > 1e-6,
          ),
        );
        expect(mosSizes(period, generator, 1, 100)).toEqual(
          sizesFromContinuedFraction(generator / period, 100),
        );
      }),
    );
  });
});
