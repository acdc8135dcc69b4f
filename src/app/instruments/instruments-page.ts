import { ChangeDetectionStrategy, Component, inject, signal } from '@angular/core';
import { MatButtonModule } from '@angular/material/button';
import { MatDialog } from '@angular/material/dialog';
import { MatIconModule } from '@angular/material/icon';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import type { InstrumentSettings } from '@shared/api/instruments';
import { firstValueFrom } from 'rxjs';
import { apiErrorMessage } from '../api/api-error';
import { ConfirmDialog, type ConfirmDialogData } from '../library/confirm-dialog';
import { SignInPrompt } from '../library/sign-in-prompt';
import { InstrumentForm } from './instrument-form';
import { type MyInstrument, MyInstruments, instrumentSummary } from './my-instruments';

/** The player's instruments: how each takes a tuning, to send and download "for my instrument". */
@Component({
  selector: 'app-instruments-page',
  changeDetection: ChangeDetectionStrategy.OnPush,
  imports: [MatButtonModule, MatIconModule, MatProgressBarModule, InstrumentForm, SignInPrompt],
  template: `
    <h1>My instruments</h1>
    <p class="about">
      How each of your instruments takes a tuning. Wherever you send or download a tuning "for my
      instrument", its settings stand in for the preset's output settings; the preset itself is not
      changed.
    </p>
    @if (store.keptIn() === 'browser') {
      <p class="note">
        You are not signed in, so these instruments are kept in this browser only. Signed in, they
        follow you to any browser.
      </p>
      <app-sign-in-prompt label="Sign in to keep instruments in your account" />
    }
    @if (store.failure(); as message) {
      <p class="failure" role="alert">{{ message }}</p>
    }
    @if (store.list(); as instruments) {
      @if (instruments.length) {
        <ul class="instruments" aria-label="Your instruments">
          @for (instrument of instruments; track instrument.id) {
            <li>
              @if (editing() === instrument.id) {
                <app-instrument-form
                  [instrument]="instrument"
                  [label]="'Change ' + instrument.name"
                  submitLabel="Save changes"
                  [busy]="busy()"
                  (saved)="save(instrument, $event)"
                  (cancelled)="editing.set(null)"
                />
              } @else {
                <div class="row">
                  <div class="text">
                    <span class="name">{{ instrument.name }}</span>
                    <span class="summary">{{ summary(instrument) }}</span>
                  </div>
                  <button
                    mat-icon-button
                    type="button"
                    (click)="edit(instrument)"
                    [attr.aria-label]="'Change ' + instrument.name"
                  >
                    <mat-icon aria-hidden="true">edit</mat-icon>
                  </button>
                  <button
                    mat-icon-button
                    type="button"
                    (click)="remove(instrument)"
                    [attr.aria-label]="'Delete ' + instrument.name"
                  >
                    <mat-icon aria-hidden="true">delete</mat-icon>
                  </button>
                </div>
              }
            </li>
          }
        </ul>
      } @else {
        <p class="empty">
          No instruments yet. Add the first one: its name and how it takes a tuning.
        </p>
      }
      @if (editing() === 'new') {
        <section class="adding" aria-labelledby="adding-heading">
          <h2 id="adding-heading">New instrument</h2>
          <app-instrument-form
            label="New instrument"
            [busy]="busy()"
            (saved)="add($event)"
            (cancelled)="editing.set(null)"
          />
        </section>
      } @else {
        <button mat-flat-button type="button" class="add" (click)="edit(null)">
          <mat-icon aria-hidden="true">add</mat-icon>
          Add an instrument
        </button>
      }
      @if (failure(); as message) {
        <p class="failure" role="alert">{{ message }}</p>
      }
    } @else {
      <mat-progress-bar mode="indeterminate" aria-label="Loading your instruments" />
    }
  `,
  styles: `
    :host {
      display: block;
      max-width: 720px;
    }
    h1 {
      font: var(--mat-sys-headline-small);
      margin: 8px 0;
    }
    h2 {
      font: var(--mat-sys-title-medium);
      margin: 0 0 8px;
    }
    .about,
    .note {
      max-width: 64ch;
      color: var(--mat-sys-on-surface-variant);
    }
    .failure {
      color: var(--mat-sys-error);
    }
    .instruments {
      list-style: none;
      padding: 0;
      margin: 0 0 16px;
    }
    .instruments li {
      padding: 8px 0;
      border-bottom: 1px solid var(--mat-sys-outline-variant);
    }
    .row {
      display: flex;
      align-items: center;
      gap: 4px;
    }
    .text {
      flex: 1;
      min-width: 0;
      display: flex;
      flex-direction: column;
    }
    .name {
      font: var(--mat-sys-title-small);
      overflow-wrap: anywhere;
    }
    .summary {
      font: var(--mat-sys-body-small);
      color: var(--mat-sys-on-surface-variant);
      overflow-wrap: anywhere;
    }
    .adding {
      padding: 16px;
      border-radius: var(--mat-sys-corner-medium);
      background: var(--mat-sys-surface-container-low);
    }
  `,
})
export class InstrumentsPage {
  protected readonly store = inject(MyInstruments);
  private readonly dialog = inject(MatDialog);

  /** The instrument whose form is open, 'new' for the new one's. */
  protected readonly editing = signal<string | null>(null);
  protected readonly busy = signal(false);
  protected readonly failure = signal<string | null>(null);
  protected readonly summary = instrumentSummary;

  constructor() {
    this.store.load();
  }

  protected edit(instrument: MyInstrument | null): void {
    this.failure.set(null);
    this.editing.set(instrument?.id ?? 'new');
  }

  protected add(settings: InstrumentSettings): Promise<void> {
    return this.run(() => this.store.add(settings), 'The instrument could not be added.');
  }

  protected save(instrument: MyInstrument, settings: InstrumentSettings): Promise<void> {
    return this.run(
      () => this.store.update(instrument.id, settings),
      'The changes could not be saved.',
    );
  }

  protected async remove(instrument: MyInstrument): Promise<void> {
    const data: ConfirmDialogData = {
      title: `Delete ${instrument.name}?`,
      message: 'Its settings are gone from Keyloom; nothing on the instrument itself changes.',
      confirm: 'Delete instrument',
    };
    const dialog = this.dialog.open<ConfirmDialog, ConfirmDialogData, boolean>(ConfirmDialog, {
      data,
    });
    if ((await firstValueFrom(dialog.afterClosed())) === true)
      await this.run(
        () => this.store.remove(instrument.id),
        'The instrument could not be deleted.',
      );
  }

  private async run(change: () => Promise<unknown>, fallback: string): Promise<void> {
    this.busy.set(true);
    this.failure.set(null);
    try {
      await change();
      this.editing.set(null);
    } catch (error) {
      this.failure.set(await apiErrorMessage(error, fallback));
    } finally {
      this.busy.set(false);
    }
  }
}
