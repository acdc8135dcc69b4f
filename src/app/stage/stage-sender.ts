import { Injectable, computed, effect, inject, signal } from '@angular/core';
import { MatDialog } from '@angular/material/dialog';
import type { Instrument, ReceiveForm } from '@shared/api/instruments';
import { presetForInstrument } from '@shared/api/preset-for-instrument';
import type { ResolvedPreset } from '@shared/preset/preset-document';
import { firstValueFrom } from 'rxjs';
import { MidiAccess } from '../hardware/midi-access';
import { TuningBackup } from '../hardware/tuning-backup';
import { type MessageFormId, messageForms, tuningMessages } from '../hardware/tuning-messages';
import {
  type StageBackup,
  StageConfirmDialog,
  type StageOverwrite,
  type StageQuestion,
} from './stage-confirm-dialog';

/** Where an instrument stands with the stage's tunings. */
export interface InstrumentStatus {
  instrument: Instrument;
  kind: 'cannot' | 'no-port' | 'waiting' | 'ready' | 'sent' | 'failed';
  /** What to tell the player, in words. */
  message: string;
}

const liveForms = new Set<string>(messageForms.map((form) => form.id));

/** Whether an instrument takes a tuning over MIDI: only the MIDI Tuning Standard forms do. */
export function takesLiveTuning(form: ReceiveForm): form is MessageFormId & ReceiveForm {
  return liveForms.has(form);
}

/** The forms that overwrite one tuning program, which the MTS dump request can ask the instrument for. */
const programForms = new Set<ReceiveForm>(['mts-bulk', 'mts-notes']);

/** What a send overwrites on an instrument that takes it in `form`. */
export function whatIsReplaced(instrument: Instrument): string {
  const { program, bank } = instrument;
  switch (instrument.receives) {
    case 'mts-bulk':
      return `tuning program ${program}`;
    case 'mts-bulk-bank':
      return `tuning program ${program} in bank ${bank}`;
    case 'mts-notes':
      return `the keys of tuning program ${program}`;
    default:
      return 'the scale/octave tuning of all 16 channels';
  }
}

interface Outcome {
  /** `failed` and `waiting` are sent again when the port returns; `cannot` waits for a tuning it can take. */
  kind: 'sent' | 'failed' | 'waiting' | 'cannot';
  message: string;
}

/**
 * Sends each tuning the stage moves to, to every instrument of the member whose MIDI port is
 * connected, in that instrument's own form, device, program and bank. Asks once before the first
 * send; an instrument whose port was missing or failed gets the tuning again when its port returns.
 */
@Injectable()
export class StageSender {
  private readonly midi = inject(MidiAccess);
  private readonly dialog = inject(MatDialog);
  private readonly backup = inject(TuningBackup);
  private latest: ResolvedPreset | null = null;
  private asking = false;
  readonly instruments = signal<Instrument[]>([]);
  /** Null until the player answers the one question; false: they chose not to send. */
  readonly agreed = signal<boolean | null>(null);
  private readonly outcomes = signal<ReadonlyMap<string, Outcome>>(new Map());

  readonly statuses = computed<InstrumentStatus[]>(() => {
    const outcomes = this.outcomes();
    const names = new Set(this.midi.outputs().map((port) => port.name));
    return this.instruments().map((instrument): InstrumentStatus => {
      const status = (kind: InstrumentStatus['kind'], message: string) => ({
        instrument,
        kind,
        message,
      });
      if (!takesLiveTuning(instrument.receives)) {
        return status(
          'cannot',
          `Takes its tuning as ${instrument.receives}, which cannot be sent over MIDI: ` +
            'download it for this instrument instead.',
        );
      }
      const outcome = outcomes.get(instrument.id);
      if (outcome) return status(outcome.kind, outcome.message);
      if (!instrument.port) return status('no-port', 'Has no MIDI port named in its settings.');
      if (this.midi.state() !== 'open') return status('ready', 'Connect MIDI to send to it.');
      if (!names.has(instrument.port)) {
        return status('waiting', `Its port "${instrument.port}" is not connected.`);
      }
      return status('ready', `Ready on "${instrument.port}".`);
    });
  });

  constructor() {
    // A port that comes back gets the tuning it missed.
    effect(() => {
      const names = new Set(this.midi.outputs().map((port) => port.name));
      const missed = this.instruments().filter((instrument) => {
        const outcome = this.outcomes().get(instrument.id);
        const behind = outcome?.kind === 'failed' || outcome?.kind === 'waiting';
        return behind && instrument.port !== null && names.has(instrument.port);
      });
      if (missed.length && this.latest && this.agreed()) {
        queueMicrotask(() => missed.forEach((instrument) => this.sendTo(instrument)));
      }
    });
  }

  /** The stage moved to `preset`: send it, asking first the first time. */
  async offer(preset: ResolvedPreset): Promise<void> {
    this.latest = preset;
    if (this.midi.state() !== 'open' || this.agreed() === false) return;
    const targets = this.instruments().filter(
      (instrument) => takesLiveTuning(instrument.receives) && instrument.port,
    );
    if (!targets.length) return;
    if (this.agreed() === null) {
      if (this.asking) return;
      this.asking = true;
      try {
        const overwrites: StageOverwrite[] = targets.map((instrument) => ({
          name: instrument.name,
          port: instrument.port!,
          replaces: whatIsReplaced(instrument),
          canBackUp: this.canBackUp(instrument),
        }));
        const question: StageQuestion = { overwrites, backUp: () => this.backUpAll(targets) };
        const ref = this.dialog.open(StageConfirmDialog, { data: question, maxWidth: '560px' });
        this.agreed.set((await firstValueFrom(ref.afterClosed())) === true);
      } finally {
        this.asking = false;
      }
      if (!this.agreed()) return;
    }
    for (const instrument of targets) this.sendTo(instrument);
  }

  /** An instrument answers a dump request on the input of its port's name, for a program form. */
  private canBackUp(instrument: Instrument): boolean {
    return (
      programForms.has(instrument.receives) &&
      this.midi.inputs().some((port) => port.name === instrument.port)
    );
  }

  /** Backs up, one after another, what each instrument holds in the program a send would replace. */
  private async backUpAll(targets: Instrument[]): Promise<StageBackup[]> {
    const outcomes: StageBackup[] = [];
    for (const instrument of targets) {
      const port = instrument.port!;
      const told = (backedUp: boolean, message: string) =>
        outcomes.push({ port, name: instrument.name, backedUp, message });
      if (!this.canBackUp(instrument)) {
        told(
          false,
          programForms.has(instrument.receives)
            ? `No MIDI input named "${port}" to hear an answer on: not backed up.`
            : 'Its form cannot be asked for the tuning it holds: not backed up.',
        );
        continue;
      }
      const outcome = await this.backup.backUpFrom({
        outputId: this.midi.outputs().find((candidate) => candidate.name === port)?.id ?? null,
        inputId: this.midi.inputs().find((candidate) => candidate.name === port)?.id ?? null,
        deviceId: instrument.deviceId,
        program: instrument.program,
      });
      told(outcome.kind === 'kept' || outcome.kind === 'downloaded', outcome.message);
    }
    return outcomes;
  }

  /** Asks again before the next send (after the player said no). */
  reset(): void {
    this.agreed.set(null);
    this.outcomes.set(new Map());
  }

  private sendTo(instrument: Instrument): void {
    const preset = this.latest;
    if (!preset || !takesLiveTuning(instrument.receives) || !instrument.port) return;
    const port = this.midi.outputs().find((candidate) => candidate.name === instrument.port);
    const output = port ? this.midi.output(port.id) : null;
    if (!output) {
      const message = `Its port "${instrument.port}" is not connected: the tuning goes out when it returns.`;
      return this.record(instrument, { kind: 'waiting', message });
    }
    const { deviceId, program, bank } = instrument;
    const aimed = presetForInstrument(preset, instrument);
    const messages = tuningMessages(aimed, instrument.receives, { deviceId, program, bank });
    if (!messages.ok) {
      const why = messages.errors.map((error) => error.message).join('; ');
      const message = `Could not build the tuning: ${why}`;
      return this.record(instrument, { kind: 'cannot', message });
    }
    try {
      for (const message of messages.value) output.send(message);
    } catch {
      const message = `Sending to "${instrument.port}" failed: it goes out again when the port returns.`;
      return this.record(instrument, { kind: 'failed', message });
    }
    const message = `Sent "${preset.name}" to "${instrument.port}".`;
    this.record(instrument, { kind: 'sent', message });
  }

  private record(instrument: Instrument, outcome: Outcome): void {
    this.outcomes.update((outcomes) => new Map(outcomes).set(instrument.id, outcome));
  }
}
