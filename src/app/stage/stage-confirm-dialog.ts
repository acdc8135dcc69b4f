import { ChangeDetectionStrategy, Component, inject } from '@angular/core';
import { MatButtonModule } from '@angular/material/button';
import { MAT_DIALOG_DATA, MatDialogModule } from '@angular/material/dialog';

/** One instrument a stage send overwrites, and what on it. */
export interface StageOverwrite {
  name: string;
  port: string;
  replaces: string;
}

/** The one question before the stage first sends tunings: what each instrument loses. */
@Component({
  selector: 'app-stage-confirm-dialog',
  changeDetection: ChangeDetectionStrategy.OnPush,
  imports: [MatDialogModule, MatButtonModule],
  template: `
    <h2 mat-dialog-title>Send each tuning to your instruments?</h2>
    <mat-dialog-content>
      <p>From now on, every move of the stage overwrites, without asking again:</p>
      <ul>
        @for (item of data; track item.port + item.name) {
          <li>
            <strong>{{ item.name }}</strong> on "{{ item.port }}": {{ item.replaces }}
          </li>
        }
      </ul>
      <p>Whatever those hold now is lost. Back them up first if you need them.</p>
    </mat-dialog-content>
    <mat-dialog-actions align="end">
      <button mat-button type="button" [mat-dialog-close]="false">Don't send</button>
      <button mat-flat-button type="button" class="send" [mat-dialog-close]="true">
        Send and replace
      </button>
    </mat-dialog-actions>
  `,
})
export class StageConfirmDialog {
  protected readonly data = inject<StageOverwrite[]>(MAT_DIALOG_DATA);
}
