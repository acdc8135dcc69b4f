import { Injectable, computed, inject, linkedSignal } from '@angular/core';
import type { Input, Listener, MessageEvent, Output } from 'webmidi';
import { presetFromKeys } from '@shared/import/tuning-from-keys';
import { decodeMtsMessage } from '@shared/midi/mts-decode';
import { encodeDumpRequest } from '@shared/midi/mts-dump-request';
import {
  type DecodedTuning,
  mtsForm,
  tuningSubId,
  universalNonRealTime,
} from '@shared/midi/mts-message';
import { firstValueFrom } from 'rxjs';
import { Session } from '../auth/session';
import { draftFrom } from '../design/draft-document';
import { PresetApi } from '../design/preset-api';
import { apiErrorMessage } from '../api/api-error';
import { MidiAccess } from './midi-access';
import { TuningSender } from './tuning-sender';

/** How long to wait for the instrument's dump: a 408-byte dump takes 131 ms on a 31,250-baud cable. */
export const backupAnswerMs = 3000;

/** How asking the instrument for its tuning went. `kept` and `downloaded` mean there is a backup. */
export type BackupOutcome =
  | { kind: 'kept'; presetId: string; name: string; message: string }
  | { kind: 'downloaded'; fileName: string; message: string }
  | { kind: 'silent'; message: string }
  | { kind: 'failed'; message: string };

/** Whether a system exclusive message is an MTS bulk dump (08 01, or 08 04 with a bank). */
function isBulkDump(data: Uint8Array): boolean {
  return (
    data.length > 6 &&
    data[0] === 0xf0 &&
    data[1] === universalNonRealTime &&
    data[3] === tuningSubId &&
    (data[4] === mtsForm.bulkDump || data[4] === mtsForm.bankedBulkDump)
  );
}

function fileNamePart(text: string): string {
  return (
    text
      .toLowerCase()
      .replace(/[^a-z0-9]+/g, '-')
      .replace(/^-|-$/g, '') || 'instrument'
  );
}

/**
 * Backing up the tuning program a send is about to overwrite: asks the instrument for it with the MTS bulk dump
 * request (`F0 7E dev 08 00 tt F7`) on the chosen output, listens on the instrument's input for the dump, and keeps
 * it as a preset in the member's library, or as an .syx download for a guest. Many instruments never answer a dump
 * request; then it says so and keeps nothing.
 */
@Injectable()
export class TuningBackup {
  private readonly midi = inject(MidiAccess);
  /** The designer's sender, whose output and program `backUp()` asks about; the stage names its own with `backUpFrom`. */
  private readonly sender = inject(TuningSender, { optional: true });
  private readonly session = inject(Session);
  private readonly presets = inject(PresetApi);

  /** The input the instrument answers on: by default the input named as the chosen output, as one device shows both. */
  readonly inputId = linkedSignal<string | null>(() => {
    const output = this.midi.outputs().find((port) => port.id === this.sender?.outputId());
    return this.midi.inputs().find((port) => port.name === output?.name)?.id ?? null;
  });
  readonly inputName = computed(
    () => this.midi.inputs().find((port) => port.id === this.inputId())?.name ?? null,
  );

  /** Asks for the dump of the send's program and keeps it; `answerMs` is how long to wait. */
  backUp(answerMs = backupAnswerMs): Promise<BackupOutcome> {
    const { deviceId, program } = this.sender?.target() ?? { deviceId: 127, program: 0 };
    const target = { outputId: this.sender?.outputId() ?? null, inputId: this.inputId() };
    return this.backUpFrom({ ...target, deviceId, program }, answerMs);
  }

  /** Asks the instrument on `outputId` for tuning program `program`, listens on `inputId`, and keeps the dump. */
  async backUpFrom(
    target: { outputId: string | null; inputId: string | null; deviceId: number; program: number },
    answerMs = backupAnswerMs,
  ): Promise<BackupOutcome> {
    const { outputId, inputId, deviceId, program } = target;
    const output = outputId ? this.midi.output(outputId) : null;
    const input = inputId ? this.midi.input(inputId) : null;
    if (!output || !input) {
      return {
        kind: 'failed',
        message:
          "Choose the instrument's MIDI output and input first: the backup asks on one and listens on the other.",
      };
    }
    const dump = await this.ask(output, input, deviceId, program, answerMs);
    if (dump === 'refused')
      return {
        kind: 'failed',
        message: 'The MIDI port refused the dump request: reconnect the instrument and try again.',
      };
    if (dump === null) {
      return {
        kind: 'silent',
        message:
          `${output.name ?? 'The instrument'} did not answer the dump request for tuning program ${program} within ` +
          `${answerMs / 1000} s. Many instruments do not answer one. Nothing was backed up.`,
      };
    }
    return this.keep(dump.bytes, dump.tuning, output.name ?? 'instrument', program);
  }

  /** Sends the request and waits for the matching dump (an input 'sysex' event); null if late. */
  private ask(
    output: Output,
    input: Input,
    deviceId: number,
    program: number,
    answerMs: number,
  ): Promise<{ bytes: Uint8Array; tuning: DecodedTuning } | null | 'refused'> {
    return new Promise((resolve) => {
      const listen = (event: MessageEvent) => {
        const data = event.message.rawData;
        if (!data || !isBulkDump(data)) return;
        const decoded = decodeMtsMessage(data);
        if (
          !decoded.ok ||
          decoded.value.kind === 'dump-request' ||
          decoded.value.program !== program
        )
          return;
        finish({ bytes: Uint8Array.from(data), tuning: decoded.value });
      };
      const timer = setTimeout(() => finish(null), answerMs);
      const finish = (answer: { bytes: Uint8Array; tuning: DecodedTuning } | null | 'refused') => {
        clearTimeout(timer);
        listener.remove();
        resolve(answer);
      };
      // WebMidi.enable opened every input, so the dump needs no open() here.
      const listener = input.addListener('sysex', listen) as Listener;
      try {
        output.send(encodeDumpRequest({ deviceId, program }));
      } catch {
        finish('refused');
      }
    });
  }

  /** A member's backup becomes a preset in their own library; a guest's is downloaded as it came, an .syx. */
  private async keep(
    bytes: Uint8Array,
    tuning: DecodedTuning,
    portName: string,
    program: number,
  ): Promise<BackupOutcome> {
    const day = new Date().toISOString().slice(0, 10);
    const name =
      `${tuning.name || 'Tuning'}, backed up from ${portName} program ${program} (${day})`.slice(
        0,
        200,
      );
    const member = this.session.member();
    const imported = member ? presetFromKeys(tuning.keys, name) : null;
    if (imported?.ok) {
      try {
        const note = `Backup of tuning program ${program} on ${portName}, taken before sending a tuning there`;
        const saving = this.presets.create(draftFrom(imported.value.document), null, note);
        const saved = await firstValueFrom(saving);
        return {
          kind: 'kept',
          presetId: saved.id,
          name,
          message: `Backed up as "${name}" in your library.`,
        };
      } catch (error) {
        const why = await apiErrorMessage(error, 'the library did not answer');
        return this.download(
          bytes,
          portName,
          program,
          `Saving to your library failed (${why}), so it was downloaded instead.`,
        );
      }
    }
    const reason =
      imported && !imported.ok
        ? `Its keys do not make a preset (${imported.errors[0].message}), so it was downloaded as it came.`
        : '';
    return this.download(bytes, portName, program, reason);
  }

  private download(
    bytes: Uint8Array,
    portName: string,
    program: number,
    reason: string,
  ): BackupOutcome {
    const fileName = `backup-${fileNamePart(portName)}-program-${program}.syx`;
    const link = document.createElement('a');
    link.href = URL.createObjectURL(
      new Blob([Uint8Array.from(bytes)], { type: 'application/octet-stream' }),
    );
    link.download = fileName;
    link.click();
    setTimeout(() => URL.revokeObjectURL(link.href), 0);
    return {
      kind: 'downloaded',
      fileName,
      message: `${reason ? `${reason} ` : ''}Backed up as ${fileName} (downloaded).`.trim(),
    };
  }
}
