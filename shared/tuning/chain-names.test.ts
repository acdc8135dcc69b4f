import { describe, expect, it } from 'vitest';
import { fifthChainName, fifthsPerStep } from './chain-names';

describe('fifthChainName', () => {
  it('names the chain from E-flat to G-sharp around C with flats below and sharps above', () => {
    // The line of fifths (common practice): Eb Bb F C G D A E B F# C# G#.
    const names = Array.from({ length: 12 }, (_, i) => fifthChainName(i - 3, 0));
    expect(names).toEqual(['E♭', 'B♭', 'F', 'C', 'G', 'D', 'A', 'E', 'B', 'F♯', 'C♯', 'G♯']);
    expect(new Set(names).size).toBe(12);
  });

  it('goes on to double sharps and double flats, and starts from another tonic', () => {
    // Fourteen fifths above C is C double sharp; nineteen, B double sharp (the line of fifths, common practice).
    expect(fifthChainName(14, 0)).toBe('C𝄪');
    expect(fifthChainName(19, 0)).toBe('B𝄪');
    expect(fifthChainName(-9, 0)).toBe('B♭♭');
    expect(fifthChainName(0, 7)).toBe('G');
    expect(fifthChainName(1, 2)).toBe('A');
    expect(fifthChainName(-1, 3)).toBe('A♭');
  });
});

describe('fifthsPerStep', () => {
  it('holds for fifths and fourths in an octave, tempered or not', () => {
    expect(fifthsPerStep(701.955, 1200)).toBe(1);
    expect(fifthsPerStep(696.578, 1200)).toBe(1);
    expect(fifthsPerStep(498.045, 1200)).toBe(-1);
    expect(fifthsPerStep(386.3, 1200)).toBeNull();
    expect(fifthsPerStep(701.955, 1901.955)).toBeNull();
  });
});
