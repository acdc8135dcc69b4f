import { type FieldError, fail, fieldError, type Result } from '../result';
import { buildEqualScale } from './equal-scale';
import { firstNonFinite } from './finite-numbers';
import { buildGeneratedScale } from './generated-scale';
import { buildHarmonicScale } from './harmonic-scale';
import type { IntervalSize } from './interval-size';
import { buildListScale } from './list-scale';
import type { ScaleDegree } from './scale-degrees';

/** A scale as the preset document describes it, defaults filled in, intervals still as text. */
export type ScaleSpec =
  | {
      kind: 'generated';
      generator: string;
      period: string;
      up: number;
      down: number;
      /** One fraction of a comma for every generator, or one link each from the chain's lowest note up (null: pure). */
      temper?: TemperLink | (TemperLink | null)[];
    }
  | { kind: 'equal'; divisions: number; period: string }
  | { kind: 'list'; degrees: string[]; period: string }
  | { kind: 'harmonic'; from: number; to: number; sub: boolean };

type ScaleKind = ScaleSpec['kind'];

/** A generator narrowed by a fraction of a comma (a negative fraction widens it). */
export interface TemperLink {
  comma: string;
  fraction: string;
}

/** A generated scale's chain: the generator as written, and each link's size from the lowest note up. */
export interface Chain {
  pure: IntervalSize;
  links: IntervalSize[];
}

/**
 * A built scale: its degrees inside one period, sorted from the tonic (degree 0, always unison)
 * upwards. Degrees that coincide are kept and reported in `warnings`, not refused: a musician may
 * pass through such a stack on the way to the one they want, and the degree numbers of a key
 * layout must not shift under them.
 */
export interface Scale {
  kind: ScaleKind;
  degrees: ScaleDegree[];
  period: IntervalSize;
  /**
   * The generator as stacked for generated scales: tempered when one fraction tempers every link, as written when
   * the links are tempered one by one (each link's size is in `chain`); null for other kinds.
   */
  generator: IntervalSize | null;
  /** For generated scales, the chain of links; null for other kinds. */
  chain?: Chain | null;
  warnings: FieldError[];
}

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
  const sizes = { degrees: degrees.map((d) => d.cents), period: period.cents, generator: generator?.cents ?? 0 };
  const broken = firstNonFinite(sizes);
  if (broken) return fail([fieldError('scale', `gives a size that is not a finite number of cents (${broken})`)]);
  return built;
}
