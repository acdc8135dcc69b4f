/**
 * The MTS frequency word `xx yy zz`: xx the equal-tempered key at or just below the pitch, `yy zz`
 * a 14-bit fraction of a semitone above it (MMA MIDI Tuning Updated Specification). Key 69 is 440
 * Hz.
 */

/** A key and the pitch it should sound; a null pitch leaves the key as it is ("no change"). */
export interface KeyPitch {
  key: number;
  hz: number | null;
}

/** Frequency words count in 1/16384 of a semitone upwards from key 0 (8.1758 Hz). */
export const mtsUnitsPerSemitone = 16384;

/** `7F 7F 7E`, the highest word that is a pitch: 13289.6566 Hz. */
const highestMtsUnits = 127 * mtsUnitsPerSemitone + 16382;

/** `7F 7F 7F` means "no change" to the key. */
const noChangeUnits = highestMtsUnits + 1;

const keyOfA4 = 69;
const hzOfA4 = 440;

/**
 * An encoded pitch: its units from key 0, and whether it had to be clamped into the range MTS can
 * send.
 */
interface MtsPitch {
  units: number;
  clamped: boolean;
}

/**
 * The one rounding step of MTS: a frequency to the nearest unit (never truncated), which leaves at
 * most half a unit, 0.0030517578125 cents, of error. Pitches outside 8.1758-13289.6566 Hz are
 * clamped to the nearest end.
 */
function nearestMtsUnits(hz: number): MtsPitch {
  const units = Math.round((keyOfA4 + 12 * Math.log2(hz / hzOfA4)) * mtsUnitsPerSemitone);
  if (units > highestMtsUnits) return { units: highestMtsUnits, clamped: true };
  if (!(units >= 0)) return { units: 0, clamped: true };
  return { units, clamped: false };
}

/**
 * Writes the word of `hz` (or "no change" for null) at `offset`; says whether the pitch was
 * clamped.
 */
export function writeFrequencyWord(target: Uint8Array, offset: number, hz: number | null): boolean {
  const pitch = hz === null ? { units: noChangeUnits, clamped: false } : nearestMtsUnits(hz);
  target[offset] = pitch.units >> 14;
  target[offset + 1] = (pitch.units >> 7) & 0x7f;
  target[offset + 2] = pitch.units & 0x7f;
  return pitch.clamped;
}

/**
 * The pitch a frequency word stands for, or null for `7F 7F 7F` ("no change"). Bytes must be 7-bit.
 */
export function hzOfFrequencyWord(xx: number, yy: number, zz: number): number | null {
  const units = (xx << 14) | (yy << 7) | zz;
  if (units === noChangeUnits) return null;
  return hzOfA4 * 2 ** ((units / mtsUnitsPerSemitone - keyOfA4) / 12);
}

/** The warning text for keys clamped into the MTS range. */
export const mtsClampWarning =
  'lie outside the pitches MTS can express (8.1758 to 13289.6566 Hz) ' +
  'and were sent as the nearest end of that range';
