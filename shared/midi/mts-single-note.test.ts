import * as fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import {
  centsBetween,
  keyTables,
  pureFifthsOnWhiteKeys,
  twelveEqualKeys,
} from './key-tables.testing';
import { decodeSingleNoteChange, encodeSingleNoteChanges } from './mts-single-note';

const target = { deviceId: 0x7f, program: 2, bank: 1 };
const bankless = { withBank: false, keysPerMessage: 127 };

describe('MTS single-note tuning changes (08 02, 08 07)', () => {
  it('sends only the mapped keys, real-time, in the 8 + 4ll layout', () => {
    const { messages } = encodeSingleNoteChanges(pureFifthsOnWhiteKeys, target, bankless);
    const mapped = pureFifthsOnWhiteKeys.filter((entry) => entry.hz !== null);
    const total = messages.reduce((sum, message) => sum + message[6], 0);
    expect(total).toBe(mapped.length);
    const [first] = messages;
    // MIDI Tuning specification: MTS 02 single-note change, real-time, F0 7F dev 08 02 tt ll (kk xx
    // yy zz)xll F7, 8 + 4ll bytes
    expect([...first.subarray(0, 6)]).toEqual([0xf0, 0x7f, 0x7f, 0x08, 0x02, 0x02]);
    expect(first).toHaveLength(8 + 4 * first[6]);
    expect(first[first.length - 1]).toBe(0xf7);
  });

  it('writes the just fifth G4 as 43 02 40', () => {
    const { messages } = encodeSingleNoteChanges(pureFifthsOnWhiteKeys, target, bankless);
    const bytes = [...messages[0]];
    const at = bytes.findIndex((byte, index) => index > 6 && (index - 7) % 4 === 0 && byte === 67);
    // MIDI Tuning specification: a just fifth above equal-tempered C4, 392.4383 Hz, encodes as 43
    // 02 40
    expect(bytes.slice(at, at + 4)).toEqual([67, 0x43, 0x02, 0x40]);
  });

  it('splits into messages of the chosen size', () => {
    const options = { withBank: false, keysPerMessage: 10 };
    const { messages } = encodeSingleNoteChanges(twelveEqualKeys, target, options);
    expect(messages).toHaveLength(13);
    expect(messages.map((message) => message[6])).toEqual([...new Array(12).fill(10), 8]);
  });

  it('writes the bank form with bank and program, real-time or not', () => {
    const options = { withBank: true, keysPerMessage: 1 };
    const realTime = encodeSingleNoteChanges(twelveEqualKeys, target, options);
    // MIDI Tuning specification: MTS 07 single-note change with bank, F0 7F|7E dev 08 07 bb tt ll
    // (kk xx yy zz)xll F7, 9 + 4ll bytes
    expect([...realTime.messages[60]]).toEqual([
      0xf0, 0x7f, 0x7f, 0x08, 0x07, 0x01, 0x02, 0x01, 60, 0x3c, 0x00, 0x00, 0xf7,
    ]);
    const later = encodeSingleNoteChanges(twelveEqualKeys, target, {
      withBank: true,
      realTime: false,
    });
    expect(later.messages[0][1]).toBe(0x7e);
    const decoded = decodeSingleNoteChange(later.messages[0]);
    expect(decoded.ok && decoded.value).toMatchObject({
      kind: 'banked-single-note',
      bank: 1,
      program: 2,
      realTime: false,
    });
  });

  it('round-trips every scale within 0.0030518 cents, in both forms and any message size', () => {
    const sizes = fc.integer({ min: 1, max: 127 });
    fc.assert(
      fc.property(keyTables, fc.boolean(), sizes, (keys, withBank, keysPerMessage) => {
        const { messages } = encodeSingleNoteChanges(keys, target, { withBank, keysPerMessage });
        const decoded = new Map<number, number | null>();
        for (const message of messages) {
          expect(message.length).toBeLessThanOrEqual((withBank ? 9 : 8) + 4 * keysPerMessage);
          const read = decodeSingleNoteChange(message);
          if (!read.ok) throw new Error(read.errors[0].message);
          for (const { key, hz } of read.value.keys) if (hz !== null) decoded.set(key, hz);
        }
        for (const entry of keys) {
          if (entry.hz === null) expect(decoded.has(entry.key)).toBe(false);
          else if (!entry.outOfMtsRange) {
            const errorCents = Math.abs(centsBetween(entry.hz, decoded.get(entry.key) ?? 0));
            // MIDI Tuning specification: rounding to the nearest unit leaves at most
            // 0.0030517578125 cents
            expect(errorCents).toBeLessThanOrEqual(0.0030518);
          }
        }
      }),
      { numRuns: 200 },
    );
  });

  it('refuses a change whose key count does not match its length', () => {
    const options = { withBank: false, keysPerMessage: 4 };
    const [message] = encodeSingleNoteChanges(twelveEqualKeys, target, options).messages;
    const lying = Uint8Array.from(message);
    lying[6] = 5;
    const decoded = decodeSingleNoteChange(lying);
    expect(!decoded.ok && decoded.errors[0].message).toMatch(
      /cut short: it has 24 bytes of the 28 it needs/,
    );
  });
});
