import { midiToFreq } from '@tonaljs/midi';
import { describe, expect, it } from 'vitest';
import { equalTemperedHz, nearestEqualTemperedNote, noteName } from './twelve-edo';

describe('twelve-tone equal temperament', () => {
  it('agrees with an independent key-to-frequency reference, also at another concert pitch', () => {
    for (const key of [0, 21, 60, 69, 108, 127]) {
      // @tonaljs/midi midiToFreq, an independent reference for key-to-frequency
      expect(equalTemperedHz(key, 440)).toBeCloseTo(midiToFreq(key), 9);
      expect(equalTemperedHz(key, 415)).toBeCloseTo(midiToFreq(key, 415), 9);
    }
  });

  it('names keys with middle C as C4', () => {
    // MIDI convention (A4 = key 69; middle C, key 60)
    expect([noteName(60), noteName(69), noteName(0), noteName(127), noteName(61)]).toEqual([
      'C4',
      'A4',
      'C-1',
      'G9',
      'C#4',
    ]);
  });

  it('finds the note nearest a pure fifth above C4 and its offset', () => {
    // arithmetic (G 3/2 above equal-tempered C4: 392.4383 Hz; ET 391.9954 Hz)
    const note = nearestEqualTemperedNote(392.4383, 440);
    expect(note.name).toBe('G4');
    expect(note.key).toBe(67);
    expect(note.offsetCents).toBeCloseTo(1200 * Math.log2(392.4383 / 391.9954), 3);
    // definition (a pure fifth is 701.9550008654 cents, the equal-tempered one 700)
    expect(note.offsetCents).toBeCloseTo(1.955, 3);
  });
});
