import * as fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { firstNonFinite } from '../tuning/finite-numbers';
import { simpleCommas } from './comma-search';
import { primeCents } from './monzo';
import {
  searchTemperaments,
  type TemperamentQuestion,
  type TunedTemperament,
} from './temperament-search';

function answer(question: Partial<TemperamentQuestion>) {
  const found = searchTemperaments({ tunings: ['TE', 'POTE', 'minimax'], ...question });
  if (!found.ok) throw new Error(found.errors.map((error) => error.message).join('\n'));
  return found.value;
}

function faults(question: Partial<TemperamentQuestion>) {
  const found = searchTemperaments({ tunings: ['TE'], ...question });
  if (found.ok) throw new Error('expected faults');
  return found.errors;
}

const byTuning = (results: TunedTemperament[], tuning: string) =>
  results.find((result) => result.tuning === tuning)!;

/** The size in cents of each prime under a result's tuning. */
const tuningMap = (result: TunedTemperament) =>
  result.primes.map(
    (_, i) => result.mapping[0][i] * result.period + result.mapping[1][i] * result.generator,
  );

describe('the generator search', () => {
  it('gives meantone for 81/80 in the 5-limit, the fourth as generator', () => {
    const { results, suggestions } = answer({ limit: 5, commas: ['81/80'] });
    expect(suggestions).toBeUndefined();
    const pote = byTuning(results, 'POTE');
    expect(pote.primes).toEqual([2, 3, 5]);
    expect(pote.commas).toEqual(['81/80']);
    // from memory (published temperament tables): meantone [<1 0 -4], <0 1 4]]; with the fourth as generator
    // (3 = two octaves less a fourth, 5 = four octaves less four fourths: arithmetic) it reads as below
    expect(pote.mapping).toEqual([
      [1, 2, 4],
      [0, -1, -4],
    ]);
    expect(pote.periodsPerOctave).toBe(1);
    expect(pote.period).toBe(1200);
    // from memory (published temperament tables): meantone POTE fifth 696.239 c
    expect(pote.period - pote.generator).toBeCloseTo(696.239, 3);
    // arithmetic: 5/4 is four fifths less two octaves, against 386.3137 c pure
    const fifth = pote.period - pote.generator;
    const third = pote.errors.find((error) => error.interval === '5/4')!;
    expect(third.cents).toBeCloseTo(4 * fifth - 2400 - 1200 * Math.log2(5 / 4), 9);
    // the 5-odd-limit consonances are measured when no targets are given
    expect(pote.errors.map((error) => error.interval)).toEqual([
      '6/5',
      '5/4',
      '4/3',
      '3/2',
      '8/5',
      '5/3',
    ]);
    // from memory (published temperament tables): meantone's MOS sizes 5, 7, 12, 19, 31
    expect(pote.mosSizes).toEqual(expect.arrayContaining([5, 7, 12, 19, 31]));
    expect(pote.mosSizes).not.toContain(6);
    const te = byTuning(results, 'TE');
    // from memory (published temperament tables): meantone TE octave 1201.397 c, fifth 697.049 c
    expect(te.period).toBeCloseTo(1201.397, 3);
    expect(te.period - te.generator).toBeCloseTo(697.049, 3);
    // from memory: the 5-odd-limit minimax meantone is quarter-comma, fifth 696.5784284662 c (standard
    // acoustics texts), where 5/4 is pure
    const minimax = byTuning(results, 'minimax');
    expect(minimax.period - minimax.generator).toBeCloseTo(696.5784284662, 9);
    expect(minimax.errors.find((error) => error.interval === '5/4')!.cents).toBeCloseTo(0, 9);
  });

  it('gives a half-octave period for 2048/2025', () => {
    const pote = byTuning(answer({ limit: 5, commas: ['2048/2025'] }).results, 'POTE');
    // from memory (published temperament tables): diaschismic has two periods an octave
    expect(pote.periodsPerOctave).toBe(2);
    expect(pote.period).toBeCloseTo(600, 9);
    expect(pote.generator).toBeGreaterThan(0);
    expect(pote.generator).toBeLessThanOrEqual(300);
    // arithmetic: every scale holds whole periods, so every MOS size is even; from memory: 10, 12, 22, 34
    expect(pote.mosSizes.every((size) => size % 2 === 0)).toBe(true);
    expect(pote.mosSizes).toEqual(expect.arrayContaining([10, 12, 22, 34]));
  });

  it('gives porcupine for 250/243 in the 5-limit, a generator of about a third-tone', () => {
    const pote = byTuning(answer({ limit: 5, commas: ['250/243'] }).results, 'POTE');
    // from memory (published temperament tables): porcupine's generator is about 163 c, a tempered 10/9 and
    // 11/10, three of which make a fourth; its MOS sizes include 7, 8, 15 and 22
    expect(pote.generator).toBeGreaterThan(161);
    expect(pote.generator).toBeLessThan(165);
    expect(pote.periodsPerOctave).toBe(1);
    expect(pote.mosSizes).toEqual(expect.arrayContaining([7, 8, 15, 22]));
  });

  it('gives septimal meantone for 81/80 with 225/224 in the 7-limit', () => {
    const pote = byTuning(answer({ limit: 7, commas: ['81/80', '225/224'] }).results, 'POTE');
    // from memory (published temperament tables): septimal meantone [<1 0 -4 -13], <0 1 4 10]]; with the
    // fourth as generator (arithmetic, as for meantone): 7 = seven octaves less ten fourths
    expect(pote.mapping).toEqual([
      [1, 2, 4, 7],
      [0, -1, -4, -10],
    ]);
    // from memory: its POTE fifth is about 696.5 c
    expect(pote.period - pote.generator).toBeCloseTo(696.5, 1);
    expect(pote.errors).toHaveLength(12);
  });

  it('measures the targets given, over the primes they use', () => {
    const { results } = answer({
      limit: 13,
      targets: ['3/2', '11/8', '13/8', '13/11'],
      commas: ['243/242', '144/143'],
    });
    expect(results).toHaveLength(3);
    for (const result of results) {
      expect(result.primes).toEqual([2, 3, 11, 13]);
      expect(result.errors.map((error) => error.interval)).toEqual([
        '3/2',
        '11/8',
        '13/8',
        '13/11',
      ]);
    }
  });

  it('suggests the commas 12 equal steps temper out, and tunes the simplest as a temperament at once', () => {
    const { results, suggestions } = answer({ limit: 5, count: 12, tunings: ['POTE'] });
    // arithmetic: <12 19 28] maps each of them to zero steps; 81/80 is the simplest (log2(81·80) = 12.66)
    expect(suggestions!.map((comma) => comma.ratio)).toEqual([
      '81/80',
      '128/125',
      '2048/2025',
      '32805/32768',
      '531441/524288',
    ]);
    expect(results).toHaveLength(1);
    expect(results[0].commas).toEqual(['81/80']);
    expect(results[0].mosSizes).toContain(12);
  });

  it('takes as many suggested commas as rank 2 needs', () => {
    const { results } = answer({ limit: 11, count: 31, tunings: ['TE'] });
    // arithmetic: five primes less rank 2 leaves three commas; 31 equal steps temper each out
    expect(results[0].commas).toHaveLength(3);
    expect(results[0].mosSizes).toContain(31);
  });

  it('gives the 3-limit untempered: two primes are rank 2 already', () => {
    const { results, suggestions } = answer({ limit: 3, tunings: ['POTE'] });
    // standard acoustics texts: the Pythagorean comma is the only 3-limit comma under a quarter tone this simple
    expect(suggestions!.map((comma) => comma.ratio)).toEqual(['531441/524288']);
    expect(results[0].commas).toEqual([]);
    // arithmetic: the fourth, 1200 log2(4/3) = 498.045 c, is the pure generator within half an octave
    expect(results[0].generator).toBeCloseTo(1200 * Math.log2(4 / 3), 9);
    for (const error of results[0].errors) expect(error.cents).toBeCloseTo(0, 9);
  });

  it('names the field of each fault', () => {
    expect(faults({})[0].path).toBe('limit');
    expect(faults({ limit: 5, targets: ['701.955c'] })[0]).toMatchObject({
      path: 'targets[0]',
      message: expect.stringMatching(/size in cents.*ratio/),
    });
    expect(faults({ limit: 5, targets: ['3/2', '7/4'] })[0]).toMatchObject({
      path: 'targets[1]',
      message: expect.stringMatching(/7, beyond the 5-limit/),
    });
    expect(faults({ targets: ['17/16'] })[0].path).toBe('targets[0]');
    expect(faults({ targets: ['2/1', '4/1'] })[0].path).toBe('targets');
    expect(faults({ limit: 5, commas: ['81/80', '64/63'] })[0]).toMatchObject({
      path: 'commas[1]',
      message: expect.stringMatching(/7, beyond the 5-limit/),
    });
    expect(faults({ targets: ['3/2', '5/4'], commas: ['64/63'] })[0]).toMatchObject({
      path: 'commas[0]',
      message: expect.stringMatching(/7, which no target uses.*2\.3\.5/),
    });
    expect(faults({ limit: 7, commas: ['81/80'] })[0].path).toBe('commas');
    expect(faults({ limit: 5, commas: ['81/80', '6561/6400'] })[0].path).toBe('commas[1]');
  });
});

/** A rank-2 temperament question from the simple commas of a limit (fast-check picks which). */
const limits = [5, 7, 11, 13];
const candidates = new Map(
  limits.map((limit) => [limit, simpleCommas([2, 3, 5, 7, 11, 13].filter((p) => p <= limit))]),
);
const primeCount = new Map([
  [5, 3],
  [7, 4],
  [11, 5],
  [13, 6],
]);
const temperamentQuestion = fc.constantFrom(...limits).chain((limit) =>
  fc
    .uniqueArray(fc.nat({ max: candidates.get(limit)!.length - 1 }), {
      minLength: primeCount.get(limit)! - 2,
      maxLength: primeCount.get(limit)! - 2,
    })
    .map((picks) => ({ limit, commas: picks.map((i) => candidates.get(limit)![i].ratio) })),
);

/** The TE error: the sum of squares of each prime's error divided by log2 of the prime. */
function teError(result: TunedTemperament, map = tuningMap(result)): number {
  const just = primeCents(result.primes);
  return map.reduce(
    (sum, cents, i) => sum + ((cents - just[i]) / Math.log2(result.primes[i])) ** 2,
    0,
  );
}

/** 1 - cos of the angle between the weighted tuning map and the weighted just map (TE's direction). */
function angleError(result: TunedTemperament, map = tuningMap(result)): number {
  const weighted = map.map((cents, i) => cents / Math.log2(result.primes[i]));
  const dot = weighted.reduce((sum, x) => sum + x * 1200, 0);
  const norm = Math.hypot(...weighted) * 1200 * Math.sqrt(weighted.length);
  return 1 - dot / norm;
}

function largestTargetError(
  result: TunedTemperament,
  generator: number,
  targets: number[][],
): number {
  const just = primeCents(result.primes);
  return Math.max(
    ...targets.map((monzo) =>
      Math.abs(
        monzo.reduce(
          (sum, e, i) =>
            sum +
            e * (result.mapping[0][i] * result.period + result.mapping[1][i] * generator - just[i]),
          0,
        ),
      ),
    ),
  );
}

const nudge = fc
  .double({ min: 0.01, max: 1, noNaN: true })
  .chain((size) => fc.constantFrom(size, -size));

describe('properties of the generator search', () => {
  it('maps every comma it is given to zero steps', () => {
    fc.assert(
      fc.property(temperamentQuestion, (question) => {
        const found = searchTemperaments({ ...question, tunings: ['POTE'] });
        fc.pre(found.ok);
        if (!found.ok) return;
        for (const result of found.value.results) {
          for (const ratio of result.commas) {
            const [n, d] = ratio.split('/').map(BigInt);
            const monzo = result.primes.map((p) => {
              let e = 0;
              let [top, bottom] = [n, d];
              while (top % BigInt(p) === 0n) [top, e] = [top / BigInt(p), e + 1];
              while (bottom % BigInt(p) === 0n) [bottom, e] = [bottom / BigInt(p), e - 1];
              return e;
            });
            for (const row of result.mapping)
              expect(row.reduce((sum, e, i) => sum + e * monzo[i], 0)).toBe(0);
          }
        }
      }),
      { numRuns: 60 },
    );
  });

  it('refuses, with the field named, any 5-limit comma it cannot make rank 2 of, and maps the rest to zero', () => {
    fc.assert(
      fc.property(
        fc.array(fc.integer({ min: -12, max: 12 }), { minLength: 3, maxLength: 3 }),
        (exponents) => {
          const [n, d] = [1n, 1n].map((one, side) =>
            exponents.reduce(
              (term, e, i) =>
                term * ((side === 0) === e > 0 ? BigInt([2, 3, 5][i]) ** BigInt(Math.abs(e)) : 1n),
              one,
            ),
          );
          const found = searchTemperaments({ limit: 5, commas: [`${n}/${d}`], tunings: ['TE'] });
          const primesUsed = exponents.filter((e) => e !== 0).length;
          expect(found.ok).toBe(primesUsed >= 2);
          if (!found.ok) expect(found.errors[0].path).toMatch(/^commas/);
          else
            for (const row of found.value.results[0].mapping)
              expect(row.reduce((sum, e, i) => sum + e * exponents[i], 0)).toBe(0);
        },
      ),
    );
  });

  it('finds TE tunings that no small change of period or generator improves', () => {
    fc.assert(
      fc.property(temperamentQuestion, nudge, nudge, (question, dPeriod, dGenerator) => {
        const found = searchTemperaments({ ...question, tunings: ['TE'] });
        fc.pre(found.ok);
        if (!found.ok) return;
        const te = found.value.results[0];
        const best = teError(te);
        const moved = te.primes.map(
          (_, i) =>
            te.mapping[0][i] * (te.period + dPeriod) +
            te.mapping[1][i] * (te.generator + dGenerator),
        );
        expect(teError(te, moved)).toBeGreaterThanOrEqual(best * (1 - 1e-12));
      }),
      { numRuns: 60 },
    );
  });

  it('finds POTE tunings that no small change of the generator brings closer to just in TE angle', () => {
    fc.assert(
      fc.property(temperamentQuestion, nudge, (question, dGenerator) => {
        const found = searchTemperaments({ ...question, tunings: ['POTE'] });
        fc.pre(found.ok);
        if (!found.ok) return;
        const pote = found.value.results[0];
        expect(pote.period * pote.periodsPerOctave).toBeCloseTo(1200, 9);
        const best = angleError(pote);
        const moved = pote.primes.map(
          (_, i) =>
            pote.mapping[0][i] * pote.period + pote.mapping[1][i] * (pote.generator + dGenerator),
        );
        expect(angleError(pote, moved)).toBeGreaterThanOrEqual(best - 1e-15);
      }),
      { numRuns: 60 },
    );
  });

  it('finds minimax tunings that no small change of the generator improves', () => {
    fc.assert(
      fc.property(temperamentQuestion, nudge, (question, dGenerator) => {
        const found = searchTemperaments({ ...question, tunings: ['minimax'] });
        fc.pre(found.ok);
        if (!found.ok) return;
        const minimax = found.value.results[0];
        const targets = minimax.errors.map(({ interval }) => {
          const [n, d] = interval.split('/').map(Number);
          return minimax.primes.map((p) => {
            let e = 0;
            let [top, bottom] = [n, d];
            while (top % p === 0) [top, e] = [top / p, e + 1];
            while (bottom % p === 0) [bottom, e] = [bottom / p, e - 1];
            return e;
          });
        });
        const best = largestTargetError(minimax, minimax.generator, targets);
        expect(best).toBeCloseTo(
          Math.max(...minimax.errors.map((error) => Math.abs(error.cents))),
          9,
        );
        const moved = largestTargetError(minimax, minimax.generator + dGenerator, targets);
        expect(moved).toBeGreaterThanOrEqual(best - 1e-9);
      }),
      { numRuns: 60 },
    );
  });
});

/** A ratio of primes up to 17 (17 lies beyond every limit), written n/d, of up to 40 characters. */
const anyRatio = fc
  .tuple(
    fc.array(fc.integer({ min: -8, max: 8 }), { minLength: 6, maxLength: 6 }),
    fc.oneof(
      { weight: 5, arbitrary: fc.constant(0) },
      { weight: 1, arbitrary: fc.integer({ min: -2, max: 2 }) },
    ),
  )
  .map(([low, seventeen]) => [...low.map((e, i) => (i > 1 && Math.abs(e) > 3 ? 0 : e)), seventeen])
  .map((exponents) => {
    const primes = [2, 3, 5, 7, 11, 13, 17];
    let [n, d] = [1n, 1n];
    exponents.forEach((e, i) => {
      if (e > 0) n *= BigInt(primes[i]) ** BigInt(e);
      else d *= BigInt(primes[i]) ** BigInt(-e);
    });
    return `${n}/${d}`;
  })
  .filter((ratio) => ratio.length <= 40);

describe('the generator search on any question the schema lets through', () => {
  it('answers with finite numbers or with faults naming a field, and never throws', () => {
    fc.assert(
      fc.property(
        fc.option(fc.constantFrom(3, 5, 7, 11, 13), { nil: undefined }),
        fc.option(fc.array(anyRatio, { minLength: 1, maxLength: 4 }), { nil: undefined }),
        fc.option(fc.array(anyRatio, { maxLength: 5 }), { nil: undefined }),
        fc.option(fc.integer({ min: 2, max: 100 }), { nil: undefined }),
        (limit, targets, commas, count) => {
          const found = searchTemperaments({
            limit,
            targets,
            commas,
            count,
            tunings: ['TE', 'POTE', 'minimax'],
          });
          if (!found.ok) {
            for (const error of found.errors)
              expect(error.path).toMatch(/^(limit|targets|commas)(\[\d+\])?$/);
            return;
          }
          expect(firstNonFinite(found.value)).toBeNull();
          for (const result of found.value.results) {
            expect(result.generator).toBeGreaterThanOrEqual(0);
            expect(result.generator).toBeLessThanOrEqual(result.period / 2 + 1e-9);
          }
        },
      ),
      { numRuns: 300 },
    );
  });
});
