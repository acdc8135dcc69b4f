// A scale from plain text: intervals one a line or several to a line (separated by commas or spaces), `#` starts a
// comment, and a line `period 3/1` sets the period (2/1 when there is none). The tonic is implied: a leading 1/1 is
// dropped, and a closing entry equal to the period is taken as the period, both said in the preset's notes.
import type { PresetDocument } from '../preset/preset-document';
import { type FieldError, type Result, fail, fieldError, succeed } from '../result';
import { entriesOf, withoutTonicAndPeriod } from '../tuning/degree-list';
import { readInterval } from '../tuning/interval';
import { largestScale } from '../tuning/scale-degrees';

/** A list longer than this (comments and blank lines included) is not a scale anyone wrote by hand. */
const mostLines = 2000;
/** Reading stops once this many lines are at fault: the answer lists the first of them, not every one. */
const mostFaults = 20;

/** The lines of `text`, one at a time, so that reading can stop early without splitting the whole text. */
function* linesOf(text: string): Generator<string> {
  let start = 0;
  while (start <= text.length) {
    const end = text.indexOf('\n', start);
    const stop = end === -1 ? text.length : end;
    yield text.slice(start, stop).replace(/\r$/, '');
    if (end === -1) return;
    start = end + 1;
  }
}

/**
 * Reads the list line by line and stops at the first limit it passes: more degrees than a scale holds, more
 * lines than a hand-written list has, or `mostFaults` lines it cannot read.
 */
export function presetFromIntervalList(text: string, name: string): Result<PresetDocument> {
  const degrees: string[] = [];
  let period = '2/1';
  const faults: FieldError[] = [];
  let number = 0;
  for (const raw of linesOf(text)) {
    number += 1;
    const where = `line ${number}`;
    if (number > mostLines)
      return fail([fieldError(where, `the list is longer than ${mostLines} lines`)]);
    const line = raw.replace(/#.*/, '').trim();
    if (line === '') continue;
    const periodLine = /^period\s*[:=]?\s*(.+)$/i.exec(line);
    for (const written of periodLine ? [periodLine[1].trim()] : entriesOf(line)) {
      const read = readInterval(written);
      if (typeof read === 'string') {
        faults.push(fieldError(where, read));
        if (faults.length === mostFaults) return fail(faults);
        continue;
      }
      if (periodLine) {
        period = written;
      } else if (degrees.length === largestScale) {
        // One more than a scale holds above its tonic: room for a leading 1/1 that is dropped below.
        return fail([
          fieldError(
            where,
            `more than ${largestScale - 1} degrees: a scale holds at most ${largestScale} with its tonic`,
          ),
        ]);
      } else {
        degrees.push(written);
      }
    }
  }
  if (faults.length > 0) return fail(faults);
  const reading = withoutTonicAndPeriod(degrees, period);
  if (reading.degrees.length === 0) {
    return fail([
      fieldError('file', 'no intervals found: write one interval a line, such as 9/8 or 203.9c'),
    ]);
  }
  return succeed({
    format: 'keyloom.preset',
    version: 1,
    name,
    notes: ['Imported from a list of intervals.', ...reading.notices].join(' '),
    scale: { kind: 'list', degrees: reading.degrees, period },
    mapping: { rootKey: 60 },
  });
}
