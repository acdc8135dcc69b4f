// The Tenney-Euclidean (TE) tuning of a temperament (Breed and Erlich's papers on regular temperaments): the
// tuning whose primes' errors, each divided by log2 of its prime, have the least sum of squares; and the same
// scaled so that the period is pure (often called POTE, "pure-octave TE").
import { Matrix, pseudoInverse } from 'ml-matrix';
import { primeCents } from './monzo';

/**
 * The sizes in cents of the mapping rows' units (the period, then the generator) under TE: with J the primes'
 * just sizes, W = diag(1 / log2 p) and M the mapping, t = J·W·pinv(M·W), the least-squares solution of
 * t·M·W ≈ J·W.
 */
export function teTuning(
  mapping: readonly (readonly number[])[],
  primes: readonly number[],
): number[] {
  const weights = primes.map((prime) => 1 / Math.log2(prime));
  const weightedMapping = new Matrix(mapping.map((row) => row.map((e, i) => e * weights[i])));
  const weightedJust = Matrix.rowVector(primeCents(primes).map((cents, i) => cents * weights[i]));
  return weightedJust.mmul(pseudoInverse(weightedMapping)).to1DArray();
}

/**
 * TE scaled so that the period is pure: every size multiplied by the one factor that makes 2/1 (the first prime)
 * exactly 1200 cents. Scaling keeps TE's direction, so this is the pure-period tuning closest in angle to just.
 */
export function pureOctaveTeTuning(
  mapping: readonly (readonly number[])[],
  primes: readonly number[],
): number[] {
  const te = teTuning(mapping, primes);
  const octave = te.reduce((sum, size, row) => sum + size * mapping[row][0], 0);
  return te.map((size) => (size * 1200) / octave);
}
