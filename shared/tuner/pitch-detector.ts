import { PitchDetector } from 'pitchy';

// The pitch of one frame of sound by the McLeod pitch method: P. McLeod and G. Wyvill, "A smarter way to find
// pitch", Proceedings of the International Computer Music Conference (ICMC), 2005. The pitchy package computes
// the paper's normalised square difference function (NSDF, its equation 9), picks the first key maximum within
// a clarity threshold of the highest, and interpolates it with a parabola. That period is then refined here
// (see `refinedPeriod`), because the parabola's error of a few hundredths of a sample is several cents at the
// short periods of high notes.

/** The lowest pitch read: below B0 (30.9 Hz), the lowest string of a five-string bass. */
export const lowestHz = 30;
/** The highest pitch read: above C8 (4186 Hz), the top of a piano. */
export const highestHz = 4200;
/** A frame whose clarity (the NSDF's value at the period, 1 for a perfectly periodic sound) is lower is unclear. */
const clarityNeeded = 0.9;
/** A frame quieter than this (RMS level against full scale) is quiet: -50 dBFS, a soft note well off the microphone. */
export const quietestDb = -50;
/** A sample louder than this amplitude is sound: the quiet level as an amplitude, 10^(-50/20) = 0.0032. */
const quietestAmplitude = 10 ** (quietestDb / 20);
/** A sound that starts within a frame is read over the frame's last quarter at least, in eighths of the frame. */
const tailSteps = 8;
/** The NSDF at a multiple of the period must stay this high for that multiple to refine the period. */
const refiningClarity = 0.8;
/** Periods are refined at multiples of the period up to this share of the frame (a third: two thirds overlap). */
const refiningReach = 1 / 3;
/** A frame holds this many periods of the lowest pitch, at least. */
const periodsOfLowest = 2.5;

/** What one frame holds: a pitch, too little sound, or sound with no clear pitch (noise, a chord, a knock). */
export type HeardFrame =
  | { kind: 'pitch'; hz: number; clarity: number; levelDb: number }
  | { kind: 'quiet'; levelDb: number }
  | { kind: 'unclear'; clarity: number; levelDb: number };

/** Reads the pitch of a frame of `frameLength` samples (any more or fewer are refused). */
export type FrameReader = (samples: Float32Array, sampleRate: number) => HeardFrame;

/** The frame length for a sample rate: the power of two that holds 2.5 periods of the lowest pitch. */
export function frameLengthFor(sampleRate: number): number {
  return 2 ** Math.ceil(Math.log2((periodsOfLowest * sampleRate) / lowestHz));
}

/** The RMS level of a frame in dB against full scale (an amplitude of 1); -Infinity for digital silence. */
export function levelDb(samples: Float32Array): number {
  let sum = 0;
  for (const sample of samples) sum += sample * sample;
  return 10 * Math.log10(sum / samples.length);
}

/**
 * The NSDF at one lag: twice the sum of x[j] x[j + lag] over the sum of x[j]² + x[j + lag]², j running over the
 * pairs inside the frame (McLeod and Wyvill 2005, equation 9).
 */
function nsdfAt(samples: Float32Array, lag: number): number {
  let product = 0;
  let energy = 0;
  for (let j = 0; j + lag < samples.length; j++) {
    const a = samples[j];
    const b = samples[j + lag];
    product += a * b;
    energy += a * a + b * b;
  }
  return energy > 0 ? (2 * product) / energy : 0;
}

/** The NSDF maximum nearest `lag`, climbing to it and interpolating it with a parabola. */
function peakNear(samples: Float32Array, lag: number): { lag: number; value: number } {
  let at = Math.round(lag);
  let value = nsdfAt(samples, at);
  for (let steps = 0; steps < 64; steps++) {
    const before = nsdfAt(samples, at - 1);
    const after = nsdfAt(samples, at + 1);
    if (before > value) {
      at--;
      value = before;
    } else if (after > value) {
      at++;
      value = after;
    } else {
      const curve = before + after - 2 * value;
      const shift = curve < 0 ? (before - after) / (2 * curve) : 0;
      return { lag: at + shift, value };
    }
  }
  return { lag: at, value };
}

/**
 * The period refined at ever larger multiples of it: the peak of the NSDF near 2, 4, 8... periods is found and
 * divided by the multiple, so that the parabola's error, a fraction of a sample at any lag, is divided too. Each
 * step starts from the last one's period, close enough to climb to the right peak. A multiple whose peak falls
 * below `refiningClarity` (a pitch that moves within the frame) ends the refinement.
 */
function refinedPeriod(samples: Float32Array, period: number): number {
  const reach = samples.length * refiningReach;
  let refined = period;
  for (let multiple = 1; multiple * period <= reach; multiple *= 2) {
    const peak = peakNear(samples, multiple * refined);
    if (peak.value < refiningClarity) break;
    refined = peak.lag / multiple;
  }
  return refined;
}

/** The index of the first sample louder than the quietest sound read, or -1 in a frame of quiet. */
export function firstSound(samples: Float32Array): number {
  return samples.findIndex((sample) => Math.abs(sample) > quietestAmplitude);
}

/**
 * A reader of frames of `frameLength` samples (see `frameLengthFor`). When a sound starts (or stops) within the
 * frame, only the sound is read: the longest part of 1/4, 3/8 ... 8/8 of the frame that holds no silence before
 * (or after) it, because silence lowers the NSDF at the period (pairs of a silent and a sounding sample count in
 * its denominator only) and would delay the first reading and bend the last. A sound shorter than a quarter of
 * the frame is not read yet. It holds pitchy's working buffers (in
 * double precision: the NSDF's running sums in single precision can blow up near the end of the frame), so
 * that reading a frame allocates nothing; keep one per stream of frames.
 */
export function pitchReader(frameLength: number): FrameReader {
  const step = Math.max(1, Math.floor(frameLength / tailSteps));
  const detectors: PitchDetector<Float64Array>[] = [];
  for (let length = frameLength; length >= frameLength / 4; length -= step) {
    const detector = PitchDetector.forFloat64Array(length);
    detector.clarityThreshold = clarityNeeded;
    detectors.push(detector);
  }
  return (samples, sampleRate) => {
    if (samples.length !== frameLength) {
      throw new Error(`a frame of ${samples.length} samples, not ${frameLength}`);
    }
    const start = firstSound(samples);
    if (start < 0) return { kind: 'quiet', levelDb: levelDb(samples) };
    let end = frameLength;
    while (!(Math.abs(samples[end - 1]) > quietestAmplitude)) end--;
    const sounding = end - start;
    const detector = detectors.find((candidate) => candidate.inputLength <= sounding);
    const tail = samples.subarray(end - (detector?.inputLength ?? sounding), end);
    const level = levelDb(tail);
    if (!(level >= quietestDb)) return { kind: 'quiet', levelDb: level };
    // Too little of a starting sound to read yet: its period would come out wrong.
    if (!detector) return { kind: 'unclear', clarity: 0, levelDb: level };
    const [hz, clarity] = detector.findPitch(tail, sampleRate);
    if (clarity < clarityNeeded || !(hz >= lowestHz && hz <= highestHz)) {
      return { kind: 'unclear', clarity, levelDb: level };
    }
    const period = refinedPeriod(tail, sampleRate / hz);
    return { kind: 'pitch', hz: sampleRate / period, clarity, levelDb: level };
  };
}
