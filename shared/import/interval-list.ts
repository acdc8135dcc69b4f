// A scale from plain text: one interval a line, `#` starts a comment, and a line `period 3/1` sets the period
// (2/1 when there is none). The tonic is implied; a line for it or for the period is refused.
import type { PresetDocument } from '../preset/preset-document';
import { type FieldError, type Result, fail, fieldError, succeed } from '../result';
import { readInterval } from '../tuning/interval';

export function presetFromIntervalList(text: string, name: string): Result<PresetDocument> {
  const degrees: string[] = [];
  let period = '2/1';
  const faults: FieldError[] = [];
  text.split(/\r?\n/).forEach((raw, index) => {
    const line = raw.replace(/#.*/, '').trim();
    if (line === '') return;
    const where = `line ${index + 1}`;
    const periodLine = /^period\s*[:=]?\s*(.+)$/i.exec(line);
    const written = periodLine ? periodLine[1].trim() : line;
    const read = readInterval(written);
    if (typeof read === 'string') {
      faults.push(fieldError(where, read));
      return;
    }
    if (periodLine) period = written;
    else degrees.push(written);
  });
  if (faults.length > 0) return fail(faults);
  if (degrees.length === 0) return fail([fieldError('file', 'no intervals found: write one interval a line, such as 9/8 or 203.9c')]);
  return succeed({
    format: 'keyloom.preset',
    version: 1,
    name,
    notes: 'Imported from a list of intervals.',
    scale: { kind: 'list', degrees, period },
    mapping: { rootKey: 60 },
  });
}
