import { TestBed } from '@angular/core/testing';
import { presetOf, resolvedPreset } from '@shared/preset/presets.testing';
import { previewTable } from '@shared/tuning/preview';
import { DegreeTable } from './degree-table';

function degreesOf(scale: unknown) {
  const preset = resolvedPreset(presetOf(scale));
  return { degrees: previewTable(preset).degrees, rootHz: preset.mapping.rootHz };
}

describe('DegreeTable', () => {
  function render(scale: unknown) {
    const fixture = TestBed.createComponent(DegreeTable);
    const { degrees, rootHz } = degreesOf(scale);
    fixture.componentRef.setInput('degrees', degrees);
    fixture.componentRef.setInput('rootHz', rootHz);
    fixture.detectChanges();
    const rows = Array.from((fixture.nativeElement as HTMLElement).querySelectorAll('tbody tr'));
    return rows.map((row) =>
      Array.from(row.querySelectorAll('td')).map((cell) => cell.textContent!.trim()),
    );
  }

  it('shows the Pythagorean ratios of five fifths up and one down', () => {
    const rows = render({ kind: 'generated', generator: '3/2', up: 5, down: 1 });
    // Stacked fifths reduced into the octave: 1/1 9/8 81/64 4/3 3/2 27/16 243/128 (from memory).
    expect(rows.map((cells) => cells[2])).toEqual([
      '1/1',
      '9/8',
      '81/64',
      '4/3',
      '3/2',
      '27/16',
      '243/128',
    ]);
    expect(rows.map((cells) => cells[0])).toEqual(['0', '1', '2', '3', '4', '5', '6']);
    // Named along the chain of fifths from C: F C G D A E B (common practice).
    expect(rows.map((cells) => cells[1])).toEqual(['C', 'D', 'E', 'F', 'G', 'A', 'B']);
  });

  it('names the degrees of 31 equal divisions each once, in ups and downs', () => {
    const names = render({ kind: 'equal', divisions: 31 }).map((cells) => cells[1]);
    expect(new Set(names).size).toBe(31);
    expect(names.slice(0, 3)).toEqual(['C', '^C', 'C♯']);
  });

  it('gives each degree its cents, step, nearest note, offset and pitch', () => {
    const [, second] = render({ kind: 'generated', generator: '3/2', up: 5, down: 1 });
    // 9/8 is 203.910 cents, 3.9 cents above D (from memory); the step up to 81/64 is another 9/8.
    expect(second.slice(3, 7)).toEqual(['203.910¢', '9/8', 'D4', '+3.9¢']);
    // Middle C at 440 Hz concert pitch is 261.626 Hz, and 9/8 of it 294.329 Hz.
    expect(second[7]).toBe('294.329');
  });

  it('shows the simplest ratio within 6 cents of a tempered degree as an approximation, and none past that', () => {
    const rows = render({ kind: 'equal', divisions: 12 });
    // The equal-tempered fifth is 1.955 cents narrow of 3/2 (REFERENCE: 1200 log2(3/2) = 701.955).
    expect(rows[7][2]).toBe('≈ 3/2 (−2.0¢)');
    // 5/4 lies 13.7 cents from the equal-tempered third: too far to name; 63/50 lies within 0.1 cent.
    expect(rows[4][2]).toBe('≈ 63/50 (−0.1¢)');
    // Nothing of the 7-limit with terms up to 256 lies within 6 cents of the tritone.
    expect(rows[6][2]).toBe('–');
  });
});
