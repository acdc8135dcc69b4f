import { describe, expect, it } from 'vitest';
import { type HeardFrame, frameLengthFor, pitchReader } from './pitch-detector';
import {
  type PitchTrack,
  agreeingFrames,
  agreementCents,
  followPitch,
  heldFrames,
  silentTrack,
} from './pitch-track';
import { harmonicTone, noise, seededRandom, withNoise } from './tones.testing';

/** A pitched frame `cents` above 440 Hz (a cent is 1/1200 octave, by definition). */
const at = (cents: number): HeardFrame => ({
  kind: 'pitch',
  hz: 440 * 2 ** (cents / 1200),
  clarity: 0.99,
  levelDb: -20,
});
const unclear: HeardFrame = { kind: 'unclear', clarity: 0.5, levelDb: -20 };
const quiet: HeardFrame = { kind: 'quiet', levelDb: -70 };

/** The reading after each frame, in cents above 440 Hz (null: no clear pitch), from silence. */
function readings(frames: HeardFrame[], start: PitchTrack = silentTrack): (number | null)[] {
  let track = start;
  return frames.map((frame) => {
    track = followPitch(track, frame);
    return track.hz === null ? null : 1200 * Math.log2(track.hz / 440);
  });
}

function rounded(values: (number | null)[]): (number | null)[] {
  return values.map((value) => (value === null ? null : Math.round(value * 1000) / 1000));
}

describe('the reading of a stream of frames', () => {
  it('shows nothing until three frames agree, then their mean', () => {
    expect(agreeingFrames).toBe(3);
    // (5 + 6 + 7) / 3 = 6 and (5 + 6 + 7 + 8) / 4 = 6.5 (arithmetic).
    expect(rounded(readings([at(5), at(6), at(7), at(8)]))).toEqual([null, null, 6, 6.5]);
  });

  it('averages at most the last five frames', () => {
    const seen = readings([at(0), at(0), at(0), at(0), at(0), at(5), at(5)]);
    // (0 + 0 + 0 + 5 + 5) / 5 = 2 (arithmetic).
    expect(rounded(seen).at(-1)).toBe(2);
  });

  it('leaves out of the mean a frame that strays more than 10 cents from the median', () => {
    expect(agreementCents).toBe(10);
    const seen = readings([at(1), at(2), at(3), at(25), at(2)]);
    // The median of 1, 2, 3, 25, 2 is 2; 25 strays 23 cents: the mean of 1, 2, 3, 2 is 2 (arithmetic).
    expect(rounded(seen).slice(2)).toEqual([2, 2, 2]);
  });

  it('moves from one note to the next without a reading between them', () => {
    const seen = rounded(readings([at(0), at(0), at(0), at(300), at(300), at(300), at(300)]));
    // A minor third higher (300 cents) is a new note: the old reading holds until three frames of it agree.
    expect(seen).toEqual([null, null, 0, 0, 0, 300, 300]);
  });

  it('holds the last reading through six frames without a pitch, then says there is none', () => {
    expect(heldFrames).toBe(6);
    const gap = Array.from({ length: heldFrames }, (_, n) => (n % 2 ? quiet : unclear));
    const seen = rounded(readings([at(4), at(4), at(4), ...gap, unclear, at(4), at(4), at(4)]));
    // After the gap the note is forgotten: three new frames must agree again.
    expect(seen).toEqual([null, null, 4, 4, 4, 4, 4, 4, 4, null, null, null, 4]);
  });

  it('never reads noise, frame after frame', () => {
    const sampleRate = 48000;
    const length = frameLengthFor(sampleRate);
    const read = pitchReader(length);
    const random = seededRandom(9);
    const frames = Array.from({ length: 120 }, () => read(noise(length, 0.2, random), sampleRate));
    expect(readings(frames).every((reading) => reading === null)).toBe(true);
  });

  it('reads a noisy low tone within 1 cent, frame after frame as the page reads it', () => {
    const sampleRate = 48000;
    const length = frameLengthFor(sampleRate);
    const read = pitchReader(length);
    const random = seededRandom(4);
    // Half a second of silence, then a second of a 10-harmonic tone at E2 (82.41 Hz, from memory) with white
    // noise 26 dB below it; one frame every 800 samples, as at 60 frames a second.
    const sound = new Float32Array(sampleRate * 1.5);
    sound.set(
      withNoise(harmonicTone(82.41, sampleRate, sampleRate, { harmonics: 10 }), 0.03, random),
      sampleRate / 2,
    );
    const frames: HeardFrame[] = [];
    for (let end = length; end <= sound.length; end += 800) {
      frames.push(read(sound.subarray(end - length, end), sampleRate));
    }
    const seen = readings(frames);
    const shown = seen.filter((reading): reading is number => reading !== null);
    expect(shown.length).toBeGreaterThan(40);
    for (const reading of shown) {
      // 1200 log2(f / 82.41) for the reading f against 440 Hz: its cents above 440 minus those of 82.41 Hz.
      expect(Math.abs(reading - 1200 * Math.log2(82.41 / 440))).toBeLessThan(1);
    }
    // Nothing is read in the silence before the tone.
    expect(seen.slice(0, Math.floor((sampleRate / 2 - length) / 800))).toEqual(
      Array.from({ length: Math.floor((sampleRate / 2 - length) / 800) }, () => null),
    );
  });
});
