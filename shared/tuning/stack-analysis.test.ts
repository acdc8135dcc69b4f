import { describe, expect, it } from 'vitest';
import { ratioToString } from './interval';
import type { ScaleSpec } from './scale-spec';
import { builtScale, stack } from './scale.testing';
import { analyzeStack } from './stack-analysis';

function stackOf(spec: ScaleSpec) {
  const found = analyzeStack(builtScale(spec));
  if (!found) throw new Error('no stack analysis');
  return found;
}

const quarterComma = { comma: '81/80', fraction: '1/4' };

describe('analyzeStack', () => {
  it('finds the Pythagorean comma and the wolf of twelve pure fifths', () => {
    const scale = builtScale(stack('3/2', '2/1', 8, 3));
    const found = analyzeStack(scale);
    // standard acoustics texts (Pythagorean comma, 23.4600103846 cents)
    expect(found?.comma.ratio && ratioToString(found.comma.ratio)).toBe('531441/524288');
    expect(found?.comma.cents).toBeCloseTo(23.4600103846, 9);
    const wolf = found?.wolf;
    // arithmetic (the wolf is a pure fifth less the comma: 262144/177147)
    expect(wolf?.size.ratio && ratioToString(wolf.size.ratio)).toBe('262144/177147');
    expect(wolf?.size.cents).toBeCloseTo(701.9550008654 - 23.4600103846, 9);
    expect(wolf?.deviationCents).toBeCloseTo(-23.4600103846, 9);
    expect(scale.degrees[wolf!.from].stackPosition).toBe(8);
    expect(scale.degrees[wolf!.to].stackPosition).toBe(-3);
  });

  it('keeps the comma of 53 pure fifths exact', () => {
    const found = stackOf(stack('3/2', '2/1', 52, 0));
    // arithmetic, 3^53 / 2^84 (3.615 cents)
    expect(found.comma.ratio && ratioToString(found.comma.ratio)).toBe(
      '19383245667680019896796723/19342813113834066795298816',
    );
    expect(found.comma.cents).toBeCloseTo(3.615, 3);
  });

  it('reports a stack that falls short as a comma below unison', () => {
    const found = stackOf(stack('3/2', '2/1', 4, 0));
    // arithmetic (five fifths reach 243/128, a 256/243 short of the octave)
    expect(found.comma.ratio && ratioToString(found.comma.ratio)).toBe('243/256');
    expect(found.comma.cents).toBeLessThan(0);
  });

  it('finds the diesis and the wide wolf of quarter-comma meantone', () => {
    const found = stackOf({
      kind: 'generated',
      generator: '3/2',
      period: '2/1',
      up: 11,
      down: 0,
      temper: quarterComma,
    });
    // standard acoustics texts (quarter-comma meantone fifth, 696.5784284662 cents)
    const fifth = 696.5784284662;
    // arithmetic (twelve quarter-comma fifths are 5^3, seven octaves up: 125/128)
    expect(found.comma.cents).toBeCloseTo(1200 * Math.log2(125 / 128), 8);
    expect(found.comma.ratio).toBeNull();
    expect(found.wolf?.size.cents).toBeCloseTo(7 * 1200 - 11 * fifth, 8);
  });

  it('lists the sizes at which the generator gives a MOS', () => {
    const pure = stackOf(stack('3/2', '2/1', 6, 0));
    // from memory: denominators of the convergents and semiconvergents of log2(3/2) up to 60
    expect(pure.mosSizes).toEqual([2, 3, 5, 7, 12, 17, 29, 41, 53]);
    const meantone = stackOf({
      kind: 'generated',
      generator: '3/2',
      period: '2/1',
      up: 6,
      down: 0,
      temper: quarterComma,
    });
    // from memory: the MOS sizes of quarter-comma meantone up to 60
    expect(meantone.mosSizes).toEqual([2, 3, 5, 7, 12, 19, 31, 50]);
  });

  it('finds no wolf when the circle closes', () => {
    const found = stackOf(stack('7\\12', '2/1', 11, 0));
    expect(found.comma.cents).toBe(0);
    expect(found.wolf).toBeNull();
    // 8 to 10 fifths of 12 equal bunch their two step sizes; 11 leave one large step, ten small
    expect(found.mosSizes).toEqual([2, 3, 5, 7, 11]);
  });

  it('has nothing to say about scales that are not stacks', () => {
    expect(analyzeStack(builtScale({ kind: 'equal', divisions: 12, period: '2/1' }))).toBeNull();
  });
});
