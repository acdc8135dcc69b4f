import { type FieldError, fieldError, type Result, succeed, fail } from '../result';
import { centsToString, readInterval } from './interval';
import { type IntervalSize, sameSize, sameSizeCents, sizeOf } from './interval-size';

/** The most degrees one period may hold: more than the 128 MIDI keys can play in two periods. */
export const largestScale = 256;

/** Periods wider than 8 octaves leave too few periods on the keyboard to make a scale. */
const widestPeriodCents = 9600;

/** One degree of a built scale: its size above the tonic, and its place in a stack. */
export interface ScaleDegree extends IntervalSize {
  /** In a generated scale, how many generators above (+) or below (-) the tonic; else null. */
  stackPosition: number | null;
}

/** A degree before sorting, with the words that name it if it lands on another one. */
export interface UnsortedDegree {
  size: IntervalSize;
  stackPosition: number | null;
  /** The field a coincidence is reported at. */
  path: string;
  /** The degree as named at its own field (`5/4`, `generator +12`). */
  written: string;
  /** The degree as named from another field (`scale.degrees[0] (5/4)`, `the tonic`). */
  label: string;
}

export function parsePeriod(text: string, path: string): Result<IntervalSize> {
  const read = readInterval(text);
  if (typeof read === 'string') return fail([fieldError(path, read)]);
  const period = sizeOf(read);
  if (period.cents < sameSizeCents) {
    const fault = `${text} is not above the tonic; a period must be wider than 1/1`;
    return fail([fieldError(path, fault)]);
  }
  if (period.cents > widestPeriodCents) {
    return fail([fieldError(path, `${text} is wider than 8 octaves (${widestPeriodCents}c)`)]);
  }
  return succeed(period);
}

export function tooManyDegrees(path: string, count: number): FieldError {
  return fieldError(path, `gives ${count} degrees; a scale holds at most ${largestScale}`);
}

/**
 * Sorts degrees from the tonic up and reports each pair that coincides (within `sameSizeCents`).
 * Coinciding degrees are kept, so that degree numbers in a key layout stay what the musician
 * counted; the report is a warning.
 */
export function sortDegrees(unsorted: UnsortedDegree[]): {
  degrees: ScaleDegree[];
  warnings: FieldError[];
} {
  const order = unsorted
    .map((_, index) => index)
    .sort((a, b) => unsorted[a].size.cents - unsorted[b].size.cents);
  const warnings: FieldError[] = [];
  for (let i = 1; i < order.length; i++) {
    const [first, second] = [order[i - 1], order[i]].sort((a, b) => a - b).map((k) => unsorted[k]);
    if (sameSize(first.size, second.size)) {
      const cents = centsToString(second.size.cents);
      warnings.push(
        fieldError(second.path, `${second.written} coincides with ${first.label} at ${cents}`),
      );
    }
  }
  const degrees = order.map((index) => {
    const { size, stackPosition } = unsorted[index];
    return { cents: size.cents, ratio: size.ratio, stackPosition };
  });
  return { degrees, warnings };
}
