import Fraction from 'fraction.js';
import { describe, expect, it } from 'vitest';
import {
  factorRatio,
  monzoCents,
  monzoOver,
  monzoRatio,
  primesUsed,
  subgroupName,
  tenneyHeight,
} from './monzo';

const fiveLimit = [2, 3, 5];

describe('monzos', () => {
  it('factors the syntonic comma over the primes up to 13', () => {
    // arithmetic: 81 = 3^4, 80 = 2^4 * 5
    expect(factorRatio(new Fraction(81, 80))).toEqual({
      exponents: [-4, 4, -1, 0, 0, 0],
      beyondThirteen: false,
    });
    expect(primesUsed([-4, 4, -1, 0, 0, 0])).toEqual([2, 3, 5]);
  });

  it('says when a prime above 13 is left over, in the numerator or the denominator', () => {
    // arithmetic: 17 and 19 are primes
    expect(factorRatio(new Fraction(17, 16)).beyondThirteen).toBe(true);
    expect(factorRatio(new Fraction(20, 19)).beyondThirteen).toBe(true);
    expect(factorRatio(new Fraction(169, 168)).beyondThirteen).toBe(false);
  });

  it('factors terms past 2^64 exactly', () => {
    // arithmetic: 3^53 / 2^84 = 19383245667680019896796723 / 19342813113834066795298816
    const ratio = new Fraction(19383245667680019896796723n, 19342813113834066795298816n);
    const { exponents } = factorRatio(ratio);
    expect(exponents).toEqual([-84, 53, 0, 0, 0, 0]);
    expect(monzoRatio(monzoOver(exponents, [2, 3]), [2, 3])).toBe(
      '19383245667680019896796723/19342813113834066795298816',
    );
    // standard acoustics texts: Mercator's comma 3^53/2^84 is about 3.615 cents
    expect(monzoCents([-84, 53], [2, 3])).toBeCloseTo(3.615, 3);
  });

  it('measures commas in cents', () => {
    // standard acoustics texts: syntonic comma 21.5062895967 c, schisma 1.9537207879 c
    expect(monzoCents([-4, 4, -1], fiveLimit)).toBeCloseTo(21.5062895967, 9);
    expect(monzoCents([-15, 8, 1], fiveLimit)).toBeCloseTo(1.9537207879, 9);
  });

  it('gives the Tenney height log2(n·d)', () => {
    // Tenney (1983): the height of n/d in lowest terms is n·d; 81·80 = 6480
    expect(tenneyHeight([-4, 4, -1], fiveLimit)).toBeCloseTo(Math.log2(6480), 12);
    expect(tenneyHeight([-1, 1, 0], fiveLimit)).toBeCloseTo(Math.log2(6), 12);
  });

  it('writes monzos back as ratios and primes as subgroups', () => {
    // arithmetic: 2^-5 3^2 5^2 7^-1 = 225/224
    expect(monzoRatio([-5, 2, 2, -1], [2, 3, 5, 7])).toBe('225/224');
    expect(monzoOver([-5, 2, 2, -1, 0, 0], [2, 3, 7])).toEqual([-5, 2, -1]);
    expect(subgroupName([2, 3, 11, 13])).toBe('2.3.11.13');
  });
});
