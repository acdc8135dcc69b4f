// The commas worth tempering out: small intervals between simple ratios of a subgroup's primes, the simplest
// (smallest Tenney height) first, and, for a count of notes, only those that the count's equal division of the
// octave maps to zero steps.
import { type Monzo, monzoRatio, tenneyHeight } from './monzo';

/** A small comma of the subgroup. */
export interface SimpleComma {
  monzo: Monzo;
  ratio: string;
  cents: number;
  /** Tenney height log2(n·d). */
  complexity: number;
}

/** Commas are smaller than this: a quarter tone (common practice; the syntonic comma is 21.5 cents). */
const largestCommaCents = 50;
/**
 * The most complex comma searched, as a Tenney height log2(n·d): past the Pythagorean comma (about 38) and the
 * schisma (about 30).
 */
const mostComplexComma = 40;

/** The patent val of `count` equal steps to the octave: each prime's size in steps, rounded to the nearest. */
export function patentVal(count: number, primes: readonly number[]): number[] {
  return primes.map((prime) => Math.round(count * Math.log2(prime)));
}

function greatestCommonDivisor(a: number, b: number): number {
  return b === 0 ? Math.abs(a) : greatestCommonDivisor(b, a % b);
}

/** The small simple commas of each subgroup searched so far: a subgroup's list never changes, so it is made once. */
const commasBySubgroup = new Map<string, SimpleComma[]>();

/**
 * Every comma over `primes` (2 first) smaller than `largestCommaCents`, no more complex than `mostComplexComma`
 * and no power of a simpler one, written upward, from the simplest; with `val`, only those it maps to zero steps.
 */
export function simpleCommas(primes: readonly number[], val?: readonly number[]): SimpleComma[] {
  const key = primes.join('.');
  let all = commasBySubgroup.get(key);
  if (!all) {
    all = searchSubgroup(primes);
    commasBySubgroup.set(key, all);
  }
  if (!val) return [...all];
  return all.filter((comma) => comma.monzo.reduce((sum, e, i) => sum + e * val[i], 0) === 0);
}

function searchSubgroup(primes: readonly number[]): SimpleComma[] {
  const odd = primes.slice(1);
  const logs = odd.map(Math.log2);
  const found: SimpleComma[] = [];
  const exponents = odd.map(() => 0);
  // The odd part's height alone is at most the whole height, so this walk over it misses nothing.
  const walk = (index: number, budget: number, started: boolean) => {
    if (index === odd.length) {
      if (started) consider();
      return;
    }
    const widest = Math.floor(budget / logs[index] + 1e-9);
    // Of a comma and its inverse, the walk visits the one whose first odd exponent is positive.
    for (let e = started ? -widest : 0; e <= widest; e++) {
      exponents[index] = e;
      walk(index + 1, budget - Math.abs(e) * logs[index], started || e !== 0);
    }
    exponents[index] = 0;
  };
  const consider = () => {
    const oddOctaves = exponents.reduce((sum, e, i) => sum + e * logs[i], 0);
    const octaves = -Math.round(oddOctaves);
    let cents = 1200 * (octaves + oddOctaves);
    if (Math.abs(cents) >= largestCommaCents) return;
    let monzo = [octaves, ...exponents];
    const complexity = tenneyHeight(monzo, primes);
    if (complexity > mostComplexComma) return;
    if (exponents.reduce(greatestCommonDivisor, octaves) !== 1) return;
    if (cents < 0) [monzo, cents] = [monzo.map((e) => -e), -cents];
    found.push({ monzo, ratio: monzoRatio(monzo, primes), cents, complexity });
  };
  walk(0, mostComplexComma, false);
  return found.sort((a, b) => a.complexity - b.complexity || a.cents - b.cents);
}
