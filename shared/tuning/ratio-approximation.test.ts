import { describe, expect, it } from 'vitest';
import { ratioToString } from './interval';
import { nearestRatio, simpleRatios } from './ratio-approximation';

describe('simpleRatios and nearestRatio', () => {
  const fifteenLimit = simpleRatios(15, 1200);

  it('finds 3/2 for the equal-tempered fifth', () => {
    const found = nearestRatio(700, fifteenLimit);
    expect(ratioToString(found.ratio)).toBe('3/2');
    // REFERENCE.md: definition, 1200 log2(3/2) = 701.9550008654
    expect(found.errorCents).toBeCloseTo(700 - 701.9550008654, 9);
  });

  it('keeps to the odd limit', () => {
    const found = nearestRatio(105, fifteenLimit);
    expect(ratioToString(found.ratio)).toBe('16/15');
    expect(ratioToString(nearestRatio(105, simpleRatios(17, 1200)).ratio)).toBe('17/16');
  });

  it('spans unison to the widest size, sorted and without repeats', () => {
    const texts = fifteenLimit.map((candidate) => ratioToString(candidate.ratio));
    expect(new Set(texts).size).toBe(texts.length);
    expect(texts[0]).toBe('1/1');
    expect(texts[texts.length - 1]).toBe('2/1');
    for (let i = 1; i < fifteenLimit.length; i++) {
      expect(fifteenLimit[i].cents).toBeGreaterThan(fifteenLimit[i - 1].cents);
    }
    expect(simpleRatios(3, 1902).map((candidate) => ratioToString(candidate.ratio))).toEqual([
      '1/1', '4/3', '3/2', '2/1', '8/3', '3/1',
    ]);
  });
});
