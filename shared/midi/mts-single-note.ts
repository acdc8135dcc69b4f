import { fail, type Result, succeed } from '../result';
import {
  hzOfFrequencyWord,
  type KeyPitch,
  mtsClampWarning,
  writeFrequencyWord,
} from './frequency-word';
import { endOfExclusive, systemExclusive } from './midi-bytes';
import {
  type DecodedTuning,
  type EncodedMessages,
  framingFault,
  keyCount,
  messageFault,
  mtsForm,
  type TuningTarget,
  tuningSubId,
  universalNonRealTime,
  universalRealTime,
} from './mts-message';
import { unreachableKeysWarning } from './unreachable-keys';

/**
 * Single-note tuning changes: `F0 7F dev 08 02 tt ll (kk xx yy zz)xll F7` (real-time, 8 + 4ll
 * bytes) and the form with bank, `F0 7F|7E dev 08 07 bb tt ll (kk xx yy zz)xll F7` (9 + 4ll bytes).
 * Only mapped keys are sent.
 */

/** A message names at most 127 keys (ll is one data byte). */
const mostKeysPerMessage = 127;

/** Small enough for the receive buffer of modest hardware: 32 keys make a message of 137 bytes. */
const defaultKeysPerMessage = 32;

export interface SingleNoteOptions {
  /** Write with bank (08 07) instead of the bankless real-time form (08 02). */
  withBank: boolean;
  /**
   * 7F forms retune sounding notes at once; 7E forms from the next note on. Only 08 07 has a 7E
   * form.
   */
  realTime?: boolean;
  keysPerMessage?: number;
}

/**
 * Single-note changes for every key with a pitch, split into messages of `keysPerMessage` keys
 * (1-127). Keys outside what MTS can express are clamped and reported.
 */
export function encodeSingleNoteChanges(
  keys: readonly KeyPitch[],
  target: TuningTarget,
  options: SingleNoteOptions,
): EncodedMessages {
  const wanted = Math.floor(options.keysPerMessage ?? defaultKeysPerMessage);
  const perMessage = Math.min(mostKeysPerMessage, Math.max(1, wanted));
  const tuned = keys.filter((entry): entry is { key: number; hz: number } => entry.hz !== null);
  const universal =
    options.withBank && options.realTime === false ? universalNonRealTime : universalRealTime;
  const { deviceId, bank, program } = target;
  const header = options.withBank
    ? [systemExclusive, universal, deviceId, tuningSubId, mtsForm.bankedSingleNote, bank, program]
    : [systemExclusive, universal, deviceId, tuningSubId, mtsForm.singleNote, program];
  const messages: Uint8Array[] = [];
  const clamped: number[] = [];
  for (let first = 0; first < tuned.length; first += perMessage) {
    const batch = tuned.slice(first, first + perMessage);
    const message = new Uint8Array(header.length + 2 + 4 * batch.length);
    message.set(header);
    let offset = header.length;
    message[offset++] = batch.length;
    for (const { key, hz } of batch) {
      message[offset] = key;
      if (writeFrequencyWord(message, offset + 1, hz)) clamped.push(key);
      offset += 4;
    }
    message[offset] = endOfExclusive;
    messages.push(message);
  }
  return { messages, warnings: unreachableKeysWarning(clamped, mtsClampWarning) };
}

/**
 * Reads a single-note change (08 02) or one with bank (08 07), the universal header already
 * recognised. Keys the message does not name are null; a key named twice takes its last pitch, as a
 * receiver would.
 */
export function decodeSingleNoteChange(message: Uint8Array): Result<DecodedTuning> {
  const banked = message[4] === mtsForm.bankedSingleNote;
  const what = banked
    ? 'single-note tuning change with bank (08 07)'
    : 'single-note tuning change (08 02)';
  const countAt = banked ? 7 : 6;
  if (message.length <= countAt) {
    return fail([messageFault(`the ${what} is cut short before its key count`)]);
  }
  const count = message[countAt];
  const framing = framingFault(message, countAt + 2 + 4 * count, `${what} of ${count} keys`);
  if (framing) return fail([framing]);
  const keys: KeyPitch[] = Array.from({ length: keyCount }, (_, key) => ({ key, hz: null }));
  for (let change = 0, offset = countAt + 1; change < count; change++, offset += 4) {
    const [key, xx, yy, zz] = message.subarray(offset, offset + 4);
    keys[key].hz = hzOfFrequencyWord(xx, yy, zz);
  }
  return succeed({
    kind: banked ? 'banked-single-note' : 'single-note',
    deviceId: message[2],
    realTime: message[1] === universalRealTime,
    bank: banked ? message[5] : null,
    program: message[countAt - 1],
    name: null,
    channels: null,
    keys,
  });
}
