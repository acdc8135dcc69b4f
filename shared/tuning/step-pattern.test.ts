import * as fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { ratioToString } from './interval';
import { intervalBetween } from './interval-size';
import type { Scale } from './scale-spec';
import { builtScale, stack } from './scale.testing';
import { analyzeStack } from './stack-analysis';
import { isBalanced, stepPattern } from './step-pattern';

function patternOf(scale: Scale) {
  const { degrees, period } = scale;
  const steps = degrees.map((degree, i) => intervalBetween(degree, degrees[i + 1] ?? period));
  return stepPattern(steps);
}

describe('stepPattern', () => {
  it('finds the two steps of the diatonic stack of fifths and calls it a MOS', () => {
    const pattern = patternOf(builtScale(stack('3/2', '2/1', 5, 1)));
    expect(pattern.pattern).toBe('LLsLLLs');
    expect(pattern.isMos).toBe(true);
    // arithmetic (9/8: two fifths less an octave; 256/243: an octave less 5 fifths)
    const sizes = pattern.sizes.map((size) => [size.letter, size.ratio!.toFraction(), size.count]);
    expect(sizes).toEqual([
      ['L', '9/8', 5],
      ['s', '256/243', 2],
    ]);
  });

  it('names three sizes L, M and s', () => {
    const pattern = patternOf(
      builtScale({
        kind: 'list',
        degrees: ['9/8', '5/4', '4/3', '3/2', '5/3', '15/8'],
        period: '2/1',
      }),
    );
    // arithmetic (steps 9/8, 10/9, 16/15 between the listed ratios)
    expect(pattern.pattern).toBe('LMsLMLs');
    expect(pattern.sizes.map((size) => size.ratio && ratioToString(size.ratio))).toEqual([
      '9/8',
      '10/9',
      '16/15',
    ]);
    expect(pattern.isMos).toBe(false);
  });

  it('does not call two sizes a MOS when they bunch together', () => {
    const pattern = patternOf(
      builtScale({ kind: 'list', degrees: ['300c', '600c', '900c', '1050c'], period: '2/1' }),
    );
    expect(pattern.pattern).toBe('LLLss');
    expect(pattern.isMos).toBe(false);
  });

  it('gives an equal scale one step size, whatever the period', () => {
    fc.assert(
      fc.property(
        fc.integer({ min: 1, max: 200 }),
        fc.constantFrom('2/1', '3/1', '3/2', '1200c', '1902.3c', '13/8'),
        (divisions, period) => {
          const pattern = patternOf(builtScale({ kind: 'equal', divisions, period }));
          expect(pattern.sizes).toHaveLength(1);
          expect(pattern.pattern).toBe('L'.repeat(divisions));
          expect(pattern.isMos).toBe(false);
        },
      ),
    );
  });

  it('gives a generated scale of a MOS size exactly two step sizes, spread evenly', () => {
    const stacks = fc
      .record({
        generator: fc.oneof(
          fc.constantFrom('3/2', '5/4', '7/4', '4/3', '9/7', '11/8'),
          fc.double({ min: 20, max: 1180, noNaN: true }).map((cents) => `${cents.toFixed(3)}c`),
        ),
        period: fc.constantFrom('2/1', '3/1', '1200c'),
      })
      .filter(({ generator, period }) => {
        return builtScale(stack(generator, period, 1, 0)).warnings.length === 0;
      });
    fc.assert(
      fc.property(stacks, fc.nat(), fc.nat(), ({ generator, period }, pickSize, pickDown) => {
        const sizes = analyzeStack(builtScale(stack(generator, period, 1, 0)))?.mosSizes ?? [];
        fc.pre(sizes.length > 0);
        const size = sizes[pickSize % sizes.length];
        const down = pickDown % size;
        const scale = builtScale(stack(generator, period, size - 1 - down, down));
        const pattern = patternOf(scale);
        expect(pattern.sizes).toHaveLength(2);
        expect(pattern.isMos).toBe(true);
      }),
    );
  });
});

/** Balance as defined: every run of k consecutive steps, read round the cycle, holds as many large steps as any other, give or take one. */
function balancedByDefinition(large: boolean[]): boolean {
  const length = large.length;
  for (let span = 1; span < length; span++) {
    const counts = Array.from({ length }, (_, start) => {
      let count = 0;
      for (let i = 0; i < span; i++) if (large[(start + i) % length]) count++;
      return count;
    });
    if (Math.max(...counts) - Math.min(...counts) > 1) return false;
  }
  return true;
}

describe('isBalanced', () => {
  it('agrees with the definition on every cyclic word of up to 14 steps', () => {
    let balanced = 0;
    for (let length = 1; length <= 14; length++) {
      for (let bits = 0; bits < 2 ** length; bits++) {
        const large = Array.from({ length }, (_, i) => ((bits >> i) & 1) === 1);
        const expected = balancedByDefinition(large);
        if (isBalanced(large) !== expected)
          expect({ large, balanced: isBalanced(large) }).toEqual({ large, balanced: expected });
        if (expected) balanced++;
      }
    }
    // Both answers come up, so agreeing means something: of the 32,766 words a few hundred are balanced.
    expect(balanced).toBeGreaterThan(300);
    expect(balanced).toBeLessThan(3000);
  });

  it('agrees with the definition on longer words, as long as scales get', () => {
    fc.assert(
      fc.property(
        fc.integer({ min: 15, max: 256 }).chain((length) =>
          fc.oneof(
            fc.array(fc.boolean(), { minLength: length, maxLength: length }),
            // Balanced words are rare among random ones: rotations of evenly spread words, some with one step flipped.
            fc
              .tuple(fc.integer({ min: 0, max: length }), fc.nat(), fc.nat(), fc.boolean())
              .map(([count, turn, flip, flipped]) => {
                const even = Array.from(
                  { length },
                  (_, i) =>
                    Math.floor(((i + 1) * count) / length) > Math.floor((i * count) / length),
                );
                const turned = even.map((_, i) => even[(i + turn) % length]);
                if (flipped) turned[flip % length] = !turned[flip % length];
                return turned;
              }),
          ),
        ),
        (large) => {
          expect(isBalanced(large)).toBe(balancedByDefinition(large));
        },
      ),
    );
  });

  it('calls the diatonic pattern balanced and a bunched one not (the MOS condition, common practice)', () => {
    expect(isBalanced([...'LLsLLLs'].map((step) => step === 'L'))).toBe(true);
    expect(isBalanced([...'LLLss'].map((step) => step === 'L'))).toBe(false);
  });
});
