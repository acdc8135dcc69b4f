import { fail, type FieldError, type Result, succeed } from '../result';
import type { KeyPitch } from './frequency-word';
import { decodeBulkDump } from './mts-bulk-dump';
import { decodeDumpRequest } from './mts-dump-request';
import { endOfExclusive, systemExclusive } from './midi-bytes';
import {
  type DecodedMtsMessage,
  hex,
  keyCount,
  messageFault,
  mtsForm,
  tuningSubId,
  universalNonRealTime,
  universalRealTime,
} from './mts-message';
import { decodeScaleOctave } from './mts-scale-octave';
import { decodeSingleNoteChange } from './mts-single-note';

/**
 * Reads MTS messages: one message, or a stream of them as a .syx file holds, into a 128-key table.
 * Foreign, truncated and corrupt bytes give an error that says what was found; nothing is thrown.
 */

/** Decodes one whole system exclusive message, F0 to F7, of any MTS form. */
export function decodeMtsMessage(message: Uint8Array): Result<DecodedMtsMessage> {
  if (message.length === 0) return fail([messageFault('there are no bytes to read')]);
  if (message[0] !== systemExclusive) {
    const first = hex(message[0]);
    return fail([messageFault(`a system exclusive message starts with F0, not ${first}`)]);
  }
  if (message.length < 6) {
    const fault = `the message is cut short: ${message.length} bytes are too few for any MTS form`;
    return fail([messageFault(fault)]);
  }
  const universal = message[1];
  if (universal !== universalNonRealTime && universal !== universalRealTime) {
    return fail([
      messageFault(
        `the message belongs to manufacturer ${hex(universal)}, not to the MIDI Tuning Standard ` +
          '(universal system exclusive 7E or 7F)',
      ),
    ]);
  }
  if (message[3] !== tuningSubId) {
    return fail([
      messageFault(
        `the universal message has sub-ID ${hex(message[3])}; ` +
          'MIDI Tuning Standard messages have sub-ID 08',
      ),
    ]);
  }
  switch (message[4]) {
    case mtsForm.dumpRequest:
      return decodeDumpRequest(message);
    case mtsForm.bulkDump:
    case mtsForm.bankedBulkDump:
      return decodeBulkDump(message);
    case mtsForm.singleNote:
    case mtsForm.bankedSingleNote:
      return decodeSingleNoteChange(message);
    case mtsForm.scaleOctave1:
    case mtsForm.scaleOctave2:
      return decodeScaleOctave(message);
    default:
      return fail([
        messageFault(
          `the tuning message has form 08 ${hex(message[4])}, which this Keyloom does not read`,
        ),
      ]);
  }
}

/**
 * What a stream of MTS messages does to the keys, in order: later messages retune what earlier ones
 * set.
 */
export interface DecodedMtsStream {
  messages: DecodedMtsMessage[];
  /** Every key's pitch after all messages; null for keys no message tuned. */
  keys: KeyPitch[];
}

/** Splits bytes into system exclusive messages, F0 to F7; anything between them is a fault. */
/**
 * The most messages one stream is read for: a bank of 128 tuning programs in every form fits many times over.
 * Reading stops there, so that a huge file is refused at once rather than decoded to the end.
 */
const mostMessages = 2048;
/** Decoding stops once this many messages are at fault. */
const mostFaultyMessages = 20;

function splitMessages(bytes: Uint8Array): Result<Uint8Array[]> {
  const messages: Uint8Array[] = [];
  let start = 0;
  while (start < bytes.length) {
    if (messages.length === mostMessages) {
      return fail([
        messageFault(
          `the file holds more than ${mostMessages} messages; split it into smaller files`,
        ),
      ]);
    }
    if (bytes[start] !== systemExclusive) {
      return fail([
        messageFault(
          `byte ${start} is ${hex(bytes[start])}, ` +
            'where a system exclusive message (F0) should start',
        ),
      ]);
    }
    const end = bytes.indexOf(endOfExclusive, start + 1);
    if (end < 0) {
      const fault = `the message that starts at byte ${start} is cut short: it never ends with F7`;
      return fail([messageFault(fault)]);
    }
    messages.push(bytes.subarray(start, end + 1));
    start = end + 1;
  }
  return succeed(messages);
}

/**
 * Decodes every message of a .syx stream, and lays them over one another into a 128-key table. Each
 * fault names the message it is in; a stream with no tuning in it (only dump requests, or nothing)
 * is refused.
 */
export function decodeMtsStream(bytes: Uint8Array): Result<DecodedMtsStream> {
  const split = splitMessages(bytes);
  if (!split.ok) return split;
  const messages: DecodedMtsMessage[] = [];
  const faults: FieldError[] = [];
  let faultyMessages = 0;
  for (const [index, message] of split.value.entries()) {
    const decoded = decodeMtsMessage(message);
    if (decoded.ok) {
      messages.push(decoded.value);
      continue;
    }
    for (const error of decoded.errors) {
      faults.push({ ...error, message: `${error.message} (message ${index + 1})` });
    }
    faultyMessages += 1;
    if (faultyMessages === mostFaultyMessages) break;
  }
  if (faults.length > 0) return fail(faults);
  const keys: KeyPitch[] = Array.from({ length: keyCount }, (_, key) => ({ key, hz: null }));
  for (const message of messages) {
    if (message.kind === 'dump-request') continue;
    for (const { key, hz } of message.keys) if (hz !== null) keys[key].hz = hz;
  }
  if (!messages.some((message) => message.kind !== 'dump-request')) {
    return fail([
      messageFault(
        'the file holds no tuning: no bulk dump, single-note change or scale/octave tuning',
      ),
    ]);
  }
  return succeed({ messages, keys });
}
