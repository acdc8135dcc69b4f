import { fail, fieldError, type Result } from '../result';
import { buildEqualScale } from './equal-scale';
import { firstNonFinite } from './finite-numbers';
import { buildGeneratedScale } from './generated-scale';
import { buildHarmonicScale } from './harmonic-scale';
import { buildListScale } from './list-scale';
import type { Scale, ScaleSpec } from './scale-spec';

function buildOfKind(spec: ScaleSpec): Result<Scale> {
  switch (spec.kind) {
    case 'generated':
      return buildGeneratedScale(spec);
    case 'equal':
      return buildEqualScale(spec);
    case 'list':
      return buildListScale(spec);
    case 'harmonic':
      return buildHarmonicScale(spec);
  }
}

/**
 * Builds any kind of scale; every fault names its field under `scale`. A scale whose sizes are not
 * all finite numbers is refused here, so that no table, file or stored document built on it can
 * carry NaN or an infinite value.
 */
export function buildScale(spec: ScaleSpec): Result<Scale> {
  const built = buildOfKind(spec);
  if (!built.ok) return built;
  const { degrees, period, generator } = built.value;
  const sizes = {
    degrees: degrees.map((d) => d.cents),
    period: period.cents,
    generator: generator?.cents ?? 0,
  };
  const broken = firstNonFinite(sizes);
  if (broken)
    return fail([
      fieldError('scale', `gives a size that is not a finite number of cents (${broken})`),
    ]);
  return built;
}
