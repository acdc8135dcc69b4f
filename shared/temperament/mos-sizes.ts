// Moment-of-symmetry scale sizes: how many notes of a generator chain, reduced into the period, make a scale of
// exactly two step sizes.

/** Steps closer than this (in cents) are one size: far below hearing, far above rounding in doubles. */
const sameStepCents = 1e-6;

function stepSizeCount(notes: number, period: number, generator: number): number {
  const degrees = Array.from({ length: notes }, (_, i) => {
    const cents = (i * generator) % period;
    return cents < 0 ? cents + period : cents;
  }).sort((a, b) => a - b);
  const steps = degrees.map((cents, i) => (degrees[i + 1] ?? period) - cents).sort((a, b) => a - b);
  // A chain that comes back to a note it has played (a generator a whole fraction of the period) is no scale.
  if (steps[0] <= sameStepCents) return 0;
  let sizes = 1;
  for (let i = 1; i < steps.length; i++) if (steps[i] - steps[i - 1] > sameStepCents) sizes++;
  return sizes;
}

/**
 * The scale sizes up to `largest` notes per octave at which the chain of `generator` within `period` gives
 * exactly two step sizes; each size counts the notes of every period in the octave (`periodsPerOctave`).
 */
export function mosSizes(
  period: number,
  generator: number,
  periodsPerOctave: number,
  largest: number,
): number[] {
  const sizes: number[] = [];
  for (let notes = 2; notes * periodsPerOctave <= largest; notes++)
    if (stepSizeCount(notes, period, generator) === 2) sizes.push(notes * periodsPerOctave);
  return sizes;
}
