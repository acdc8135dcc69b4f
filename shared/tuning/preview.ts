import { type FieldError, fieldError } from '../result';
import { keyRuns } from '../text/key-runs';
import { analyzeScale } from './analysis';
import type { Beat } from './beats';
import { ratioToString } from './interval';
import type { IntervalSize } from './interval-size';
import { type KeyMapping, type KeyTable, mapKeys } from './key-table';
import { buildScale } from './scale';
import type { Scale, ScaleSpec } from './scale-spec';
import { ratioSearch } from './ratio-approximation';
import { fifthsPerStep } from './chain-names';
import { chainIntervalName, degreeNames } from './degree-names';
import { reduceIntoPeriod } from './interval-size';

/** An interval as JSON: its exact ratio as text ("531441/524288") or null, and its cents. */
export interface SizeJson {
  ratio: string | null;
  cents: number;
}

export interface PreviewDegree extends SizeJson {
  /** What the degree is called: along the chain of fifths, in ups and downs, or by step; no two alike. */
  name: string;
  degree: number;
  /** For a degree with no exact ratio, the nearest ratio within the odd limit, and the error. */
  approximation: { ratio: string; errorCents: number } | null;
  step: SizeJson;
  nearestNote: { name: string; offsetCents: number };
  /** Generators above (+) or below (-) the tonic, for generated scales. */
  stackPosition: number | null;
  fifth: Beat | null;
  majorThird: Beat | null;
}

export interface PreviewKey {
  key: number;
  degree: number | null;
  hz: number | null;
  /** Cents from the root key's pitch (so the root key is 0 and an octave below it -1200). */
  cents: number | null;
  centsFrom12: number | null;
  outOfMtsRange: boolean;
}

export interface PreviewTable {
  degrees: PreviewDegree[];
  analysis: {
    size: number;
    period: SizeJson;
    /** How the `approximation` of a degree was chosen. */
    ratioSearch: typeof ratioSearch;
    stepPattern: {
      sizes: (SizeJson & { letter: string; count: number })[];
      pattern: string;
      isMos: boolean;
    };
    stack: {
      generator: SizeJson;
      reducedGenerator: SizeJson;
      comma: SizeJson;
      /** `name`: for a chain of fifths, the interval the wolf is, such as `diminished sixth G♯–E♭`; else null. */
      wolf:
        | (SizeJson & { from: number; to: number; deviationCents: number; name: string | null })
        | null;
      mosSizes: number[];
      /**
       * The chain from its lowest note up: each link from one stack position to the next, its size and how far it
       * lies from the generator as written (negative: narrowed).
       */
      chain: (SizeJson & { from: number; to: number; deviationCents: number })[];
    } | null;
    intervalMatrix: number[][];
  };
  keys: PreviewKey[];
  /** Coinciding degrees, keys MTS cannot express: the table stands, the musician should know. */
  warnings: FieldError[];
}

function builtOrThrow(spec: ScaleSpec): Scale {
  const built = buildScale(spec);
  if (!built.ok) throw new Error(built.errors.map((error) => error.message).join('; '));
  return built.value;
}

function sizeJson(size: IntervalSize): SizeJson {
  return { ratio: size.ratio ? ratioToString(size.ratio) : null, cents: size.cents };
}

function mtsRangeWarning(keys: KeyTable): FieldError[] {
  const outside = keys.filter((entry) => entry.outOfMtsRange).map((entry) => entry.key);
  if (outside.length === 0) return [];
  const which = outside.length === 1 ? `key ${outside[0]} lies` : `keys ${keyRuns(outside)} lie`;
  const range = 'outside the pitches MTS can express (8.1758 to 13289.6566 Hz)';
  return [fieldError('mapping', `${which} ${range}`)];
}

/** The wolf as the interval it is along a chain of fifths (`diminished sixth G♯–E♭`); null for other chains. */
function wolfName(scale: Scale, names: string[], from: number, to: number): string | null {
  const { generator, period, degrees } = scale;
  if (!generator) return null;
  const step = fifthsPerStep(reduceIntoPeriod(generator, period).reduced.cents, period.cents);
  if (!step) return null;
  const fifths = step * ((degrees[to].stackPosition ?? 0) - (degrees[from].stackPosition ?? 0));
  return `${chainIntervalName(fifths)} ${names[from]}–${names[to]}`;
}

function chainJson(scale: Scale): NonNullable<PreviewTable['analysis']['stack']>['chain'] {
  if (!scale.chain) return [];
  const lowest = Math.min(...scale.degrees.map((degree) => degree.stackPosition ?? 0));
  const { pure, links } = scale.chain;
  return links.map((link, index) => ({
    from: lowest + index,
    to: lowest + index + 1,
    ...sizeJson(link),
    deviationCents: link.cents - pure.cents,
  }));
}

/**
 * The body of `POST /api/preview/table`: the scale's degrees with their analysis, the scale-wide
 * analysis and the 128-key table, all JSON-safe (ratios as text, cents and Hz as numbers). Takes
 * the scale and mapping of what `parsePresetDocument` returned; a preset that did not come through
 * it may not build, and then this throws. `scale`: the scale `parsePresetAndScale` built from the
 * same spec, so that it is not built twice.
 */
export function previewTable(
  preset: { scale: ScaleSpec; mapping: KeyMapping },
  scale: Scale = builtOrThrow(preset.scale),
): PreviewTable {
  const analysis = analyzeScale(scale, preset.mapping);
  const table = mapKeys(scale, preset.mapping);
  const { stack, stepPattern } = analysis;
  const names = degreeNames(scale, preset.mapping.rootKey % 12);
  return {
    degrees: analysis.degrees.map((degree) => ({
      degree: degree.degree,
      name: names[degree.degree],
      ratio: degree.ratio && ratioToString(degree.ratio),
      cents: degree.cents,
      approximation: degree.approximation && {
        ratio: ratioToString(degree.approximation.ratio),
        errorCents: degree.approximation.errorCents,
      },
      step: sizeJson(degree.step),
      nearestNote: degree.nearestNote,
      stackPosition: degree.stackPosition,
      fifth: degree.fifth,
      majorThird: degree.majorThird,
    })),
    analysis: {
      size: scale.degrees.length,
      period: sizeJson(scale.period),
      ratioSearch,
      stepPattern: {
        sizes: stepPattern.sizes.map((size) => ({
          ...sizeJson(size),
          letter: size.letter,
          count: size.count,
        })),
        pattern: stepPattern.pattern,
        isMos: stepPattern.isMos,
      },
      stack: stack && {
        generator: sizeJson(stack.generator),
        reducedGenerator: sizeJson(stack.reducedGenerator),
        comma: sizeJson(stack.comma),
        wolf: stack.wolf && {
          from: stack.wolf.from,
          to: stack.wolf.to,
          ...sizeJson(stack.wolf.size),
          deviationCents: stack.wolf.deviationCents,
          name: wolfName(scale, names, stack.wolf.from, stack.wolf.to),
        },
        mosSizes: stack.mosSizes,
        chain: chainJson(scale),
      },
      intervalMatrix: analysis.intervalMatrix,
    },
    keys: table.map((entry) => ({
      key: entry.key,
      degree: entry.degree,
      hz: entry.hz,
      cents: entry.centsFromRoot,
      centsFrom12: entry.centsFrom12,
      outOfMtsRange: entry.outOfMtsRange,
    })),
    warnings: [...scale.warnings, ...mtsRangeWarning(table)],
  };
}
