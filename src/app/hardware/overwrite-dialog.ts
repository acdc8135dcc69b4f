import { Component, inject } from '@angular/core';
import { MatButtonModule } from '@angular/material/button';
import { MAT_DIALOG_DATA, MatDialogModule } from '@angular/material/dialog';

/** What a send is about to replace on the instrument. */
export interface OverwriteQuestion {
  portName: string;
  /** Null for the scale/octave forms, which retune channels rather than a stored program. */
  program: number | null;
  bank: number | null;
}

/** Asks before a send replaces a tuning program on the instrument, and suggests a backup or a free program. */
@Component({
  selector: 'app-overwrite-dialog',
  imports: [MatDialogModule, MatButtonModule],
  template: `
    <h2 mat-dialog-title>Replace the tuning on {{ data.portName }}?</h2>
    <mat-dialog-content>
      @if (data.program !== null) {
        <p>
          This overwrites <strong>tuning program {{ data.program }}@if (data.bank !== null) { in bank {{ data.bank }}}</strong>
          on the instrument. Whatever that program holds now is lost.
        </p>
        <p>Back it up first (a dump from the instrument), or choose a tuning program that is free.</p>
      } @else {
        <p>This replaces the scale/octave tuning of all 16 channels on the instrument at once.</p>
        <p>Note its current tuning first if you want to return to it.</p>
      }
    </mat-dialog-content>
    <mat-dialog-actions align="end">
      <button mat-button type="button" [mat-dialog-close]="false">Cancel</button>
      <button mat-flat-button type="button" [mat-dialog-close]="true">Send and replace</button>
    </mat-dialog-actions>
  `,
})
export class OverwriteDialog {
  protected readonly data = inject<OverwriteQuestion>(MAT_DIALOG_DATA);
}
