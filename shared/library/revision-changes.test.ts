import { describe, expect, it } from 'vitest';
import { parsePresetDocument, type ResolvedPreset } from '../preset/preset-document';
import { summarizeChanges } from './revision-changes';

function preset(
  scale: object,
  mapping: object = { rootKey: 60 },
  output: object = {},
): ResolvedPreset {
  const parsed = parsePresetDocument({
    format: 'keyloom.preset',
    version: 1,
    name: 'Test',
    scale,
    mapping,
    output,
  });
  if (!parsed.ok) throw new Error(parsed.errors[0].message);
  return parsed.value;
}

describe('summarizeChanges', () => {
  it('finds the degrees a longer stack of fifths adds', () => {
    const seven = preset({ kind: 'generated', generator: '3/2', period: '2/1', up: 5, down: 1 });
    const eight = preset({ kind: 'generated', generator: '3/2', period: '2/1', up: 6, down: 1 });
    const changes = summarizeChanges(seven, eight);
    // The sixth fifth above C is 729/512 (arithmetic: 3^6 / 2^9).
    expect(changes.degreesAdded.map((d) => d.ratio)).toEqual(['729/512']);
    expect(changes.degreesRemoved).toEqual([]);
    expect(changes.degreesMoved).toEqual([]);
  });

  it('pairs degrees that changed size as moved, with the distance in cents', () => {
    const pure = preset({ kind: 'list', degrees: ['9/8', '5/4', '3/2'], period: '2/1' });
    const wider = preset({ kind: 'list', degrees: ['9/8', '81/64', '3/2'], period: '2/1' });
    const [moved] = summarizeChanges(pure, wider).degreesMoved;
    expect(moved.from.ratio).toBe('5/4');
    expect(moved.to.ratio).toBe('81/64');
    // Syntonic comma 81/80 = 21.5062895967 cents (standard acoustics texts).
    expect(moved.byCents).toBeCloseTo(21.5062895967, 8);
  });

  it('lists mapping and output changes and says when nothing changed', () => {
    const a = preset({ kind: 'equal', divisions: 19, period: '2/1' });
    const b = preset(
      { kind: 'equal', divisions: 19, period: '2/1' },
      { rootKey: 62 },
      { program: 5 },
    );
    const changes = summarizeChanges(a, b);
    expect(changes.settings.map((s) => s.field)).toEqual([
      'mapping.rootKey',
      'mapping.rootHz',
      'output.program',
    ]);
    expect(changes.lines).toContain('output.program changed from 0 to 5.');
    expect(summarizeChanges(a, a).lines).toEqual(['No changes.']);
  });
});
