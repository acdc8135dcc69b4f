// The generator search: from the intervals a composer wants (a prime limit or target ratios) and the commas to
// temper out, the rank-2 temperament they make, tuned by the published methods asked for. Without commas, the
// simplest commas worth tempering out, and the temperament of the simplest of them that give rank 2, so that a
// composer sees a temperament at once.
import Fraction from 'fraction.js';
import { fail, type FieldError, fieldError, type Result, succeed } from '../result';
import { readInterval } from '../tuning/interval';
import { type SimpleComma, patentVal, simpleCommas } from './comma-search';
import { oddLimitConsonances } from './default-targets';
import { withGeneratorWithinHalfPeriod } from './generator-choice';
import { integerRank } from './hermite';
import { type Comma, type RankTwoMapping, rankTwoMapping } from './mapping';
import { minimaxTuning } from './minimax-tuning';
import {
  factorRatio,
  type Monzo,
  monzoCents,
  monzoOver,
  primesUsed,
  searchPrimes,
  subgroupName,
} from './monzo';
import { mosSizes } from './mos-sizes';
import { pureOctaveTeTuning, teTuning } from './te-tuning';

/** The tunings by their published names: TE, TE with a pure period (often called POTE), minimax. */
export type TuningMethod = 'TE' | 'POTE' | 'minimax';

/** The question, as the request schema gives it. */
export interface TemperamentQuestion {
  /** A prime limit from 3 to 13: its primes, and its odd-limit consonances as targets when none are given. */
  limit?: number;
  /** Target ratios: the primes they use (with 2) make the subgroup; the limit, if given, bounds them. */
  targets?: readonly string[];
  commas?: readonly string[];
  /** Notes per octave: without commas, only commas its equal division (patent val) tempers out are suggested. */
  count?: number;
  tunings: readonly TuningMethod[];
}

/** One temperament under one tuning; see `TemperamentResult` in the API contract. */
export interface TunedTemperament {
  tuning: TuningMethod;
  primes: number[];
  /** The period row and the generator row matching `period` and `generator`. */
  mapping: [number[], number[]];
  commas: string[];
  periodsPerOctave: number;
  period: number;
  generator: number;
  errors: { interval: string; cents: number }[];
  mosSizes: number[];
}

export interface TemperamentSearch {
  results: TunedTemperament[];
  suggestions?: { ratio: string; cents: number; complexity: number }[];
}

/** The largest MOS size listed, in notes per octave. */
const largestMosSize = 100;
/** How many comma suggestions an answer lists, the simplest first. */
const listedSuggestions = 12;

interface Target {
  ratio: string;
  exponents: Monzo;
}

/** Reads a ratio over the primes up to 13 from the field at `path`, or says why it is none. */
function readRatio(text: string, path: string, what: 'a target' | 'a comma'): Target | FieldError {
  const read = readInterval(text);
  if (typeof read === 'string') return fieldError(path, read);
  if (read.kind === 'cents')
    return fieldError(
      path,
      `${text.trim()} is a size in cents; ${what} must be a ratio such as ${what === 'a comma' ? '81/80' : '3/2'}`,
    );
  const written = `${read.ratio.n}/${read.ratio.d}`;
  const factored = factorRatio(read.ratio);
  if (factored.beyondThirteen)
    return fieldError(
      path,
      `${written} has a prime factor above 13; the search takes primes up to 13`,
    );
  return { ratio: written, exponents: factored.exponents };
}

/** The fault of a ratio using primes outside `allowed`, or null. */
function outside(target: Target, allowed: readonly number[], where: string): string | null {
  const stray = primesUsed(target.exponents).filter((prime) => !allowed.includes(prime));
  if (stray.length === 0) return null;
  const primes =
    stray.length === 1 ? `${stray[0]}` : `${stray.slice(0, -1).join(', ')} and ${stray.at(-1)}`;
  return `${target.ratio} uses ${stray.length === 1 ? 'the prime' : 'the primes'} ${primes}, ${where}`;
}

interface Question {
  primes: number[];
  targets: Target[];
  commas: Comma[];
}

/** Reads the fields into the subgroup, the targets and the commas, with every fault found. */
function readQuestion(question: TemperamentQuestion): Result<Question> {
  const faults: FieldError[] = [];
  const { limit } = question;
  const givenTargets = question.targets ?? [];
  if (limit === undefined && givenTargets.length === 0)
    faults.push(fieldError('limit', 'give a prime limit (3, 5, 7, 11 or 13) or target intervals'));
  const limitPrimes = searchPrimes.filter((prime) => prime <= (limit ?? 13));
  const beyondLimit = `beyond the ${limit ?? 13}-limit`;
  const targets: Target[] = [];
  givenTargets.forEach((text, i) => {
    const read = readRatio(text, `targets[${i}]`, 'a target');
    const stray = 'path' in read ? null : outside(read, limitPrimes, beyondLimit);
    if ('path' in read) faults.push(read);
    else if (stray) faults.push(fieldError(`targets[${i}]`, stray));
    else targets.push(read);
  });
  const targetPrimes = (prime: number) =>
    prime === 2 || targets.some((target) => primesUsed(target.exponents).includes(prime));
  const primes = givenTargets.length === 0 ? limitPrimes : searchPrimes.filter(targetPrimes);
  if (givenTargets.length > 0 && faults.length === 0 && primes.length < 2)
    faults.push(
      fieldError('targets', 'the targets use no prime but 2: name an interval such as 3/2 as well'),
    );
  // Against targets that could not be read, the subgroup is unknown: only the limit is checked then.
  const [allowed, where] =
    givenTargets.length === 0 || faults.length > 0
      ? [limitPrimes, beyondLimit]
      : [primes, `which no target uses (the targets' primes are ${subgroupName(primes)})`];
  const commas: Comma[] = [];
  (question.commas ?? []).forEach((text, i) => {
    const path = `commas[${i}]`;
    const read = readRatio(text, path, 'a comma');
    const stray = 'path' in read ? null : outside(read, allowed, where);
    if ('path' in read) faults.push(read);
    else if (stray) faults.push(fieldError(path, stray));
    else commas.push({ ratio: read.ratio, monzo: monzoOver(read.exponents, primes), path });
  });
  if (faults.length > 0) return fail(faults);
  const measured =
    targets.length > 0
      ? targets
      : oddLimitConsonances(limit!).map((ratio) => ({
          ratio,
          exponents: factorRatio(new Fraction(ratio)).exponents,
        }));
  return succeed({ primes, targets: measured, commas });
}

/** The temperament of `mapping` under each tuning asked for, with its errors and MOS sizes. */
function tuneAll(
  temperament: RankTwoMapping,
  commas: readonly string[],
  targets: readonly Target[],
  tunings: readonly TuningMethod[],
): TunedTemperament[] {
  const { primes, hermite, periodsPerOctave } = temperament;
  const monzos = targets.map((target) => monzoOver(target.exponents, primes));
  const te = teTuning(hermite, primes);
  const pote = pureOctaveTeTuning(hermite, primes);
  const sizes: Record<TuningMethod, () => number[]> = {
    TE: () => te,
    POTE: () => pote,
    minimax: () => minimaxTuning(hermite, primes, monzos, pote[1]),
  };
  return [...new Set(tunings)].map((tuning) => {
    const [periodSize, generatorSize] = sizes[tuning]();
    const chosen = withGeneratorWithinHalfPeriod({
      mapping: hermite,
      period: periodSize,
      generator: generatorSize,
    });
    const { mapping, period, generator } = chosen;
    const tempered = (monzo: Monzo) =>
      monzo.reduce(
        (sum, e, i) => sum + e * (mapping[0][i] * period + mapping[1][i] * generator),
        0,
      );
    return {
      tuning,
      primes: [...primes],
      mapping,
      commas: [...commas],
      periodsPerOctave,
      period,
      generator,
      errors: targets.map((target, i) => ({
        interval: target.ratio,
        cents: tempered(monzos[i]) - monzoCents(monzos[i], primes),
      })),
      mosSizes: mosSizes(period, generator, periodsPerOctave, largestMosSize),
    };
  });
}

/**
 * The simplest commas of `candidates` (already simplest first) that give a rank-2 temperament: each taken when
 * it is independent of those taken before, skipped when the last one would make a prime a unison.
 */
function simplestRankTwo(
  candidates: readonly SimpleComma[],
  primes: readonly number[],
): { commas: SimpleComma[]; temperament: RankTwoMapping } | null {
  const needed = primes.length - 2;
  const chosen: SimpleComma[] = [];
  for (const candidate of candidates) {
    if (chosen.length === needed) break;
    const trial = [...chosen, candidate];
    if (
      integerRank(
        trial.map((comma) => comma.monzo),
        primes.length,
      ) < trial.length
    )
      continue;
    if (trial.length === needed && !rankTwoMapping(asCommas(trial), primes).ok) continue;
    chosen.push(candidate);
  }
  if (chosen.length < needed) return null;
  const made = rankTwoMapping(asCommas(chosen), primes);
  return made.ok ? { commas: chosen, temperament: made.value } : null;
}

function asCommas(commas: readonly SimpleComma[]): Comma[] {
  return commas.map((comma, i) => ({
    ratio: comma.ratio,
    monzo: comma.monzo,
    path: `commas[${i}]`,
  }));
}

/**
 * Answers a generator search. With commas: the rank-2 temperament that tempers them out, under each tuning, or
 * the faults by field (`limit`, `targets[i]`, `commas[i]`, or `commas` for a set of another rank or one that
 * makes a prime a unison). Without: up to 12 of the simplest commas (with `count`, those its equal division
 * tempers out), and the results of the simplest of them that give rank 2 (none when no such set is found).
 */
export function searchTemperaments(question: TemperamentQuestion): Result<TemperamentSearch> {
  const read = readQuestion(question);
  if (!read.ok) return read;
  const { primes, targets, commas } = read.value;
  if (commas.length > 0) {
    const made = rankTwoMapping(commas, primes);
    if (!made.ok) return made;
    const given = commas.map((comma) => comma.ratio);
    return succeed({ results: tuneAll(made.value, given, targets, question.tunings) });
  }
  const val = question.count === undefined ? undefined : patentVal(question.count, primes);
  const candidates = simpleCommas(primes, val);
  const simplest = simplestRankTwo(candidates, primes);
  const results = simplest
    ? tuneAll(
        simplest.temperament,
        simplest.commas.map((comma) => comma.ratio),
        targets,
        question.tunings,
      )
    : [];
  const suggestions = candidates
    .slice(0, listedSuggestions)
    .map(({ ratio, cents, complexity }) => ({ ratio, cents, complexity }));
  return succeed({ results, suggestions });
}
