import { fail, type Result, succeed } from '../result';
import { endOfExclusive, systemExclusive } from './midi-bytes';
import {
  type DecodedDumpRequest,
  framingFault,
  mtsForm,
  tuningSubId,
  universalNonRealTime,
} from './mts-message';

/**
 * The bulk dump request, `F0 7E dev 08 00 tt F7`: asks an instrument to send tuning program `tt`.
 */
const dumpRequestLength = 7;

export function encodeDumpRequest(target: { deviceId: number; program: number }): Uint8Array {
  const { deviceId, program } = target;
  return Uint8Array.of(
    systemExclusive,
    universalNonRealTime,
    deviceId,
    tuningSubId,
    mtsForm.dumpRequest,
    program,
    endOfExclusive,
  );
}

export function decodeDumpRequest(message: Uint8Array): Result<DecodedDumpRequest> {
  const framing = framingFault(message, dumpRequestLength, 'bulk dump request (08 00)');
  if (framing) return fail([framing]);
  return succeed({ kind: 'dump-request', deviceId: message[2], program: message[5] });
}
