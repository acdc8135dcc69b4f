import { type FieldError, fieldError, type Result, succeed, fail } from '../result';
import { intervalToString, readInterval } from './interval';
import { type IntervalSize, sameSizeCents, sizeOf, unison } from './interval-size';
import type { Scale, ScaleSpec } from './scale-spec';
import {
  type UnsortedDegree,
  largestScale,
  parsePeriod,
  sortDegrees,
  tooManyDegrees,
} from './scale-degrees';

type ListScaleSpec = Extract<ScaleSpec, { kind: 'list' }>;

function isBelow(lower: IntervalSize, upper: IntervalSize): boolean {
  if (lower.ratio && upper.ratio) return lower.ratio.compare(upper.ratio) < 0;
  return upper.cents - lower.cents >= sameSizeCents;
}

/**
 * A scale from a list of degrees that lie strictly between the tonic (implied) and the period (its
 * own field), sorted from the tonic up. The list may be written in any order; a degree written
 * twice is kept and reported.
 */
export function buildListScale(spec: ListScaleSpec): Result<Scale> {
  const period = parsePeriod(spec.period, 'scale.period');
  const errors: FieldError[] = period.ok ? [] : [...period.errors];
  if (spec.degrees.length + 1 > largestScale) {
    errors.push(tooManyDegrees('scale.degrees', spec.degrees.length + 1));
  }
  const unsorted: UnsortedDegree[] = [];
  spec.degrees.forEach((text, index) => {
    const path = `scale.degrees[${index}]`;
    const read = readInterval(text);
    if (typeof read === 'string') {
      errors.push(fieldError(path, read));
      return;
    }
    const size = sizeOf(read);
    const written = intervalToString(read);
    if (!isBelow(unison, size)) {
      errors.push(fieldError(path, `${written} is not above the tonic`));
    } else if (period.ok && !isBelow(size, period.value)) {
      errors.push(fieldError(path, `${written} is not below the period ${spec.period.trim()}`));
    }
    unsorted.push({ size, stackPosition: null, path, written, label: `${path} (${written})` });
  });
  if (!period.ok || errors.length > 0) return fail(errors);

  const tonic: UnsortedDegree = {
    size: unison,
    stackPosition: null,
    path: 'scale',
    written: 'the tonic',
    label: 'the tonic',
  };
  const { degrees, warnings } = sortDegrees([tonic, ...unsorted]);
  return succeed({ kind: 'list', degrees, period: period.value, generator: null, warnings });
}
