import type { ResolvedPreset } from '@shared/preset/preset-document';
import type { MidiAccess, MidiPort } from '../hardware/midi-access';
import {
  type MessageFormId,
  cableMs,
  messageForms,
  tuningMessages,
} from '../hardware/tuning-messages';
import { type MyInstrument, receiveFormLabels } from './my-instruments';

/** One instrument's send: where it goes, what it replaces there, and the messages in its own form. */
export interface PlannedSend {
  instrument: string;
  portId: string;
  portName: string;
  /** What the send overwrites: "tuning program 5 in bank 3", or every channel's scale/octave tuning. */
  replaces: string;
  messages: Uint8Array[];
  bytes: number;
}

/** An instrument that is not sent to, and why. */
export interface SkippedSend {
  instrument: string;
  reason: string;
}

export interface SendPlan {
  sends: PlannedSend[];
  skipped: SkippedSend[];
}

/** Whether an instrument takes its tuning as one of the MTS messages the send panel sends. */
export function isMessageForm(form: string): form is MessageFormId {
  return messageForms.some((candidate) => candidate.id === form);
}

/** What a send in `form` to `program` and `bank` replaces on the instrument. */
export function replacedBy(form: MessageFormId, program: number, bank: number): string {
  if (form === 'mts-octave-1' || form === 'mts-octave-2')
    return 'the scale/octave tuning of all 16 channels';
  const inBank =
    form === 'mts-bulk-bank' || (form === 'mts-notes' && bank !== 0) ? ` in bank ${bank}` : '';
  return `tuning program ${program}${inBank}`;
}

/**
 * The sends "to all my connected instruments": each instrument whose port names a connected output, in its own form
 * and with its own device id, program and bank; the others are listed with the reason they are left out.
 */
export function planSends(
  instruments: readonly MyInstrument[],
  outputs: readonly MidiPort[],
  preset: ResolvedPreset,
): SendPlan {
  const plan: SendPlan = { sends: [], skipped: [] };
  for (const instrument of instruments) {
    const skip = (reason: string) => plan.skipped.push({ instrument: instrument.name, reason });
    const form = instrument.receives;
    if (!isMessageForm(form)) {
      skip(
        `takes ${receiveFormLabels[form]}, which is a file rather than a MIDI message: download it instead.`,
      );
      continue;
    }
    if (!instrument.port) {
      skip('has no MIDI output port set.');
      continue;
    }
    const port = outputs.find((candidate) => candidate.name === instrument.port);
    if (!port) {
      skip(`is not connected: no MIDI output is called ${instrument.port}.`);
      continue;
    }
    const { deviceId, program, bank } = instrument;
    const built = tuningMessages(preset, form, { deviceId, program, bank });
    if (!built.ok) {
      skip(built.errors.map((error) => error.message).join(' '));
      continue;
    }
    plan.sends.push({
      instrument: instrument.name,
      portId: port.id,
      portName: port.name,
      replaces: replacedBy(form, program, bank),
      messages: built.value,
      bytes: built.value.reduce((sum, message) => sum + message.length, 0),
    });
  }
  return plan;
}

function wait(ms: number): Promise<void> {
  return new Promise((resolve) => setTimeout(resolve, ms));
}

/**
 * Sends each planned instrument its messages in turn, paced as the send panel paces a send: after each message, the
 * time a 31,250-baud cable needs for the longest one. Resolves to one line per instrument on how it went.
 */
export async function sendAll(
  plan: readonly PlannedSend[],
  midi: MidiAccess,
): Promise<{ instrument: string; sent: boolean; text: string }[]> {
  const outcomes = [];
  for (const send of plan) {
    const pause = cableMs(Math.max(0, ...send.messages.map((message) => message.length)));
    let sent = true;
    for (const message of send.messages) {
      const port = midi.output(send.portId);
      try {
        if (!port) throw new Error('gone');
        port.send(message);
      } catch {
        sent = false;
        break;
      }
      await wait(pause);
    }
    outcomes.push({
      instrument: send.instrument,
      sent,
      text: sent
        ? `${send.instrument}: sent ${send.messages.length} message${send.messages.length === 1 ? '' : 's'} (${send.bytes} bytes) to ${send.portName}.`
        : `${send.instrument}: ${send.portName} disappeared while sending; reconnect it and send again.`,
    });
  }
  return outcomes;
}
