import Fraction from 'fraction.js';
import { ratioCents } from './interval';

/** A simple ratio near a tempered size, and how many cents the size lies above (+) it. */
export interface RatioApproximation {
  ratio: Fraction;
  errorCents: number;
}

interface Candidate {
  ratio: Fraction;
  cents: number;
}

function greatestCommonDivisor(a: number, b: number): number {
  return b === 0 ? a : greatestCommonDivisor(b, a % b);
}

/**
 * Every ratio from unison to `widestCents` whose numerator and denominator, with factors of 2
 * removed, are at most `oddLimit` (with 15, 15/8 and 7/4 are in, 17/16 is not), sorted by size.
 */
export function simpleRatios(oddLimit: number, widestCents: number): Candidate[] {
  const candidates: Candidate[] = [];
  for (let upper = 1; upper <= oddLimit; upper += 2) {
    for (let lower = 1; lower <= oddLimit; lower += 2) {
      if (greatestCommonDivisor(upper, lower) !== 1) continue;
      const base = new Fraction(upper, lower);
      const baseCents = ratioCents(base);
      const lowestOctave = Math.ceil(-baseCents / 1200);
      const highestOctave = Math.floor((widestCents - baseCents) / 1200);
      for (let octave = lowestOctave; octave <= highestOctave; octave++) {
        const ratio = base.mul(new Fraction(2).pow(octave));
        candidates.push({ ratio, cents: baseCents + 1200 * octave });
      }
    }
  }
  return candidates.sort((a, b) => a.cents - b.cents);
}

/** The candidate nearest `cents` (candidates sorted by size, at least one). */
export function nearestRatio(cents: number, candidates: Candidate[]): RatioApproximation {
  let [low, high] = [0, candidates.length - 1];
  while (high - low > 1) {
    const middle = (low + high) >> 1;
    if (candidates[middle].cents <= cents) low = middle;
    else high = middle;
  }
  const below = candidates[low];
  const above = candidates[high];
  const nearest = Math.abs(cents - below.cents) <= Math.abs(above.cents - cents) ? below : above;
  return { ratio: nearest.ratio, errorCents: cents - nearest.cents };
}
