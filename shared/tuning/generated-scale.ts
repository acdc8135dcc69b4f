import Fraction from 'fraction.js';
import { type FieldError, fieldError, type Result, succeed, fail } from '../result';
import { intervalToString, parseInterval } from './interval';
import {
  type IntervalSize,
  exactSize,
  reduceIntoPeriod,
  repeatInterval,
  sameSizeCents,
  sizeOf,
  temperedSize,
} from './interval-size';
import type { Scale, ScaleSpec } from './scale';
import {
  type UnsortedDegree,
  largestScale,
  parsePeriod,
  sortDegrees,
  tooManyDegrees,
} from './scale-degrees';

type GeneratedScaleSpec = Extract<ScaleSpec, { kind: 'generated' }>;

const fractionPattern = /^(\d+)(?:\s*\/\s*(\d+))?$/;

/** Terms of a comma fraction go up to 9999 (1/1200 is as fine as anyone tempers). */
const largestFractionTerm = 9999n;
/** Tempering by more than this many commas moves a generator out of all recognition. */
const mostCommas = 8;

/**
 * Exact arithmetic slows down as the terms of the ratios grow: a stack whose powers would pass
 * this many bits in numerator or denominator is computed in cents instead, and says so.
 */
const exactBitsBudget = 2048;

/** The bits of the larger term of a ratio (3/2: 2, 81/80: 7). */
function termBits(ratio: Fraction): number {
  return Math.max(ratio.n.toString(2).length, ratio.d.toString(2).length);
}

function parseCommaFraction(text: string, path: string): Result<Fraction> {
  const written = text.trim();
  const match = fractionPattern.exec(written);
  if (!match) {
    return fail([fieldError(path, `"${written}" is not a fraction: write one such as 1/4`)]);
  }
  const denominator = BigInt(match[2] ?? '1');
  if (denominator === 0n) return fail([fieldError(path, `${written} has a zero denominator`)]);
  const numerator = BigInt(match[1]);
  if (numerator === 0n) return fail([fieldError(path, `${written} is not a fraction above 0`)]);
  if (numerator > largestFractionTerm || denominator > largestFractionTerm) {
    const shown = written.length > 24 ? `${written.slice(0, 20)}...` : written;
    return fail([fieldError(path, `${shown} has a term past ${largestFractionTerm}: write a fraction such as 1/4 or 2/7`)]);
  }
  const fraction = new Fraction(numerator, denominator);
  if (fraction.compare(mostCommas) > 0) {
    return fail([fieldError(path, `${written} tempers by more than ${mostCommas} commas`)]);
  }
  return succeed(fraction);
}

/**
 * Narrows the generator by `fraction` of `comma`. The result stays exact when the comma is a ratio
 * and the fraction a whole number (3/2 narrowed by all of 81/80 is 40/27); otherwise it is
 * tempered, in cents.
 */
function temperGenerator(
  generator: IntervalSize,
  comma: IntervalSize,
  fraction: Fraction,
): IntervalSize {
  const exactBits = comma.ratio ? Number(fraction.n) * termBits(comma.ratio) : Infinity;
  if (generator.ratio && comma.ratio && fraction.d === 1n && exactBits <= exactBitsBudget) {
    return exactSize(generator.ratio.div(comma.ratio.pow(fraction)));
  }
  return temperedSize(generator.cents - fraction.valueOf() * comma.cents);
}

function parseGenerator(spec: GeneratedScaleSpec): Result<IntervalSize> {
  const generator = parseInterval(spec.generator, 'scale.generator');
  if (!spec.temper) return generator.ok ? succeed(sizeOf(generator.value)) : generator;
  const comma = parseInterval(spec.temper.comma, 'scale.temper.comma');
  const fraction = parseCommaFraction(spec.temper.fraction, 'scale.temper.fraction');
  const errors = [generator, comma, fraction].flatMap((read) => (read.ok ? [] : read.errors));
  if (!generator.ok || !comma.ok || !fraction.ok) return fail(errors);
  const commaSize = sizeOf(comma.value);
  if (Math.abs(commaSize.cents) < sameSizeCents) {
    const fault = `${intervalToString(comma.value)} is a unison, so it tempers nothing`;
    return fail([fieldError('scale.temper.comma', fault)]);
  }
  return succeed(temperGenerator(sizeOf(generator.value), commaSize, fraction.value));
}

function stackLabel(position: number): string {
  if (position === 0) return 'the tonic';
  return `generator ${position > 0 ? '+' : ''}${position}`;
}

/**
 * Stacks `up` generators above the tonic and `down` below it, each reduced into the period. Exact
 * generators and periods give exact degrees however high the stack goes (53 pure fifths reduce to
 * 3^53/2^84).
 */
export function buildGeneratedScale(spec: GeneratedScaleSpec): Result<Scale> {
  const errors: FieldError[] = [];
  const period = parsePeriod(spec.period, 'scale.period');
  const generator = parseGenerator(spec);
  if (!period.ok) errors.push(...period.errors);
  if (!generator.ok) errors.push(...generator.errors);
  for (const field of ['up', 'down'] as const) {
    if (!Number.isInteger(spec[field]) || spec[field] < 0) {
      const fault = `${spec[field]} is not a whole number of generators`;
      errors.push(fieldError(`scale.${field}`, fault));
    }
  }
  const count = spec.up + spec.down + 1;
  if (count > largestScale) errors.push(tooManyDegrees('scale.up', count));
  if (!period.ok || !generator.ok || errors.length > 0) return fail(errors);

  if (reduceIntoPeriod(generator.value, period.value).reduced.cents === 0) {
    return fail([
      fieldError(
        'scale.generator',
        `${spec.generator} spans a whole number of periods, so every generator lands on the tonic`,
      ),
    ]);
  }
  const warnings: FieldError[] = [];
  let stacked = generator.value;
  const { ratio } = stacked;
  const periodRatio = period.value.ratio;
  // Each step of the stack multiplies by the generator and divides by as many periods as the generator spans:
  // a small period (81/80) under a large generator (3/2) grows the terms much faster than the generator alone.
  const periodsPerStep = Math.ceil(Math.abs(stacked.cents) / period.value.cents) + 1;
  if (ratio && periodRatio && count * (termBits(ratio) + periodsPerStep * termBits(periodRatio)) > exactBitsBudget) {
    stacked = temperedSize(stacked.cents);
    const fault = `stacked ${count} times, ${spec.generator} gives ratios too large to keep exact`;
    warnings.push(fieldError('scale.generator', `${fault}; the degrees are given in cents`));
  }
  const unsorted: UnsortedDegree[] = [];
  // 0 - down rather than -down: a stack with nothing below starts at 0, not -0
  for (let position = 0 - spec.down; position <= spec.up; position++) {
    unsorted.push({
      size: reduceIntoPeriod(repeatInterval(stacked, position), period.value).reduced,
      stackPosition: position,
      path: 'scale',
      written: stackLabel(position),
      label: stackLabel(position),
    });
  }
  const sorted = sortDegrees(unsorted);
  return succeed({
    kind: 'generated',
    degrees: sorted.degrees,
    period: period.value,
    generator: stacked,
    warnings: [...warnings, ...sorted.warnings],
  });
}
