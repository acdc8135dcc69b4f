// Moment-of-symmetry scale sizes: how many notes of a generator chain, reduced into the period, make a scale of
// exactly two step sizes, spread as evenly as they can be (with a generator a whole fraction of the period, two
// of the three sizes a chain can have may coincide, and two sizes alone do not make a MOS).
import { isBalanced } from '../tuning/step-pattern';

/** Steps closer than this (in cents) are one size: far below hearing, far above rounding in doubles. */
const sameStepCents = 1e-6;

function isMos(notes: number, period: number, generator: number): boolean {
  const degrees = Array.from({ length: notes }, (_, i) => {
    const cents = (i * generator) % period;
    return cents < 0 ? cents + period : cents;
  }).sort((a, b) => a - b);
  const steps = degrees.map((cents, i) => (degrees[i + 1] ?? period) - cents);
  const smallest = Math.min(...steps);
  const largest = Math.max(...steps);
  // A chain that comes back to a note it has played (a generator a whole fraction of the period) is no scale.
  if (smallest <= sameStepCents || largest - smallest <= sameStepCents) return false;
  const large = steps.map((step) => largest - step <= sameStepCents);
  const twoSizes = steps.every((step, i) => large[i] || step - smallest <= sameStepCents);
  return twoSizes && isBalanced(large);
}

/**
 * The scale sizes up to `largest` notes per octave at which the chain of `generator` within `period` gives
 * exactly two step sizes, evenly spread; each size counts the notes of every period in the octave (`periodsPerOctave`).
 */
export function mosSizes(
  period: number,
  generator: number,
  periodsPerOctave: number,
  largest: number,
): number[] {
  const sizes: number[] = [];
  for (let notes = 2; notes * periodsPerOctave <= largest; notes++)
    if (isMos(notes, period, generator)) sizes.push(notes * periodsPerOctave);
  return sizes;
}
