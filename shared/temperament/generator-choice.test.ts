import * as fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { withGeneratorWithinHalfPeriod } from './generator-choice';

describe('the generator within half a period', () => {
  it('turns meantone twelfth into the fourth', () => {
    // arithmetic: 1901.955 - 1200 = 701.955, the fifth; the octave less that, 498.045, is the fourth
    const chosen = withGeneratorWithinHalfPeriod({
      mapping: [
        [1, 0, -4],
        [0, 1, 4],
      ],
      period: 1200,
      generator: 1901.955,
    });
    expect(chosen.generator).toBeCloseTo(498.045, 9);
    // 3 is then two octaves less a fourth; 5 four octaves less four fourths (arithmetic)
    expect(chosen.mapping).toEqual([
      [1, 2, 4],
      [0, -1, -4],
    ]);
  });

  it('keeps every prime the size it was, and puts the generator from 0 to half a period', () => {
    fc.assert(
      fc.property(
        fc.array(fc.integer({ min: -20, max: 20 }), { minLength: 4, maxLength: 4 }),
        fc.array(fc.integer({ min: -20, max: 20 }), { minLength: 4, maxLength: 4 }),
        fc.double({ min: 100, max: 1300, noNaN: true }),
        fc.double({ min: -5000, max: 5000, noNaN: true }),
        (periods, generators, period, generator) => {
          const chosen = withGeneratorWithinHalfPeriod({
            mapping: [periods, generators],
            period,
            generator,
          });
          expect(chosen.period).toBe(period);
          expect(chosen.generator).toBeGreaterThanOrEqual(0);
          expect(chosen.generator).toBeLessThanOrEqual(period / 2 + 1e-9);
          for (let i = 0; i < 4; i++) {
            const before = periods[i] * period + generators[i] * generator;
            const after = chosen.mapping[0][i] * period + chosen.mapping[1][i] * chosen.generator;
            expect(after).toBeCloseTo(before, 6);
          }
        },
      ),
    );
  });
});
