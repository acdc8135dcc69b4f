// Generator search: `POST /api/temperaments`. From the intervals a composer wants (a prime limit or a list of target
// ratios) and the commas to temper out, the rank-2 temperaments that fit, each tuned by a published method.
import * as z from 'zod';
import { storableString } from '../text/plain-text';

/** The prime limits a search takes. */
export const primeLimits = [3, 5, 7, 11, 13] as const;
export type PrimeLimit = (typeof primeLimits)[number];

/** Tunings by their published names: Tenney-Euclidean least squares, the same with a pure period, minimax. */
export const temperamentTunings = ['TE', 'POTE', 'minimax'] as const;
export type TemperamentTuning = (typeof temperamentTunings)[number];

/** The largest MOS size listed. */
export const largestMosSize = 100;

const ratioText = storableString().trim().min(1, { error: 'must not be empty' }).max(40, {
  error: 'must be at most 40 characters',
});

/**
 * The question. Either `limit` or `targets` says which intervals matter (with both, the targets are measured and the
 * limit bounds the primes). Without `commas`, `count` (notes per octave wanted) asks for the simplest commas worth
 * tempering out that its equal division maps to zero steps. Interval texts use the interval syntax (ratios such as
 * `81/80`).
 */
export const temperamentRequest = z.strictObject({
  limit: z.literal(primeLimits, { error: `must be one of ${primeLimits.join(', ')}` }).optional(),
  targets: z
    .array(ratioText)
    .min(1, { error: 'must name at least one interval' })
    .max(20, { error: 'must hold at most 20 intervals' })
    .optional(),
  commas: z.array(ratioText).max(6, { error: 'must hold at most 6 commas' }).optional(),
  count: z
    .int({ error: 'must be a whole number of notes from 2 to 100' })
    .min(2)
    .max(largestMosSize)
    .optional(),
  tunings: z
    .array(z.enum(temperamentTunings, { error: `must be one of ${temperamentTunings.join(', ')}` }))
    .min(1)
    .default(['TE', 'POTE']),
});
export type TemperamentRequest = z.output<typeof temperamentRequest>;

/** How far one target interval lands from pure, in cents (tempered minus pure). */
export interface TargetError {
  interval: string;
  cents: number;
}

/** One temperament under one tuning. */
export interface TemperamentResult {
  /** The tuning method, by its published name. */
  tuning: TemperamentTuning;
  /** The primes the mapping's columns stand for, in order. */
  primes: number[];
  /**
   * Two rows over `primes`: periods, then generators (the Hermite normal form, its generator brought within half a
   * period): prime j is `mapping[0][j]` periods plus `mapping[1][j]` generators of this result's sizes.
   */
  mapping: [number[], number[]];
  /** The commas tempered out, as given or as suggested. */
  commas: string[];
  /** Periods in the octave (1 when the period is the octave). */
  periodsPerOctave: number;
  period: number;
  generator: number;
  errors: TargetError[];
  /** The scale sizes in notes an octave, up to `largestMosSize`, where the generator chain makes a two-step-size scale. */
  mosSizes: number[];
}

/** A comma worth tempering out: small and simple, vanishing in the equal division of `count` notes. */
export interface CommaSuggestion {
  ratio: string;
  cents: number;
  /** Tenney height log2(n·d): smaller is simpler. */
  complexity: number;
}

export interface TemperamentsAnswer {
  results: TemperamentResult[];
  /** Present when the question gave no commas. */
  suggestions?: CommaSuggestion[];
}
