import { ChangeDetectionStrategy, Component, inject, signal } from '@angular/core';
import { MatButtonModule } from '@angular/material/button';
import { MatDialog } from '@angular/material/dialog';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatSelectModule } from '@angular/material/select';
import { firstValueFrom } from 'rxjs';
import { DesignState } from '../design/design-state';
import { MidiAccess } from '../hardware/midi-access';
import { TuningSender } from '../hardware/tuning-sender';
import { type MyInstrument, MyInstruments, receiveFormLabels } from './my-instruments';
import { SendAllDialog } from './send-all-dialog';
import { type SendPlan, isMessageForm, planSends, sendAll } from './send-to-all';

/**
 * The send panel's part for the player's own instruments: one chosen to aim the send at (its form, device id,
 * program, bank and port, the design untouched), or the tuning sent to all of them that are connected at once.
 */
@Component({
  selector: 'app-instrument-send',
  changeDetection: ChangeDetectionStrategy.OnPush,
  imports: [MatButtonModule, MatFormFieldModule, MatSelectModule],
  template: `
    <div class="instrument-send">
      <mat-form-field class="chooser" subscriptSizing="dynamic">
        <mat-label>For my instrument</mat-label>
        <mat-select [value]="chosenId()" (valueChange)="choose($event)">
          <mat-option [value]="null">The design's output settings</mat-option>
          @for (instrument of store.list() ?? []; track instrument.id) {
            @let sendable = isMessageForm(instrument.receives);
            <mat-option [value]="instrument.id" [disabled]="!sendable">
              {{ sendable ? instrument.name : optionOf(instrument) }}
            </mat-option>
          }
        </mat-select>
        <mat-hint
          >Its message form, device id, program, bank and port for this send; the design stays as it
          is</mat-hint
        >
      </mat-form-field>
      <button
        mat-stroked-button
        type="button"
        class="send-all"
        (click)="sendToAll()"
        [disabled]="sending() || !store.list()?.length"
      >
        Send to all my connected instruments
      </button>
    </div>
    @if (note(); as note) {
      <p class="note" role="status">{{ note }}</p>
    }
    @if (outcomes().length) {
      <ul class="outcomes" role="status" aria-label="Sent to my instruments">
        @for (outcome of outcomes(); track $index) {
          <li [class.failed]="!outcome.sent">{{ outcome.text }}</li>
        }
      </ul>
    }
  `,
  styles: `
    :host {
      display: block;
      margin: 0 0 12px;
    }
    .instrument-send {
      display: flex;
      flex-wrap: wrap;
      align-items: center;
      gap: 8px 16px;
    }
    .chooser {
      flex: 1 1 260px;
      min-width: 0;
    }
    .send-all {
      white-space: normal;
      height: auto;
      min-height: 40px;
    }
    .note,
    .outcomes {
      font: var(--mat-sys-body-small);
      margin: 8px 0 0;
    }
    .outcomes {
      padding-left: 20px;
    }
    .failed {
      color: var(--mat-sys-error);
    }
  `,
})
export class InstrumentSend {
  protected readonly store = inject(MyInstruments);
  private readonly sender = inject(TuningSender);
  private readonly midi = inject(MidiAccess);
  private readonly state = inject(DesignState);
  private readonly dialog = inject(MatDialog);
  protected readonly isMessageForm = isMessageForm;

  /** An instrument the panel cannot send to, named with what it takes instead. */
  protected optionOf(instrument: MyInstrument): string {
    return `${instrument.name} (takes ${receiveFormLabels[instrument.receives]}: download it)`;
  }

  protected readonly chosenId = signal<string | null>(null);
  protected readonly note = signal<string | null>(null);
  protected readonly sending = signal(false);
  protected readonly outcomes = signal<{ instrument: string; sent: boolean; text: string }[]>([]);

  constructor() {
    this.store.load();
  }

  protected choose(id: string | null): void {
    const instrument = this.store.list()?.find((candidate) => candidate.id === id);
    this.chosenId.set(instrument?.id ?? null);
    this.note.set(null);
    if (!instrument || !isMessageForm(instrument.receives)) {
      this.sender.instrumentTarget.set(null);
      return;
    }
    const { deviceId, program, bank, port } = instrument;
    this.sender.form.set(instrument.receives);
    this.sender.instrumentTarget.set({ deviceId, program, bank });
    const output = port
      ? this.midi.outputs().find((candidate) => candidate.name === port)
      : undefined;
    if (output) this.sender.outputId.set(output.id);
    else if (port)
      this.note.set(
        `${instrument.name}'s port, ${port}, is not connected: choose the MIDI output above.`,
      );
  }

  protected async sendToAll(): Promise<void> {
    const preset = this.state.shown()?.preset;
    if (!preset) {
      this.note.set('The design does not build yet.');
      return;
    }
    const plan: SendPlan = planSends(this.store.list() ?? [], this.midi.outputs(), preset);
    const dialog = this.dialog.open<SendAllDialog, SendPlan, boolean>(SendAllDialog, {
      data: plan,
      maxWidth: '560px',
    });
    if ((await firstValueFrom(dialog.afterClosed())) !== true) return;
    this.sending.set(true);
    this.outcomes.set([]);
    try {
      this.outcomes.set(await sendAll(plan.sends, this.midi));
    } finally {
      this.sending.set(false);
    }
  }
}
