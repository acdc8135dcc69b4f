// Ratios as monzos: the exponents of their prime factors, written over a list of primes (2.3.5 for 5/4 is
// [-2, 0, 1]). Exact inside (BigInt factoring), numbers at the edges.
import Fraction from 'fraction.js';

/** The primes a generator search knows, up to the 13-limit. */
export const searchPrimes = [2, 3, 5, 7, 11, 13] as const;

/** Prime exponents over a list of primes, in the same order. */
export type Monzo = number[];

/** A ratio's exponents over `searchPrimes`, and whether a prime above 13 is left over. */
interface Factored {
  exponents: Monzo;
  beyondThirteen: boolean;
}

function exponentsIn(value: bigint): Factored {
  let rest = value;
  const exponents = searchPrimes.map((prime) => {
    const p = BigInt(prime);
    let count = 0;
    while (rest % p === 0n) {
      rest /= p;
      count++;
    }
    return count;
  });
  return { exponents, beyondThirteen: rest !== 1n };
}

/** Factors a positive ratio over the primes up to 13. */
export function factorRatio(ratio: Fraction): Factored {
  const top = exponentsIn(ratio.n);
  const bottom = exponentsIn(ratio.d);
  return {
    exponents: top.exponents.map((e, i) => e - bottom.exponents[i]),
    beyondThirteen: top.beyondThirteen || bottom.beyondThirteen,
  };
}

/** The exponents of `factored` (over `searchPrimes`) taken over `primes`, a subset of them. */
export function monzoOver(exponents: Monzo, primes: readonly number[]): Monzo {
  return primes.map((prime) => exponents[searchPrimes.indexOf(prime as never)]);
}

/** The primes of `searchPrimes` that the exponents use. */
export function primesUsed(exponents: Monzo): number[] {
  return searchPrimes.filter((_, i) => exponents[i] !== 0);
}

/** The just size of each prime in cents, 1200 log2 p. */
export function primeCents(primes: readonly number[]): number[] {
  return primes.map((prime) => 1200 * Math.log2(prime));
}

/** The just size of a monzo in cents. */
export function monzoCents(monzo: Monzo, primes: readonly number[]): number {
  return monzo.reduce((sum, e, i) => sum + e * 1200 * Math.log2(primes[i]), 0);
}

/** Tenney height log2(n·d) of the ratio a monzo stands for: the smaller, the simpler (Tenney, 1983). */
export function tenneyHeight(monzo: Monzo, primes: readonly number[]): number {
  return monzo.reduce((sum, e, i) => sum + Math.abs(e) * Math.log2(primes[i]), 0);
}

/** The ratio a monzo stands for, written `n/d`. */
export function monzoRatio(monzo: Monzo, primes: readonly number[]): string {
  let n = 1n;
  let d = 1n;
  monzo.forEach((e, i) => {
    const power = BigInt(primes[i]) ** BigInt(Math.abs(e));
    if (e > 0) n *= power;
    else d *= power;
  });
  return `${n}/${d}`;
}

/** Primes written as a subgroup: `2.3.5`. */
export function subgroupName(primes: readonly number[]): string {
  return primes.join('.');
}
