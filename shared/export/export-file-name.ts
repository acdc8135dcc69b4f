const longestStem = 60;
const fallbackStem = 'keyloom-tuning';

/**
 * A file name made from a preset name, safe on every system and in a download header: accents
 * dropped, lower case, every run of other characters one hyphen, at most 60 characters ("Fen
 * Fifths!" becomes "fen-fifths"), then the suffix and extension (".syx", "-mpe.mid").
 */
export function exportFileName(presetName: string, ending: string): string {
  const stem = presetName
    .normalize('NFD')
    .replace(/[\u0300-\u036f]/g, '')
    .toLowerCase()
    .replace(/[^a-z0-9]+/g, '-')
    .slice(0, longestStem)
    .replace(/^-+|-+$/g, '');
  return `${stem || fallbackStem}${ending}`;
}
