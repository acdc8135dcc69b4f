import {
  type IntervalSize,
  intervalBetween,
  reduceIntoPeriod,
  repeatInterval,
  sameSizeCents,
} from './interval-size';
import type { Scale } from './scale-spec';
import { isBalanced } from './step-pattern';

/** The largest scale size searched for moments of symmetry. */
const largestMosSize = 60;

export interface Wolf {
  /** The degree at the top of the stack, where the off-size generator starts. */
  from: number;
  /** The degree at the bottom of the stack, where it ends. */
  to: number;
  size: IntervalSize;
  /** How far the wolf is from the generator reduced into the period: minus the comma. */
  deviationCents: number;
}

export interface StackAnalysis {
  /** The generator as stacked (after tempering). */
  generator: IntervalSize;
  /** The generator brought into the period, the size of every generator step between degrees. */
  reducedGenerator: IntervalSize;
  /**
   * What a stack as long as the scale (one generator per degree) misses the tonic by, the smaller
   * way round: positive when it overshoots. Twelve pure fifths overshoot by the Pythagorean comma.
   */
  comma: IntervalSize;
  /** The one generator step that closes the circle off size; null when the comma is 0. */
  wolf: Wolf | null;
  /** The scale sizes up to 60 at which this generator and period give a MOS. */
  mosSizes: number[];
}

/**
 * The sizes of stacks (from 2 to 60 generators) whose degrees fall into exactly two step sizes
 * spread evenly. The evenness matters only for generators that divide the period exactly (700c in
 * 1200c): there the third step size of the other stacks coincides with one of the two, as 8 fifths
 * of 12 equal give steps of 1 and 2 bunched as ssLLsLLs.
 */
function mosSizes(reducedGeneratorCents: number, periodCents: number): number[] {
  const sizes: number[] = [];
  // The stack's positions in the period, kept in order as each generator is added, and the steps between them.
  const positions = new Float64Array(largestMosSize);
  const steps = new Float64Array(largestMosSize);
  for (let count = 2; count <= largestMosSize; count++) {
    const position = ((count - 1) * reducedGeneratorCents) % periodCents;
    let place = count - 1;
    while (place > 0 && positions[place - 1] > position) place--;
    positions.copyWithin(place + 1, place, count - 1);
    positions[place] = position;
    let smallest = Infinity;
    let largest = -Infinity;
    for (let index = 0; index < count; index++) {
      const step = (index + 1 < count ? positions[index + 1] : periodCents) - positions[index];
      steps[index] = step;
      if (step < smallest) smallest = step;
      if (step > largest) largest = step;
    }
    if (smallest < sameSizeCents || largest - smallest < sameSizeCents) continue;
    const large: boolean[] = new Array(count);
    let twoSizes = true;
    for (let index = 0; index < count && twoSizes; index++) {
      large[index] = largest - steps[index] < sameSizeCents;
      twoSizes = large[index] || steps[index] - smallest < sameSizeCents;
    }
    if (twoSizes && isBalanced(large)) sizes.push(count);
  }
  return sizes;
}

/** What a generated scale's stack does: its comma, its wolf and its MOS sizes; else null. */
export function analyzeStack(scale: Scale): StackAnalysis | null {
  const { generator, period, degrees } = scale;
  if (!generator) return null;
  const size = degrees.length;
  const reducedGenerator = reduceIntoPeriod(generator, period).reduced;
  const overshoot = reduceIntoPeriod(repeatInterval(generator, size), period).reduced;
  const comma = overshoot.cents > period.cents / 2 ? intervalBetween(period, overshoot) : overshoot;
  const positions = degrees.map((degree) => degree.stackPosition ?? 0);
  const top = positions.indexOf(Math.max(...positions));
  const bottom = positions.indexOf(Math.min(...positions));
  // The step from the top of the chain round to its bottom: the one that closes the circle. With one generator
  // throughout it misses the generator by the comma; a chain tempered link by link may close it exactly.
  const closing = reduceIntoPeriod(intervalBetween(degrees[top], degrees[bottom]), period).reduced;
  let deviationCents = closing.cents - reducedGenerator.cents;
  if (deviationCents > period.cents / 2) deviationCents -= period.cents;
  if (deviationCents < -period.cents / 2) deviationCents += period.cents;
  const wolf =
    size < 2 || Math.abs(deviationCents) < sameSizeCents
      ? null
      : { from: top, to: bottom, size: closing, deviationCents };
  return {
    generator,
    reducedGenerator,
    comma,
    wolf,
    mosSizes: mosSizes(reducedGenerator.cents, period.cents),
  };
}
