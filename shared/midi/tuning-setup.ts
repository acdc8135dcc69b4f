import type { FieldError } from '../result';
import type { KeyPitch } from './frequency-word';
import { encodeBankedBulkDump, encodeBulkDump } from './mts-bulk-dump';
import type { TuningTarget } from './mts-message';
import { encodeSingleNoteChanges } from './mts-single-note';

/** The MTS settings of a preset's output: where its tuning goes and under what name. */
export type MtsOutput = TuningTarget & { tuningName: string };

/**
 * What a MIDI file sends at its start to tune a receiver: the tuning as a bulk dump and again as
 * real-time single-note changes for every mapped key, because receivers differ in which of the two
 * they apply. Bank 0 uses the bankless forms (08 01, 08 02) that most receivers know; another bank
 * the forms with bank (08 04, 08 07).
 */
export function tuningSysex(
  keys: readonly KeyPitch[],
  output: MtsOutput,
): { messages: Uint8Array[]; warnings: FieldError[] } {
  const withBank = output.bank !== 0;
  const dump = withBank ? encodeBankedBulkDump(keys, output) : encodeBulkDump(keys, output);
  const changes = encodeSingleNoteChanges(keys, output, { withBank });
  return { messages: [...dump.messages, ...changes.messages], warnings: dump.warnings };
}
