import { ChangeDetectionStrategy, Component, inject, signal } from '@angular/core';
import { MatDialogModule, MatDialogRef } from '@angular/material/dialog';
import type { InstrumentSettings } from '@shared/api/instruments';
import { apiErrorMessage } from '../api/api-error';
import { InstrumentForm } from './instrument-form';
import { type MyInstrument, MyInstruments } from './my-instruments';

/** Sets up one instrument where it is needed (a download, a share link); closes with it once kept. */
@Component({
  selector: 'app-instrument-dialog',
  changeDetection: ChangeDetectionStrategy.OnPush,
  imports: [MatDialogModule, InstrumentForm],
  template: `
    <h2 mat-dialog-title>Set up an instrument</h2>
    <mat-dialog-content>
      <p class="about">
        @if (store.keptIn() === 'account') {
          It is kept with your account, under My instruments.
        } @else {
          No account needed: it is kept in this browser only.
        }
      </p>
      <app-instrument-form
        label="New instrument"
        [busy]="busy()"
        (saved)="add($event)"
        (cancelled)="ref.close()"
      />
      @if (failure(); as message) {
        <p class="failure" role="alert">{{ message }}</p>
      }
    </mat-dialog-content>
  `,
  styles: `
    .about {
      margin: 0 0 12px;
      color: var(--mat-sys-on-surface-variant);
    }
    .failure {
      color: var(--mat-sys-error);
    }
  `,
})
export class InstrumentDialog {
  protected readonly store = inject(MyInstruments);
  protected readonly ref = inject<MatDialogRef<InstrumentDialog, MyInstrument>>(MatDialogRef);
  protected readonly busy = signal(false);
  protected readonly failure = signal<string | null>(null);

  protected async add(settings: InstrumentSettings): Promise<void> {
    this.busy.set(true);
    this.failure.set(null);
    try {
      this.ref.close(await this.store.add(settings));
    } catch (error) {
      this.failure.set(await apiErrorMessage(error, 'The instrument could not be kept.'));
    } finally {
      this.busy.set(false);
    }
  }
}
