import * as fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import {
  centsBetween,
  keyTables,
  pureFifthsOnWhiteKeys,
  twelveEqualKeys,
} from './key-tables.testing';
import { decodeBulkDump, encodeBankedBulkDump, encodeBulkDump } from './mts-bulk-dump';

const allDevices = { deviceId: 0x7f, program: 0 };

/** The frequency word of a key in a bulk dump (08 01): after 6 header bytes and 16 of name. */
function wordOfKey(dump: Uint8Array, key: number): number[] {
  return [...dump.subarray(22 + 3 * key, 25 + 3 * key)];
}

describe('MTS bulk dump (08 01)', () => {
  it('writes twelve-tone equal temperament named "12-TET" as the reference check value', () => {
    const { messages, warnings } = encodeBulkDump(twelveEqualKeys, {
      ...allDevices,
      tuningName: '12-TET',
    });
    const [dump] = messages;
    // MIDI Tuning specification: check value, a 12-tone equal dump, device 7F, program 0, name
    // "12-TET" padded with spaces to 16 bytes, entries nn 00 00, has checksum 0x63 and 408 bytes
    expect(dump).toHaveLength(408);
    expect([...dump.subarray(0, 6)]).toEqual([0xf0, 0x7e, 0x7f, 0x08, 0x01, 0x00]);
    expect(String.fromCharCode(...dump.subarray(6, 22))).toBe('12-TET          ');
    for (let key = 0; key < 128; key++) expect(wordOfKey(dump, key)).toEqual([key, 0, 0]);
    expect(dump[406]).toBe(0x63);
    expect(dump[407]).toBe(0xf7);
    expect(warnings).toEqual([]);
  });

  it('writes unmapped keys as "no change" and the just fifth G as 43 02 40', () => {
    const target = { ...allDevices, tuningName: 'FIFTHS C' };
    const [dump] = encodeBulkDump(pureFifthsOnWhiteKeys, target).messages;
    // MIDI Tuning specification: 7F 7F 7F means "no change"; a just fifth above equal-tempered C4
    // is 43 02 40
    expect(wordOfKey(dump, 61)).toEqual([0x7f, 0x7f, 0x7f]);
    expect(wordOfKey(dump, 67)).toEqual([0x43, 0x02, 0x40]);
    expect(wordOfKey(dump, 60)).toEqual([0x3c, 0x00, 0x00]);
  });

  it('makes names 7-bit ASCII, cut to 16 characters and padded', () => {
    const target = { ...allDevices, tuningName: 'Tempérament égal à douze' };
    const [dump] = encodeBulkDump(twelveEqualKeys, target).messages;
    expect(String.fromCharCode(...dump.subarray(6, 22))).toBe('Temperament egal');
    expect(dump.subarray(1, 406).every((byte) => byte < 0x80)).toBe(true);
  });

  it('clamps keys MTS cannot express and reports them', () => {
    const high = twelveEqualKeys.map((entry) => ({ key: entry.key, hz: (entry.hz ?? 0) * 1.2 }));
    const { messages, warnings } = encodeBulkDump(high, { ...allDevices, tuningName: 'high' });
    // MIDI Tuning specification: 7F 7F 7E = 13289.6566 Hz is the top of the range; key 125 * 1.2 =
    // 13410.6 Hz lies above it
    expect(wordOfKey(messages[0], 127)).toEqual([0x7f, 0x7f, 0x7e]);
    expect(warnings).toHaveLength(1);
    expect(warnings[0].path).toBe('mapping');
    expect(warnings[0].message).toMatch(/keys 125-127 lie outside the pitches MTS can express/);
  });

  it('round-trips every scale within half a unit (0.0030518 cents) over all 128 keys', () => {
    fc.assert(
      fc.property(keyTables, (keys) => {
        const { messages, warnings } = encodeBulkDump(keys, { ...allDevices, tuningName: 'any' });
        const decoded = decodeBulkDump(messages[0]);
        if (!decoded.ok) throw new Error(decoded.errors[0].message);
        const clamped = keys.filter((entry) => entry.outOfMtsRange);
        expect(warnings.length).toBe(clamped.length > 0 ? 1 : 0);
        let largestErrorCents = 0;
        for (const entry of keys) {
          const hz = decoded.value.keys[entry.key].hz;
          if (entry.hz === null) expect(hz).toBeNull();
          else if (!entry.outOfMtsRange) {
            const errorCents = Math.abs(centsBetween(entry.hz, hz ?? 0));
            largestErrorCents = Math.max(largestErrorCents, errorCents);
          }
        }
        // MIDI Tuning specification: rounding to the nearest unit leaves at most 0.0030517578125
        // cents of error
        expect(largestErrorCents).toBeLessThanOrEqual(0.0030518);
      }),
      { numRuns: 300 },
    );
  });
});

describe('MTS key-based dump with bank (08 04)', () => {
  const target = { deviceId: 0x10, bank: 3, program: 5, tuningName: 'FIFTHS C' };

  it('writes bank and program before the name, 409 bytes, and reads them back', () => {
    const [dump] = encodeBankedBulkDump(pureFifthsOnWhiteKeys, target).messages;
    // MIDI Tuning specification: MTS 04 key-based dump with bank, F0 7E dev 08 04 bb tt name[16]
    // (xx yy zz)x128 cs F7, 409 bytes
    expect(dump).toHaveLength(409);
    expect([...dump.subarray(0, 7)]).toEqual([0xf0, 0x7e, 0x10, 0x08, 0x04, 0x03, 0x05]);
    let xor = 0;
    for (let index = 1; index < 407; index++) xor ^= dump[index];
    // MIDI Tuning specification: checksum = XOR of every byte after F0 up to the last data byte,
    // AND 7F
    expect(dump[407]).toBe(xor & 0x7f);
    const decoded = decodeBulkDump(dump);
    expect(decoded.ok && decoded.value).toMatchObject({
      kind: 'banked-bulk-dump',
      deviceId: 0x10,
      bank: 3,
      program: 5,
      name: 'FIFTHS C',
    });
  });

  it('refuses a dump whose checksum is wrong', () => {
    const [dump] = encodeBankedBulkDump(twelveEqualKeys, target).messages;
    dump[100] ^= 0x01;
    const decoded = decodeBulkDump(dump);
    expect(decoded.ok).toBe(false);
    expect(!decoded.ok && decoded.errors[0].message).toMatch(/checksum .* damaged/);
  });
});
