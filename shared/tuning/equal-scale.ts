import Fraction from 'fraction.js';
import { fieldError, type Result, succeed, fail } from '../result';
import { exactSize, temperedSize } from './interval-size';
import type { Scale, ScaleSpec } from './scale-spec';
import { type ScaleDegree, largestScale, parsePeriod } from './scale-degrees';

type EqualScaleSpec = Extract<ScaleSpec, { kind: 'equal' }>;

function integerRoot(value: bigint, exponent: number): bigint | null {
  const estimate = BigInt(Math.round(Math.exp(Math.log(Number(value)) / exponent)));
  for (const candidate of [estimate - 1n, estimate, estimate + 1n]) {
    if (candidate > 0n && candidate ** BigInt(exponent) === value) return candidate;
  }
  return null;
}

/** A ratio as base^exponent with the largest whole exponent: 9/4 = (3/2)^2, 2/1 = (2/1)^1. */
function asPower(ratio: Fraction): { base: Fraction; exponent: number } {
  const bits = Math.max(ratio.n.toString(2).length, ratio.d.toString(2).length);
  for (let exponent = bits - 1; exponent >= 2; exponent--) {
    const n = integerRoot(ratio.n, exponent);
    const d = n === null ? null : integerRoot(ratio.d, exponent);
    if (n !== null && d !== null) return { base: new Fraction(n, d), exponent };
  }
  return { base: ratio, exponent: 1 };
}

/**
 * Divides the period into `divisions` equal steps. A step is exact only where the period is a power
 * that divides evenly (4/1 in 2 steps gives 2/1); elsewhere it is tempered.
 */
export function buildEqualScale(spec: EqualScaleSpec): Result<Scale> {
  const period = parsePeriod(spec.period, 'scale.period');
  const { divisions } = spec;
  const errors = period.ok ? [] : [...period.errors];
  if (!Number.isInteger(divisions) || divisions < 1 || divisions > largestScale) {
    errors.push(
      fieldError('scale.divisions', `${divisions} is not a whole number from 1 to ${largestScale}`),
    );
  }
  if (!period.ok || errors.length > 0) return fail(errors);

  const power = period.value.ratio ? asPower(period.value.ratio) : null;
  const degrees: ScaleDegree[] = [];
  for (let step = 0; step < divisions; step++) {
    const exactPower = power ? (power.exponent * step) / divisions : NaN;
    const size =
      power && Number.isInteger(exactPower)
        ? exactSize(power.base.pow(exactPower))
        : temperedSize((period.value.cents * step) / divisions);
    degrees.push({ cents: size.cents, ratio: size.ratio, stackPosition: null });
  }
  return succeed({ kind: 'equal', degrees, period: period.value, generator: null, warnings: [] });
}
