// From the commas to temper out to the mapping of a rank-2 temperament: the integer null space of the commas'
// monzos, in Hermite normal form, with the faults a composer can make named by field.
import { fail, type FieldError, fieldError, type Result, succeed } from '../result';
import { integerNullSpace, integerRank } from './hermite';
import { type Monzo, subgroupName } from './monzo';

/** A comma to temper out, as read from the field at `path`. */
export interface Comma {
  ratio: string;
  monzo: Monzo;
  path: string;
}

/** The mapping of a rank-2 temperament over its primes, the first of which is 2. */
export interface RankTwoMapping {
  primes: number[];
  /**
   * The Hermite normal form of the vals that map every comma to zero steps: the period row, then the generator
   * row. Column j says how many periods and generators make prime j.
   */
  hermite: [number[], number[]];
  /** Periods in the octave: 2/1 maps to this many periods and no generator. */
  periodsPerOctave: number;
}

function commaFault(comma: Comma, primes: readonly number[]): string | null {
  const used = comma.monzo.flatMap((e, i) => (e !== 0 ? [primes[i]] : []));
  if (used.length === 0) return `${comma.ratio} is a unison: there is nothing to temper out`;
  if (used.length === 1)
    return `${comma.ratio} is a power of ${used[0]} alone: tempering it out would make ${used[0]}/1 a unison`;
  return null;
}

/** Names the rank the commas leave and what would make it two. */
function rankFault(rank: number, commas: number, primes: readonly number[]): string {
  const needed = primes.length - 2;
  const what = rank === 1 ? ' (an equal division)' : rank === 0 ? ' (nothing is left)' : '';
  const change =
    rank > 2
      ? `temper out ${rank - 2} more independent comma${rank - 2 === 1 ? '' : 's'}`
      : `leave out ${2 - rank} comma${2 - rank === 1 ? '' : 's'}`;
  const given =
    commas === 0 ? 'no comma leaves' : `${commas} comma${commas === 1 ? ' leaves' : 's leave'}`;
  return `${given} a rank-${rank} temperament${what} of ${subgroupName(primes)}; rank 2 over ${primes.length} primes needs ${needed} independent comma${needed === 1 ? '' : 's'}: ${change}`;
}

/**
 * The rank-2 temperament of `primes` (2 first) that tempers out `commas`, or the faults: a comma that is a unison
 * or a power of one prime, a comma that follows from those before it, a rank other than two, or commas that
 * together make a prime a unison. Faults of single commas name their field; faults of the set name `commas`.
 */
export function rankTwoMapping(
  commas: readonly Comma[],
  primes: readonly number[],
): Result<RankTwoMapping> {
  const faults: FieldError[] = [];
  for (const comma of commas) {
    const fault = commaFault(comma, primes);
    if (fault) faults.push(fieldError(comma.path, fault));
  }
  if (faults.length > 0) return fail(faults);
  for (let j = 1; j < commas.length; j++) {
    const before = commas.slice(0, j + 1).map((comma) => comma.monzo);
    if (integerRank(before, primes.length) <= j) {
      const others = j === 1 ? commas[0].ratio : `the ${j} commas before it`;
      return fail([
        fieldError(
          commas[j].path,
          `${commas[j].ratio} follows from ${others} (it is a product of their powers): leave it out`,
        ),
      ]);
    }
  }
  const vals = integerNullSpace(
    commas.map((comma) => comma.monzo),
    primes.length,
  );
  if (vals.length !== 2)
    return fail([fieldError('commas', rankFault(vals.length, commas.length, primes))]);
  const hermite: [number[], number[]] = [vals[0], vals[1]];
  const unisons = primes.filter((_, i) => hermite[0][i] === 0 && hermite[1][i] === 0);
  if (unisons.length > 0) {
    const names = unisons.map((prime) => `${prime}/1`).join(' and ');
    return fail([
      fieldError(
        'commas',
        `together these commas make ${names} a unison, which no tuning can play: choose commas that keep every prime apart`,
      ),
    ]);
  }
  return succeed({ primes: [...primes], hermite, periodsPerOctave: hermite[0][0] });
}
