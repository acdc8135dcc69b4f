import { renderExport } from '@shared/export/export-catalogue';
import { tuningOfPreset } from '@shared/export/preset-tuning';
import { encodeSingleNoteChanges } from '@shared/midi/mts-single-note';
import type { KeyPitch } from '@shared/midi/frequency-word';
import type { ResolvedPreset } from '@shared/preset/preset-document';
import { type Result, succeed } from '@shared/result';

/** The MTS message forms a tuning can be sent in, each the export whose bytes it sends. */
export const messageForms = [
  { id: 'mts-bulk', label: 'Bulk dump (all 128 keys)' },
  { id: 'mts-notes', label: 'Single-note real-time changes' },
  { id: 'mts-octave-1', label: 'Scale/octave, 1-byte' },
  { id: 'mts-octave-2', label: 'Scale/octave, 2-byte' },
  { id: 'mts-bulk-bank', label: 'Key-based dump with bank' },
] as const;

export type MessageFormId = (typeof messageForms)[number]['id'];

/** Where on the instrument the tuning goes. */
export interface SendTarget {
  deviceId: number;
  program: number;
  bank: number;
}

/** Bits per byte on a MIDI cable (start, eight data, stop) at 31,250 baud: 0.32 ms a byte. */
const cableMsPerByte = (10 / 31250) * 1000;

/** How long a 31,250-baud MIDI cable takes to carry a message of `length` bytes. */
export function cableMs(length: number): number {
  return length * cableMsPerByte;
}

/** A .syx file's whole F0…F7 messages, in order. */
export function splitSystemExclusive(bytes: Uint8Array): Uint8Array[] {
  const messages: Uint8Array[] = [];
  let start = -1;
  bytes.forEach((byte, index) => {
    if (byte === 0xf0) start = index;
    else if (byte === 0xf7 && start >= 0) {
      messages.push(bytes.slice(start, index + 1));
      start = -1;
    }
  });
  return messages;
}

/**
 * The messages that put `preset` into `target` in form `form`: exactly the bytes of the export that
 * form names, with the device id, program and bank given.
 */
export function tuningMessages(
  preset: ResolvedPreset,
  form: MessageFormId,
  target: SendTarget,
): Result<Uint8Array[]> {
  const aimed = { ...preset, output: { ...preset.output, ...target } };
  const rendered = renderExport(aimed, form);
  if (!rendered.ok) return rendered;
  return succeed(splitSystemExclusive(rendered.value.bytes));
}

/** Every key's pitch in `preset`, as the MTS encoders take them. */
export function keyPitches(preset: ResolvedPreset): KeyPitch[] | null {
  const tuning = tuningOfPreset(preset);
  return tuning.ok ? tuning.value.keys.map(({ key, hz }) => ({ key, hz })) : null;
}

/**
 * Real-time single-note changes (08 02) for the keys whose pitch differs between `before` and
 * `after`; keys that became unmapped are left as they sound.
 */
export function changedKeyMessages(
  before: readonly KeyPitch[],
  after: readonly KeyPitch[],
  target: SendTarget,
): Uint8Array[] {
  const changed = after.filter(
    (entry, index) => entry.hz !== null && entry.hz !== before[index]?.hz,
  );
  if (changed.length === 0) return [];
  return encodeSingleNoteChanges(changed, target, { withBank: false }).messages;
}
