import { ChangeDetectionStrategy, Component, computed, inject } from '@angular/core';
import { FormsModule } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatDialog } from '@angular/material/dialog';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatInputModule } from '@angular/material/input';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { MatSelectModule } from '@angular/material/select';
import { MatSlideToggleModule } from '@angular/material/slide-toggle';
import { firstValueFrom } from 'rxjs';
import { InstrumentSend } from '../instruments/instrument-send';
import { LiveFollow } from './live-follow';
import { MidiAccess, midiAccessFaults } from './midi-access';
import { OverwriteDialog, type OverwriteQuestion } from './overwrite-dialog';
import { type MessageFormId, messageForms } from './tuning-messages';
import { TuningBackup } from './tuning-backup';
import { TuningSender } from './tuning-sender';

/** Every byte as two hex digits, a message a line. */
function hexLines(messages: Uint8Array[]): string {
  return messages
    .map((message) =>
      Array.from(message, (byte) => byte.toString(16).toUpperCase().padStart(2, '0')).join(' '),
    )
    .join('\n');
}

/** Putting the tuning into a connected instrument over Web MIDI, once or following every edit. */
@Component({
  selector: 'app-send-panel',
  changeDetection: ChangeDetectionStrategy.OnPush,
  imports: [
    FormsModule,
    MatButtonModule,
    MatFormFieldModule,
    MatInputModule,
    MatProgressBarModule,
    MatSelectModule,
    MatSlideToggleModule,
    InstrumentSend,
  ],
  templateUrl: './send-panel.html',
  styleUrl: './send-panel.scss',
})
export class SendPanel {
  protected readonly midi = inject(MidiAccess);
  protected readonly sender = inject(TuningSender);
  protected readonly follow = inject(LiveFollow);
  protected readonly backup = inject(TuningBackup);
  private readonly dialog = inject(MatDialog);
  protected readonly forms = messageForms;
  protected readonly accessFault = computed(() => midiAccessFaults[this.midi.state()] ?? null);
  protected readonly hex = computed(() => {
    const built = this.sender.messages();
    return built.ok ? hexLines(built.messages) : '';
  });
  protected readonly byteCount = computed(() => {
    const built = this.sender.messages();
    return built.ok ? built.messages.reduce((sum, message) => sum + message.length, 0) : 0;
  });
  protected readonly usesProgram = computed(() => !this.sender.form().startsWith('mts-octave'));
  protected readonly usesBank = computed(
    () =>
      this.sender.form() === 'mts-bulk-bank' ||
      (this.sender.form() === 'mts-notes' && this.sender.bank() !== 0),
  );
  /** Where the send goes, in one sentence: "To device 16, tuning program 5, bank 2." */
  protected readonly target = computed(() => {
    const device = this.sender.deviceId();
    const parts = [`To device ${device}${device === 127 ? ' (every device)' : ''}`];
    if (this.usesProgram()) parts.push(`tuning program ${this.sender.program()}`);
    if (this.usesBank()) parts.push(`bank ${this.sender.bank()}`);
    return `${parts.join(', ')}.`;
  });

  protected async connectMidi(): Promise<void> {
    if (!(await this.midi.open())) return;
    const first = this.midi.outputs()[0];
    if (first && !this.sender.outputId()) this.sender.outputId.set(first.id);
  }

  protected chooseForm(form: MessageFormId): void {
    this.sender.form.set(form);
  }

  protected numberFrom(text: string | number, fallback: number, highest = 127): number {
    const value = Number(text);
    return Number.isFinite(value) ? Math.min(highest, Math.max(0, Math.round(value))) : fallback;
  }

  protected async confirmAndSend(): Promise<void> {
    const port = this.midi.outputs().find((candidate) => candidate.id === this.sender.outputId());
    const canBackUp = this.usesProgram() && this.backup.inputId() !== null;
    const question: OverwriteQuestion = {
      portName: port?.name ?? 'the instrument',
      program: this.usesProgram() ? this.sender.program() : null,
      bank: this.usesBank() ? this.sender.bank() : null,
      backUp: canBackUp ? () => this.backup.backUp() : null,
      noBackup: this.midi.inputs().length
        ? 'To back it up from here, choose the instrument under "Answers from (MIDI input)".'
        : "To back it up from here, connect the instrument's MIDI output to this computer too.",
    };
    const answer = await firstValueFrom(
      this.dialog.open(OverwriteDialog, { data: question }).afterClosed(),
    );
    if (answer === true) await this.sender.send();
  }

  protected switchLiveFollow(on: boolean): void {
    if (on) this.follow.start();
    else this.follow.stop();
  }
}
