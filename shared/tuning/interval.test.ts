import Fraction from 'fraction.js';
import { describe, expect, it } from 'vitest';
import { intervalCents, intervalToString, parseInterval, ratioCents } from './interval';

function parsed(text: string) {
  const result = parseInterval(text, 'scale.generator');
  if (!result.ok) throw new Error(result.errors[0].message);
  return result.value;
}

function faultOf(text: string, path = 'scale.generator'): string {
  const result = parseInterval(text, path);
  if (result.ok) throw new Error(`${text} was accepted`);
  expect(result.errors).toHaveLength(1);
  expect(result.errors[0].path).toBe(path);
  return result.errors[0].message;
}

describe('parseInterval', () => {
  it('reads a ratio exactly, reduced to lowest terms', () => {
    const interval = parsed('6/4');
    expect(interval.kind).toBe('ratio');
    expect(intervalToString(interval)).toBe('3/2');
  });

  it('reads a bare integer as n/1', () => {
    expect(intervalToString(parsed('5'))).toBe('5/1');
  });

  it('reads cents with c or ¢, signed', () => {
    expect(parsed('701.955c')).toEqual({ kind: 'cents', cents: 701.955 });
    expect(parsed('-13.7c')).toEqual({ kind: 'cents', cents: -13.7 });
    expect(parsed('386¢')).toEqual({ kind: 'cents', cents: 386 });
  });

  it('reads k\\n as k steps of n equal divisions of the octave', () => {
    expect(parsed('7\\12')).toEqual({ kind: 'cents', cents: 700 });
    expect(intervalCents(parsed('31\\53'))).toBeCloseTo((1200 * 31) / 53, 12);
  });

  it('ignores spaces around the parts', () => {
    expect(intervalToString(parsed(' 81 / 80 '))).toBe('81/80');
  });

  it('asks for a unit on a bare decimal', () => {
    expect(faultOf('1.5')).toBe(
      'scale.generator: 1.5 needs a unit: write 1.5c for cents or a ratio such as 3/2',
    );
  });

  it('refuses zero, negative and zero-denominator ratios, naming the field', () => {
    expect(faultOf('0/2', 'scale.degrees[3]')).toBe('scale.degrees[3]: 0/2 is not a ratio above 0');
    expect(faultOf('0')).toBe('scale.generator: 0 is not a ratio above 0');
    expect(faultOf('-3/2')).toBe('scale.generator: -3/2 is not a ratio above 0');
    expect(faultOf('3/0')).toBe('scale.generator: 3/0 has a zero denominator');
  });

  it('refuses empty text, junk, and equal steps of zero divisions', () => {
    expect(faultOf('  ')).toMatch(/^scale\.generator: is empty/);
    expect(faultOf('3:2')).toMatch(/^scale\.generator: "3:2" is not an interval/);
    expect(faultOf('fifth')).toMatch(/^scale\.generator: "fifth" is not an interval/);
    expect(faultOf('7\\0')).toMatch(/^scale\.generator: 7\\0 divides the octave into 0 steps/);
    expect(faultOf('1'.repeat(65))).toBe('scale.generator: is longer than 64 characters');
  });
});

describe('ratioCents', () => {
  it('measures the pure fifth', () => {
    // definition, 1200 log2(3/2)
    expect(ratioCents(new Fraction(3, 2))).toBeCloseTo(701.9550008654, 9);
  });

  it('measures the commas', () => {
    // standard acoustics texts
    expect(ratioCents(new Fraction(531441, 524288))).toBeCloseTo(23.4600103846, 9);
    // standard acoustics texts
    expect(ratioCents(new Fraction(81, 80))).toBeCloseTo(21.5062895967, 9);
    // standard acoustics texts
    expect(ratioCents(new Fraction(32805, 32768))).toBeCloseTo(1.9537207879, 9);
  });

  it('measures ratios whose terms pass what a double can hold', () => {
    const huge = new Fraction(3n ** 1000n, 2n ** 1500n);
    expect(ratioCents(huge)).toBeCloseTo(1200 * (1000 * Math.log2(3) - 1500), 6);
  });
});

describe('intervalToString', () => {
  it('writes cents back in a form parseInterval reads again', () => {
    const written = intervalToString({ kind: 'cents', cents: 696.578428466209 });
    expect(written).toBe('696.578428c');
    expect(intervalCents(parsed(written))).toBeCloseTo(696.578428, 9);
  });
});
