import * as fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { pureFifthsOnWhiteKeys, twelveEqualKeys } from './key-tables.testing';
import { encodeBankedBulkDump, encodeBulkDump } from './mts-bulk-dump';
import { decodeMtsMessage, decodeMtsStream } from './mts-decode';
import { encodeDumpRequest } from './mts-dump-request';
import { encodeScaleOctave1, encodeScaleOctave2 } from './mts-scale-octave';
import { encodeSingleNoteChanges } from './mts-single-note';

const target = { deviceId: 0x7f, program: 0, bank: 0, tuningName: 'fifths' };

function concatenate(messages: Uint8Array[]): Uint8Array {
  const bytes = new Uint8Array(messages.reduce((length, message) => length + message.length, 0));
  let offset = 0;
  for (const message of messages) {
    bytes.set(message, offset);
    offset += message.length;
  }
  return bytes;
}

function faultOf(bytes: Uint8Array): string {
  const decoded = decodeMtsStream(bytes);
  if (decoded.ok) throw new Error('the bytes were accepted');
  return decoded.errors.map((error) => error.message).join('\n');
}

const oneMessage = { keysPerMessage: 127 };
const oneChannel = (channel: number, realTime: boolean) => ({
  deviceId: 0x7f,
  channels: [channel],
  realTime,
});

/** Every MTS form this code writes, each a whole message. */
const everyForm: Uint8Array[] = [
  encodeDumpRequest({ deviceId: 0x7f, program: 0 }),
  ...encodeBulkDump(pureFifthsOnWhiteKeys, target).messages,
  ...encodeBankedBulkDump(pureFifthsOnWhiteKeys, target).messages,
  ...encodeSingleNoteChanges(pureFifthsOnWhiteKeys, target, { withBank: false, ...oneMessage })
    .messages,
  ...encodeSingleNoteChanges(pureFifthsOnWhiteKeys, target, { withBank: true, ...oneMessage })
    .messages,
  ...encodeScaleOctave1(new Array(12).fill(3), oneChannel(1, true)).messages,
  ...encodeScaleOctave2(new Array(12).fill(-3), oneChannel(2, false)).messages,
];

describe('decoding MTS messages and .syx streams', () => {
  it('recognises every form', () => {
    const kinds = everyForm.map((message) => {
      const decoded = decodeMtsMessage(message);
      return decoded.ok ? decoded.value.kind : decoded.errors[0].message;
    });
    expect(kinds).toEqual([
      'dump-request',
      'bulk-dump',
      'banked-bulk-dump',
      'single-note',
      'banked-single-note',
      'scale-octave-1',
      'scale-octave-2',
    ]);
  });

  it('lays a stream of messages over one another, later messages winning', () => {
    const dump = encodeBulkDump(twelveEqualKeys, target).messages;
    const changes = encodeSingleNoteChanges(pureFifthsOnWhiteKeys, target, {
      withBank: false,
      keysPerMessage: 3,
    }).messages;
    const decoded = decodeMtsStream(concatenate([...dump, ...changes]));
    if (!decoded.ok) throw new Error(decoded.errors[0].message);
    expect(decoded.value.messages).toHaveLength(1 + changes.length);
    // arithmetic (MIDI convention): pure fifths from equal-tempered C4: G = 392.4383 Hz;
    // equal-tempered C#4 = 277.1826 Hz (frequency word table, 3D 00 00)
    expect(decoded.value.keys[67].hz).toBeCloseTo(392.4383, 3);
    expect(decoded.value.keys[61].hz).toBeCloseTo(277.1826, 3);
  });

  it('names foreign, truncated and corrupt messages', () => {
    const foreign = Uint8Array.of(0xf0, 0x43, 0x10, 0x4c, 0x00, 0x00, 0xf7);
    expect(faultOf(foreign)).toMatch(/manufacturer 43, not to the MIDI Tuning Standard/);
    expect(faultOf(Uint8Array.of(0xf0, 0x7e, 0x7f, 0x06, 0x01, 0x00, 0xf7))).toMatch(/sub-ID 06/);
    expect(faultOf(Uint8Array.of(0xf0, 0x7e, 0x7f, 0x08, 0x05, 0x00, 0xf7))).toMatch(/form 08 05/);
    expect(faultOf(Uint8Array.of(0x90, 0x3c, 0x40))).toMatch(
      /byte 0 is 90, where a system exclusive message \(F0\) should start/,
    );
    expect(faultOf(everyForm[1].subarray(0, 300))).toMatch(/never ends with F7/);
    const cutThenNext = concatenate([everyForm[1].subarray(0, 300), everyForm[0]]);
    expect(faultOf(cutThenNext)).toMatch(/holds the byte F0 at 300.*\(message 1\)/);
    expect(faultOf(everyForm[0])).toMatch(/holds no tuning/);
    expect(faultOf(new Uint8Array(0))).toMatch(/holds no tuning/);
  });

  it('refuses every message cut anywhere before its end', () => {
    for (const message of everyForm) {
      for (let length = 0; length < message.length; length++) {
        expect(decodeMtsMessage(message.subarray(0, length)).ok).toBe(false);
      }
    }
  });

  it('survives random bytes and random damage with a result, never an exception', () => {
    fc.assert(
      fc.property(fc.uint8Array({ maxLength: 600 }), (bytes) => {
        expect(typeof decodeMtsStream(bytes).ok).toBe('boolean');
      }),
      { numRuns: 3000 },
    );
    const damage = fc.array(fc.tuple(fc.nat(), fc.integer({ min: 0, max: 255 })), {
      minLength: 1,
      maxLength: 4,
    });
    fc.assert(
      fc.property(fc.constantFrom(...everyForm), damage, fc.nat(), (message, changes, cut) => {
        const damaged = Uint8Array.from(message);
        for (const [at, byte] of changes) damaged[at % damaged.length] = byte;
        const decoded = decodeMtsMessage(damaged.subarray(0, damaged.length - (cut % 3)));
        if (decoded.ok && decoded.value.kind !== 'dump-request') {
          expect(decoded.value.keys).toHaveLength(128);
        }
      }),
      { numRuns: 3000 },
    );
  });

  it('catches a damaged bulk dump by its checksum', () => {
    const places = fc.integer({ min: 22, max: 405 });
    fc.assert(
      fc.property(places, fc.integer({ min: 1, max: 0x7f }), (at, flip) => {
        const damaged = Uint8Array.from(everyForm[1]);
        damaged[at] ^= flip;
        expect(decodeMtsMessage(damaged).ok).toBe(false);
      }),
    );
  });
});
