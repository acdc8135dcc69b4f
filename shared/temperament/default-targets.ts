// The intervals a search measures when the question names only a prime limit: the consonances of the odd limit
// of the same number, the ratios within an octave whose numerator and denominator, with factors of 2 taken out,
// are both odd numbers up to the limit (3/2, 4/3, 5/4, 8/5, 6/5, 5/3 for 5; the 11 and 13 odd limits take 9 in).
import Fraction from 'fraction.js';

/** The odd-limit consonances of `limit` from the smallest up, each once, as `n/d`. */
export function oddLimitConsonances(limit: number): string[] {
  const odds = Array.from({ length: Math.floor((limit + 1) / 2) }, (_, i) => 2 * i + 1);
  const found = new Map<string, number>();
  for (const top of odds) {
    for (const bottom of odds) {
      if (top === bottom) continue;
      let ratio = new Fraction(top, bottom);
      while (ratio.compare(2) >= 0) ratio = ratio.div(2);
      while (ratio.compare(1) < 0) ratio = ratio.mul(2);
      found.set(`${ratio.n}/${ratio.d}`, ratio.valueOf());
    }
  }
  return [...found].sort((a, b) => a[1] - b[1]).map(([ratio]) => ratio);
}
