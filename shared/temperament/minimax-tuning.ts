// The minimax tuning over target intervals: the period kept pure (a whole fraction of the octave, as the classic
// minimax tunings of the odd-limit consonances keep the octave pure) and the generator that makes the largest
// absolute error over the targets, in plain cents, as small as it can be. Each target's error is a straight line
// in the generator, so the largest is convex and piecewise linear: its least value lies where two targets' errors
// are equal in size (or one is zero). The method checks every such candidate, exactly; no iteration.
import { type Monzo, monzoCents } from './monzo';

/** error_i(g) = slope_i · g + offset_i in cents, for one target. */
interface ErrorLine {
  slope: number;
  offset: number;
}

function largestError(lines: readonly ErrorLine[], generator: number): number {
  return lines.reduce(
    (most, line) => Math.max(most, Math.abs(line.slope * generator + line.offset)),
    0,
  );
}

/**
 * The sizes in cents of the mapping rows' units (the period, then the generator) under minimax over `targets`
 * (monzos over `primes`), the period pure. `fallbackGenerator` is used when no target involves the generator.
 */
export function minimaxTuning(
  mapping: readonly [readonly number[], readonly number[]],
  primes: readonly number[],
  targets: readonly Monzo[],
  fallbackGenerator: number,
): [number, number] {
  const octave = mapping[0][0];
  const period = 1200 / octave;
  const dot = (row: readonly number[], monzo: Monzo) =>
    row.reduce((sum, e, i) => sum + e * monzo[i], 0);
  const lines = targets.map((target) => ({
    slope: dot(mapping[1], target),
    offset: dot(mapping[0], target) * period - monzoCents(target, primes),
  }));
  const moving = lines.filter((line) => line.slope !== 0);
  if (moving.length === 0) return [period, fallbackGenerator];
  let best = Infinity;
  let bestGenerator = fallbackGenerator;
  for (let i = 0; i < moving.length; i++) {
    for (let j = i; j < moving.length; j++) {
      for (const sign of [1, -1]) {
        // slope_i g + offset_i = sign (slope_j g + offset_j)
        const coefficient = moving[i].slope - sign * moving[j].slope;
        if (coefficient === 0) continue;
        const generator = (sign * moving[j].offset - moving[i].offset) / coefficient;
        const error = largestError(lines, generator);
        if (error < best) [best, bestGenerator] = [error, generator];
      }
    }
  }
  // Where targets the generator leaves alone hold the largest error, every generator in a span does as well:
  // take the middle of the span, so that the answer does not hang on the order of the targets.
  let low = -Infinity;
  let high = Infinity;
  for (const line of moving) {
    const a = (-best - line.offset) / line.slope;
    const b = (best - line.offset) / line.slope;
    low = Math.max(low, Math.min(a, b));
    high = Math.min(high, Math.max(a, b));
  }
  const middle = (low + high) / 2;
  return [period, low <= high && largestError(lines, middle) <= best ? middle : bestGenerator];
}
