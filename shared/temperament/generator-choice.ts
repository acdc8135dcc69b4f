// The period and generator as a composer reads them: of the generators that make the same temperament (any
// generator plus or minus whole periods, or its inverse), the one from 0 up to half a period.

/** A temperament's mapping rows and their sizes in cents: the period row first, then the generator row. */
interface PeriodAndGenerator {
  mapping: [number[], number[]];
  period: number;
  generator: number;
}

/**
 * Rewrites a tuned mapping so that the generator lies from 0 up to half a period. With g' = s·g + m·p (s = ±1,
 * m whole), an interval of a periods and b generators is (a - s·m·b) periods and s·b generators of g'.
 */
export function withGeneratorWithinHalfPeriod(tuned: PeriodAndGenerator): PeriodAndGenerator {
  const { mapping, period, generator } = tuned;
  const below = Math.floor(generator / period);
  const remainder = generator - below * period;
  const [sign, periods] = remainder <= period / 2 ? [1, -below] : [-1, below + 1];
  return {
    mapping: [
      // (+ 0 turns a negative zero into zero)
      mapping[0].map((a, i) => a - sign * periods * mapping[1][i] + 0),
      mapping[1].map((b) => sign * b + 0),
    ],
    period,
    // Rounding can leave a hair below zero when the generator is a whole number of periods.
    generator: Math.max(0, sign * generator + periods * period),
  };
}
