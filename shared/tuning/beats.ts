import type { Scale } from './scale-spec';

/** How fast an interval near a just ratio beats, from one degree to another. */
export interface Beat {
  /** The degree the interval reaches (in the same period or a higher one). */
  toDegree: number;
  intervalCents: number;
  beatsPerSecond: number;
}

export interface DegreeBeats {
  fifth: Beat | null;
  majorThird: Beat | null;
}

/** An interval further than this from the just ratio is not heard as it, so it gets no rate. */
const widestMistuningCents = 50;

/** A just ratio upper:lower, and its size. */
interface JustInterval {
  upper: number;
  lower: number;
  cents: number;
}

const justFifth: JustInterval = { upper: 3, lower: 2, cents: 1200 * Math.log2(3 / 2) };
const justMajorThird: JustInterval = { upper: 5, lower: 4, cents: 1200 * Math.log2(5 / 4) };

/** Cents from degree `from` up by `steps` degrees, a period higher each time the top is passed. */
function centsAbove(scale: Scale, from: number, steps: number): number {
  const size = scale.degrees.length;
  const periods = Math.floor((from + steps) / size);
  const reached = scale.degrees[from + steps - periods * size];
  return reached.cents + periods * scale.period.cents - scale.degrees[from].cents;
}

/**
 * The interval of the scale nearest the just ratio above degree `from`, and its beat rate at the
 * degree's frequency: |lower * f_upper - upper * f_lower| per second (201 Hz against 300 Hz beats 3
 * times a second). Intervals grow with the number of steps, so halving the range finds it.
 */
function beatAbove(scale: Scale, from: number, fromHz: number, just: JustInterval): Beat | null {
  const size = scale.degrees.length;
  let [low, high] = [1, size * Math.max(1, Math.ceil(just.cents / scale.period.cents))];
  while (low < high) {
    const middle = (low + high) >> 1;
    if (centsAbove(scale, from, middle) >= just.cents) high = middle;
    else low = middle + 1;
  }
  const below =
    low > 1 &&
    just.cents - centsAbove(scale, from, low - 1) < centsAbove(scale, from, low) - just.cents;
  const steps = below ? low - 1 : low;
  const cents = centsAbove(scale, from, steps);
  if (Math.abs(cents - just.cents) > widestMistuningCents) return null;
  const upperHz = fromHz * 2 ** (cents / 1200);
  return {
    toDegree: (from + steps) % size,
    intervalCents: cents,
    beatsPerSecond: Math.abs(just.lower * upperHz - just.upper * fromHz),
  };
}

/** The beat rates of the fifth and the major third above each degree, the root at `rootHz`. */
export function beatRates(scale: Scale, rootHz: number): DegreeBeats[] {
  return scale.degrees.map((degree, index) => {
    const hz = rootHz * 2 ** (degree.cents / 1200);
    return {
      fifth: beatAbove(scale, index, hz, justFifth),
      majorThird: beatAbove(scale, index, hz, justMajorThird),
    };
  });
}
