import Fraction from 'fraction.js';
import { fieldError, type Result, succeed, fail } from '../result';
import { exactSize } from './interval-size';
import type { Scale, ScaleSpec } from './scale-spec';
import { largestScale, parsePeriod, tooManyDegrees } from './scale-degrees';

type HarmonicScaleSpec = Extract<ScaleSpec, { kind: 'harmonic' }>;

/**
 * Harmonics `from` to `to` as a scale: degrees k/from for k = from..to-1 in the period to/from. The
 * subharmonic mirror (`sub`) takes to/k for k = to down to from+1, so its steps widen going up
 * where the harmonics' narrow.
 */
export function buildHarmonicScale(spec: HarmonicScaleSpec): Result<Scale> {
  const { from, to, sub } = spec;
  if (!Number.isInteger(from) || from < 1) {
    return fail([fieldError('scale.from', `${from} is not a harmonic number (1, 2, 3...)`)]);
  }
  if (!Number.isInteger(to) || to <= from) {
    return fail([fieldError('scale.to', `${to} is not a harmonic number above ${from}`)]);
  }
  if (to - from > largestScale) return fail([tooManyDegrees('scale.to', to - from)]);
  const period = parsePeriod(`${to}/${from}`, 'scale.to');
  if (!period.ok) return period;

  const degrees = Array.from({ length: to - from }, (_, step) => {
    const ratio = sub ? new Fraction(to, to - step) : new Fraction(from + step, from);
    return { ...exactSize(ratio), stackPosition: null };
  });
  return succeed({
    kind: 'harmonic',
    degrees,
    period: period.value,
    generator: null,
    warnings: [],
  });
}
