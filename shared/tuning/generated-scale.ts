import Fraction from 'fraction.js';
import { type FieldError, fieldError, type Result, succeed, fail } from '../result';
import { intervalToString, parseInterval } from './interval';
import {
  type IntervalSize,
  exactSize,
  intervalBetween,
  reduceIntoPeriod,
  repeatInterval,
  sameSizeCents,
  sizeOf,
  temperedSize,
  unison,
} from './interval-size';
import type { Scale, ScaleSpec } from './scale-spec';
import {
  type UnsortedDegree,
  largestScale,
  parsePeriod,
  sortDegrees,
  tooManyDegrees,
} from './scale-degrees';

type GeneratedScaleSpec = Extract<ScaleSpec, { kind: 'generated' }>;

const fractionPattern = /^([+-]?)(\d+)(?:\s*\/\s*(\d+))?$/;
const decimalPattern = /^([+-]?)(\d*)\.(\d{1,6})$/;

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

/**
 * A fraction of a comma: `1/4`, `2/7`, `-1/6` (negative widens the generator), `0.25`, or `0` (pure).
 */
function parseCommaFraction(text: string, path: string): Result<Fraction> {
  const written = text.trim();
  const shown = written.length > 24 ? `${written.slice(0, 20)}...` : written;
  const match = fractionPattern.exec(written);
  const decimal = decimalPattern.exec(written);
  if (!match && !decimal) {
    return fail([
      fieldError(path, `"${shown}" is not a fraction: write one such as 1/4, -1/6 or 0.25`),
    ]);
  }
  let fraction: Fraction;
  if (match) {
    const denominator = BigInt(match[3] ?? '1');
    if (denominator === 0n) return fail([fieldError(path, `${written} has a zero denominator`)]);
    const numerator = BigInt(match[2]);
    if (numerator > largestFractionTerm || denominator > largestFractionTerm) {
      return fail([
        fieldError(
          path,
          `${shown} has a term past ${largestFractionTerm}: write a fraction such as 1/4 or 2/7`,
        ),
      ]);
    }
    fraction = new Fraction(numerator, denominator);
    if (match[1] === '-') fraction = fraction.neg();
  } else {
    const [, sign, whole, decimals] = decimal!;
    fraction = new Fraction(BigInt(`${whole || '0'}${decimals}`), 10n ** BigInt(decimals.length));
    if (sign === '-') fraction = fraction.neg();
  }
  if (fraction.abs().compare(mostCommas) > 0) {
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

type TemperLink = { comma: string; fraction: string };

/** One link tempered by a fraction of a comma, with faults at `path`. */
function temperedLink(pure: IntervalSize, temper: TemperLink, path: string): Result<IntervalSize> {
  const comma = parseInterval(temper.comma, `${path}.comma`);
  const fraction = parseCommaFraction(temper.fraction, `${path}.fraction`);
  if (!comma.ok || !fraction.ok)
    return fail([comma, fraction].flatMap((read) => (read.ok ? [] : read.errors)));
  const commaSize = sizeOf(comma.value);
  if (Math.abs(commaSize.cents) < sameSizeCents) {
    const fault = `${intervalToString(comma.value)} is a unison, so it tempers nothing`;
    return fail([fieldError(`${path}.comma`, fault)]);
  }
  return succeed(temperGenerator(pure, commaSize, fraction.value));
}

/**
 * The generator as stacked, and for a chain tempered link by link the size of each link from the
 * lowest note up. A link list must have one entry per link of the chain (`up + down`).
 */
function parseGenerator(
  spec: GeneratedScaleSpec,
): Result<{ pure: IntervalSize; stacked: IntervalSize; links: IntervalSize[] | null }> {
  const generator = parseInterval(spec.generator, 'scale.generator');
  if (!generator.ok) return generator;
  const pure = sizeOf(generator.value);
  const { temper } = spec;
  if (!temper) return succeed({ pure, stacked: pure, links: null });
  if (!Array.isArray(temper)) {
    const tempered = temperedLink(pure, temper, 'scale.temper');
    return tempered.ok ? succeed({ pure, stacked: tempered.value, links: null }) : tempered;
  }
  const linkCount = spec.up + spec.down;
  if (temper.length !== linkCount) {
    const fault = `has ${temper.length} links, but a chain of ${linkCount + 1} notes has ${linkCount}: one for each generator`;
    return fail([fieldError('scale.temper', fault)]);
  }
  const read = temper.map((link, index) =>
    link ? temperedLink(pure, link, `scale.temper[${index}]`) : succeed(pure),
  );
  const faults = read.flatMap((link) => (link.ok ? [] : link.errors));
  if (faults.length > 0) return fail(faults);
  // The chain is stacked from the pure generator; each link's deviation shows in the chain itself.
  return succeed({
    pure,
    stacked: pure,
    links: read.map((link) => (link as { ok: true; value: IntervalSize }).value),
  });
}

/** Two intervals one on top of the other: exact while both are. */
function plus(a: IntervalSize, b: IntervalSize): IntervalSize {
  return a.ratio && b.ratio ? exactSize(a.ratio.mul(b.ratio)) : temperedSize(a.cents + b.cents);
}

/**
 * Each stack position's size above the tonic, from `down` below to `up` above, for a chain of
 * links (the links from the lowest note up).
 */
function chainSizes(links: IntervalSize[], down: number, up: number): Map<number, IntervalSize> {
  const sizes = new Map<number, IntervalSize>([[0, unison]]);
  let above = unison;
  for (let position = 1; position <= up; position++) {
    above = plus(above, links[down + position - 1]);
    sizes.set(position, above);
  }
  let below = unison;
  for (let position = -1; position >= -down; position--) {
    below = intervalBetween(links[down + position], below);
    sizes.set(position, below);
  }
  return sizes;
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

  if (reduceIntoPeriod(generator.value.pure, period.value).reduced.cents === 0) {
    return fail([
      fieldError(
        'scale.generator',
        `${spec.generator} spans a whole number of periods, so every generator lands on the tonic`,
      ),
    ]);
  }
  const warnings: FieldError[] = [];
  let { stacked, links } = generator.value;
  const periodRatio = period.value.ratio;
  // Each step of the stack multiplies by the generator and divides by as many periods as the generator spans:
  // a small period (81/80) under a large generator (3/2) grows the terms much faster than the generator alone.
  const periodsPerStep = Math.ceil(Math.abs(stacked.cents) / period.value.cents) + 1;
  const widestBits = Math.max(
    ...(links ?? [stacked]).map((link) => (link.ratio ? termBits(link.ratio) : 0)),
  );
  if (
    widestBits > 0 &&
    periodRatio &&
    count * (widestBits + periodsPerStep * termBits(periodRatio)) > exactBitsBudget
  ) {
    stacked = temperedSize(stacked.cents);
    links = links && links.map((link) => temperedSize(link.cents));
    const fault = `stacked ${count} times, ${spec.generator} gives ratios too large to keep exact`;
    warnings.push(fieldError('scale.generator', `${fault}; the degrees are given in cents`));
  }
  const chain = links && chainSizes(links, spec.down, spec.up);
  const unsorted: UnsortedDegree[] = [];
  // 0 - down rather than -down: a stack with nothing below starts at 0, not -0
  for (let position = 0 - spec.down; position <= spec.up; position++) {
    unsorted.push({
      size: reduceIntoPeriod(
        chain ? chain.get(position)! : repeatInterval(stacked, position),
        period.value,
      ).reduced,
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
    chain: {
      pure: generator.value.pure,
      links: links ?? Array.from({ length: spec.up + spec.down }, () => stacked),
    },
    warnings: [...warnings, ...sorted.warnings],
  });
}
