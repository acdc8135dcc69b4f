import { ChangeDetectionStrategy, Component, inject } from '@angular/core';
import { MatButtonModule } from '@angular/material/button';
import { MAT_DIALOG_DATA, MatDialogModule } from '@angular/material/dialog';
import type { SendPlan } from './send-to-all';

/** One confirmation for a send to several instruments: what each one will have replaced, and who is left out. */
@Component({
  selector: 'app-send-all-dialog',
  changeDetection: ChangeDetectionStrategy.OnPush,
  imports: [MatDialogModule, MatButtonModule],
  template: `
    <h2 mat-dialog-title>Replace the tuning on {{ count() }}?</h2>
    <mat-dialog-content>
      @if (data.sends.length) {
        <p>Each instrument gets the tuning in its own form. Whatever these hold now is lost:</p>
        <ul class="sends" aria-label="What each instrument will have replaced">
          @for (send of data.sends; track send.portId + send.instrument) {
            <li>
              <strong>{{ send.instrument }}</strong> on {{ send.portName }}: replaces
              {{ send.replaces }} ({{ send.bytes }} bytes)
            </li>
          }
        </ul>
        <p class="hint">
          To keep a copy of a program first, send to that instrument alone and back it up there.
        </p>
      } @else {
        <p>None of your instruments can be sent to now.</p>
      }
      @if (data.skipped.length) {
        <p>Left out:</p>
        <ul class="skipped" aria-label="Instruments left out">
          @for (skip of data.skipped; track $index) {
            <li>
              <strong>{{ skip.instrument }}</strong> {{ skip.reason }}
            </li>
          }
        </ul>
      }
    </mat-dialog-content>
    <mat-dialog-actions align="end">
      <button mat-button type="button" [mat-dialog-close]="false">Cancel</button>
      @if (data.sends.length) {
        <button mat-flat-button type="button" class="send" [mat-dialog-close]="true">
          Send and replace
        </button>
      }
    </mat-dialog-actions>
  `,
  styles: `
    ul {
      padding-left: 20px;
      margin: 0 0 12px;
    }
    li {
      margin: 4px 0;
      overflow-wrap: anywhere;
    }
    p {
      max-width: 52ch;
    }
    .hint {
      font: var(--mat-sys-body-small);
      color: var(--mat-sys-on-surface-variant);
    }
  `,
})
export class SendAllDialog {
  protected readonly data = inject<SendPlan>(MAT_DIALOG_DATA);

  protected count(): string {
    const n = this.data.sends.length;
    return n === 1 ? '1 instrument' : `${n} instruments`;
  }
}
