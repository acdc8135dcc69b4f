import type { KeyTable } from '../tuning/key-table';
import { noteName } from '../tuning/twelve-edo';

/**
 * Every one of the 128 keys as CSV: the key, its twelve-tone note name, the degree it plays, its pitch in Hz and in
 * cents from its own equal-tempered pitch, and whether it is mapped. Unmapped keys leave degree, Hz and cents empty.
 * Hz are written to 6 decimals and cents to 4: finer than any receiver resolves (MTS: 0.006 cents).
 */
export function keyTableCsv(keys: KeyTable): string {
  const lines = ['key,note,degree,hz,cents_from_12tet,mapped'];
  for (const entry of keys) {
    const mapped = entry.degree !== null && entry.hz !== null && entry.centsFrom12 !== null;
    lines.push(
      [
        entry.key,
        noteName(entry.key),
        mapped ? entry.degree : '',
        mapped ? entry.hz!.toFixed(6) : '',
        mapped ? entry.centsFrom12!.toFixed(4) : '',
        mapped ? 'yes' : 'no',
      ].join(','),
    );
  }
  return `${lines.join('\r\n')}\r\n`;
}
