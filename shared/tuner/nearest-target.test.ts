import { describe, expect, it } from 'vitest';
import { resolvedPreset } from '../preset/presets.testing';
import { previewTable } from '../tuning/preview';
import { frameLengthFor, pitchReader } from './pitch-detector';
import { type TunerTarget, centsFrom, nearestTarget, tunerTargets } from './nearest-target';
import { readingText } from './tuner-reading';
import { harmonicTone } from './tones.testing';

/** Twelve pure fifths from C (8 up, 3 down), degree 0 on key 60 at its equal-tempered pitch from A = 440 Hz. */
function twelveFifths(mapping: object = {}) {
  const preset = resolvedPreset({
    format: 'keyloom.preset',
    version: 1,
    name: 'Fen Fifths',
    scale: { kind: 'generated', generator: '3/2', period: '2/1', up: 8, down: 3 },
    mapping: { rootKey: 60, concertA: 440, ...mapping },
  });
  return previewTable(preset).keys;
}

// Middle C at A = 440 Hz in equal temperament: 440 x 2^(-9/12) = 261.6256 Hz (arithmetic).
const c4 = 440 * 2 ** (-9 / 12);
// The Pythagorean major third 81/64 above C4: degree 4 of the chain, on key 64 (E4).
const e4 = (c4 * 81) / 64;

describe('the nearest target', () => {
  it('finds the key and degree nearest a pitch and its offset in cents', () => {
    const targets = tunerTargets(twelveFifths());
    const match = nearestTarget(e4 * 2 ** (5 / 1200), targets);
    // cents = 1200 log2(f / f_target): a pitch 2^(5/1200) above the target lies 5 cents above it (definition).
    expect(match).toEqual({
      key: 64,
      degree: 4,
      hz: expect.closeTo(e4, 9),
      cents: expect.closeTo(5, 9),
    });
  });

  it('reads a detected tone 5 cents sharp of a degree as +5.0 cents', () => {
    const sampleRate = 48000;
    const length = frameLengthFor(sampleRate);
    const read = pitchReader(length);
    const tone = harmonicTone(e4 * 2 ** (5 / 1200), sampleRate, length, { harmonics: 10 });
    const heard = read(tone, sampleRate);
    if (heard.kind !== 'pitch') throw new Error(`no pitch: ${heard.kind}`);
    const match = nearestTarget(heard.hz, tunerTargets(twelveFifths()))!;
    expect(readingText(match)).toBe('E4 · degree 4 · +5.0 cents');
  });

  it('reads every mapped key from 55 Hz to 2 kHz at its own offset within 0.5 cents', () => {
    const sampleRate = 44100;
    const length = frameLengthFor(sampleRate);
    const read = pitchReader(length);
    const targets = tunerTargets(twelveFifths());
    const inRange = targets.filter((target) => target.hz >= 55 && target.hz <= 2000);
    // Keys 33 (A1, 27/16 above C1: 55.19 Hz) to 95 (B6, 243/128 above C6: 1986.7 Hz), by arithmetic.
    expect(inRange.length).toBe(63);
    for (const [index, target] of inRange.entries()) {
      // Offsets well inside the smallest step of the scale (the limma, 90.2 cents): the key stays the nearest.
      const offset = [-31.7, -5, 0, 5, 23.4][index % 5];
      const tone = harmonicTone(target.hz * 2 ** (offset / 1200), sampleRate, length, {
        harmonics: index % 2 ? 10 : 1,
      });
      const heard = read(tone, sampleRate);
      if (heard.kind !== 'pitch') throw new Error(`no pitch at key ${target.key}`);
      const match = nearestTarget(heard.hz, targets)!;
      expect(match.key).toBe(target.key);
      expect(Math.abs(match.cents - offset)).toBeLessThan(0.5);
    }
  });

  it('locked to a degree, reads against that degree’s nearest key, whichever note is nearer', () => {
    const targets = tunerTargets(twelveFifths());
    // F5 is 4/3 above C5 and E5 81/64 above it; their ratio 256/243 is the Pythagorean limma, 90.22 cents
    // (standard acoustics texts). F5 read against degree 4 is E5 (key 76), 90.22 cents above it.
    const f5 = c4 * 2 * (4 / 3);
    const match = nearestTarget(f5, targets, { kind: 'degree', degree: 4 })!;
    expect(match.key).toBe(76);
    expect(match.cents).toBeCloseTo(1200 * Math.log2(256 / 243), 9);
    expect(match.cents).toBeCloseTo(90.225, 3);
    expect(nearestTarget(f5, targets)?.degree).toBe(5);
  });

  it('locked to a key, reads against that key however far away the pitch is', () => {
    const targets = tunerTargets(twelveFifths());
    const match = nearestTarget(e4 * 2, targets, { kind: 'key', key: 64 })!;
    // An octave (2/1) is 1200 cents (definition).
    expect(match.key).toBe(64);
    expect(match.cents).toBeCloseTo(1200, 9);
  });

  it('finds nothing when the lock allows no target', () => {
    const whiteKeys = [0, null, 1, null, 2, 3, null, 4, null, 5, null, 6];
    const seven = twelveFifths({ keysPerPeriod: 12, layout: whiteKeys });
    const targets = tunerTargets(seven);
    // Seven degrees on the white keys of 128 keys from C-1 (key 0): 75 keys (10 octaves of 7, and 5 above C9).
    expect(targets.length).toBe(75);
    expect(nearestTarget(440, targets, { kind: 'key', key: 61 })).toBeNull();
    expect(nearestTarget(440, targets, { kind: 'degree', degree: 7 })).toBeNull();
    expect(nearestTarget(440, [])).toBeNull();
  });

  it('moves every target by the ratio of a session’s concert A to the preset’s', () => {
    const targets = tunerTargets(twelveFifths(), 442 / 440);
    const match = nearestTarget(e4, targets)!;
    // A pitch at the target for A = 440 lies 1200 log2(440 / 442) = -7.85 cents below the one for A = 442.
    expect(match.key).toBe(64);
    expect(match.hz).toBeCloseTo((e4 * 442) / 440, 9);
    expect(match.cents).toBeCloseTo(1200 * Math.log2(440 / 442), 9);
    expect(match.cents).toBeCloseTo(-7.85, 2);
  });

  it('gives a tie to the lower key', () => {
    const twins: TunerTarget[] = [
      { key: 70, degree: 1, hz: 450 },
      { key: 71, degree: 2, hz: 450 },
      { key: 72, degree: 3, hz: 500 },
    ];
    expect(nearestTarget(451, twins)?.key).toBe(70);
  });

  it('measures offsets as 1200 log2(f / f_target)', () => {
    // A pure fifth 3/2 is 701.955 cents, an equal-tempered semitone 100 (standard acoustics texts).
    expect(centsFrom(660, 440)).toBeCloseTo(701.955, 3);
    expect(centsFrom(440, 440 * 2 ** (1 / 12))).toBeCloseTo(-100, 9);
  });
});
