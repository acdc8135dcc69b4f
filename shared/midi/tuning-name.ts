/** MTS carries a tuning name of 16 characters of 7-bit ASCII. */
export const longestTuningName = 16;

/** Printable 7-bit ASCII, the characters a tuning name may hold. */
export const tuningNamePattern = /^[\x20-\x7e]*$/;

const fallbackName = 'Keyloom';

/**
 * A tuning name made from a preset name: accents dropped (é becomes e), other characters MTS
 * cannot carry left out, spaces collapsed, cut to 16 characters; if nothing is left, "Keyloom".
 */
export function tuningNameFrom(presetName: string): string {
  const ascii = presetName
    .normalize('NFD')
    .replace(/[\u0300-\u036f]/g, '')
    .replace(/[^\x20-\x7e]/g, '')
    .replace(/\s+/g, ' ')
    .trim();
  return ascii.slice(0, longestTuningName).trimEnd() || fallbackName;
}
