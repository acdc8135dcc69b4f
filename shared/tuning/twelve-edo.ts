/** The MIDI key of A4, which sounds at the concert pitch. */
const keyOfA4 = 69;

const noteNames = ['C', 'C#', 'D', 'D#', 'E', 'F', 'F#', 'G', 'G#', 'A', 'A#', 'B'];

/** The twelve-tone equal-tempered pitch of a MIDI key with A4 (key 69) at `concertA`. */
export function equalTemperedHz(key: number, concertA: number): number {
  return concertA * 2 ** ((key - keyOfA4) / 12);
}

/** How many cents a frequency lies above (+) or below (-) the equal-tempered pitch of a key. */
export function centsFromEqualTempered(hz: number, key: number, concertA: number): number {
  return 1200 * Math.log2(hz / concertA) - 100 * (key - keyOfA4);
}

/** Names a MIDI key as a note with its octave, middle C (key 60) being C4. */
export function noteName(key: number): string {
  const pitchClass = ((key % 12) + 12) % 12;
  return `${noteNames[pitchClass]}${Math.floor(key / 12) - 1}`;
}

/** The equal-tempered note nearest a frequency, and how many cents the frequency lies above it. */
export function nearestEqualTemperedNote(
  hz: number,
  concertA: number,
): { key: number; name: string; offsetCents: number } {
  const key = Math.round(keyOfA4 + 12 * Math.log2(hz / concertA));
  return { key, name: noteName(key), offsetCents: centsFromEqualTempered(hz, key, concertA) };
}
