// Names along a chain of fifths: generators stacked up take sharps, those stacked down take flats (E-flat, not D#),
// so no two notes of one chain share a name, however long it runs.

/** The natural notes in the order of the chain of fifths. */
const fifthsOrder = ['F', 'C', 'G', 'D', 'A', 'E', 'B'];

/** Each pitch class's place on the line of fifths (C = 0), spelt with as few accidentals as the usual keys use. */
const linePlace = [0, -5, 2, -3, 4, -1, 6, 1, -4, 3, -2, 5];

/** The note `position` fifths above (+) or below (-) the tonic on pitch class `tonic` (0 = C): `E♭`, `G♯`, `F𝄪`. */
export function fifthChainName(position: number, tonic: number): string {
  const place = linePlace[((tonic % 12) + 12) % 12] + position;
  const index = place + 1;
  const letter = fifthsOrder[((index % 7) + 7) % 7];
  const accidentals = Math.floor(index / 7);
  if (accidentals === 0) return letter;
  if (accidentals > 0) return letter + (accidentals === 2 ? '𝄪' : '♯'.repeat(accidentals));
  return letter + '♭'.repeat(-accidentals);
}

/**
 * How many fifths one generator step is, when a generator in a period is a fifth or a fourth in an octave (within 30
 * cents): 1 for a fifth, -1 for a fourth (a fifth downwards), null for anything else, which fifth names do not fit.
 */
export function fifthsPerStep(reducedGeneratorCents: number, periodCents: number): 1 | -1 | null {
  const fifth = 701.955;
  if (Math.abs(periodCents - 1200) >= 1e-6) return null;
  if (Math.abs(reducedGeneratorCents - fifth) < 30) return 1;
  if (Math.abs(reducedGeneratorCents - (1200 - fifth)) < 30) return -1;
  return null;
}
