import { describe, expect, it } from 'vitest';
import { builtScale, degreeRatios, scaleFaults } from './scale.testing';

describe('list scales', () => {
  it('puts the tonic first and sorts the degrees', () => {
    const scale = builtScale({
      kind: 'list',
      degrees: ['15/8', '9/8', '5/3', '5/4', '3/2', '4/3'],
      period: '2/1',
    });
    expect(degreeRatios(scale)).toEqual(['1/1', '9/8', '5/4', '4/3', '3/2', '5/3', '15/8']);
  });

  it('mixes ratios and cents, keeping the ratios exact', () => {
    const scale = builtScale({ kind: 'list', degrees: ['700c', '5/4'], period: '2/1' });
    expect(degreeRatios(scale)).toEqual(['1/1', '5/4', null]);
    expect(scale.degrees[2].cents).toBe(700);
  });

  it('keeps a degree written twice and warns at the later one', () => {
    const scale = builtScale({
      kind: 'list',
      degrees: ['5/4', '9/8', '386.3137139c'],
      period: '2/1',
    });
    expect(scale.degrees).toHaveLength(4);
    expect(scale.warnings).toEqual([
      {
        path: 'scale.degrees[2]',
        message:
          'scale.degrees[2]: 386.313714c coincides with scale.degrees[0] (5/4) at 386.313714c',
      },
    ]);
  });

  it('names the field of every degree outside the period', () => {
    expect(
      scaleFaults({
        kind: 'list',
        degrees: ['9/8', '0/2', '2/1', '1/1', '-5c', '5/2', '1.5'],
        period: '2/1',
      }),
    ).toEqual([
      'scale.degrees[1]: 0/2 is not a ratio above 0',
      'scale.degrees[2]: 2/1 is not below the period 2/1',
      'scale.degrees[3]: 1/1 is not above the tonic',
      'scale.degrees[4]: -5c is not above the tonic',
      'scale.degrees[5]: 5/2 is not below the period 2/1',
      'scale.degrees[6]: 1.5 needs a unit: write 1.5c for cents or a ratio such as 3/2',
    ]);
  });

  it('refuses a list longer than a scale may be', () => {
    const degrees = Array.from({ length: 256 }, (_, index) => `${index + 1}c`);
    expect(scaleFaults({ kind: 'list', degrees, period: '2/1' })).toEqual([
      'scale.degrees: gives 257 degrees; a scale holds at most 256',
    ]);
  });
});
