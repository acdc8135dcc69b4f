import { describe, expect, it } from 'vitest';
import { analyzeScale } from './analysis';
import { ratioToString } from './interval';
import { builtScale, stack } from './scale.testing';
import { equalTemperedHz } from './twelve-edo';

const fromMiddleC = { rootHz: equalTemperedHz(60, 440), concertA: 440 };

describe('analyzeScale', () => {
  it('describes each degree of the fifths from F: ratio, step, nearest note and offset', () => {
    const scale = builtScale(stack('3/2', '2/1', 5, 1));
    const { degrees } = analyzeScale(scale, fromMiddleC);
    expect(degrees.map((degree) => degree.nearestNote.name)).toEqual([
      'C4',
      'D4',
      'E4',
      'F4',
      'G4',
      'A4',
      'B4',
    ]);
    // arithmetic (pure fifths from C4: E 331.1199 Hz; equal-tempered 329.6276)
    const offsets = degrees.map((degree) => degree.nearestNote.offsetCents);
    expect(offsets[2]).toBeCloseTo(1200 * Math.log2(331.1199 / 329.6276), 3);
    // arithmetic (F 348.8341 Hz against equal-tempered 349.2282)
    expect(offsets[3]).toBeCloseTo(1200 * Math.log2(348.8341 / 349.2282), 3);
    expect(degrees.map((degree) => ratioToString(degree.step.ratio!))).toEqual([
      '9/8',
      '9/8',
      '256/243',
      '9/8',
      '9/8',
      '9/8',
      '256/243',
    ]);
    expect(degrees.every((degree) => degree.approximation === null)).toBe(true);
    expect(degrees[0].majorThird?.toDegree).toBe(2);
  });

  it('approximates tempered degrees by simple ratios with their error', () => {
    const meantone = builtScale({
      kind: 'generated',
      generator: '3/2',
      period: '2/1',
      up: 4,
      down: 0,
      temper: { comma: '81/80', fraction: '1/4' },
    });
    const { degrees } = analyzeScale(meantone, fromMiddleC);
    const third = degrees.find((degree) => degree.stackPosition === 4);
    // arithmetic (four fifths of 5^(1/4) make 5/1, two octaves above a pure 5/4): exactly 5/4,
    // so the third is shown as that ratio and approximates nothing.
    expect(third?.ratio && ratioToString(third.ratio)).toBe('5/4');
    expect(third?.approximation).toBeNull();
    const fifth = degrees.find((degree) => degree.stackPosition === 1);
    // standard acoustics texts (quarter-comma fifth); definition (3/2)
    expect(fifth?.approximation?.errorCents).toBeCloseTo(696.5784284662 - 701.9550008654, 9);
  });

  it('lays out the interval matrix from every degree through one period', () => {
    const scale = builtScale({ kind: 'list', degrees: ['5/4', '3/2'], period: '2/1' });
    const { intervalMatrix } = analyzeScale(scale, fromMiddleC);
    const [third, fifth] = [1200 * Math.log2(5 / 4), 1200 * Math.log2(3 / 2)];
    const expected = [
      [0, third, fifth, 1200],
      [0, fifth - third, 1200 - third, 1200],
      [0, 1200 - fifth, 1200 + third - fifth, 1200],
    ];
    intervalMatrix.forEach((row, i) =>
      row.forEach((cents, j) => expect(cents).toBeCloseTo(expected[i][j], 9)),
    );
  });

  it('shows a tempered degree that equals a ratio as that ratio, and names nothing that misleads', () => {
    const meantone = builtScale({
      kind: 'generated',
      generator: '3/2',
      period: '2/1',
      up: 8,
      down: 3,
      temper: { comma: '81/80', fraction: '1/4' },
    });
    const degrees = analyzeScale(meantone, fromMiddleC).degrees;
    const byName = (cents: number) => degrees.find((d) => Math.abs(d.cents - cents) < 0.01)!;
    // REFERENCE: quarter-comma meantone, the eighth fifth up (G#) is exactly 25/16, 772.627 c; E is 5/4.
    expect(ratioToString(byName(772.627).ratio!)).toBe('25/16');
    expect(byName(772.627).approximation).toBeNull();
    expect(ratioToString(byName(386.314).ratio!)).toBe('5/4');
    for (const degree of degrees) {
      if (degree.approximation)
        expect(Math.abs(degree.approximation.errorCents)).toBeLessThanOrEqual(6);
    }
    const thirtyOne = analyzeScale(
      builtScale({ kind: 'equal', divisions: 31, period: '2/1' }),
      fromMiddleC,
    ).degrees;
    // 31 equal divisions: the first step (38.71 c) must not read "about 1/1".
    expect(thirtyOne[1].approximation && ratioToString(thirtyOne[1].approximation.ratio)).not.toBe(
      '1/1',
    );
  });
});
