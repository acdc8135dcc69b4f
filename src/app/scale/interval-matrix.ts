import {
  ChangeDetectionStrategy,
  Component,
  computed,
  input,
  linkedSignal,
  output,
} from '@angular/core';

interface MatrixCell {
  cents: string;
  /** How far the interval strays from its column's mean, in steps from -4 (narrowest) to 4 (widest). */
  shade: number;
}

/** Each shade step is this many cents from the column's mean: four steps make a syntonic comma's worth. */
const centsPerShade = 6;
const shadeSteps = 4;
/** Larger scales show the matrix on request: thousands of cells are slow to redraw on every keystroke. */
const largestOpenMatrix = 24;

/**
 * Every interval of the scale: row i, column k is the interval from degree i up k steps. Each
 * column's intervals are shaded by how far they stray from the column's mean, so wide and narrow
 * versions of "the same" interval (a wolf among fifths) stand out.
 */
@Component({
  selector: 'app-interval-matrix',
  changeDetection: ChangeDetectionStrategy.OnPush,
  template: `
    <details [open]="open()" (toggle)="open.set(details.open)" #details>
      <summary>
        {{ open() ? 'Hide' : 'Show' }} the {{ size() }} × {{ size() - 1 }} intervals
      </summary>
      @if (open()) {
        <div
          class="scroller"
          tabindex="0"
          role="region"
          aria-label="Interval matrix, scrolls both ways"
        >
          <table>
            <caption class="visually-hidden">
              Intervals in cents from each degree up by 1 to
              {{
                size() - 1
              }}
              steps; shading marks intervals wider (warm) or narrower (cool) than the others with
              the same number of steps.
            </caption>
            <thead>
              <tr>
                <th scope="col">From</th>
                @for (steps of stepNumbers(); track steps) {
                  <th scope="col">+{{ steps }}</th>
                }
              </tr>
            </thead>
            <tbody>
              @for (row of rows(); track $index; let from = $index) {
                <tr>
                  <th scope="row">{{ $index }}</th>
                  @for (cell of row; track $index) {
                    <td
                      [attr.data-shade]="cell.shade"
                      (click)="intervalChosen.emit({ from, steps: $index + 1 })"
                    >
                      {{ cell.cents }}
                    </td>
                  }
                </tr>
              }
            </tbody>
          </table>
        </div>
      }
    </details>
  `,
  styles: `
    summary {
      cursor: pointer;
      color: var(--mat-sys-primary);
      margin-bottom: 8px;
      width: fit-content;
    }
    .scroller {
      overflow: auto;
      max-width: 100%;
      max-height: 480px;
    }
    table {
      border-collapse: collapse;
      font: var(--mat-sys-body-small);
      font-variant-numeric: tabular-nums;
    }
    th,
    td {
      padding: 3px 6px;
      text-align: right;
      border: 1px solid var(--mat-sys-outline-variant);
      white-space: nowrap;
    }
    th {
      position: sticky;
      background: var(--mat-sys-surface-container);
      color: var(--mat-sys-on-surface-variant);
      font-weight: 500;
    }
    thead th {
      top: 0;
      z-index: 1;
    }
    tbody th {
      left: 0;
    }
    td {
      cursor: pointer;
      --tone: var(--mat-sys-tertiary);
      --strength: 0%;
      background: color-mix(in srgb, var(--tone) var(--strength), transparent);
    }
    td[data-shade^='-'] {
      --tone: var(--mat-sys-primary);
    }
    td[data-shade='1'],
    td[data-shade='-1'] {
      --strength: 14%;
    }
    td[data-shade='2'],
    td[data-shade='-2'] {
      --strength: 28%;
    }
    td[data-shade='3'],
    td[data-shade='-3'] {
      --strength: 42%;
    }
    td[data-shade='4'],
    td[data-shade='-4'] {
      --strength: 56%;
    }
  `,
})
export class IntervalMatrix {
  /** Cents from each degree (row) up by 0, 1, ... size steps (column), as the analysis gives them. */
  readonly matrix = input.required<number[][]>();
  /** A cell was clicked: the interval from degree `from` up `steps` steps. */
  readonly intervalChosen = output<{ from: number; steps: number }>();
  protected readonly size = computed(() => this.matrix().length);
  private readonly small = computed(() => this.size() <= largestOpenMatrix);
  /** Open for small scales; a musician's choice stands until the scale crosses the line. */
  protected readonly open = linkedSignal(() => this.small());
  protected readonly stepNumbers = computed(() =>
    Array.from({ length: this.size() - 1 }, (_, index) => index + 1),
  );
  protected readonly rows = computed(() => {
    const matrix = this.matrix();
    const size = matrix.length;
    const means = Array.from(
      { length: size },
      (_, steps) => matrix.reduce((sum, row) => sum + row[steps], 0) / size,
    );
    return matrix.map((row) =>
      row.slice(1, size).map((cents, index): MatrixCell => {
        const shade = Math.round((cents - means[index + 1]) / centsPerShade);
        return {
          cents: cents.toFixed(1),
          shade: Math.max(-shadeSteps, Math.min(shadeSteps, shade)),
        };
      }),
    );
  });
}
