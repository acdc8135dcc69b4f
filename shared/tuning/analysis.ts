import { type Beat, beatRates } from './beats';
import { type IntervalSize, intervalBetween } from './interval-size';
import { type RatioApproximation, exactRatioOf, nearestSimpleRatio } from './ratio-approximation';
import type { Scale } from './scale-spec';
import type { ScaleDegree } from './scale-degrees';
import { type StackAnalysis, analyzeStack } from './stack-analysis';
import { type StepPattern, stepPattern } from './step-pattern';
import { nearestEqualTemperedNote } from './twelve-edo';

export interface DegreeAnalysis extends ScaleDegree {
  degree: number;
  /** For a degree that is no exact ratio, the simplest ratio within 6 cents (ratioSearch); else null. */
  approximation: RatioApproximation | null;
  /** The step up to the next degree (from the last degree, up to the period). */
  step: IntervalSize;
  /** The equal-tempered note nearest the degree as played from the root, and the offset from it. */
  nearestNote: { name: string; offsetCents: number };
  fifth: Beat | null;
  majorThird: Beat | null;
}

export interface ScaleAnalysis {
  degrees: DegreeAnalysis[];
  stepPattern: StepPattern;
  /** For generated scales: comma, wolf and MOS sizes; null for other kinds. */
  stack: StackAnalysis | null;
  /**
   * Cents from each degree (row) up by 0, 1, ... size steps (column): row i, column j is the
   * interval from degree i to degree i + j, a period higher once it passes the top.
   */
  intervalMatrix: number[][];
}

/** The step from each degree to the next, the last one up to the period. */
function stepsOf(scale: Scale): IntervalSize[] {
  const { degrees, period } = scale;
  return degrees.map((degree, index) => intervalBetween(degree, degrees[index + 1] ?? period));
}

function intervalMatrix(scale: Scale): number[][] {
  const cents = scale.degrees.map((degree) => degree.cents);
  const size = cents.length;
  const periodCents = scale.period.cents;
  const rows: number[][] = new Array(size);
  for (let row = 0; row < size; row++) {
    const intervals: number[] = new Array(size + 1);
    for (let steps = 0; steps <= size; steps++) {
      const reached = row + steps;
      intervals[steps] =
        reached < size
          ? cents[reached] - cents[row]
          : cents[reached - size] + periodCents - cents[row];
    }
    rows[row] = intervals;
  }
  return rows;
}

/** Everything the designer shows about a scale played from `rootHz`, with A4 at `concertA`. */
export function analyzeScale(
  scale: Scale,
  pitch: { rootHz: number; concertA: number },
): ScaleAnalysis {
  const steps = stepsOf(scale);
  const beats = beatRates(scale, pitch.rootHz);
  const degrees = scale.degrees.map((degree, index) => {
    const hz = pitch.rootHz * 2 ** (degree.cents / 1200);
    const { name, offsetCents } = nearestEqualTemperedNote(hz, pitch.concertA);
    // A tempered degree that equals a ratio is shown as that ratio, not as an approximation of another.
    const ratio = degree.ratio ?? exactRatioOf(degree.cents);
    return {
      degree: index,
      cents: degree.cents,
      ratio,
      stackPosition: degree.stackPosition,
      approximation: ratio ? null : nearestSimpleRatio(degree.cents),
      step: steps[index],
      nearestNote: { name, offsetCents },
      fifth: beats[index].fifth,
      majorThird: beats[index].majorThird,
    };
  });
  return {
    degrees,
    stepPattern: stepPattern(steps),
    stack: analyzeStack(scale),
    intervalMatrix: intervalMatrix(scale),
  };
}
