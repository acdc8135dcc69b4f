import { TestBed } from '@angular/core/testing';
import { presetOf, resolvedPreset } from '@shared/preset/presets.testing';
import { previewTable } from '@shared/tuning/preview';
import { IntervalMatrix } from './interval-matrix';

function matrixOf(scale: unknown): number[][] {
  const preset = resolvedPreset(presetOf(scale));
  return previewTable(preset).analysis.intervalMatrix;
}

describe('IntervalMatrix', () => {
  function render(scale: unknown) {
    const fixture = TestBed.createComponent(IntervalMatrix);
    fixture.componentRef.setInput('matrix', matrixOf(scale));
    fixture.detectChanges();
    return { fixture, element: fixture.nativeElement as HTMLElement };
  }

  it('shades the wolf fifth of twelve pure fifths apart from the other fifths', () => {
    const { element } = render({ kind: 'generated', generator: '3/2', up: 11, down: 0 });
    const fifths = Array.from(element.querySelectorAll('tbody tr')).map(
      (row) => row.querySelectorAll('td')[6],
    );
    // Eleven pure fifths of 702.0c and a wolf narrower by the Pythagorean comma, 678.5c (from memory).
    const wolves = fifths.filter((cell) => cell.textContent?.trim() === '678.5');
    expect(wolves.length).toBe(1);
    expect(Number(wolves[0].getAttribute('data-shade'))).toBe(-4);
    expect(
      fifths
        .filter((cell) => cell.textContent?.trim() === '702.0')
        .every((cell) => cell.getAttribute('data-shade') === '0'),
    ).toBeTrue();
  });

  it('shows a small scale open and leaves a large one to be opened on request', () => {
    const small = render({ kind: 'equal', divisions: 12 });
    expect(small.element.querySelectorAll('tbody tr').length).toBe(12);
    expect(small.element.querySelectorAll('thead th').length).toBe(12);

    const large = render({ kind: 'equal', divisions: 53 });
    expect(large.element.querySelector('table')).toBeNull();
    expect(large.element.querySelector('summary')?.textContent).toContain(
      'Show the 53 × 52 intervals',
    );
    const details = large.element.querySelector('details')!;
    details.open = true;
    details.dispatchEvent(new Event('toggle'));
    large.fixture.detectChanges();
    expect(large.element.querySelectorAll('tbody tr').length).toBe(53);
  });
});
