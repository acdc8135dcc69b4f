import { longestTuningName, tuningNameFrom } from './tuning-name';
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
  hex,
  keyCount,
  messageFault,
  mtsChecksum,
  mtsForm,
  pitchesByKey,
  type TuningTarget,
  tuningSubId,
  universalNonRealTime,
} from './mts-message';
import { unreachableKeysWarning } from './unreachable-keys';

/**
 * The MTS bulk tuning dump, `F0 7E dev 08 01 tt name[16] (xx yy zz)x128 cs F7` (408 bytes), and the
 * key-based dump with bank, `F0 7E dev 08 04 bb tt name[16] (xx yy zz)x128 cs F7` (409 bytes):
 * every key, key 0 first.
 */

const bulkDumpLength = 408;
const bankedBulkDumpLength = 409;

/**
 * The name as a dump carries it: 7-bit printable ASCII (accents dropped), cut and padded with
 * spaces to 16.
 */
function tuningNameBytes(name: string): number[] {
  const ascii = tuningNameFrom(name).padEnd(longestTuningName, ' ');
  return Array.from(ascii, (character) => character.charCodeAt(0));
}

function encodeDump(
  keys: readonly KeyPitch[],
  header: number[],
  name: string,
  length: number,
): EncodedMessages {
  const message = new Uint8Array(length);
  message.set([...header, ...tuningNameBytes(name)]);
  const pitches = pitchesByKey(keys);
  const clamped: number[] = [];
  let offset = header.length + longestTuningName;
  for (let key = 0; key < keyCount; key++, offset += 3) {
    if (writeFrequencyWord(message, offset, pitches[key])) clamped.push(key);
  }
  message[offset] = mtsChecksum(message, offset);
  message[offset + 1] = endOfExclusive;
  return { messages: [message], warnings: unreachableKeysWarning(clamped, mtsClampWarning) };
}

/**
 * The bulk dump (08 01) of every key into tuning program `program`; unmapped keys are "no change".
 */
export function encodeBulkDump(
  keys: readonly KeyPitch[],
  target: Omit<TuningTarget, 'bank'> & { tuningName: string },
): EncodedMessages {
  const { deviceId, program, tuningName } = target;
  const header = [
    systemExclusive,
    universalNonRealTime,
    deviceId,
    tuningSubId,
    mtsForm.bulkDump,
    program,
  ];
  return encodeDump(keys, header, tuningName, bulkDumpLength);
}

/**
 * The key-based dump with bank (08 04) of every key into tuning program `program` of bank `bank`.
 */
export function encodeBankedBulkDump(
  keys: readonly KeyPitch[],
  target: TuningTarget & { tuningName: string },
): EncodedMessages {
  const { deviceId, bank, program, tuningName } = target;
  const header = [
    systemExclusive,
    universalNonRealTime,
    deviceId,
    tuningSubId,
    mtsForm.bankedBulkDump,
    bank,
    program,
  ];
  return encodeDump(keys, header, tuningName, bankedBulkDumpLength);
}

/**
 * Reads a bulk dump (08 01) or a key-based dump with bank (08 04), the universal header already
 * recognised. The checksum is verified: a dump that fails it is refused rather than half-trusted.
 */
export function decodeBulkDump(message: Uint8Array): Result<DecodedTuning> {
  const banked = message[4] === mtsForm.bankedBulkDump;
  const what = banked ? 'key-based tuning dump with bank (08 04)' : 'bulk tuning dump (08 01)';
  const length = banked ? bankedBulkDumpLength : bulkDumpLength;
  const framing = framingFault(message, length, what);
  if (framing) return fail([framing]);
  const checksumAt = length - 2;
  const expected = mtsChecksum(message, checksumAt);
  if (message[checksumAt] !== expected) {
    return fail([
      messageFault(
        `the ${what} has checksum ${hex(message[checksumAt])}, ` +
          `but its bytes give ${hex(expected)}: the dump was damaged on its way`,
      ),
    ]);
  }
  const nameAt = banked ? 7 : 6;
  const nameBytes = message.subarray(nameAt, nameAt + longestTuningName);
  const name = String.fromCharCode(...nameBytes).trimEnd();
  const keys: KeyPitch[] = [];
  for (let key = 0, offset = nameAt + longestTuningName; key < keyCount; key++, offset += 3) {
    const hz = hzOfFrequencyWord(message[offset], message[offset + 1], message[offset + 2]);
    keys.push({ key, hz });
  }
  return succeed({
    kind: banked ? 'banked-bulk-dump' : 'bulk-dump',
    deviceId: message[2],
    realTime: false,
    bank: banked ? message[5] : null,
    program: message[nameAt - 1],
    name,
    channels: null,
    keys,
  });
}
