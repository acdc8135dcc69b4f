import { ChangeDetectionStrategy, Component, computed, input } from '@angular/core';
import { MatTableModule } from '@angular/material/table';
import type { PreviewDegree, SizeJson } from '@shared/tuning/preview';
import { centsText, signedCentsText } from './cents-text';

interface DegreeRow {
  degree: number;
  name: string;
  ratio: string;
  approximate: boolean;
  cents: string;
  step: string;
  note: string;
  offset: string;
  hz: string;
  fifthBeats: string;
  thirdBeats: string;
}

function sizeText(size: SizeJson): string {
  return size.ratio ?? centsText(size.cents, 1);
}

function beatsText(beat: PreviewDegree['fifth']): string {
  return beat ? beat.beatsPerSecond.toFixed(2) : '–';
}

function rowOf(degree: PreviewDegree, rootHz: number): DegreeRow {
  const approximation = degree.approximation;
  return {
    degree: degree.degree,
    name: degree.name,
    ratio:
      degree.ratio ??
      (approximation
        ? `≈ ${approximation.ratio} (${signedCentsText(approximation.errorCents)})`
        : '–'),
    approximate: degree.ratio === null,
    cents: centsText(degree.cents),
    step: sizeText(degree.step),
    note: degree.nearestNote.name,
    offset: signedCentsText(degree.nearestNote.offsetCents),
    hz: (rootHz * 2 ** (degree.cents / 1200)).toFixed(3),
    fifthBeats: beatsText(degree.fifth),
    thirdBeats: beatsText(degree.majorThird),
  };
}

/** Every degree of the scale: its name, ratio, cents, the step up from it, its nearest note and pitch. */
@Component({
  selector: 'app-degree-table',
  changeDetection: ChangeDetectionStrategy.OnPush,
  imports: [MatTableModule],
  template: `
    <div class="scroller" tabindex="0" role="region" aria-label="Degrees, scrolls sideways">
      <table mat-table [dataSource]="rows()" [trackBy]="trackDegree" class="degrees">
        <caption class="visually-hidden">
          Degrees of the scale played from
          {{
            rootHz().toFixed(3)
          }}
          Hz
        </caption>
        <!--
          The degree and its name stay in view while the table scrolls sideways on a phone: sticky by CSS (styles
          below), with the degree column's width fixed, rather than by the table's sticky columns, which measure and
          restyle every row's cells on every keystroke.
        -->
        <ng-container matColumnDef="degree">
          <th mat-header-cell *matHeaderCellDef scope="col">Degree</th>
          <td mat-cell *matCellDef="let row">{{ row.degree }}</td>
        </ng-container>
        <ng-container matColumnDef="name">
          <th mat-header-cell *matHeaderCellDef scope="col">Name</th>
          <td mat-cell *matCellDef="let row">{{ row.name }}</td>
        </ng-container>
        <ng-container matColumnDef="ratio">
          <th mat-header-cell *matHeaderCellDef scope="col">Ratio</th>
          <td mat-cell *matCellDef="let row" [class.approximate]="row.approximate">
            {{ row.ratio }}
          </td>
        </ng-container>
        <ng-container matColumnDef="cents">
          <th mat-header-cell *matHeaderCellDef scope="col">Cents</th>
          <td mat-cell *matCellDef="let row">{{ row.cents }}</td>
        </ng-container>
        <ng-container matColumnDef="step">
          <th mat-header-cell *matHeaderCellDef scope="col">Step up</th>
          <td mat-cell *matCellDef="let row">{{ row.step }}</td>
        </ng-container>
        <ng-container matColumnDef="note">
          <th mat-header-cell *matHeaderCellDef scope="col">Nearest note</th>
          <td mat-cell *matCellDef="let row">{{ row.note }}</td>
        </ng-container>
        <ng-container matColumnDef="offset">
          <th mat-header-cell *matHeaderCellDef scope="col">Offset</th>
          <td mat-cell *matCellDef="let row">{{ row.offset }}</td>
        </ng-container>
        <ng-container matColumnDef="hz">
          <th mat-header-cell *matHeaderCellDef scope="col">Hz</th>
          <td mat-cell *matCellDef="let row">{{ row.hz }}</td>
        </ng-container>
        <ng-container matColumnDef="fifthBeats">
          <th mat-header-cell *matHeaderCellDef scope="col">
            <abbr title="Beats per second of the fifth above">Fifth beats</abbr>
          </th>
          <td mat-cell *matCellDef="let row">{{ row.fifthBeats }}</td>
        </ng-container>
        <ng-container matColumnDef="thirdBeats">
          <th mat-header-cell *matHeaderCellDef scope="col">
            <abbr title="Beats per second of the major third above">Third beats</abbr>
          </th>
          <td mat-cell *matCellDef="let row">{{ row.thirdBeats }}</td>
        </ng-container>
        <tr mat-header-row *matHeaderRowDef="columns"></tr>
        <tr mat-row *matRowDef="let row; columns: columns"></tr>
      </table>
    </div>
  `,
  styles: `
    .scroller {
      overflow-x: auto;
      max-width: 100%;
    }
    .degrees {
      min-width: 640px;
      font-variant-numeric: tabular-nums;
    }
    .mat-mdc-cell,
    .mat-mdc-header-cell {
      padding: 0 10px;
      white-space: nowrap;
    }
    /* Sticky only when the table is wider than its box and scrolls; at full width they would cost every frame. */
    .scroller {
      container-type: inline-size;
    }
    @container (max-width: 639px) {
      .mat-column-degree,
      .mat-column-name {
        position: sticky;
        z-index: 1;
        background: var(--mat-sys-surface);
      }
      .mat-column-degree {
        left: 0;
        box-sizing: border-box;
        width: 76px;
        min-width: 76px;
        max-width: 76px;
      }
      .mat-column-name {
        left: 76px;
      }
    }
    .approximate {
      color: var(--mat-sys-on-surface-variant);
      font-style: italic;
    }
    abbr {
      text-decoration: none;
    }
  `,
})
export class DegreeTable {
  readonly degrees = input.required<PreviewDegree[]>();
  readonly rootHz = input.required<number>();
  protected readonly columns = [
    'degree',
    'name',
    'ratio',
    'cents',
    'step',
    'note',
    'offset',
    'hz',
    'fifthBeats',
    'thirdBeats',
  ];
  protected readonly trackDegree = (_index: number, row: DegreeRow) => row.degree;
  protected readonly rows = computed(() =>
    this.degrees().map((degree) => rowOf(degree, this.rootHz())),
  );
}
