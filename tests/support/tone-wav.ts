// A WAV file for Chromium's fake microphone (--use-file-for-fake-audio-capture, which loops it): silence, then a
// tone. 16-bit PCM, one channel (the RIFF WAVE layout: a RIFF header, a "fmt " chunk and a "data" chunk).
import { writeFileSync } from 'node:fs';
import { harmonicTone } from '../../shared/tuner/tones.testing';

export interface ToneWav {
  hz: number;
  /** Partials of the tone, the n-th at 1/n of the first's amplitude; 1 is a sine. */
  harmonics?: number;
  silenceSeconds: number;
  toneSeconds: number;
  sampleRate?: number;
  peak?: number;
}

/** Writes the WAV to `path`. The tone fades in and out over 2 ms, so that the loop does not click. */
export function writeToneWav(path: string, wav: ToneWav): void {
  const { hz, harmonics = 1, silenceSeconds, toneSeconds, sampleRate = 48000, peak = 0.5 } = wav;
  const silence = Math.round(silenceSeconds * sampleRate);
  const tone = harmonicTone(hz, sampleRate, Math.round(toneSeconds * sampleRate), {
    harmonics,
    peak,
  });
  const fade = Math.round(0.002 * sampleRate);
  for (let i = 0; i < fade; i++) {
    tone[i] *= i / fade;
    tone[tone.length - 1 - i] *= i / fade;
  }
  const frames = silence + tone.length;
  const bytes = Buffer.alloc(44 + 2 * frames);
  bytes.write('RIFF', 0, 'ascii');
  bytes.writeUInt32LE(36 + 2 * frames, 4);
  bytes.write('WAVE', 8, 'ascii');
  bytes.write('fmt ', 12, 'ascii');
  bytes.writeUInt32LE(16, 16);
  bytes.writeUInt16LE(1, 20); // PCM
  bytes.writeUInt16LE(1, 22); // one channel
  bytes.writeUInt32LE(sampleRate, 24);
  bytes.writeUInt32LE(2 * sampleRate, 28); // bytes a second
  bytes.writeUInt16LE(2, 32); // bytes a frame
  bytes.writeUInt16LE(16, 34); // bits a sample
  bytes.write('data', 36, 'ascii');
  bytes.writeUInt32LE(2 * frames, 40);
  tone.forEach((sample, i) => {
    const clamped = Math.max(-1, Math.min(1, sample));
    bytes.writeInt16LE(Math.round(clamped * 32767), 44 + 2 * (silence + i));
  });
  writeFileSync(path, bytes);
}
