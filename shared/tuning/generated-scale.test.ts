import { describe, expect, it } from 'vitest';
import { ratioToString } from './interval';
import { builtScale, degreeRatios, scaleFaults, stack } from './scale.testing';

const fifths = (up: number, down = 0) => builtScale(stack('3/2', '2/1', up, down));

/** One fifth narrowed by a fraction of the syntonic comma. */
const temperedFifth = (fraction: string) =>
  builtScale({ ...stack('3/2', '2/1', 1, 0), temper: { comma: '81/80', fraction } });

describe('generated scales', () => {
  it('stacks 5 fifths up and 1 down into the seven exact degrees, sorted', () => {
    const scale = fifths(5, 1);
    // arithmetic (pure fifths stacked from C: D 9/8, E 81/64 ... B 243/128)
    expect(degreeRatios(scale)).toEqual(['1/1', '9/8', '81/64', '4/3', '3/2', '27/16', '243/128']);
    expect(scale.degrees.map((degree) => degree.stackPosition)).toEqual([0, 2, 4, -1, 1, 3, 5]);
    expect(scale.warnings).toEqual([]);
  });

  it('keeps a stack of 53 pure fifths exact', () => {
    const top = fifths(53).degrees.find((degree) => degree.stackPosition === 53);
    // arithmetic, 3^53 / 2^84
    expect(top?.ratio && ratioToString(top.ratio)).toBe(
      '19383245667680019896796723/19342813113834066795298816',
    );
    // arithmetic (3.615 cents)
    expect(top?.cents).toBeCloseTo(3.615, 3);
  });

  it('lands the twelfth pure fifth a Pythagorean comma above the tonic', () => {
    const twelfth = fifths(12).degrees.find((degree) => degree.stackPosition === 12);
    // standard acoustics texts (Pythagorean comma, 23.4600103846 cents)
    expect(twelfth?.ratio && ratioToString(twelfth.ratio)).toBe('531441/524288');
    expect(twelfth?.cents).toBeCloseTo(23.4600103846, 9);
  });

  it('narrows the fifth by a quarter of the syntonic comma', () => {
    const scale = temperedFifth('1/4');
    // standard acoustics texts (quarter-comma meantone fifth, 5^(1/4))
    expect(scale.generator?.cents).toBeCloseTo(696.5784284662, 9);
    expect(scale.degrees[1].cents).toBeCloseTo(696.5784284662, 9);
    expect(scale.degrees[1].ratio).toBeNull();
  });

  it('stays exact when a whole comma is taken out', () => {
    expect(degreeRatios(temperedFifth('1'))).toEqual(['1/1', '40/27']);
  });

  it('gives degrees in cents, with a warning, when exact ratios would grow too large', () => {
    const scale = builtScale(stack('65537/65536', '2/1', 255, 0));
    expect(scale.degrees.every((degree) => degree.ratio === null || degree.cents === 0)).toBe(true);
    expect(scale.degrees[1].cents).toBeCloseTo(1200 * Math.log2(65537 / 65536), 9);
    expect(scale.warnings).toEqual([
      {
        path: 'scale.generator',
        message:
          'scale.generator: stacked 256 times, 65537/65536 gives ratios too large to keep exact; ' +
          'the degrees are given in cents',
      },
    ]);
    const manyCommas = builtScale({
      ...stack('3/2', '2/1', 1, 0),
      temper: { comma: '531441/524288', fraction: '8' },
    });
    // 531441/524288 to the 8th has terms of 8 x 20 bits, within the budget: still exact.
    // (3/2) / (3^12/2^19)^8 = 2^151 / 3^95 (arithmetic).
    expect(manyCommas.generator?.ratio && ratioToString(manyCommas.generator.ratio)).toBe(
      `${2n ** 151n}/${3n ** 95n}`,
    );
  });

  it('refuses a comma fraction with huge terms or of more than 8 commas, naming the field', () => {
    const refused = (fraction: string) =>
      scaleFaults({ ...stack('3/2', '2/1', 11, 0), temper: { comma: '81/80', fraction } });
    expect(refused('9'.repeat(400))).toEqual([
      'scale.temper.fraction: 99999999999999999999... has a term past 9999: write a fraction such as 1/4 or 2/7',
    ]);
    expect(refused('1/99999')).toEqual([
      'scale.temper.fraction: 1/99999 has a term past 9999: write a fraction such as 1/4 or 2/7',
    ]);
    expect(refused('9')).toEqual(['scale.temper.fraction: 9 tempers by more than 8 commas']);
    expect(
      builtScale({ ...stack('3/2', '2/1', 11, 0), temper: { comma: '81/80', fraction: '8' } })
        .degrees,
    ).toHaveLength(12);
  });

  it('stacks inside a tritave period', () => {
    const scale = builtScale(stack('5/3', '3/1', 4, 0));
    expect(degreeRatios(scale)).toEqual(['1/1', '125/81', '5/3', '625/243', '25/9']);
  });

  it('stacks inside a period smaller than an octave', () => {
    const scale = builtScale(stack('9/8', '3/2', 4, 0));
    expect(degreeRatios(scale)).toEqual(['1/1', '2187/2048', '9/8', '81/64', '729/512']);
    for (const degree of scale.degrees) {
      expect(degree.cents).toBeGreaterThanOrEqual(0);
      expect(degree.cents).toBeLessThan(scale.period.cents);
    }
  });

  it('reduces a generator wider than the period', () => {
    const twelfths = builtScale(stack('3', '2', 2, 0));
    expect(degreeRatios(twelfths)).toEqual(['1/1', '9/8', '3/2']);
  });

  it('keeps degrees that coincide and warns about them', () => {
    const scale = builtScale(stack('7\\12', '2/1', 12, 0));
    expect(scale.degrees).toHaveLength(13);
    expect(scale.warnings).toEqual([
      { path: 'scale', message: 'scale: generator +12 coincides with the tonic at 0c' },
    ]);
  });

  it('names the field of every fault', () => {
    expect(scaleFaults(stack('1.5', '1/2', 300, 0))).toEqual([
      'scale.period: 1/2 is not above the tonic; a period must be wider than 1/1',
      'scale.generator: 1.5 needs a unit: write 1.5c for cents or a ratio such as 3/2',
      'scale.up: gives 301 degrees; a scale holds at most 256',
    ]);
    expect(scaleFaults(stack('4', '2/1', 3, 0))).toEqual([
      'scale.generator: 4 spans a whole number of periods, so every generator lands on the tonic',
    ]);
    expect(
      scaleFaults({ kind: 'generated', generator: '3/2', period: '2/1', up: -1, down: 0.5 }),
    ).toEqual([
      'scale.up: -1 is not a whole number of generators',
      'scale.down: 0.5 is not a whole number of generators',
    ]);
  });

  it('names the field of a bad temper', () => {
    const tempered = (comma: string, fraction: string) =>
      scaleFaults({
        kind: 'generated',
        generator: '3/2',
        period: '2/1',
        up: 3,
        down: 0,
        temper: { comma, fraction },
      });
    expect(tempered('81/80', 'a quarter')).toEqual([
      'scale.temper.fraction: "a quarter" is not a fraction: write one such as 1/4, -1/6 or 0.25',
    ]);
    expect(tempered('81/80', '0.1234567')).toEqual([
      'scale.temper.fraction: "0.1234567" is not a fraction: write one such as 1/4, -1/6 or 0.25',
    ]);
    expect(tempered('1/1', '1/4')).toEqual([
      'scale.temper.comma: 1/1 is a unison, so it tempers nothing',
    ]);
    expect(tempered('x', '1/0')).toEqual([
      expect.stringMatching(/^scale\.temper\.comma: "x" is not an interval/),
      'scale.temper.fraction: 1/0 has a zero denominator',
    ]);
  });
});
