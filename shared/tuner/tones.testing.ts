// Synthetic sound for the tuner's tests and benchmark: sines, harmonic tones, noise and silence, sample by sample.

/** A generator of uniform numbers in [0, 1) from a seed, the same sequence every run (mulberry32). */
export function seededRandom(seed: number): () => number {
  let state = seed >>> 0;
  return () => {
    state = (state + 0x6d2b79f5) >>> 0;
    let t = state;
    t = Math.imul(t ^ (t >>> 15), t | 1);
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
}

/**
 * `length` samples of a tone at `hz` with `harmonics` partials, the n-th at 1/n of the first's amplitude (a
 * sawtooth's spectrum cut after that many partials, none at or above half the sample rate), scaled to a peak
 * of `peak`, starting at `phase` radians. One harmonic is a sine.
 */
export function harmonicTone(
  hz: number,
  sampleRate: number,
  length: number,
  { harmonics = 1, peak = 0.5, phase = 0 } = {},
): Float32Array {
  const samples = new Float64Array(length);
  for (let n = 1; n <= harmonics && n * hz < sampleRate / 2; n++) {
    const step = (2 * Math.PI * n * hz) / sampleRate;
    for (let i = 0; i < length; i++) samples[i] += Math.sin(step * i + n * phase) / n;
  }
  let largest = 0;
  for (const sample of samples) largest = Math.max(largest, Math.abs(sample));
  return Float32Array.from(samples, (sample) => (sample * peak) / (largest || 1));
}

/** `sound` with white noise added, uniform between -`amplitude` and `amplitude`. */
export function withNoise(
  sound: Float32Array,
  amplitude: number,
  random: () => number,
): Float32Array {
  return sound.map((sample) => sample + amplitude * (2 * random() - 1));
}

/** White noise alone, uniform between -`amplitude` and `amplitude`. */
export function noise(length: number, amplitude: number, random: () => number): Float32Array {
  return withNoise(new Float32Array(length), amplitude, random);
}
