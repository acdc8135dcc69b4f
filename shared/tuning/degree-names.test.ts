import { describe, expect, it } from 'vitest';
import { parsePresetDocument } from '../preset/preset-document';
import { chainIntervalName, degreeNames } from './degree-names';
import { previewTable } from './preview';
import { builtScale } from './scale.testing';

const preview = (scale: object, rootKey = 60) => {
  const parsed = parsePresetDocument({
    format: 'keyloom.preset',
    version: 1,
    name: 'N',
    scale,
    mapping: { rootKey },
  });
  if (!parsed.ok) throw new Error(parsed.errors[0].message);
  return previewTable(parsed.value);
};

describe('degreeNames', () => {
  it('names a chain of fifths along the chain: flats below the tonic, sharps above', () => {
    // Twelve fifths from E-flat to G-sharp around C (the line of fifths, common practice).
    const names = degreeNames(
      builtScale({ kind: 'generated', generator: '3/2', period: '2/1', up: 8, down: 3 }),
      0,
    );
    expect(names).toEqual(['C', 'C♯', 'D', 'E♭', 'E', 'F', 'F♯', 'G', 'G♯', 'A', 'B♭', 'B']);
    // From D: the same chain a whole tone up.
    expect(
      degreeNames(
        builtScale({ kind: 'generated', generator: '3/2', period: '2/1', up: 5, down: 1 }),
        2,
      ),
    ).toEqual(['D', 'E', 'F♯', 'G', 'A', 'B', 'C♯']);
  });

  it('names a chain of fourths as fifths downwards, and seventeen fifths with no name twice', () => {
    expect(
      degreeNames(
        builtScale({ kind: 'generated', generator: '4/3', period: '2/1', up: 2, down: 0 }),
        0,
      ),
    ).toEqual(['C', 'F', 'B♭']);
    const seventeen = degreeNames(
      builtScale({ kind: 'generated', generator: '3/2', period: '2/1', up: 8, down: 8 }),
      0,
    );
    expect(new Set(seventeen).size).toBe(17);
    expect(seventeen).toContain('D♭');
    expect(seventeen).toContain('C♯');
  });

  it('names 31 equal divisions in ups and downs, each step once, and never two alike', () => {
    // 31 equal: the fifth is 18 steps and the sharp 2 (7 x 18 - 4 x 31), so one step is an up (arithmetic).
    const names = degreeNames(builtScale({ kind: 'equal', divisions: 31, period: '2/1' }), 0);
    expect(names).toHaveLength(31);
    expect(new Set(names).size).toBe(31);
    expect(names.slice(0, 6)).toEqual(['C', '^C', 'C♯', 'D♭', 'vD', 'D']);
    expect(names[18]).toBe('G');
  });

  it('falls back to step numbers where the fifths make no chain (7 equal divisions: the sharp is a unison)', () => {
    expect(degreeNames(builtScale({ kind: 'equal', divisions: 7, period: '2/1' }), 0)).toEqual([
      'C',
      'step 1',
      'step 2',
      'step 3',
      'step 4',
      'step 5',
      'step 6',
    ]);
  });

  it('names other scales by their nearest twelve-tone note, telling apart two that share one', () => {
    const harmonics = degreeNames(builtScale({ kind: 'harmonic', from: 8, to: 16, sub: false }), 0);
    // 8:9:10:11:12:13:14:15 from C: 11/8 (551 c) and 12/8 (702 c) lie nearest F-sharp and G.
    expect(harmonics.slice(0, 3)).toEqual(['C', 'D', 'E']);
    expect(new Set(harmonics).size).toBe(8);
    const crowded = degreeNames(
      builtScale({ kind: 'list', degrees: ['25/24', '16/15', '9/8'], period: '2/1' }),
      0,
    );
    expect(crowded).toEqual(['C', 'C♯ (1)', 'C♯ (2)', 'D']);
  });
});

describe('chainIntervalName', () => {
  it('names intervals by the fifths between their notes (common practice)', () => {
    expect(chainIntervalName(0)).toBe('perfect unison');
    expect(chainIntervalName(1)).toBe('perfect fifth');
    expect(chainIntervalName(-1)).toBe('perfect fourth');
    expect(chainIntervalName(4)).toBe('major third');
    expect(chainIntervalName(-3)).toBe('minor third');
    expect(chainIntervalName(6)).toBe('augmented fourth');
    expect(chainIntervalName(-6)).toBe('diminished fifth');
    expect(chainIntervalName(-11)).toBe('diminished sixth');
    expect(chainIntervalName(-8)).toBe('diminished fourth');
  });
});

describe('the preview names degrees and the wolf', () => {
  it('calls the quarter-comma wolf the diminished sixth G♯–E♭, 41.059 cents wide of the fifth', () => {
    const table = preview({
      kind: 'generated',
      generator: '3/2',
      up: 8,
      down: 3,
      temper: { comma: '81/80', fraction: '1/4' },
    });
    const wolf = table.analysis.stack!.wolf!;
    expect(wolf.name).toBe('diminished sixth G♯–E♭');
    // Quarter-comma meantone: the wolf G#-Eb is 737.637 c, 41.059 c wider than the tempered fifth of 696.578 c
    // (arithmetic).
    expect(wolf.cents).toBeCloseTo(737.637, 3);
    expect(wolf.deviationCents).toBeCloseTo(41.059, 3);
    expect(table.degrees.map((degree) => degree.name)).toEqual([
      'C',
      'C♯',
      'D',
      'E♭',
      'E',
      'F',
      'F♯',
      'G',
      'G♯',
      'A',
      'B♭',
      'B',
    ]);
  });

  it('has no wolf name where the chain is not of fifths', () => {
    const table = preview({ kind: 'generated', generator: '5/4', up: 3, down: 0 });
    expect(table.analysis.stack!.wolf?.name ?? null).toBeNull();
  });
});
