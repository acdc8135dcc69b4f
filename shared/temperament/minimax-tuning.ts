// The minimax tuning over target intervals: the period kept pure (a whole fraction of the octave, as the classic
// minimax tunings of the odd-limit consonances keep the octave pure) and the generator that makes the largest
// absolute error over the targets, in plain cents, as small as it can be. Each target's error is a straight line
// in the generator, so the largest is convex and piecewise linear: its least value lies where two targets' errors
// are equal in size (or one is zero). The method checks every such candidate, exactly; no iteration.
import { type Monzo, monzoCents } from './monzo';

/** error(g) = slope · g + offset in cents, for one target; written with slope > 0. */
interface ErrorLine {
  slope: number;
  offset: number;
}

function largestError(lines: readonly ErrorLine[], fixed: number, generator: number): number {
  let most = fixed;
  for (const { slope, offset } of lines)
    most = Math.max(most, Math.abs(slope * generator + offset));
  return most;
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
  const period = 1200 / mapping[0][0];
  const dot = (row: readonly number[], monzo: Monzo) =>
    row.reduce((sum, e, i) => sum + e * monzo[i], 0);
  // Targets the generator leaves alone err by the same whatever it is; an interval and its inverse (or any two
  // targets on one line up to sign) count once.
  let fixed = 0;
  const seen = new Set<string>();
  const lines: ErrorLine[] = [];
  for (const target of targets) {
    const slope = dot(mapping[1], target);
    const offset = dot(mapping[0], target) * period - monzoCents(target, primes);
    if (slope === 0) {
      fixed = Math.max(fixed, Math.abs(offset));
      continue;
    }
    const line = slope > 0 ? { slope, offset } : { slope: -slope, offset: -offset };
    const key = `${line.slope}:${line.offset.toFixed(9)}`;
    if (seen.has(key)) continue;
    seen.add(key);
    lines.push(line);
  }
  if (lines.length === 0) return [period, fallbackGenerator];
  let best = Infinity;
  let bestGenerator = fallbackGenerator;
  for (let i = 0; i < lines.length; i++) {
    for (let j = i; j < lines.length; j++) {
      for (const sign of [1, -1]) {
        // slope_i g + offset_i = sign (slope_j g + offset_j)
        const coefficient = lines[i].slope - sign * lines[j].slope;
        if (coefficient === 0) continue;
        const generator = (sign * lines[j].offset - lines[i].offset) / coefficient;
        const error = largestError(lines, fixed, generator);
        if (error < best) [best, bestGenerator] = [error, generator];
      }
    }
  }
  // Where targets the generator leaves alone hold the largest error, every generator in a span does as well:
  // take the middle of the span, so that the answer does not hang on the order of the targets.
  let low = -Infinity;
  let high = Infinity;
  for (const { slope, offset } of lines) {
    low = Math.max(low, (-best - offset) / slope);
    high = Math.min(high, (best - offset) / slope);
  }
  const middle = (low + high) / 2;
  const inSpan = low <= high && largestError(lines, fixed, middle) <= best;
  return [period, inSpan ? middle : bestGenerator];
}
