import { ChangeDetectionStrategy, Component, inject, signal } from '@angular/core';
import { MatButtonModule } from '@angular/material/button';
import { MAT_DIALOG_DATA, MatDialogModule } from '@angular/material/dialog';
import { MatProgressBarModule } from '@angular/material/progress-bar';

/** One instrument a stage send overwrites, and what on it. */
export interface StageOverwrite {
  name: string;
  port: string;
  replaces: string;
  /** Whether it can be asked for what it holds: an MTS program form, and an input of the port's name. */
  canBackUp: boolean;
}

/** What backing up one instrument came to, in words. */
export interface StageBackup {
  port: string;
  name: string;
  backedUp: boolean;
  message: string;
}

export interface StageQuestion {
  overwrites: StageOverwrite[];
  /** Asks each instrument that can answer for the program about to be replaced, and keeps what it sends. */
  backUp: () => Promise<StageBackup[]>;
}

/**
 * The one question before the stage first sends tunings: what each instrument loses, with the offer to back up
 * first what can be backed up. Backing up never sends a tuning; only "Send and replace" does.
 */
@Component({
  selector: 'app-stage-confirm-dialog',
  changeDetection: ChangeDetectionStrategy.OnPush,
  imports: [MatDialogModule, MatButtonModule, MatProgressBarModule],
  template: `
    <h2 mat-dialog-title>Send each tuning to your instruments?</h2>
    <mat-dialog-content>
      <p>From now on, every move of the stage overwrites, without asking again:</p>
      <ul>
        @for (item of data.overwrites; track item.port + item.name) {
          <li>
            <strong>{{ item.name }}</strong> on "{{ item.port }}": {{ item.replaces }}
            @if (outcomeOf(item); as outcome) {
              <span class="outcome" [class.kept]="outcome.backedUp">{{ outcome.message }}</span>
            }
          </li>
        }
      </ul>
      @if (backingUp()) {
        <mat-progress-bar
          mode="indeterminate"
          aria-label="Asking the instruments for their tunings"
        />
      }
      <p class="advice" aria-live="polite">{{ advice() }}</p>
    </mat-dialog-content>
    <mat-dialog-actions align="end">
      <button mat-button type="button" [mat-dialog-close]="false">Don't send</button>
      @if (backable && !outcomes()) {
        <button
          mat-stroked-button
          type="button"
          class="back-up"
          [disabled]="backingUp()"
          (click)="backUp()"
        >
          Back up first
        </button>
      }
      <button
        mat-flat-button
        type="button"
        class="send"
        [disabled]="backingUp()"
        [mat-dialog-close]="true"
      >
        Send and replace
      </button>
    </mat-dialog-actions>
  `,
  styles: `
    .outcome {
      display: block;
      color: var(--mat-sys-error);
    }
    .outcome.kept {
      color: var(--mat-sys-on-surface-variant);
    }
  `,
})
export class StageConfirmDialog {
  protected readonly data = inject<StageQuestion>(MAT_DIALOG_DATA);
  protected readonly backable = this.data.overwrites.some((item) => item.canBackUp);
  protected readonly backingUp = signal(false);
  protected readonly outcomes = signal<StageBackup[] | null>(null);

  protected outcomeOf(item: StageOverwrite): StageBackup | undefined {
    return this.outcomes()?.find(
      (outcome) => outcome.port === item.port && outcome.name === item.name,
    );
  }

  protected advice(): string {
    if (this.backingUp()) return 'Asking each instrument for the tuning it holds (up to 3 s each)…';
    const outcomes = this.outcomes();
    if (!outcomes) {
      return this.backable
        ? 'Whatever those hold now is lost. "Back up first" asks each instrument that can answer for it.'
        : 'Whatever those hold now is lost. Back them up first if you need them.';
    }
    const missing = this.data.overwrites.length - outcomes.filter((o) => o.backedUp).length;
    return missing
      ? `${missing} of ${this.data.overwrites.length} could not be backed up: what they hold is lost if you send.`
      : 'Every instrument is backed up.';
  }

  protected async backUp(): Promise<void> {
    this.backingUp.set(true);
    try {
      this.outcomes.set(await this.data.backUp());
    } finally {
      this.backingUp.set(false);
    }
  }
}
