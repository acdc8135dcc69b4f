import { describe, expect, it } from 'vitest';
import { ratioToString } from './interval';
import { exactRatioOf, nearestSimpleRatio, ratioSearch } from './ratio-approximation';

const quarterCommaFifth = 1200 * Math.log2(1.5) - 21.5062895967 / 4;

describe('exactRatioOf', () => {
  it('recognises the eighth quarter-comma fifth as exactly 25/16', () => {
    // REFERENCE: quarter-comma meantone, the eighth fifth up from C, reduced, is exactly 25/16 (772.627 c), since
    // four such fifths make 5/1 (standard acoustics texts).
    const gSharp = 8 * quarterCommaFifth - 4 * 1200;
    expect(ratioToString(exactRatioOf(gSharp)!)).toBe('25/16');
    expect(gSharp).toBeCloseTo(772.627, 3);
    // Four fifths up, two octaves down: 5/4 exactly.
    expect(ratioToString(exactRatioOf(4 * quarterCommaFifth - 2400)!)).toBe('5/4');
  });

  it('finds no ratio for a size that is not one with terms up to 10,000', () => {
    expect(exactRatioOf(quarterCommaFifth)).toBeNull();
    expect(exactRatioOf(700)).toBeNull();
    // 3^53 / 2^84 has terms far past 10,000 (REFERENCE: arithmetic).
    expect(
      exactRatioOf(1200 * Math.log2(19383245667680019896796723 / 19342813113834066795298816)),
    ).toBeNull();
    expect(ratioToString(exactRatioOf(1200 * Math.log2(10000 / 9999))!)).toBe('10000/9999');
  });
});

describe('nearestSimpleRatio', () => {
  it('names the simplest ratio by Tenney height within 6 cents', () => {
    // 12-TET fifth 700 c: 3/2 (height 6) is 1.955 c away (REFERENCE: 1200 log2(3/2) = 701.9550008654).
    const fifth = nearestSimpleRatio(700)!;
    expect(ratioToString(fifth.ratio)).toBe('3/2');
    expect(fifth.errorCents).toBeCloseTo(700 - 701.9550008654, 9);
    // 12-TET major third 400 c: 5/4 is 13.7 c away, too far; the simplest ratio within 6 c stands instead.
    const third = nearestSimpleRatio(400)!;
    expect(Math.abs(third.errorCents)).toBeLessThanOrEqual(ratioSearch.withinCents);
    expect(ratioToString(third.ratio)).not.toBe('5/4');
  });

  it('never names a unison for a step of 31 equal divisions', () => {
    // 31 equal divisions: the step of 38.71 c is no simple ratio within 6 c; it must not read "about 1/1".
    const step = nearestSimpleRatio(1200 / 31);
    expect(step && ratioToString(step.ratio)).not.toBe('1/1');
    expect(Math.abs(step?.errorCents ?? 0)).toBeLessThanOrEqual(6);
  });

  it('prefers the smaller height over the nearer ratio', () => {
    // Tenney height of p/q in lowest terms is p * q; the smaller, the simpler (Tenney, 1983).
    // 386 c: 5/4 (height 20, 0.31 c away) over anything nearer and more complex.
    expect(ratioToString(nearestSimpleRatio(386)!.ratio)).toBe('5/4');
    // 969 c: 7/4 (968.826 c, height 28).
    expect(ratioToString(nearestSimpleRatio(969)!.ratio)).toBe('7/4');
  });

  it('draws only from ratios of 2, 3, 5 and 7 with terms up to 256', () => {
    // 11/8 is 551.318 c: out of the 7-limit, so another ratio within 6 c or nothing.
    const near = nearestSimpleRatio(551.318);
    if (near) {
      const [n, d] = ratioToString(near.ratio).split('/').map(Number);
      expect(n % 11 === 0 || d % 11 === 0).toBe(false);
      expect(Math.max(n, d)).toBeLessThanOrEqual(256);
    }
  });
});
