import { describe, expect, it } from 'vitest';
import {
  type HeardFrame,
  frameLengthFor,
  levelDb,
  pitchReader,
  quietestDb,
} from './pitch-detector';
import { harmonicTone, noise, seededRandom, withNoise } from './tones.testing';

/** Pitches from A1 (55 Hz) to 2 kHz, a little over a third of a semitone apart: 160 of them. */
const pitches = Array.from({ length: 160 }, (_, n) => 55 * (2000 / 55) ** (n / 159));

/** How many cents the frame's pitch lies from `hz`: 1200 log2(f / f_true), the definition of the cent. */
function errorCents(frame: HeardFrame, hz: number): number {
  if (frame.kind !== 'pitch') throw new Error(`no pitch at ${hz.toFixed(2)} Hz: ${frame.kind}`);
  return 1200 * Math.log2(frame.hz / hz);
}

function worstError(errors: number[]): number {
  return Math.max(...errors.map(Math.abs));
}

describe('the pitch of one frame (McLeod pitch method, period refined)', () => {
  it('takes frames that hold 2.5 periods of 30 Hz, a power of two long', () => {
    // arithmetic: 2.5 x 44100 / 30 = 3675 and 2.5 x 48000 / 30 = 4000 fit 4096; 2.5 x 96000 / 30 = 8000 fits 8192
    expect(frameLengthFor(44100)).toBe(4096);
    expect(frameLengthFor(48000)).toBe(4096);
    expect(frameLengthFor(96000)).toBe(8192);
  });

  for (const sampleRate of [44100, 48000]) {
    const length = frameLengthFor(sampleRate);
    const read = pitchReader(length);
    const random = seededRandom(sampleRate);

    it(`reads sines from 55 Hz to 2 kHz within 0.5 cents at ${sampleRate} Hz`, () => {
      const errors = pitches.map((hz) =>
        errorCents(
          read(harmonicTone(hz, sampleRate, length, { phase: 6 * random() }), sampleRate),
          hz,
        ),
      );
      // The target of the tuner's accuracy: 0.5 cents; a cent is 1/1200 octave (definition).
      expect(worstError(errors)).toBeLessThan(0.5);
    });

    it(`reads tones of 10 harmonics from 55 Hz to 2 kHz within 0.5 cents at ${sampleRate} Hz`, () => {
      const errors = pitches.map((hz) => {
        const tone = harmonicTone(hz, sampleRate, length, { harmonics: 10, phase: 6 * random() });
        return errorCents(read(tone, sampleRate), hz);
      });
      // The same target; an octave error would show as 1200 cents.
      expect(worstError(errors)).toBeLessThan(0.5);
    });
  }

  const sampleRate = 48000;
  const length = frameLengthFor(sampleRate);
  const read = pitchReader(length);

  it('reads a sine with white noise 36 dB below it within 0.5 cents, and 26 dB below within 3', () => {
    const random = seededRandom(26);
    // A sine of peak 0.5 has an RMS of 0.354; uniform noise of amplitude a an RMS of a / sqrt 3, so 0.01 lies
    // 20 log10(0.354 / 0.00577) = 35.7 dB below it and 0.03 lies 26.2 dB below (arithmetic). One frame of a
    // low tone holds few periods, so noise moves it most; the reading's average over frames narrows that.
    for (const [amplitude, bound] of [
      [0.01, 0.5],
      [0.03, 3],
    ]) {
      const errors = pitches.map((hz) => {
        const noisy = withNoise(harmonicTone(hz, sampleRate, length), amplitude, random);
        return errorCents(read(noisy, sampleRate), hz);
      });
      expect(worstError(errors)).toBeLessThan(bound);
    }
  });

  it('finds no clear pitch in a tone drowned in noise, nor in noise alone', () => {
    const random = seededRandom(2);
    for (const hz of pitches.filter((_, n) => n % 10 === 0)) {
      const drowned = withNoise(harmonicTone(hz, sampleRate, length), 0.5, random);
      expect(read(drowned, sampleRate).kind).toBe('unclear');
    }
    for (let frame = 0; frame < 100; frame++) {
      expect(read(noise(length, 0.3, random), sampleRate).kind).toBe('unclear');
    }
  });

  it('hears digital silence and a tone at -63 dBFS as quiet', () => {
    expect(read(new Float32Array(length), sampleRate)).toEqual({
      kind: 'quiet',
      levelDb: -Infinity,
    });
    const whisper = read(harmonicTone(440, sampleRate, length, { peak: 0.001 }), sampleRate);
    expect(whisper.kind).toBe('quiet');
    // A sine's RMS is its peak over sqrt 2: 20 log10(0.001 / sqrt 2) = -63.0 dBFS (arithmetic).
    expect(whisper.levelDb).toBeCloseTo(-63.0, 1);
    expect(whisper.levelDb).toBeLessThan(quietestDb);
  });

  it('reads a tone that fills only the last third of the frame, as at a note’s start', () => {
    const tone = harmonicTone(329.63, sampleRate, 1400, { harmonics: 10 });
    const frame = new Float32Array(length);
    frame.set(tone, length - tone.length);
    // 1400 samples at 48 kHz are 29 ms, almost ten periods of E4 (329.63 Hz, from memory).
    expect(Math.abs(errorCents(read(frame, sampleRate), 329.63))).toBeLessThan(0.5);
  });

  it('reads a low tone that starts and stops within the frame over the sound alone', () => {
    // 2100 samples are 2.4 periods of A1 (55 Hz): read with the silence around them, the NSDF at the period
    // falls under the clarity needed (about 0.6 here).
    const tone = harmonicTone(55, sampleRate, 2100, { harmonics: 10 });
    const frame = new Float32Array(length);
    frame.set(tone, 1000);
    expect(Math.abs(errorCents(read(frame, sampleRate), 55))).toBeLessThan(0.5);
  });

  it('does not read a sound shorter than a quarter of the frame yet', () => {
    const frame = new Float32Array(length);
    frame.set(harmonicTone(440, sampleRate, length / 4 - 20), length * 0.75 + 20);
    expect(read(frame, sampleRate).kind).toBe('unclear');
  });

  it('reads a tone whose NSDF, summed in single precision, peaked at the end of the frame', () => {
    // Found by the benchmark: in single precision the NSDF's denominator, a running difference, shrinks to
    // rounding errors at the longest lags, and the peak there (11.7 Hz) outweighed the true one.
    const tone = harmonicTone(117.2, sampleRate, length, { harmonics: 10, phase: 3.067 });
    expect(Math.abs(errorCents(read(tone, sampleRate), 117.2))).toBeLessThan(0.5);
  });

  it('measures the level as the RMS against full scale', () => {
    // A full-scale square wave has an RMS of 1: 0 dBFS (definition).
    expect(levelDb(Float32Array.from({ length: 64 }, (_, i) => (i % 2 ? 1 : -1)))).toBeCloseTo(
      0,
      9,
    );
  });

  it('refuses a frame of another length', () => {
    expect(() => read(new Float32Array(length / 2), sampleRate)).toThrow(/2048 samples, not 4096/);
  });
});
