import { type IntervalSize, sameSize } from './interval-size';

export interface StepSize extends IntervalSize {
  /**
   * The letter for this size in the pattern: L and s for two sizes, L, M and s for three, and a,
   * b, c... from the largest down for more (starting again after z).
   */
  letter: string;
  count: number;
}

export interface StepPattern {
  /** The distinct step sizes, largest first. */
  sizes: StepSize[];
  /** One letter per step from the tonic up, such as `LLsLLLs`. */
  pattern: string;
  /** Two step sizes spread as evenly as they can be (a moment of symmetry). */
  isMos: boolean;
}

function lettersFor(count: number): string[] {
  if (count === 1) return ['L'];
  if (count === 2) return ['L', 's'];
  if (count === 3) return ['L', 'M', 's'];
  return Array.from({ length: count }, (_, index) => String.fromCharCode(97 + (index % 26)));
}

/**
 * Whether a cyclic word of two letters is balanced: every run of k consecutive steps holds the same
 * number of large steps, give or take one. Balanced two-size patterns are exactly the MOS patterns.
 * A cyclic word with a large steps in n is balanced exactly when it is a rotation of the one word
 * that spreads them most evenly, whose step i is large when floor((i + 1) a / n) passes floor(i a / n)
 * (a power of a Christoffel word): one pass to write that word and one search of it written twice,
 * rather than counting every run of every length.
 */
export function isBalanced(large: boolean[]): boolean {
  const length = large.length;
  let count = 0;
  for (const step of large) if (step) count++;
  if (count === 0 || count === length) return true;
  let even = '';
  let given = '';
  for (let i = 0; i < length; i++) {
    even += Math.floor(((i + 1) * count) / length) > Math.floor((i * count) / length) ? 'L' : 's';
    given += large[i] ? 'L' : 's';
  }
  return (even + even).includes(given);
}

/** Groups the steps of a scale (from each degree to the next, the last to the period) by size. */
export function stepPattern(steps: IntervalSize[]): StepPattern {
  const order = steps.map((_, index) => index).sort((a, b) => steps[b].cents - steps[a].cents);
  const sizes: IntervalSize[] = [];
  const sizeIndex: number[] = new Array(steps.length);
  for (const index of order) {
    if (sizes.length === 0 || !sameSize(sizes[sizes.length - 1], steps[index])) {
      sizes.push(steps[index]);
    }
    sizeIndex[index] = sizes.length - 1;
  }
  const letters = lettersFor(sizes.length);
  const counts = sizes.map(() => 0);
  for (const index of sizeIndex) counts[index] += 1;
  return {
    sizes: sizes.map((size, index) => ({ ...size, letter: letters[index], count: counts[index] })),
    pattern: sizeIndex.map((index) => letters[index]).join(''),
    isMos: sizes.length === 2 && isBalanced(sizeIndex.map((index) => index === 0)),
  };
}
