import Fraction from 'fraction.js';
import { describe, expect, it } from 'vitest';
import { type Comma, rankTwoMapping } from './mapping';
import { factorRatio, monzoOver } from './monzo';
import { pureOctaveTeTuning, teTuning } from './te-tuning';

function hermiteOf(primes: number[], ...ratios: string[]): number[][] {
  const commas: Comma[] = ratios.map((ratio, i) => ({
    ratio,
    monzo: monzoOver(factorRatio(new Fraction(ratio)).exponents, primes),
    path: `commas[${i}]`,
  }));
  const made = rankTwoMapping(commas, primes);
  if (!made.ok) throw new Error(made.errors[0].message);
  return made.value.hermite;
}

/**
 * TE from its definition, written apart from the implementation (which takes ml-matrix's pseudo-inverse): with
 * A = M·W (W = diag(1 / log2 p)) and b = J·W (J the primes in cents), the least-squares t of t·A ≈ b solves
 * the normal equations t·(A·Aᵀ) = b·Aᵀ; the 2 x 2 system is solved here by Cramer's rule.
 */
function teByNormalEquations(mapping: number[][], primes: number[]): [number, number] {
  const a = mapping.map((row) => row.map((e, i) => e / Math.log2(primes[i])));
  const b = primes.map((p) => (1200 * Math.log2(p)) / Math.log2(p));
  const dot = (x: number[], y: number[]) => x.reduce((sum, v, i) => sum + v * y[i], 0);
  const [g00, g01, g11] = [dot(a[0], a[0]), dot(a[0], a[1]), dot(a[1], a[1])];
  const [r0, r1] = [dot(b, a[0]), dot(b, a[1])];
  const determinant = g00 * g11 - g01 * g01;
  return [(r0 * g11 - r1 * g01) / determinant, (r1 * g00 - r0 * g01) / determinant];
}

const temperaments: [string, number[], string[]][] = [
  ['meantone', [2, 3, 5], ['81/80']],
  ['diaschismic', [2, 3, 5], ['2048/2025']],
  ['porcupine', [2, 3, 5], ['250/243']],
  ['septimal meantone', [2, 3, 5, 7], ['81/80', '225/224']],
  ['a 13-limit temperament', [2, 3, 5, 7, 11, 13], ['81/80', '126/125', '99/98', '144/143']],
  ['a 2.3.11.13 temperament', [2, 3, 11, 13], ['243/242', '144/143']],
];

describe('the TE tuning', () => {
  it.each(temperaments)(
    'agrees with the normal equations solved by hand for %s, to 1e-9 cents',
    (_name, primes, commas) => {
      const mapping = hermiteOf(primes, ...commas);
      const expected = teByNormalEquations(mapping, primes);
      const found = teTuning(mapping, primes);
      expect(Math.abs(found[0] - expected[0])).toBeLessThan(1e-9);
      expect(Math.abs(found[1] - expected[1])).toBeLessThan(1e-9);
    },
  );

  it('tunes meantone as published', () => {
    const mapping = hermiteOf([2, 3, 5], '81/80');
    const [octave, twelfth] = teTuning(mapping, [2, 3, 5]);
    // from memory (published temperament tables): meantone TE octave 1201.397 c, fifth 697.049 c
    expect(octave).toBeCloseTo(1201.397, 3);
    expect(twelfth - octave).toBeCloseTo(697.049, 3);
  });

  it('scales TE to a pure octave for POTE', () => {
    const mapping = hermiteOf([2, 3, 5], '81/80');
    const [octave, twelfth] = pureOctaveTeTuning(mapping, [2, 3, 5]);
    // from memory (published temperament tables): meantone POTE fifth 696.239 c
    expect(octave).toBe(1200);
    expect(twelfth - octave).toBeCloseTo(696.239, 3);
    // arithmetic: the same ratio as TE's twelfth to its octave
    const te = teTuning(mapping, [2, 3, 5]);
    expect(twelfth / octave).toBeCloseTo(te[1] / te[0], 12);
  });

  it('keeps a half-octave period pure for a temperament of two periods an octave', () => {
    const mapping = hermiteOf([2, 3, 5], '2048/2025');
    // arithmetic: 2/1 maps to two periods, so a pure octave is two periods of 600 c
    expect(pureOctaveTeTuning(mapping, [2, 3, 5])[0]).toBeCloseTo(600, 9);
  });
});
