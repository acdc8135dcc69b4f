import { describe, expect, it } from 'vitest';
import { readingParts, readingText, signedCents } from './tuner-reading';

describe('the reading in words', () => {
  it('names the key, the degree and the offset with one decimal', () => {
    // MIDI convention: key 64 is E4 (middle C, key 60, is C4).
    expect(readingText({ key: 64, degree: 4, cents: 5.04 })).toBe('E4 · degree 4 · +5.0 cents');
    expect(readingText({ key: 61, degree: 1, cents: -12.36 })).toBe('C#4 · degree 1 · −12.4 cents');
    expect(readingParts({ key: 57, degree: 9, cents: 0.25 })).toEqual([
      'A3',
      'degree 9',
      '+0.3 cents',
    ]);
  });

  it('writes a sign on every offset, a true minus below and ± for what rounds to zero', () => {
    expect([signedCents(0.96), signedCents(-0.04), signedCents(0.04), signedCents(-49.95)]).toEqual(
      ['+1.0', '±0.0', '±0.0', '−50.0'],
    );
  });
});
