import { pitchBend } from './midi-bytes';

/**
 * Playing a pitch on an instrument that only knows equal temperament: the nearest equal-tempered
 * note, bent by a 14-bit pitch bend `En ll mm` (LSB first, centre 8192) within the bend range (MIDI
 * 1.0 Detailed Specification). The receiver is taken to play key 69 at 440 Hz, its usual master
 * tuning, so that bent notes sound at the same frequencies as the MTS messages.
 */

export const bendCentre = 8192;
const highestBendValue = 16383;
const keyOfA4 = 69;
const hzOfA4 = 440;

/** The size of one bend step in cents: 100 * range / 8192. */
export function bendStepCents(bendRangeSemitones: number): number {
  return (100 * bendRangeSemitones) / bendCentre;
}

export interface BentPitch {
  /** The key to send, 0-127. */
  note: number;
  bendValue14: number;
  /** What is left after bending: the pitch wanted minus the pitch sounding, in cents. */
  residualCents: number;
  /**
   * True when the note or the bend had to be clamped, leaving more than half a bend step of error.
   */
  clamped: boolean;
}

/**
 * The one rounding step of pitch bend: an offset in cents to the nearest bend value, clamped into
 * 0-16383.
 */
export function nearestBendValue(cents: number, bendRangeSemitones: number): number {
  const value = Math.round(bendCentre + cents / bendStepCents(bendRangeSemitones));
  return Math.min(highestBendValue, Math.max(0, value));
}

/** The offset in cents that a bend value sounds within a bend range. */
export function centsOfBendValue(bendValue14: number, bendRangeSemitones: number): number {
  return (bendValue14 - bendCentre) * bendStepCents(bendRangeSemitones);
}

/**
 * How to play `hz`: the nearest equal-tempered note (so that the bend stays within half a semitone,
 * whatever the bend range), and the bend that moves it there. Pitches beyond keys 0-127 take the
 * end key and as much bend as the range gives, and are flagged.
 */
export function bendForPitch(hz: number, bendRangeSemitones: number): BentPitch {
  const exactKey = keyOfA4 + 12 * Math.log2(hz / hzOfA4);
  const note = Math.min(127, Math.max(0, Math.round(exactKey)));
  const wantedCents = (exactKey - note) * 100;
  const bendValue14 = nearestBendValue(wantedCents, bendRangeSemitones);
  const residualCents = wantedCents - centsOfBendValue(bendValue14, bendRangeSemitones);
  const clamped = !(Math.abs(residualCents) <= bendStepCents(bendRangeSemitones) / 2 + 1e-9);
  return { note, bendValue14, residualCents, clamped };
}

/** The end of a warning naming keys whose bend had to be clamped. */
export function bendClampWarning(bendRangeSemitones: number): string {
  return (
    `lie beyond what keys 0-127 bent by ±${bendRangeSemitones} semitones can reach; ` +
    'their bends were clamped'
  );
}

/** The pitch bend message `En ll mm` on a channel 1-16. */
export function pitchBendMessage(channel: number, bendValue14: number): number[] {
  return [pitchBend | (channel - 1), bendValue14 & 0x7f, bendValue14 >> 7];
}
