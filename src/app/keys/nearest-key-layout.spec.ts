import { nearestKeyLayout } from './nearest-key-layout';

describe('nearestKeyLayout', () => {
  it('puts the Pythagorean major scale on the white keys', () => {
    // 1/1 9/8 81/64 4/3 3/2 27/16 243/128 in cents (from memory).
    const cents = [0, 203.91, 407.82, 498.04, 701.96, 905.87, 1109.78];
    expect(nearestKeyLayout(cents, 1200)).toEqual([
      0,
      null,
      1,
      null,
      2,
      3,
      null,
      4,
      null,
      5,
      null,
      6,
    ]);
  });

  it('spans a tritave with 19 keys', () => {
    expect(nearestKeyLayout([0, 950], 1901.955)?.length).toBe(19);
  });

  it('gives up when two degrees share a key', () => {
    expect(nearestKeyLayout([0, 38.7, 77.4], 1200)).toBeNull();
    expect(
      nearestKeyLayout(
        Array.from({ length: 19 }, (_, step) => step * 63.16),
        1200,
      ),
    ).toBeNull();
  });
});
