import { Injectable, type OnDestroy, signal } from '@angular/core';
import { type Input, type Listener, type Output, WebMidi } from 'webmidi';

/** A MIDI port as the page lists it. */
export interface MidiPort {
  id: string;
  name: string;
}

export type MidiAccessState = 'closed' | 'asking' | 'open' | 'unsupported' | 'refused';

/** What each state that stops MIDI tells the musician. */
export const midiAccessFaults: Partial<Record<MidiAccessState, string>> = {
  unsupported:
    'This browser has no Web MIDI. Use a Chromium-based browser or Firefox, or download the .syx file and send it with your own tool.',
  refused:
    'The browser refused access to MIDI devices with system exclusive messages. Allow MIDI for this site in the address bar and try again.',
};

/**
 * webmidi's `WebMidi` is one object for the whole page, while each page of the app provides its own
 * MidiAccess. They share one enabling of it; when the last one that opened it goes away, WebMidi is
 * disabled, so that the next open asks the browser afresh (another page later, or the next spec
 * with its own stand-in for Web MIDI).
 */
const shared = {
  users: 0,
  enabling: null as Promise<unknown> | null,
  disabling: Promise.resolve() as Promise<unknown>,
};

/** Enables WebMidi with system exclusive once for all MidiAccess; after a refusal, asks again. */
function enableWebMidi(): Promise<unknown> {
  if (!shared.enabling) {
    const attempt = shared.disabling.then(() => WebMidi.enable({ sysex: true }));
    shared.enabling = attempt;
    attempt.catch(() => {
      if (shared.enabling === attempt) shared.enabling = null;
    });
  }
  return shared.enabling;
}

function release(): void {
  shared.users -= 1;
  if (shared.users > 0) return;
  const enabled = shared.enabling;
  shared.enabling = null;
  shared.disabling = (enabled ?? Promise.resolve())
    .then(() => WebMidi.disable())
    .catch(() => undefined);
}

function portsOf(ports: (Input | Output)[]): MidiPort[] {
  return ports
    .filter((port) => port.state !== 'disconnected')
    .map((port) => ({ id: port.id, name: port.name ?? port.id }));
}

/**
 * The browser's Web MIDI access with system exclusive through webmidi, asked for on request, and
 * the input and output ports it offers, kept up to date as devices come and go (WebMidi's
 * `connected` and `disconnected` events).
 */
@Injectable()
export class MidiAccess implements OnDestroy {
  private opened = false;
  private portListeners: Listener[] = [];
  readonly state = signal<MidiAccessState>('closed');
  readonly inputs = signal<MidiPort[]>([]);
  readonly outputs = signal<MidiPort[]>([]);

  /** Asks the browser for MIDI with system exclusive; true once granted. */
  async open(): Promise<boolean> {
    if (this.opened) return true;
    // WebMidi.enable rejects alike whether Web MIDI is missing or refused: `supported` tells which.
    if (!WebMidi.supported) {
      this.state.set('unsupported');
      return false;
    }
    this.state.set('asking');
    try {
      // An enabling that the last other user's departure cancelled meanwhile does not count.
      for (let enabling = enableWebMidi(); ; enabling = enableWebMidi()) {
        await enabling;
        if (shared.enabling === enabling) break;
      }
    } catch {
      this.state.set('refused');
      return false;
    }
    if (this.opened) return true;
    this.opened = true;
    shared.users += 1;
    const listPorts = () => this.listPorts();
    this.portListeners = [
      WebMidi.addListener('connected', listPorts),
      WebMidi.addListener('disconnected', listPorts),
    ];
    this.listPorts();
    this.state.set('open');
    return true;
  }

  /** The output port `id` while it is connected, else null. */
  output(id: string): Output | null {
    if (!this.opened) return null;
    return WebMidi.outputs.find((port) => port.id === id && port.state !== 'disconnected') ?? null;
  }

  input(id: string): Input | null {
    if (!this.opened) return null;
    return WebMidi.inputs.find((port) => port.id === id && port.state !== 'disconnected') ?? null;
  }

  ngOnDestroy(): void {
    if (!this.opened) return;
    this.opened = false;
    for (const listener of this.portListeners) listener.remove();
    this.portListeners = [];
    release();
  }

  private listPorts(): void {
    if (!this.opened) return;
    this.inputs.set(portsOf(WebMidi.inputs));
    this.outputs.set(portsOf(WebMidi.outputs));
  }
}
