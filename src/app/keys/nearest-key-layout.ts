/** An equal-tempered semitone, the width of one key. */
const semitoneCents = 100;

/**
 * A layout that puts each degree on the key of its nearest equal-tempered semitone above the root,
 * one block spanning the period in semitones (12 keys for an octave): five fifths up and one down
 * land on the white keys. Null when two degrees would share a key or the period is under a semitone.
 */
export function nearestKeyLayout(
  degreeCents: number[],
  periodCents: number,
): (number | null)[] | null {
  const keys = Math.round(periodCents / semitoneCents);
  if (keys < 1 || keys > 128 || degreeCents.length > keys) return null;
  const layout: (number | null)[] = new Array(keys).fill(null);
  for (const [degree, cents] of degreeCents.entries()) {
    const key = Math.round(cents / semitoneCents);
    if (key >= keys || layout[key] !== null) return null;
    layout[key] = degree;
  }
  return layout;
}
