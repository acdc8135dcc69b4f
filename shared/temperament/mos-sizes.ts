// Moment-of-symmetry scale sizes: how many notes of a generator chain, reduced into the period, make a scale of
// exactly two step sizes, spread as evenly as they can be (with a generator a whole fraction of the period, two
// of the three sizes a chain can have may coincide, and two sizes alone do not make a MOS).
import { isBalanced } from '../tuning/step-pattern';

/** Steps closer than this (in cents) are one size: far below hearing, far above rounding in doubles. */
const sameStepCents = 1e-6;

/** Whether the notes of a scale (cents from its first, in order, within `period`) step in two sizes, evenly spread. */
function isMos(degrees: readonly number[], period: number): boolean {
  const step = (i: number) => (i + 1 < degrees.length ? degrees[i + 1] : period) - degrees[i];
  let smallest = Infinity;
  let largest = -Infinity;
  for (let i = 0; i < degrees.length; i++) {
    smallest = Math.min(smallest, step(i));
    largest = Math.max(largest, step(i));
  }
  // A chain that comes back to a note it has played (a generator a whole fraction of the period) is no scale.
  if (smallest <= sameStepCents || largest - smallest <= sameStepCents) return false;
  const large: boolean[] = [];
  for (let i = 0; i < degrees.length; i++) {
    const size = step(i);
    large.push(largest - size <= sameStepCents);
    if (!large[i] && size - smallest > sameStepCents) return false;
  }
  return isBalanced(large);
}

/**
 * The scale sizes up to `largest` notes per octave at which the chain of `generator` within `period` gives
 * exactly two step sizes, evenly spread; each size counts the notes of every period in the octave
 * (`periodsPerOctave`).
 */
export function mosSizes(
  period: number,
  generator: number,
  periodsPerOctave: number,
  largest: number,
): number[] {
  const sizes: number[] = [];
  // The chain's notes within the period, kept in order as each new one is put in its place.
  const degrees = [0];
  for (let notes = 2; notes * periodsPerOctave <= largest; notes++) {
    const cents = ((((notes - 1) * generator) % period) + period) % period;
    let at = degrees.length;
    while (at > 0 && degrees[at - 1] > cents) at--;
    degrees.splice(at, 0, cents);
    if (isMos(degrees, period)) sizes.push(notes * periodsPerOctave);
  }
  return sizes;
}
