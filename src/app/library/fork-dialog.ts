import { ChangeDetectionStrategy, Component, inject, signal } from '@angular/core';
import { FormsModule } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MAT_DIALOG_DATA, MatDialogModule } from '@angular/material/dialog';
import { MatRadioModule } from '@angular/material/radio';

export interface ForkTarget {
  /** null is my own library. */
  bandId: string | null;
  label: string;
}

export interface ForkDialogData {
  name: string;
  targets: ForkTarget[];
}

/** Asks where a fork goes: my library or a band where I may save. Closes with `{ bandId }`. */
@Component({
  selector: 'app-fork-dialog',
  changeDetection: ChangeDetectionStrategy.OnPush,
  imports: [MatDialogModule, MatButtonModule, MatRadioModule, FormsModule],
  template: `
    <h2 mat-dialog-title>Fork “{{ data.name }}”</h2>
    <mat-dialog-content>
      <p id="fork-where">
        A fork is a copy of the latest revision with a history of its own. Where should it go?
      </p>
      <mat-radio-group class="targets" aria-labelledby="fork-where" [(ngModel)]="chosen">
        @for (target of data.targets; track target.bandId) {
          <mat-radio-button [value]="target.bandId">{{ target.label }}</mat-radio-button>
        }
      </mat-radio-group>
    </mat-dialog-content>
    <mat-dialog-actions align="end">
      <button mat-button mat-dialog-close>Cancel</button>
      <button mat-flat-button [mat-dialog-close]="{ bandId: chosen() }">Fork</button>
    </mat-dialog-actions>
  `,
  styles: `
    p {
      max-width: 48ch;
      margin-top: 0;
    }
    .targets {
      display: flex;
      flex-direction: column;
    }
  `,
})
export class ForkDialog {
  protected readonly data = inject<ForkDialogData>(MAT_DIALOG_DATA);
  protected readonly chosen = signal<string | null>(null);
}
