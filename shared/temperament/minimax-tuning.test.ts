import Fraction from 'fraction.js';
import { describe, expect, it } from 'vitest';
import { factorRatio, monzoOver } from './monzo';
import { minimaxTuning } from './minimax-tuning';

const fiveLimit = [2, 3, 5];
const monzo = (ratio: string) => monzoOver(factorRatio(new Fraction(ratio)).exponents, fiveLimit);
const consonances = ['6/5', '5/4', '4/3', '3/2', '8/5', '5/3'].map(monzo);

describe('the minimax tuning (pure period, the largest absolute error as small as it can be)', () => {
  it('gives quarter-comma meantone over the 5-limit consonances', () => {
    // from memory (and arithmetic: with fifth error e, the thirds err by 4e + 21.506 and -(3e + 21.506), and
    // |e| = |3e + 21.506| meets at e = -21.506/4, where 5/4 is pure): meantone's minimax over the 5-odd-limit
    // is quarter-comma meantone, whose fifth is 5^(1/4) = 696.5784284662 c (standard acoustics texts)
    const [octave, twelfth] = minimaxTuning(
      [
        [1, 0, -4],
        [0, 1, 4],
      ],
      fiveLimit,
      consonances,
      0,
    );
    expect(octave).toBe(1200);
    expect(twelfth - octave).toBeCloseTo(696.5784284662, 9);
  });

  it('takes the middle when a target the generator leaves alone holds the largest error', () => {
    // arithmetic: with two periods of 600 c an octave, 45/32 = [-5 2 1> maps to one period and no generator
    // ([<2 0 11], <0 1 -2]]), so it errs by 600 - 590.224 = 9.776 c whatever the generator; every generator
    // that keeps 3/2 within that much is as good, and the middle of them makes 3/2 pure
    const [period, twelfth] = minimaxTuning(
      [
        [2, 0, 11],
        [0, 1, -2],
      ],
      fiveLimit,
      [monzo('45/32'), monzo('3/2')],
      0,
    );
    expect(period).toBe(600);
    // 3/2 = [-1 1 0> is the generator less two periods
    expect(twelfth - 2 * period).toBeCloseTo(1200 * Math.log2(3 / 2), 9);
  });

  it('falls back to the given generator when no target involves the generator', () => {
    const tuning = minimaxTuning(
      [
        [1, 0, -4],
        [0, 1, 4],
      ],
      fiveLimit,
      [monzo('2/1')],
      1897.3,
    );
    expect(tuning).toEqual([1200, 1897.3]);
  });
});
