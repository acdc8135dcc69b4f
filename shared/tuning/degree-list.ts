// A list of degrees as musicians paste it: one a line, or on one line separated by commas or spaces, often with
// the tonic (1/1) in front and the period (2/1) at the end. What was read is said, never silently changed.
import { readInterval } from './interval';
import { sameSize, sizeOf, unison } from './interval-size';

export interface DegreeListReading {
  degrees: string[];
  /** The period: the one written, or the closing entry of the list when it equals that period. */
  period: string;
  /** What the reading did besides splitting: each a sentence a musician can check. */
  notices: string[];
}

/** Entries of a pasted text: comments (`#` to the end of a line) dropped; `9 / 8` and `386.3 c` kept whole. */
export function entriesOf(text: string): string[] {
  return text
    .split(/\r?\n/)
    .map((line) => line.replace(/#.*/, ''))
    .join('\n')
    .replace(/\s*([/\\])\s*/g, '$1')
    .replace(/(\d)\s+(c|¢)(?![a-z])/gi, '$1$2')
    .split(/[\s,;]+/)
    .filter((entry) => entry !== '');
}

function sameAs(entry: string, other: string): boolean {
  const a = readInterval(entry);
  const b = readInterval(other);
  return typeof a !== 'string' && typeof b !== 'string' && sameSize(sizeOf(a), sizeOf(b));
}

/**
 * Reads a pasted list of degrees: a leading unison (1/1, 0c) is the tonic, which the scale implies, and is
 * dropped; a closing entry equal to `period` (2/1 when none is written) is the period, and is taken as it.
 * Entries that are not intervals are kept as written, for the scale to refuse by name.
 */
export function readDegreeList(text: string, period = '2/1'): DegreeListReading {
  return withoutTonicAndPeriod(entriesOf(text), period);
}

/** Drops a leading unison and a closing entry equal to `period` from a list of degrees, saying so. */
export function withoutTonicAndPeriod(entries: string[], period: string): DegreeListReading {
  const degrees = [...entries];
  const notices: string[] = [];
  const first = degrees.length > 0 ? readInterval(degrees[0]) : null;
  if (first && typeof first !== 'string' && sameSize(sizeOf(first), unison)) {
    notices.push(
      `The leading ${degrees[0]} is the tonic, which every scale has: it was left out of the list.`,
    );
    degrees.shift();
  }
  const last = degrees[degrees.length - 1];
  if (last !== undefined && sameAs(last, period)) {
    notices.push(`The closing ${last} is the period: it was taken as the period, not as a degree.`);
    degrees.pop();
  }
  return { degrees, period, notices };
}
