import Fraction from 'fraction.js';
import { describe, expect, it } from 'vitest';
import { type Comma, rankTwoMapping } from './mapping';
import { factorRatio, monzoOver } from './monzo';

function commas(primes: number[], ...ratios: string[]): Comma[] {
  return ratios.map((ratio, i) => ({
    ratio,
    monzo: monzoOver(factorRatio(new Fraction(ratio)).exponents, primes),
    path: `commas[${i}]`,
  }));
}

function mappingOf(primes: number[], ...ratios: string[]) {
  const made = rankTwoMapping(commas(primes, ...ratios), primes);
  if (!made.ok) throw new Error(made.errors[0].message);
  return made.value;
}

function faultOf(primes: number[], ...ratios: string[]) {
  const made = rankTwoMapping(commas(primes, ...ratios), primes);
  if (made.ok) throw new Error('expected a fault');
  return made.errors[0];
}

describe('rank-2 mappings from commas', () => {
  it('gives meantone for 81/80 in the 5-limit', () => {
    // from memory (published temperament tables): meantone [<1 0 -4], <0 1 4]]: the twelfth as generator,
    // 5 = four twelfths less four octaves
    const meantone = mappingOf([2, 3, 5], '81/80');
    expect(meantone.hermite).toEqual([
      [1, 0, -4],
      [0, 1, 4],
    ]);
    expect(meantone.periodsPerOctave).toBe(1);
  });

  it('gives a half-octave period for 2048/2025', () => {
    // from memory (published temperament tables): diaschismic [<2 0 11], <0 1 -2]], two periods an octave
    const diaschismic = mappingOf([2, 3, 5], '2048/2025');
    expect(diaschismic.hermite).toEqual([
      [2, 0, 11],
      [0, 1, -2],
    ]);
    expect(diaschismic.periodsPerOctave).toBe(2);
  });

  it('gives porcupine for 250/243 in the 5-limit', () => {
    // from memory (published temperament tables): porcupine [<1 2 3], <0 3 5]]
    expect(mappingOf([2, 3, 5], '250/243').hermite).toEqual([
      [1, 2, 3],
      [0, 3, 5],
    ]);
  });

  it('gives septimal meantone for 81/80 with 225/224 in the 7-limit', () => {
    // from memory (published temperament tables): septimal meantone [<1 0 -4 -13], <0 1 4 10]]
    expect(mappingOf([2, 3, 5, 7], '81/80', '225/224').hermite).toEqual([
      [1, 0, -4, -13],
      [0, 1, 4, 10],
    ]);
  });

  it('maps every comma to zero periods and zero generators', () => {
    const primes = [2, 3, 5, 7, 11, 13];
    const ratios = ['81/80', '126/125', '99/98', '144/143'];
    const { hermite } = mappingOf(primes, ...ratios);
    for (const comma of commas(primes, ...ratios))
      for (const row of hermite)
        expect(row.reduce((sum, e, i) => sum + e * comma.monzo[i], 0)).toBe(0);
  });

  it('refuses a comma that follows from those before it, naming it', () => {
    // arithmetic: 6561/6400 = (81/80)^2
    const fault = faultOf([2, 3, 5, 7], '81/80', '6561/6400');
    expect(fault.path).toBe('commas[1]');
    expect(fault.message).toMatch(/follows from 81\/80/);
    // arithmetic: 225/224 * 81/80 = 18225/17920
    expect(faultOf([2, 3, 5, 7], '81/80', '225/224', '18225/17920').path).toBe('commas[2]');
  });

  it('refuses a rank other than two, saying how many commas rank 2 takes', () => {
    const rankThree = faultOf([2, 3, 5, 7], '81/80');
    expect(rankThree.path).toBe('commas');
    expect(rankThree.message).toMatch(/rank-3 temperament of 2\.3\.5\.7.*2 independent commas/);
    const rankOne = faultOf([2, 3, 5], '81/80', '128/125');
    expect(rankOne.path).toBe('commas');
    expect(rankOne.message).toMatch(/rank-1 temperament \(an equal division\)/);
  });

  it('refuses a unison and the power of a single prime', () => {
    expect(faultOf([2, 3, 5], '1/1')).toMatchObject({ path: 'commas[0]' });
    const power = faultOf([2, 3, 5], '81/80', '9/1');
    // arithmetic: tempering out 9/1 makes 3 twice a unison
    expect(power.path).toBe('commas[1]');
    expect(power.message).toMatch(/power of 3 alone/);
  });

  it('refuses commas that together make a prime a unison', () => {
    // arithmetic: tempering out 3/2 and 4/3 tempers out their product 2/1, and so 3/1 as well
    const fault = faultOf([2, 3, 5, 7], '3/2', '4/3');
    expect(fault.path).toBe('commas');
    expect(fault.message).toMatch(/2\/1 and 3\/1 a unison/);
  });
});
