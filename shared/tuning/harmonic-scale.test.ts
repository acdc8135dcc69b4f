import { describe, expect, it } from 'vitest';
import { builtScale, degreeRatios, scaleFaults } from './scale.testing';

describe('harmonic scales', () => {
  it('takes harmonics 8 to 15 over 8 in the period 16/8', () => {
    const scale = builtScale({ kind: 'harmonic', from: 8, to: 16, sub: false });
    expect(degreeRatios(scale)).toEqual([
      '1/1',
      '9/8',
      '5/4',
      '11/8',
      '3/2',
      '13/8',
      '7/4',
      '15/8',
    ]);
    expect(scale.period.ratio?.equals(2)).toBe(true);
  });

  it('mirrors the segment as subharmonics', () => {
    const scale = builtScale({ kind: 'harmonic', from: 8, to: 16, sub: true });
    expect(degreeRatios(scale)).toEqual([
      '1/1',
      '16/15',
      '8/7',
      '16/13',
      '4/3',
      '16/11',
      '8/5',
      '16/9',
    ]);
  });

  it('allows a period other than the octave', () => {
    const scale = builtScale({ kind: 'harmonic', from: 4, to: 7, sub: false });
    expect(degreeRatios(scale)).toEqual(['1/1', '5/4', '3/2']);
    expect(scale.period.ratio?.equals([7, 4])).toBe(true);
  });

  it('names the field of every fault', () => {
    expect(scaleFaults({ kind: 'harmonic', from: 0, to: 4, sub: false })).toEqual([
      'scale.from: 0 is not a harmonic number (1, 2, 3...)',
    ]);
    expect(scaleFaults({ kind: 'harmonic', from: 8, to: 8, sub: false })).toEqual([
      'scale.to: 8 is not a harmonic number above 8',
    ]);
    expect(scaleFaults({ kind: 'harmonic', from: 1, to: 300, sub: false })).toEqual([
      'scale.to: gives 299 degrees; a scale holds at most 256',
    ]);
    expect(scaleFaults({ kind: 'harmonic', from: 1, to: 257, sub: false })).toEqual([
      'scale.to: 257/1 is wider than 8 octaves (9600c)',
    ]);
  });
});
