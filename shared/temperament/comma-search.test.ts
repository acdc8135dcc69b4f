import { describe, expect, it } from 'vitest';
import { patentVal, simpleCommas } from './comma-search';

describe('comma suggestions', () => {
  it('writes the patent val of 12 equal steps', () => {
    // from memory (published temperament tables): 12-tone equal temperament's 7-limit val is <12 19 28 34]
    expect(patentVal(12, [2, 3, 5, 7])).toEqual([12, 19, 28, 34]);
  });

  it('lists the 5-limit commas that 12 equal steps temper out, the simplest first', () => {
    const found = simpleCommas([2, 3, 5], patentVal(12, [2, 3, 5]));
    // arithmetic: <12 19 28] maps each to zero steps; 250/243 = [1 -5 3> maps to 1 step and is left out
    expect(found.map((comma) => comma.ratio)).toEqual([
      '81/80',
      '128/125',
      '2048/2025',
      '32805/32768',
      '531441/524288',
    ]);
    // standard acoustics texts: syntonic comma 21.5062895967 c, Pythagorean comma 23.4600103846 c
    expect(found[0].cents).toBeCloseTo(21.5062895967, 9);
    expect(found[4].cents).toBeCloseTo(23.4600103846, 9);
    // Tenney (1983): height log2(81 * 80)
    expect(found[0].complexity).toBeCloseTo(Math.log2(6480), 12);
  });

  it('without a val, lists every small simple comma of the subgroup, each small, upward and primitive', () => {
    const primes = [2, 3, 5, 7];
    const found = simpleCommas(primes);
    // arithmetic: 250/243 = 49.17 c and 36/35 = 48.77 c are under a quarter tone; 25/24 (70.67 c) is not
    expect(found.map((comma) => comma.ratio)).toEqual(expect.arrayContaining(['250/243', '36/35']));
    expect(found.map((comma) => comma.ratio)).not.toContain('25/24');
    // (81/80)^2 is a power of a simpler comma
    expect(found.map((comma) => comma.ratio)).not.toContain('6561/6400');
    for (const [i, comma] of found.entries()) {
      expect(comma.cents).toBeGreaterThan(0);
      // under a quarter tone (common practice), no more complex than log2(n·d) = 40
      expect(comma.cents).toBeLessThan(50);
      expect(comma.complexity).toBeLessThanOrEqual(40);
      if (i > 0) expect(comma.complexity).toBeGreaterThanOrEqual(found[i - 1].complexity);
      const [n, d] = comma.ratio.split('/').map(BigInt);
      expect(1200 * Math.log2(Number(n) / Number(d))).toBeCloseTo(comma.cents, 6);
    }
  });

  it('keeps only commas the val maps to zero steps', () => {
    const primes = [2, 3, 5, 7, 11];
    const val = patentVal(31, primes);
    const found = simpleCommas(primes, val);
    expect(found.length).toBeGreaterThan(0);
    for (const comma of found)
      expect(comma.monzo.reduce((sum, e, i) => sum + e * val[i], 0)).toBe(0);
    // from memory: 31 equal steps temper out the syntonic comma (it is a meantone tuning) and 99/98
    expect(found.map((comma) => comma.ratio)).toEqual(expect.arrayContaining(['81/80', '99/98']));
  });
});
