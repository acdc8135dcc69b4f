import Fraction from 'fraction.js';
import { type Interval, ratioCents } from './interval';

/**
 * An interval measured: its size in cents, and its exact ratio while the arithmetic that made it
 * stayed rational (stacking ratios keeps it; anything tempered or typed in cents has none).
 */
export interface IntervalSize {
  cents: number;
  ratio: Fraction | null;
}

/** Sizes closer than this many cents count as one (arithmetic in doubles stays far inside). */
export const sameSizeCents = 1e-6;

const one = new Fraction(1);

export const unison: IntervalSize = { cents: 0, ratio: one };

export function exactSize(ratio: Fraction): IntervalSize {
  return { cents: ratioCents(ratio), ratio };
}

export function temperedSize(cents: number): IntervalSize {
  return { cents, ratio: null };
}

export function sizeOf(interval: Interval): IntervalSize {
  return interval.kind === 'ratio' ? exactSize(interval.ratio) : temperedSize(interval.cents);
}

/** The interval from `lower` up to `upper` (negative when `upper` lies below). */
export function intervalBetween(lower: IntervalSize, upper: IntervalSize): IntervalSize {
  if (lower.ratio && upper.ratio) return exactSize(upper.ratio.div(lower.ratio));
  return temperedSize(upper.cents - lower.cents);
}

export function sameSize(a: IntervalSize, b: IntervalSize): boolean {
  if (a.ratio && b.ratio) return a.ratio.n === b.ratio.n && a.ratio.d === b.ratio.d;
  return Math.abs(a.cents - b.cents) < sameSizeCents;
}

/** The largest power of the period, in bits, that reducing into the period computes exactly. */
const largestExactPowerBits = 4096;

/**
 * Brings an interval into [unison, period) by whole periods, and says how many periods it took
 * (negative when it had to go up). An exact ratio is divided by period^k at once, k estimated from
 * the sizes in cents (for terms past 2^1024, from their bit lengths) and then checked exactly: no
 * loop that takes off one period at a time.
 */
export function reduceIntoPeriod(
  interval: IntervalSize,
  period: IntervalSize,
): { reduced: IntervalSize; periods: number } {
  let periods = Math.floor(interval.cents / period.cents);
  // Exact only while period^k stays small: a huge interval in a tiny period (1/10^60 in 81/80) would need powers
  // of tens of thousands of bits, and is measured in cents instead.
  const periodBits = period.ratio
    ? Math.max(period.ratio.n.toString(2).length, period.ratio.d.toString(2).length)
    : 0;
  if (interval.ratio && period.ratio && Math.abs(periods) * periodBits <= largestExactPowerBits) {
    let reduced = interval.ratio.div(period.ratio.pow(periods));
    if (reduced.compare(1) < 0) {
      reduced = reduced.mul(period.ratio);
      periods -= 1;
    } else if (reduced.compare(period.ratio) >= 0) {
      reduced = reduced.div(period.ratio);
      periods += 1;
    }
    return { reduced: exactSize(reduced), periods };
  }
  let cents = interval.cents - periods * period.cents;
  if (period.cents - cents < sameSizeCents) {
    cents = 0;
    periods += 1;
  } else if (cents < sameSizeCents) {
    cents = 0;
  }
  return { reduced: cents === 0 ? unison : temperedSize(cents), periods };
}

/** The interval taken `times` times over (negative: that many times downwards). */
export function repeatInterval(interval: IntervalSize, times: number): IntervalSize {
  if (interval.ratio) return exactSize(interval.ratio.pow(times));
  return temperedSize(interval.cents * times);
}
