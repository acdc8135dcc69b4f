// What a scale is, apart from how it is built: the spec as the preset document gives it, and the
// built scale. The builders (equal-scale.ts, generated-scale.ts, harmonic-scale.ts, list-scale.ts)
// and scale.ts, which picks one of them, stand on this file.
import type { FieldError } from '../result';
import type { IntervalSize } from './interval-size';
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
