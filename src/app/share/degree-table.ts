import { Component, input } from '@angular/core';
import type { PreviewDegree } from '@shared/tuning/preview';

/**
 * A scale's degrees: exact ratio (or the nearest simple one), cents, and the nearest equal-tempered note with the
 * offset from it.
 */
@Component({
  selector: 'app-degree-table',
  template: `
    <table class="degrees">
      <caption class="visually-hidden">Degrees of the scale</caption>
      <thead>
        <tr>
          <th scope="col">Degree</th>
          <th scope="col">Ratio</th>
          <th scope="col" class="number">Cents</th>
          <th scope="col">Note</th>
          <th scope="col" class="number">Offset</th>
        </tr>
      </thead>
      <tbody>
        @for (degree of degrees(); track degree.degree) {
          <tr>
            <th scope="row">{{ degree.degree }}</th>
            <td>
              @if (degree.ratio) {
                {{ degree.ratio }}
              } @else if (degree.approximation) {
                <span aria-hidden="true">≈</span><span class="visually-hidden">about</span>
                {{ degree.approximation.ratio }} <span class="error">{{ signed(degree.approximation.errorCents) }}</span>
              } @else {
                —
              }
            </td>
            <td class="number">{{ degree.cents.toFixed(2) }}</td>
            <td>{{ degree.nearestNote.name }}</td>
            <td class="number">{{ signed(degree.nearestNote.offsetCents) }}</td>
          </tr>
        }
      </tbody>
    </table>
  `,
  styles: `
    .degrees { border-collapse: collapse; width: 100%; font-variant-numeric: tabular-nums; }
    th, td { padding: 6px 10px; text-align: start; border-bottom: 1px solid var(--mat-sys-outline-variant); }
    @media (max-width: 480px) { th, td { padding: 6px 4px; } }
    thead th { font: var(--mat-sys-label-large); color: var(--mat-sys-on-surface-variant); }
    .number { text-align: end; }
    tbody th { font-weight: normal; }
    .error { font: var(--mat-sys-body-small); color: var(--mat-sys-on-surface-variant); }
  `,
})
export class DegreeTable {
  readonly degrees = input.required<readonly PreviewDegree[]>();

  /** Cents with their sign, as a tuner shows them: +3.91c, −13.69c. */
  protected signed(cents: number): string {
    const rounded = Math.round(cents * 100) / 100;
    if (rounded === 0) return '0.00c';
    return `${rounded > 0 ? '+' : '−'}${Math.abs(rounded).toFixed(2)}c`;
  }
}
