import { describe, expect, it } from 'vitest';
import { beatRates } from './beats';
import { builtScale, stack } from './scale.testing';
import { equalTemperedHz } from './twelve-edo';

const twelveEqual = builtScale({ kind: 'equal', divisions: 12, period: '2/1' });

describe('beatRates', () => {
  it('counts 3 beats a second for 201 Hz against 300 Hz', () => {
    const scale = builtScale({ kind: 'list', degrees: ['300/201'], period: '2/1' });
    const [tonic] = beatRates(scale, 201);
    // standard acoustics handbooks (201 Hz against 300 Hz beats 3 times a second)
    expect(tonic.fifth?.beatsPerSecond).toBeCloseTo(3, 9);
    expect(tonic.fifth?.toDegree).toBe(1);
  });

  it('gives the equal-tempered thirds on F3 and C4 their familiar beat rates', () => {
    const fromF3 = beatRates(twelveEqual, equalTemperedHz(53, 440));
    const fromC4 = beatRates(twelveEqual, equalTemperedHz(60, 440));
    // standard acoustics handbooks (equal-tempered F3-A3 about 6.9 beats a second)
    expect(fromF3[0].majorThird?.beatsPerSecond).toBeCloseTo(6.9, 1);
    // standard acoustics handbooks (equal-tempered C4-E4 about 10.4 beats a second)
    expect(fromC4[0].majorThird?.beatsPerSecond).toBeCloseTo(10.4, 1);
    expect(fromC4[0].majorThird?.toDegree).toBe(4);
    expect(fromC4[0].fifth?.toDegree).toBe(7);
  });

  it('finds the fifth a period up, and no beats in a pure fifth', () => {
    const fifths = builtScale(stack('3/2', '2/1', 5, 1));
    const beats = beatRates(fifths, 261.6255653);
    expect(beats[4].fifth).toEqual({
      toDegree: 1,
      intervalCents: expect.closeTo(701.955, 3),
      beatsPerSecond: expect.closeTo(0, 9),
    });
    expect(beats[6].fifth).toBeNull();
  });

  it('leaves out intervals that are too far from the just ratio to beat', () => {
    const bohlenPierce = builtScale({ kind: 'equal', divisions: 13, period: '3/1' });
    expect(beatRates(bohlenPierce, 200).every((beats) => beats.majorThird === null)).toBe(true);
  });
});
