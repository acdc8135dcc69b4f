import { ChangeDetectionStrategy, Component, inject, signal } from '@angular/core';
import { MatButtonModule } from '@angular/material/button';
import { MAT_DIALOG_DATA, MatDialogModule } from '@angular/material/dialog';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { RouterLink } from '@angular/router';
import type { BackupOutcome } from './tuning-backup';

/** What a send is about to replace on the instrument. */
export interface OverwriteQuestion {
  portName: string;
  /** Null for the scale/octave forms, which retune channels rather than a stored program. */
  program: number | null;
  bank: number | null;
  /**
   * Asks the instrument for the program's tuning and keeps it; null when no input from the instrument is chosen,
   * with `noBackup` saying why.
   */
  backUp: (() => Promise<BackupOutcome>) | null;
  noBackup: string | null;
}

/**
 * Asks before a send replaces a tuning program on the instrument, and offers to back that program up first over
 * MIDI. The send goes ahead only when the player presses send, whatever the backup gave.
 */
@Component({
  selector: 'app-overwrite-dialog',
  changeDetection: ChangeDetectionStrategy.OnPush,
  imports: [MatDialogModule, MatButtonModule, MatProgressBarModule, RouterLink],
  template: `
    <h2 mat-dialog-title>Replace the tuning on {{ data.portName }}?</h2>
    <mat-dialog-content>
      @if (data.program !== null) {
        <p>
          This overwrites
          <strong
            >tuning program {{ data.program }}
            @if (data.bank !== null) {
              in bank {{ data.bank }}
            }
          </strong>
          on the instrument. Whatever that program holds now is lost.
        </p>
        @if (data.backUp) {
          @if (outcome(); as outcome) {
            @if (outcome.kind === 'kept') {
              <p class="backed-up" role="status">
                {{ outcome.message }}
                <a [routerLink]="['/design', outcome.presetId]" target="_blank">Open the backup</a>
              </p>
            } @else if (outcome.kind === 'downloaded') {
              <p class="backed-up" role="status">{{ outcome.message }}</p>
            } @else {
              <p class="no-answer" role="alert">{{ outcome.message }}</p>
              <p>
                Send only if you do not need what program {{ data.program }} holds, or choose a free
                program in the output settings.
              </p>
            }
          } @else if (asking()) {
            <p role="status">Asking {{ data.portName }} for tuning program {{ data.program }}…</p>
            <mat-progress-bar
              mode="indeterminate"
              aria-label="Waiting for the instrument's answer"
            />
          } @else {
            <p>
              Keep a copy first: the instrument is asked for what program {{ data.program }} holds
              now.
            </p>
            <button mat-stroked-button type="button" class="back-up" (click)="backUp()">
              Back up the instrument's tuning first
            </button>
          }
        } @else {
          <p>Back it up first, or choose a tuning program that is free. {{ data.noBackup }}</p>
        }
      } @else {
        <p>This replaces the scale/octave tuning of all 16 channels on the instrument at once.</p>
        <p>Note its current tuning first if you want to return to it.</p>
      }
    </mat-dialog-content>
    <mat-dialog-actions align="end">
      <button mat-button type="button" [mat-dialog-close]="false">Cancel</button>
      <button
        mat-flat-button
        type="button"
        class="send"
        [mat-dialog-close]="true"
        [disabled]="asking()"
      >
        {{ withoutBackup() ? 'Send without a backup' : 'Send and replace' }}
      </button>
    </mat-dialog-actions>
  `,
})
export class OverwriteDialog {
  protected readonly data = inject<OverwriteQuestion>(MAT_DIALOG_DATA);
  protected readonly asking = signal(false);
  protected readonly outcome = signal<BackupOutcome | null>(null);

  /** Whether the backup was tried and gave nothing: the send button then says so. */
  protected withoutBackup(): boolean {
    const kind = this.outcome()?.kind;
    return kind === 'silent' || kind === 'failed';
  }

  protected async backUp(): Promise<void> {
    if (!this.data.backUp || this.asking()) return;
    this.asking.set(true);
    try {
      this.outcome.set(await this.data.backUp());
    } finally {
      this.asking.set(false);
    }
  }
}
