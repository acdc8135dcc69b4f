import { type FieldError, fieldError } from '../result';
import type { KeyPitch } from './frequency-word';
import { endOfExclusive } from './midi-bytes';

/**
 * What every MTS message shares: universal system exclusive `F0 7E|7F dev 08 sub-ID#2 ... F7`
 * (MMA MIDI Tuning Updated Specification).
 */
export const universalNonRealTime = 0x7e;
export const universalRealTime = 0x7f;
export const tuningSubId = 0x08;

/** Sub-ID#2 of each MTS form. */
export const mtsForm = {
  dumpRequest: 0x00,
  bulkDump: 0x01,
  singleNote: 0x02,
  bankedBulkDump: 0x04,
  bankedSingleNote: 0x07,
  scaleOctave1: 0x08,
  scaleOctave2: 0x09,
} as const;

export const keyCount = 128;

/**
 * Where an MTS message goes: the device id (127 = all devices), and the tuning program and bank it
 * writes.
 */
export interface TuningTarget {
  deviceId: number;
  program: number;
  bank: number;
}

/** One or more encoded messages and the keys that had to be clamped, reported as warnings. */
export interface EncodedMessages {
  messages: Uint8Array[];
  warnings: FieldError[];
}

/**
 * A decoded tuning message: every key's pitch (null where the message leaves the key unchanged).
 */
export interface DecodedTuning {
  kind:
    | 'bulk-dump'
    | 'banked-bulk-dump'
    | 'single-note'
    | 'banked-single-note'
    | 'scale-octave-1'
    | 'scale-octave-2';
  deviceId: number;
  realTime: boolean;
  /**
   * The bank and program the message writes; null for scale/octave tuning, which retunes channels.
   */
  bank: number | null;
  program: number | null;
  /** The tuning name of a dump, spaces at the end removed. */
  name: string | null;
  /** The channels (1-16) a scale/octave message retunes. */
  channels: number[] | null;
  keys: KeyPitch[];
}

export interface DecodedDumpRequest {
  kind: 'dump-request';
  deviceId: number;
  program: number;
}

export type DecodedMtsMessage = DecodedTuning | DecodedDumpRequest;

/**
 * The checksum of the dumps: XOR of every byte after F0 up to the last data byte, then AND 7F.
 * `end` is the index just past the last data byte.
 */
export function mtsChecksum(message: Uint8Array, end: number): number {
  let sum = 0;
  for (let index = 1; index < end; index++) sum ^= message[index];
  return sum & 0x7f;
}

/** One pitch per key, key 0 first; keys the table does not name are null ("no change"). */
export function pitchesByKey(keys: readonly KeyPitch[]): (number | null)[] {
  const pitches: (number | null)[] = new Array(keyCount).fill(null);
  for (const { key, hz } of keys) if (key >= 0 && key < keyCount) pitches[key] = hz;
  return pitches;
}

/** The fault of a message being decoded; the field is the uploaded file. */
export function messageFault(fault: string): FieldError {
  return fieldError('file', fault);
}

export function hex(byte: number): string {
  return byte.toString(16).toUpperCase().padStart(2, '0');
}

/**
 * Checks that a message is one whole system exclusive message of `length` bytes with 7-bit data,
 * and names the first fault: a stray status byte (often the start of the next message), cut short,
 * too long, no F7 at the end.
 */
export function framingFault(message: Uint8Array, length: number, what: string): FieldError | null {
  const last = message.length - 1;
  for (let index = 1; index < Math.min(message.length, length); index++) {
    if (message[index] > 0x7f && !(index === last && message[index] === endOfExclusive)) {
      return messageFault(
        `the ${what} holds the byte ${hex(message[index])} at ${index}, ` +
          'where only 7-bit data may stand',
      );
    }
  }
  if (message.length < length) {
    return messageFault(
      `the ${what} is cut short: it has ${message.length} bytes of the ${length} it needs`,
    );
  }
  if (message.length > length) {
    return messageFault(
      `the ${what} has ${message.length} bytes, but this form has exactly ${length}`,
    );
  }
  if (message[last] !== endOfExclusive) {
    return messageFault(
      `the ${what} does not end with F7 (its last byte is ${hex(message[last])})`,
    );
  }
  return null;
}
