import { Injectable, computed, inject, linkedSignal, signal } from '@angular/core';
import { DesignState } from '../design/design-state';
import { MidiAccess } from './midi-access';
import { type MessageFormId, type SendTarget, cableMs, tuningMessages } from './tuning-messages';

export interface SendProgress {
  sent: number;
  total: number;
}

const portGone =
  'The MIDI port disappeared while sending: reconnect the instrument, choose the port again and resend.';

function wait(ms: number): Promise<void> {
  return new Promise((resolve) => setTimeout(resolve, ms));
}

/**
 * Sending the design to an instrument: the chosen output port, message form and target (device id,
 * program, bank: the preset's output settings), the messages themselves, and a paced
 * send with progress that stops with a clear message when the port goes away.
 */
@Injectable()
export class TuningSender {
  private readonly state = inject(DesignState);
  private readonly midi = inject(MidiAccess);
  private readonly output = computed(() => this.state.shown()?.preset.output);

  readonly outputId = signal<string | null>(null);
  readonly form = signal<MessageFormId>('mts-bulk');
  // Device id, program and bank live in one place, the design's output settings (or the instrument chosen for the
  // send): the warning, the hex preview and the bytes sent all read them from there.
  /** The instrument chosen "for my instrument": its target stands in for the output settings. */
  readonly instrumentTarget = signal<SendTarget | null>(null);
  private readonly aim = computed(() => this.instrumentTarget() ?? this.output());
  readonly deviceId = computed(() => this.aim()?.deviceId ?? 127);
  readonly program = computed(() => this.aim()?.program ?? 0);
  readonly bank = computed(() => this.aim()?.bank ?? 0);
  readonly target = computed<SendTarget>(() => ({
    deviceId: this.deviceId(),
    program: this.program(),
    bank: this.bank(),
  }));
  /** The messages for the current design, or why the form cannot carry it. */
  readonly messages = computed(() => {
    const preset = this.state.shown()?.preset;
    if (!preset) return { ok: false as const, fault: 'The design does not build yet.' };
    const built = tuningMessages(preset, this.form(), this.target());
    return built.ok
      ? { ok: true as const, messages: built.value }
      : { ok: false as const, fault: built.errors.map((error) => error.message).join(' ') };
  });
  /** The pause after each message: by default what a 31,250-baud cable needs to carry the longest one. */
  readonly pauseMs = linkedSignal(() => {
    const built = this.messages();
    const longest = built.ok ? Math.max(0, ...built.messages.map((message) => message.length)) : 0;
    return Math.round(cableMs(longest) * 100) / 100;
  });
  readonly progress = signal<SendProgress | null>(null);
  readonly sending = signal(false);
  readonly fault = signal<string | null>(null);
  readonly done = signal<string | null>(null);

  /** Sends the messages to the chosen port, one after another with the pause between. */
  async send(): Promise<boolean> {
    const built = this.messages();
    const id = this.outputId();
    this.fault.set(null);
    this.done.set(null);
    if (!built.ok) return this.stop(built.fault);
    if (!id || !this.midi.output(id)) return this.stop('Choose a connected MIDI output first.');
    this.sending.set(true);
    const total = built.messages.length;
    this.progress.set({ sent: 0, total });
    try {
      for (const [index, message] of built.messages.entries()) {
        if (!this.sendNow(message)) return this.stop(portGone);
        this.progress.set({ sent: index + 1, total });
        await wait(this.pauseMs());
      }
    } finally {
      this.sending.set(false);
    }
    const bytes = built.messages.reduce((sum, message) => sum + message.length, 0);
    this.done.set(`Sent ${total} message${total === 1 ? '' : 's'} (${bytes} bytes).`);
    return true;
  }

  /** Sends one message to the chosen port at once; false when the port is gone or refuses it. */
  sendNow(message: Uint8Array): boolean {
    const id = this.outputId();
    const port = id ? this.midi.output(id) : null;
    if (!port) return false;
    try {
      port.send(message);
      return true;
    } catch {
      return false;
    }
  }

  /** Records why sending stopped. */
  reportPortGone(): void {
    this.fault.set(portGone);
  }

  private stop(fault: string): false {
    this.fault.set(fault);
    return false;
  }
}
