import { ratioToString } from './interval';
import { buildScale, type Scale, type ScaleSpec } from './scale';

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
