import { DOCUMENT } from '@angular/common';
import { ChangeDetectionStrategy, Component, computed, inject, input, signal } from '@angular/core';
import { MatButtonModule } from '@angular/material/button';
import { MatIconModule } from '@angular/material/icon';
import type { PreviewKey } from '@shared/tuning/preview';
import { noteName } from '@shared/tuning/twelve-edo';
import { signedCentsText } from '../scale/cents-text';

interface KeyRow {
  key: number;
  note: string;
  degree: string;
  hz: string;
  offset: string;
  mapped: boolean;
}

/** Every one of the 128 keys: its note, the degree it plays, its pitch and its distance from 12-tone equal; printable. */
@Component({
  selector: 'app-key-table',
  changeDetection: ChangeDetectionStrategy.OnPush,
  imports: [MatButtonModule, MatIconModule],
  template: `
    <details [open]="open()" (toggle)="open.set(details.open)" #details>
      <summary>Table of all 128 keys</summary>
      <button mat-stroked-button type="button" class="print" (click)="print()">
        <mat-icon aria-hidden="true">print</mat-icon> Print the key table
      </button>
      @if (open()) {
        <table class="keys">
          <caption>
            Every key: the degree it plays, its pitch, and cents from its 12-tone equal-tempered
            pitch
          </caption>
          <thead>
            <tr>
              <th scope="col">Key</th>
              <th scope="col">Note</th>
              <th scope="col">Degree</th>
              <th scope="col">Hz</th>
              <th scope="col">Cents from 12-TET</th>
              <th scope="col">Mapped</th>
            </tr>
          </thead>
          <tbody>
            @for (row of rows(); track row.key) {
              <tr [class.unmapped]="!row.mapped">
                <th scope="row">{{ row.key }}</th>
                <td>{{ row.note }}</td>
                <td>{{ row.degree }}</td>
                <td class="number">{{ row.hz }}</td>
                <td class="number">{{ row.offset }}</td>
                <td>{{ row.mapped ? 'yes' : 'no' }}</td>
              </tr>
            }
          </tbody>
        </table>
      }
    </details>
  `,
  styles: `
    :host {
      display: block;
      margin-top: 16px;
    }
    summary {
      font: var(--mat-sys-title-small);
      cursor: pointer;
    }
    .print {
      margin: 8px 0;
    }
    .keys {
      border-collapse: collapse;
      font-variant-numeric: tabular-nums;
      font: var(--mat-sys-body-small);
    }
    .keys caption {
      text-align: left;
      margin-bottom: 4px;
      color: var(--mat-sys-on-surface-variant);
    }
    .keys th,
    .keys td {
      padding: 2px 12px 2px 0;
      text-align: left;
      border-bottom: 1px solid var(--mat-sys-outline-variant);
    }
    .number {
      text-align: right;
    }
    .unmapped {
      color: var(--mat-sys-on-surface-variant);
    }
  `,
})
export class KeyTable {
  private readonly document = inject(DOCUMENT);
  readonly keys = input.required<PreviewKey[]>();
  /** The 128 rows are drawn only while the table is open. */
  protected readonly open = signal(false);
  protected readonly rows = computed<KeyRow[]>(() =>
    this.keys().map((entry) => {
      const mapped = entry.degree !== null && entry.hz !== null;
      return {
        key: entry.key,
        note: noteName(entry.key),
        degree: mapped ? String(entry.degree) : '–',
        hz: mapped ? entry.hz!.toFixed(3) : '–',
        offset: mapped && entry.centsFrom12 !== null ? signedCentsText(entry.centsFrom12, 2) : '–',
        mapped,
      };
    }),
  );

  /** Prints the table alone: the page marks itself so that the print styles hide everything else. */
  protected print(): void {
    this.open.set(true);
    const body = this.document.body;
    body.classList.add('printing-key-table');
    const done = () => body.classList.remove('printing-key-table');
    this.document.defaultView?.addEventListener('afterprint', done, { once: true });
    setTimeout(() => this.document.defaultView?.print());
  }
}
