import * as fc from 'fast-check';
import { ratioToString } from './interval';
import { buildScale } from './scale';
import type { Scale, ScaleSpec } from './scale-spec';

/** A generated scale: `up` generators stacked above the tonic and `down` below it. */
export function stack(
  generator: string,
  period: string,
  up: number,
  down: number,
): Extract<ScaleSpec, { kind: 'generated' }> {
  return { kind: 'generated', generator, period, up, down };
}

/** Builds a scale that a test expects to be valid, failing the test with the faults otherwise. */
export function builtScale(spec: ScaleSpec): Scale {
  const result = buildScale(spec);
  if (!result.ok) throw new Error(result.errors.map((error) => error.message).join('\n'));
  return result.value;
}

/** The faults a test expects from an invalid scale. */
export function scaleFaults(spec: ScaleSpec): string[] {
  const result = buildScale(spec);
  if (result.ok) throw new Error('the scale was accepted');
  return result.errors.map((error) => error.message);
}

export function degreeRatios(scale: Scale): (string | null)[] {
  return scale.degrees.map((degree) => (degree.ratio ? ratioToString(degree.ratio) : null));
}

const periods = fc.constantFrom('2/1', '3/1', '3/2', '7/4', '1200c', '1902c', '600c');

const generators = fc.oneof(
  fc.constantFrom('3/2', '5/4', '4/3', '7/4', '11/8', '9/8', '7\\12'),
  fc.double({ min: 1, max: 2000, noNaN: true }).map((cents) => `${cents.toFixed(4)}c`),
);

/** Scales of every kind that build without faults (coinciding degrees allowed). */
export const scaleSpecs: fc.Arbitrary<ScaleSpec> = fc
  .oneof(
    fc.record({
      kind: fc.constant('equal' as const),
      divisions: fc.integer({ min: 1, max: 72 }),
      period: periods,
    }),
    fc.record({
      kind: fc.constant('generated' as const),
      generator: generators,
      period: periods,
      up: fc.integer({ min: 0, max: 40 }),
      down: fc.integer({ min: 0, max: 20 }),
    }),
    fc.integer({ min: 1, max: 24 }).chain((from) =>
      fc.record({
        kind: fc.constant('harmonic' as const),
        from: fc.constant(from),
        to: fc.integer({ min: from + 1, max: from + 40 }),
        sub: fc.boolean(),
      }),
    ),
    fc.record({
      kind: fc.constant('list' as const),
      degrees: fc.uniqueArray(
        fc.oneof(
          fc.integer({ min: 1, max: 1199 }).map((cents) => `${cents}c`),
          fc.integer({ min: 101, max: 199 }).map((hundredths) => `${hundredths}/100`),
        ),
        { maxLength: 40 },
      ),
      period: fc.constant('2/1'),
    }),
  )
  .filter((spec) => buildScale(spec).ok);
