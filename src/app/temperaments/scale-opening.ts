import type { TemperamentResult } from '@shared/api/temperaments';
import { tuningNameFrom } from '@shared/midi/tuning-name';
import { centsToString } from '@shared/tuning/interval';
import { intervalBetween, sameSizeCents } from '@shared/tuning/interval-size';
import { buildScale } from '@shared/tuning/scale';
import { type StepPattern, stepPattern } from '@shared/tuning/step-pattern';
import { encodeDesign } from '../design/design-address';
import { type DraftDocument, newDraft } from '../design/draft-document';
import { nearestKeyLayout } from '../keys/nearest-key-layout';

/** A tempered result as a scale of one of its MOS sizes, ready to open in the designer. */
export interface ScaleOpening {
  /** Notes in an octave: the MOS size chosen, as the search lists them. */
  size: number;
  /** Notes in one period (fewer than `size` when the period divides the octave). */
  perPeriod: number;
  /** The generator and period as the design writes them, in the interval syntax. */
  generator: string;
  period: string;
  up: number;
  down: number;
  pattern: StepPattern;
  /** The design as the designer's address carries it: `/design?d=` this. */
  address: string;
}

/**
 * How a chain of `size` notes sits around the tonic: a third of its generators below and the rest above, as twelve
 * fifths run from E-flat to G-sharp around C and nineteen from G-flat to B-sharp (common practice). The counts are
 * taken along the larger of the generator and its complement in the period, so that a temperament gives the same
 * notes whichever way its generator is written.
 */
function chainAround(size: number, generatorCents: number, periodCents: number) {
  const below = Math.floor((size - 1) / 3);
  const above = size - 1 - below;
  return 2 * generatorCents >= periodCents
    ? { up: above, down: below }
    : { up: below, down: above };
}

/** The period as written: the octave as the exact 2/1 when the tuning keeps it pure, else the tempered cents. */
function periodText(periodCents: number): string {
  return Math.abs(periodCents - 1200) < sameSizeCents ? '2/1' : centsToString(periodCents);
}

/**
 * Opens `result` as a `generated` design of `size` notes an octave (`size` divided by the periods in the octave
 * are built in each period): the tempered generator (brought into the period)
 * and period in cents, the chain laid around the tonic, the step pattern it makes. A scale of fewer than 12 notes
 * in a pure octave goes on its nearest keys, as the designer lays out such scales. Says why in words when the
 * result makes no scale (a generator that lands on the tonic).
 */
export function scaleOpening(result: TemperamentResult, size: number): ScaleOpening | string {
  const periodCents = result.period;
  const generatorCents = ((result.generator % periodCents) + periodCents) % periodCents;
  if (generatorCents < sameSizeCents || periodCents - generatorCents < sameSizeCents) {
    return 'The generator of this tuning spans whole periods, so its chain makes no scale.';
  }
  const perPeriod = size / result.periodsPerOctave;
  if (!Number.isInteger(perPeriod)) {
    return `${size} notes do not share out evenly over ${result.periodsPerOctave} periods.`;
  }
  const generator = centsToString(generatorCents);
  const period = periodText(periodCents);
  const { up, down } = chainAround(perPeriod, generatorCents, periodCents);
  const built = buildScale({ kind: 'generated', generator, period, up, down });
  if (!built.ok) return built.errors[0].message;
  const { degrees } = built.value;
  const steps = degrees.map((degree, index) =>
    intervalBetween(degree, degrees[index + 1] ?? built.value.period),
  );
  const layout =
    period === '2/1' && size < 12
      ? nearestKeyLayout(
          degrees.map((degree) => degree.cents),
          periodCents,
        )
      : null;

  const blank = newDraft();
  const { layout: _, ...mapping } = blank.mapping;
  const tempering = result.commas.length ? ` tempering out ${result.commas.join(' and ')}` : '';
  const draft: DraftDocument = {
    ...blank,
    name: `${size} notes${tempering} (${result.tuning})`,
    scale: { kind: 'generated', generator, period, up, down },
    mapping: layout ? { ...mapping, layout } : mapping,
    output: {
      ...blank.output,
      tuningName: tuningNameFrom(`${size} ${result.tuning} ${result.commas.join(' ')}`),
    },
  };
  return {
    size,
    perPeriod,
    generator,
    period,
    up,
    down,
    pattern: stepPattern(steps),
    address: encodeDesign(draft),
  };
}
