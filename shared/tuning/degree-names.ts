// What to call each degree of a scale, so that no name misleads: a chain of fifths is named along the chain (sharps
// above the tonic, flats below); an equal division other than 12 in the published ups-and-downs notation (Kite
// Giedraitis; from memory): the division's own chain of fifths, with ^ and v for one step up or down; or by step
// number where that notation has no names; anything else by its nearest twelve-tone note, told apart when two
// share one.
import { fifthChainName, fifthsPerStep } from './chain-names';
import { reduceIntoPeriod } from './interval-size';
import type { Scale } from './scale-spec';

const twelveNames = ['C', 'C♯', 'D', 'E♭', 'E', 'F', 'F♯', 'G', 'A♭', 'A', 'B♭', 'B'];

/** The names of a scale's degrees, degree 0 first, from a tonic on pitch class `tonic` (0 = C). No two alike. */
export function degreeNames(scale: Scale, tonic: number): string[] {
  const { degrees, period, generator } = scale;
  const octave = Math.abs(period.cents - 1200) < 1e-6;
  if (generator && degrees.every((degree) => degree.stackPosition !== null)) {
    // A chain of fourths is a chain of fifths downwards.
    const step = fifthsPerStep(reduceIntoPeriod(generator, period).reduced.cents, period.cents);
    if (step)
      return unique(degrees.map((degree) => fifthChainName(step * degree.stackPosition!, tonic)));
  }
  if (scale.kind === 'equal' && octave && degrees.length === 12) {
    return degrees.map((_, step) => twelveNames[(tonic + step) % 12]);
  }
  if (scale.kind === 'equal' && octave) {
    const named = upsAndDowns(degrees.length, tonic);
    if (named) return named;
    return degrees.map((_, step) => (step === 0 ? twelveNames[tonic % 12] : `step ${step}`));
  }
  return unique(
    degrees.map(
      (degree) =>
        twelveNames[(tonic + Math.round(degree.cents / 100)) % 12] ?? twelveNames[tonic % 12],
    ),
  );
}

/** Names that repeat are told apart by their degree number: `E (4)`, `E (5)`. */
function unique(names: string[]): string[] {
  const counts = new Map<string, number>();
  for (const name of names) counts.set(name, (counts.get(name) ?? 0) + 1);
  return names.map((name, degree) => (counts.get(name)! > 1 ? `${name} (${degree})` : name));
}

/**
 * Ups and downs for `n` equal divisions of the octave: each step is a note of the division's chain of fifths, raised
 * (^) or lowered (v) by single steps: a single sharp or flat before an up or down, an up or down before a double
 * sharp or flat. Null when
 * the division's sharp is not above a unison (its fifths do not make a usable chain), or names would repeat.
 */
function upsAndDowns(n: number, tonic: number): string[] | null {
  const fifth = Math.round(n * Math.log2(3 / 2));
  const sharp = 7 * fifth - 4 * n;
  if (sharp < 1 || n > 72) return null;
  const tonicPlace = [0, -5, 2, -3, 4, -1, 6, 1, -4, 3, -2, 5][tonic % 12];
  const best: { name: string; cost: number }[] = Array.from({ length: n }, () => ({
    name: '',
    cost: Infinity,
  }));
  for (let position = -14; position <= 14; position++) {
    const step = (((position * fifth) % n) + n) % n;
    const accidentals = Math.abs(Math.floor((tonicPlace + position + 1) / 7));
    for (let moves = -2; moves <= 2; moves++) {
      const target = (((step + moves) % n) + n) % n;
      // One sharp or flat is cheaper than an up; an up is cheaper than a double sharp or flat.
      const cost = Math.abs(moves) * 10 + (accidentals <= 1 ? accidentals : 100 * accidentals);
      if (cost < best[target].cost) {
        const marks = moves > 0 ? '^'.repeat(moves) : 'v'.repeat(-moves);
        best[target] = { name: marks + fifthChainName(position, tonic), cost };
      }
    }
  }
  const names = best.map((entry) => entry.name);
  return names.every((name) => name !== '') && new Set(names).size === n ? names : null;
}

const numberWords = ['unison', 'second', 'third', 'fourth', 'fifth', 'sixth', 'seventh'];

/**
 * The interval from one note of a chain of fifths to another, by the number of fifths between them (the line of
 * fifths): 1 a perfect fifth, 4 a major third, -11 a diminished sixth (common practice).
 */
export function chainIntervalName(fifths: number): string {
  // The note that many fifths above C names the interval above C: its letter gives the number, its sharps and flats
  // the quality against the major or perfect interval.
  const index = fifths + 1;
  const letterIndex = ((index % 7) + 7) % 7; // F C G D A E B
  const accidentals = Math.floor(index / 7);
  const number = [3, 0, 4, 1, 5, 2, 6][letterIndex];
  const perfect = number === 0 || number === 3 || number === 4;
  const quality = perfect
    ? accidentals === 0
      ? 'perfect'
      : accidentals > 0
        ? augmented(accidentals)
        : diminished(-accidentals)
    : accidentals === 0
      ? 'major'
      : accidentals === -1
        ? 'minor'
        : accidentals > 0
          ? augmented(accidentals)
          : diminished(-accidentals - 1);
  return `${quality} ${numberWords[number]}`;
}

function augmented(times: number): string {
  return times === 1 ? 'augmented' : times === 2 ? 'doubly augmented' : `${times}-times augmented`;
}

function diminished(times: number): string {
  return times === 1
    ? 'diminished'
    : times === 2
      ? 'doubly diminished'
      : `${times}-times diminished`;
}
