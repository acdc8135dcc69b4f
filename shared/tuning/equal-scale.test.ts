import { describe, expect, it } from 'vitest';
import { builtScale, degreeRatios, scaleFaults } from './scale.testing';

describe('equal scales', () => {
  it('divides the tritave into 13 equal steps', () => {
    const scale = builtScale({ kind: 'equal', divisions: 13, period: '3/1' });
    // published definition of the scale (Bohlen-Pierce step, 3^(1/13))
    expect(scale.degrees[1].cents).toBeCloseTo(146.3042308358, 9);
    expect(scale.degrees).toHaveLength(13);
  });

  it('has a fifth 0.0682 cents narrow of pure in 53 equal divisions', () => {
    const scale = builtScale({ kind: 'equal', divisions: 53, period: '2/1' });
    // definition (53 equal fifth, 701.8867924528 cents, -0.0682 from 3/2)
    expect(scale.degrees[31].cents).toBeCloseTo(701.8867924528, 9);
    expect(scale.degrees[31].cents - 701.9550008654).toBeCloseTo(-0.0682, 4);
  });

  it('keeps the steps exact where the period divides evenly', () => {
    const scale = builtScale({ kind: 'equal', divisions: 4, period: '4/1' });
    expect(degreeRatios(scale)).toEqual(['1/1', null, '2/1', null]);
    expect(scale.degrees[1].cents).toBeCloseTo(600, 12);
  });

  it('divides a period written in cents', () => {
    const scale = builtScale({ kind: 'equal', divisions: 3, period: '1902c' });
    expect(scale.degrees.map((degree) => degree.cents)).toEqual([0, 634, 1268]);
  });

  it('names the field of every fault', () => {
    expect(scaleFaults({ kind: 'equal', divisions: 0, period: '2/1' })).toEqual([
      'scale.divisions: 0 is not a whole number from 1 to 256',
    ]);
    expect(scaleFaults({ kind: 'equal', divisions: 12, period: '0c' })).toEqual([
      'scale.period: 0c is not above the tonic; a period must be wider than 1/1',
    ]);
    expect(scaleFaults({ kind: 'equal', divisions: 12, period: '1000/1' })).toEqual([
      'scale.period: 1000/1 is wider than 8 octaves (9600c)',
    ]);
  });
});
