import Fraction from 'fraction.js';
import { fieldError, type Result, succeed, fail } from '../result';

/** An interval as written: an exact frequency ratio, or a size in cents. */
export type Interval = { kind: 'ratio'; ratio: Fraction } | { kind: 'cents'; cents: number };

const longestText = 64;
/** Sizes in cents go up to 100 octaves either way; past that no key, file or ear can follow. */
const widestCents = 120_000;
const howToWrite =
  'write a ratio such as 3/2, cents such as 701.955c, or equal steps such as 7\\12';

const integerPattern = /^\d+$/;
const ratioPattern = /^(\d+)\s*\/\s*(\d+)$/;
const negativeRatioPattern = /^-\s*\d+(\s*\/\s*\d+)?$/;
const centsPattern = /^([+-]?(?:\d+(?:\.\d*)?|\.\d+))\s*(?:c|¢)$/i;
const equalStepsPattern = /^([+-]?\d+)\s*\\\s*(\d+)$/;
const bareDecimalPattern = /^[+-]?(?:\d+\.\d*|\.\d+)$/;

/**
 * Reads one interval in the syntax of the preset document: `3/2`, `5` (= 5/1), `701.955c`, `386¢`,
 * `7\12` (7 steps of 12 equal divisions of the octave). Returns the interval, or the fault as words
 * without a path.
 */
export function readInterval(text: string): Interval | string {
  const written = text.trim();
  if (written === '') return `is empty: ${howToWrite}`;
  if (written.length > longestText) return `is longer than ${longestText} characters`;
  if (integerPattern.test(written)) return exactRatio(written, '1', written);
  const ratio = ratioPattern.exec(written);
  if (ratio) return exactRatio(ratio[1], ratio[2], written);
  if (negativeRatioPattern.test(written)) return `${written} is not a ratio above 0`;
  const cents = centsPattern.exec(written);
  if (cents) return centsWithin(Number(cents[1]), written);
  const steps = equalStepsPattern.exec(written);
  if (steps) {
    const divisions = Number(steps[2]);
    if (divisions === 0) return `${written} divides the octave into 0 steps; use 1 or more`;
    return centsWithin((1200 * Number(steps[1])) / divisions, written);
  }
  if (bareDecimalPattern.test(written)) {
    return `${written} needs a unit: write ${written}c for cents or a ratio such as 3/2`;
  }
  return `"${written}" is not an interval: ${howToWrite}`;
}

function centsWithin(cents: number, written: string): Interval | string {
  if (Math.abs(cents) > widestCents)
    return `${written} is wider than ${widestCents}c (100 octaves)`;
  return { kind: 'cents', cents };
}

function exactRatio(numerator: string, denominator: string, written: string): Interval | string {
  const n = BigInt(numerator);
  const d = BigInt(denominator);
  if (d === 0n) return `${written} has a zero denominator`;
  if (n === 0n) return `${written} is not a ratio above 0`;
  return { kind: 'ratio', ratio: new Fraction(n, d) };
}

/** Parses an interval typed into the field at `path`; every fault names that path. */
export function parseInterval(text: string, path: string): Result<Interval> {
  const read = readInterval(text);
  return typeof read === 'string' ? fail([fieldError(path, read)]) : succeed(read);
}

function log2BigInt(value: bigint): number {
  const asNumber = Number(value);
  if (asNumber !== Infinity) return Math.log2(asNumber);
  const extraBits = value.toString(16).length * 4 - 64;
  return Math.log2(Number(value >> BigInt(extraBits))) + extraBits;
}

/** The size of a positive ratio in cents, 1200 log2(n/d), even with terms past 2^1024. */
export function ratioCents(ratio: Fraction): number {
  const [n, d] = [Number(ratio.n), Number(ratio.d)];
  if (n !== Infinity && d !== Infinity) return 1200 * Math.log2(n / d);
  return 1200 * (log2BigInt(ratio.n) - log2BigInt(ratio.d));
}

export function intervalCents(interval: Interval): number {
  return interval.kind === 'ratio' ? ratioCents(interval.ratio) : interval.cents;
}

/** Writes a ratio as `n/d` (always with its denominator, as `2/1`). */
export function ratioToString(ratio: Fraction): string {
  return `${ratio.s < 0n ? '-' : ''}${ratio.n}/${ratio.d}`;
}

/** Cents with at most six decimals and no trailing zeros, the unit included: `696.578428c`. */
export function centsToString(cents: number): string {
  return `${Number(cents.toFixed(6))}c`;
}

/** Writes an interval back in the syntax that `parseInterval` reads. */
export function intervalToString(interval: Interval): string {
  return interval.kind === 'ratio' ? ratioToString(interval.ratio) : centsToString(interval.cents);
}
