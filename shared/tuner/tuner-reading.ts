import { noteName } from '../tuning/twelve-edo';
import type { TunerMatch } from './nearest-target';

/** An offset in cents to one decimal with its sign always written, a true minus for negatives: `+5.0`, `−0.3`. */
export function signedCents(cents: number): string {
  const rounded = Number(cents.toFixed(1));
  const sign = rounded > 0 ? '+' : rounded < 0 ? '−' : '±';
  return `${sign}${Math.abs(rounded).toFixed(1)}`;
}

type Reading = Pick<TunerMatch, 'key' | 'degree' | 'cents'>;

/** The three parts of the reading: the key by name, its degree and the offset, `E4`, `degree 4`, `+5.0 cents`. */
export function readingParts(match: Reading): [key: string, degree: string, offset: string] {
  return [noteName(match.key), `degree ${match.degree}`, `${signedCents(match.cents)} cents`];
}

/** The tuner's reading in words: its parts between middle dots, `E4 · degree 4 · +5.0 cents`. */
export function readingText(match: Reading): string {
  return readingParts(match).join(' · ');
}
