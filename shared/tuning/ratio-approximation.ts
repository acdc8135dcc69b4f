// Which ratio a size in cents is, or is near. A tempered size can equal a ratio exactly (four quarter-comma fifths
// make 5/1, so the eighth fifth up is 25/16); otherwise the simplest ratio close by is worth naming, and a ratio
// far away is worth nothing: a label must never mislead.
import Fraction from 'fraction.js';
import { ratioCents } from './interval';
import { sameSizeCents } from './interval-size';

/** A simple ratio near a tempered size, and how many cents the size lies above (+) it. */
export interface RatioApproximation {
  ratio: Fraction;
  errorCents: number;
}

interface Candidate {
  ratio: Fraction;
  cents: number;
  /** Tenney height n * d: the smaller, the simpler the ratio (Tenney, 1983). */
  height: number;
}

/** How the nearest simple ratio is chosen: from ratios of primes up to 7 with terms up to 256, within 6 cents. */
export const ratioSearch = { primeLimit: 7, largestTerm: 256, withinCents: 6 } as const;

/** The largest term of a ratio that a tempered size is recognised as being exactly. */
const largestExactTerm = 10_000;

function isSmooth(n: number, primeLimit: number): boolean {
  for (const p of [2, 3, 5, 7, 11, 13].filter((prime) => prime <= primeLimit))
    while (n % p === 0) n /= p;
  return n === 1;
}

function greatestCommonDivisor(a: number, b: number): number {
  return b === 0 ? a : greatestCommonDivisor(b, a % b);
}

let candidates: Candidate[] | undefined;

/** Every ratio of ratioSearch's primes and terms from a unison up, sorted by size. */
function searchedRatios(): Candidate[] {
  if (candidates) return candidates;
  const { primeLimit, largestTerm } = ratioSearch;
  const terms = Array.from({ length: largestTerm }, (_, i) => i + 1).filter((n) =>
    isSmooth(n, primeLimit),
  );
  const found: Candidate[] = [];
  for (const n of terms) {
    for (const d of terms) {
      if (n < d || greatestCommonDivisor(n, d) !== 1) continue;
      const ratio = new Fraction(n, d);
      found.push({ ratio, cents: ratioCents(ratio), height: n * d });
    }
  }
  candidates = found.sort((a, b) => a.cents - b.cents);
  return candidates;
}

/**
 * The simplest ratio (smallest Tenney height; the nearer on a tie) within `ratioSearch.withinCents` of `cents`,
 * from the ratios of primes up to 7 with terms up to 256; null when none is that close.
 */
export function nearestSimpleRatio(cents: number): RatioApproximation | null {
  let best: Candidate | null = null;
  for (const candidate of searchedRatios()) {
    const error = Math.abs(cents - candidate.cents);
    if (error > ratioSearch.withinCents) continue;
    if (
      !best ||
      candidate.height < best.height ||
      (candidate.height === best.height && error < Math.abs(cents - best.cents))
    ) {
      best = candidate;
    }
  }
  return best && { ratio: best.ratio, errorCents: cents - best.cents };
}

/**
 * The ratio a size in cents is, when it is one with terms up to 10,000 (within 1e-6 cents); else null. The
 * continued fraction of the frequency ratio meets every such ratio among its convergents.
 */
export function exactRatioOf(cents: number): Fraction | null {
  const x = 2 ** (cents / 1200);
  let [previousN, n] = [1, Math.floor(x)];
  let [previousD, d] = [0, 1];
  let rest = x - Math.floor(x);
  for (let step = 0; step < 40; step++) {
    if (n > largestExactTerm || d > largestExactTerm) return null;
    if (Math.abs(ratioCents(new Fraction(n, d)) - cents) < sameSizeCents) return new Fraction(n, d);
    if (rest < 1e-12) return null;
    const inverse = 1 / rest;
    const term = Math.floor(inverse);
    rest = inverse - term;
    [previousN, n] = [n, term * n + previousN];
    [previousD, d] = [d, term * d + previousD];
  }
  return null;
}
