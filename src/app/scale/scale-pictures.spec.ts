import { TestBed } from '@angular/core/testing';
import { presetOf, resolvedPreset } from '@shared/preset/presets.testing';
import { previewTable } from '@shared/tuning/preview';
import { OffsetChart } from './offset-chart';
import { PeriodRing } from './period-ring';
import { ScaleSummary } from './scale-summary';

function tableOf(scale: unknown) {
  const preset = resolvedPreset(presetOf(scale));
  return previewTable(preset);
}

const fifths = { kind: 'generated', generator: '3/2', up: 5, down: 1 };

describe('The pictures of a scale', () => {
  it('draws a bar per degree, above the line for a degree sharp of its equal-tempered note', () => {
    const fixture = TestBed.createComponent(OffsetChart);
    fixture.componentRef.setInput('degrees', tableOf(fifths).degrees);
    fixture.detectChanges();
    const bars = Array.from((fixture.nativeElement as HTMLElement).querySelectorAll('rect'));
    expect(bars.length).toBe(7);
    // 4/3 lies 2.0 cents below F, every other degree of the stack at or above its note (from memory).
    expect(bars.map((bar) => bar.classList.contains('raised'))).toEqual([
      false,
      true,
      true,
      false,
      true,
      true,
      true,
    ]);
    expect(bars[3].parentElement?.querySelector('title')?.textContent).toBe(
      'Degree 3: −2.0¢ from F4',
    );
  });

  it('puts the degrees round a ring, the tonic at the top and 3/2 at 702 of 1200 cents', () => {
    const fixture = TestBed.createComponent(PeriodRing);
    const table = tableOf(fifths);
    fixture.componentRef.setInput(
      'degreeCents',
      table.degrees.map((degree) => degree.cents),
    );
    fixture.componentRef.setInput('periodCents', table.analysis.period.cents);
    fixture.detectChanges();
    const element = fixture.nativeElement as HTMLElement;
    const points = Array.from(element.querySelectorAll('circle.degree'));
    expect(points.length).toBe(7);
    expect(points[0].classList).toContain('tonic');
    expect(Number(points[0].getAttribute('cx'))).toBeCloseTo(120, 5);
    expect(Number(points[0].getAttribute('cy'))).toBeLessThan(120);
    expect(Number(points[4].getAttribute('cx')))
      .withContext('702 cents lies past half the ring, on the left')
      .toBeLessThan(120);
    expect(element.querySelectorAll('line.tick').length).toBe(12);
    expect(element.querySelector('svg')?.getAttribute('aria-label')).toContain(
      'Ring of the 7 degrees',
    );
  });

  it('sums up the step pattern, the MOS sizes, the comma and the wolf', () => {
    const fixture = TestBed.createComponent(ScaleSummary);
    fixture.componentRef.setInput('table', tableOf(fifths));
    fixture.detectChanges();
    const rows = Array.from(
      (fixture.nativeElement as HTMLElement).querySelectorAll('dl > div'),
    ).map((row) =>
      [row.querySelector('dt')!, row.querySelector('dd')!].map((cell) =>
        cell.textContent!.replace(/\s+/g, ' ').trim(),
      ),
    );
    const said = Object.fromEntries(rows);
    expect(said['Step pattern']).toMatch(/^LLsLLLs\s*MOS/);
    // Seven fifths up overshoot four octaves by 2187/2048 (arithmetic: 3^7 / 2^11).
    expect(said['Comma']).toBe('2187/2048 (113.685¢)');
    expect(said['Wolf']).toContain('degree 6 to degree 3');
    // The wolf runs from B up to F: the diminished fifth 1024/729 (588.270c), narrower than the fifth by the comma
    // of seven notes, 2187/2048 (113.685c; arithmetic).
    expect(said['Wolf']).toBe(
      'the diminished fifth B–F (degree 6 to degree 3) is 1024/729 (588.270¢), 113.685¢ narrow of the fifth',
    );
    expect(said['MOS sizes']).toBe('2, 3, 5, 7, 12, 17, 29, 41, 53');
  });
});
