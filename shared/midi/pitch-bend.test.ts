import * as fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import {
  bendForPitch,
  bendStepCents,
  centsOfBendValue,
  nearestBendValue,
  pitchBendMessage,
} from './pitch-bend';

describe('pitch bend', () => {
  it('has the resolution of the MIDI 1.0 specification', () => {
    // MIDI 1.0 specification, resolution, 100 * range / 8192 cents per step: 0.0244140625 at +-2,
    // 0.5859375 at +-48
    expect(bendStepCents(2)).toBe(0.0244140625);
    expect(bendStepCents(48)).toBe(0.5859375);
  });

  it('writes En ll mm, LSB first, centre 00 40', () => {
    // MIDI 1.0 specification, pitch bend En ll mm, LSB first, value = 128*mm + ll, centre 8192
    // (En 00 40)
    expect(pitchBendMessage(1, 8192)).toEqual([0xe0, 0x00, 0x40]);
    expect(pitchBendMessage(16, 16383)).toEqual([0xef, 0x7f, 0x7f]);
    expect(pitchBendMessage(3, 8193)).toEqual([0xe2, 0x01, 0x40]);
  });

  it('plays the just fifth above C4 as G4 bent up 1.955 cents', () => {
    // arithmetic (MIDI convention): pure fifths from equal-tempered C4: G 392.4383 Hz against
    // equal-tempered 391.9954 Hz
    const bent = bendForPitch(392.4383, 2);
    expect(bent.note).toBe(67);
    expect(bent.bendValue14).toBe(8192 + Math.round(1.955 / 0.0244140625));
    expect(Math.abs(bent.residualCents)).toBeLessThanOrEqual(0.0244140625 / 2);
    expect(bent.clamped).toBe(false);
  });

  it('rounds to the nearest step and clamps at the ends', () => {
    expect(nearestBendValue(0.6 * bendStepCents(2), 2)).toBe(8193);
    expect(nearestBendValue(0.4 * bendStepCents(2), 2)).toBe(8192);
    expect(nearestBendValue(500, 2)).toBe(16383);
    expect(nearestBendValue(-500, 2)).toBe(0);
    expect(centsOfBendValue(0, 2)).toBe(-200);
  });

  it('flags pitches beyond the keys it can bend', () => {
    // MIDI convention: key 127 = 12543.8539514 Hz; 20 kHz lies 8 semitones above it
    expect(bendForPitch(20000, 2)).toMatchObject({ note: 127, bendValue14: 16383, clamped: true });
    expect(bendForPitch(20000, 12).clamped).toBe(false);
  });

  it('leaves at most half a bend step of error on the whole keyboard at any bend range', () => {
    const pitches = fc.double({ min: 8.2, max: 12500, noNaN: true });
    fc.assert(
      fc.property(pitches, fc.integer({ min: 1, max: 96 }), (hz, range) => {
        const bent = bendForPitch(hz, range);
        const bentCents = centsOfBendValue(bent.bendValue14, range);
        const sounding = 440 * 2 ** ((bent.note - 69) / 12 + bentCents / 1200);
        const errorCents = 1200 * Math.log2(hz / sounding);
        expect(errorCents).toBeCloseTo(bent.residualCents, 9);
        // MIDI 1.0 specification: resolution 100 * range / 8192 cents per step; nearest leaves half
        // a step
        expect(Math.abs(errorCents)).toBeLessThanOrEqual(bendStepCents(range) / 2 + 1e-9);
      }),
      { numRuns: 3000 },
    );
  });
});
