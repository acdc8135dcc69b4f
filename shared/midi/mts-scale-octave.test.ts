import * as fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { mapKeys } from '../tuning/key-table';
import { builtScale } from '../tuning/scale.testing';
import { equalTemperedHz } from '../tuning/twelve-edo';
import type { KeyPitch } from './frequency-word';
import { centsBetween, pureFifthsOnWhiteKeys, twelveEqualKeys } from './key-tables.testing';
import {
  decodeScaleOctave,
  encodeScaleOctave1,
  encodeScaleOctave2,
  octaveOffsets,
} from './mts-scale-octave';

const octave = { keysPerPeriod: 12, periodCents: 1200 };
const everyChannel = Array.from({ length: 16 }, (_, index) => index + 1);
const target = { deviceId: 0x7f, channels: everyChannel, realTime: true };

function offsetsOf(keys: readonly KeyPitch[]) {
  const offsets = octaveOffsets(keys, octave);
  if (!offsets.ok) throw new Error(offsets.errors[0].message);
  return offsets.value;
}

describe('MTS scale/octave tuning (08 08, 08 09)', () => {
  it('writes the channel bitmap ff gg hh', () => {
    const offsets = new Array(12).fill(0);
    const bitmap = (channels: number[]) => {
      const [message] = encodeScaleOctave1(offsets, { ...target, channels }).messages;
      return [...message.subarray(5, 8)];
    };
    // MIDI Tuning specification: channel bitmap, all channels = 03 7F 7F; hh bits 0-6 = channels
    // 1-7, gg bits 0-6 = channels 8-14, ff bits 0-1 = channels 15-16
    expect(bitmap(everyChannel)).toEqual([0x03, 0x7f, 0x7f]);
    expect(bitmap([1])).toEqual([0x00, 0x00, 0x01]);
    expect(bitmap([8, 16])).toEqual([0x02, 0x01, 0x00]);
  });

  it('writes equal temperament as 40 in the 1-byte form and 40 00 in the 2-byte form', () => {
    const offsets = offsetsOf(twelveEqualKeys);
    const [one] = encodeScaleOctave1(offsets, target).messages;
    const [two] = encodeScaleOctave2(offsets, target).messages;
    // MIDI Tuning specification: 08 08 is 21 bytes, ss = 40 is 0 cents; 08 09 is 33 bytes, 40 00 is
    // 0 cents
    const header = [0xf0, 0x7f, 0x7f, 0x08, 0x08, 0x03, 0x7f, 0x7f];
    expect([...one]).toEqual([...header, ...new Array(12).fill(0x40), 0xf7]);
    expect(two).toHaveLength(33);
    expect([...two.subarray(8, 32)]).toEqual(new Array(12).fill([0x40, 0x00]).flat());
  });

  it('writes pure fifths as the offset of each note name, unmapped ones unchanged', () => {
    const offsets = offsetsOf(pureFifthsOnWhiteKeys);
    // arithmetic (MIDI convention): pure fifths from equal-tempered C4: G 392.4383 Hz against
    // 391.9954 (+1.955 cents), E 331.1199 against 329.6276
    expect(offsets[7]).toBeCloseTo(1.955, 3);
    expect(offsets[4]).toBeCloseTo(1200 * Math.log2(331.1199 / 329.6276), 3);
    expect(offsets[1]).toBeNull();
    const { messages, warnings } = encodeScaleOctave2(offsets, { ...target, realTime: false });
    // MIDI Tuning specification: 2-byte offset v = 128*ss + tt, cents = (v - 8192) * 100 / 8192:
    // +1.955 cents is v = 8352
    expect([...messages[0].subarray(8 + 14, 8 + 16)]).toEqual([8352 >> 7, 8352 & 0x7f]);
    expect(messages[0][1]).toBe(0x7e);
    expect(warnings.map((warning) => warning.message)).toEqual([
      'mapping: C#, D#, F#, G#, A# have no mapped key; sent in equal temperament',
    ]);
    const [one] = encodeScaleOctave1(offsets, target).messages;
    // MIDI Tuning specification: 1-byte offset, cents = ss - 64: +2 cents (1.955 rounded) is 42, +8
    // cents (7.82 rounded) is 48
    expect(one[8 + 7]).toBe(0x42);
    expect(one[8 + 4]).toBe(0x48);
  });

  it('refuses layouts that are not 12 keys per 2/1, saying why', () => {
    const tritave = octaveOffsets(twelveEqualKeys, { keysPerPeriod: 13, periodCents: 1901.955 });
    expect(tritave.ok).toBe(false);
    expect(!tritave.ok && tritave.errors.map((error) => error.message)).toEqual([
      'mapping.keysPerPeriod: this layout repeats every 13 keys, and scale/octave tuning needs 12 keys an ' +
        'octave: send a bulk dump or single-note changes instead',
      'scale.period: this scale repeats every 1901.955 cents, and scale/octave tuning needs an octave ' +
        '(2/1, 1200 cents): send a bulk dump or single-note changes instead',
    ]);
    expect(octaveOffsets(twelveEqualKeys, { keysPerPeriod: 31, periodCents: 1200 }).ok).toBe(false);
  });

  it('clamps offsets beyond the range of the 1-byte form and reports them', () => {
    const sharp = twelveEqualKeys.map((entry) => ({
      key: entry.key,
      hz: (entry.hz ?? 0) * 2 ** (80 / 1200),
    }));
    const { messages, warnings } = encodeScaleOctave1(offsetsOf(sharp), target);
    // MIDI Tuning specification: 1-byte offset, 7F = +63 cents is the top
    expect(messages[0][8]).toBe(0x7f);
    expect(warnings[0].message).toMatch(
      /C, C#, D, D#, E, F, F#, G, G#, A, A#, B lie further .* -64 to \+63\.000 cents/,
    );
  });

  it('round-trips 12-key tunings within the step of each form', () => {
    const degreeOffsets = fc.array(fc.double({ min: -99, max: 99, noNaN: true }), {
      minLength: 11,
      maxLength: 11,
    });
    const rootOffsets = fc.double({ min: -40, max: 40, noNaN: true });
    const channelSets = fc.subarray(everyChannel, { minLength: 1 });
    fc.assert(
      fc.property(degreeOffsets, rootOffsets, channelSets, (degreeCents, rootCents, channels) => {
        const degrees = degreeCents.map((cents, index) => `${(index + 1) * 100 + cents / 2.01}c`);
        const scale = builtScale({ kind: 'list', degrees, period: '2/1' });
        const rootHz = equalTemperedHz(60, 440) * 2 ** (rootCents / 1200);
        const keys = mapKeys(scale, { rootKey: 60, rootHz, concertA: 440, layout: null });
        const offsets = offsetsOf(keys);
        const inOneByteRange = offsets.every(
          (offset) => offset !== null && offset >= -64 && offset <= 63,
        );
        const forms = [
          [encodeScaleOctave2, 100 / 8192 / 2, true],
          [encodeScaleOctave1, 0.5, inOneByteRange],
        ] as const;
        for (const [encode, halfStepCents, applies] of forms) {
          const [message] = encode(offsets, { ...target, channels }).messages;
          const decoded = decodeScaleOctave(message);
          if (!decoded.ok) throw new Error(decoded.errors[0].message);
          expect(decoded.value.channels).toEqual(channels);
          if (!applies) continue;
          for (const entry of keys) {
            const hz = decoded.value.keys[entry.key].hz ?? 0;
            // MIDI Tuning specification: 2-byte step 0.01220703125 cents, 1-byte step 1 cent;
            // rounding to the nearest leaves half a step
            const errorCents = Math.abs(centsBetween(entry.hz ?? 0, hz));
            expect(errorCents).toBeLessThanOrEqual(halfStepCents + 1e-9);
          }
        }
      }),
      { numRuns: 200 },
    );
  });
});
