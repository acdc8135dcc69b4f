import { Injectable, signal } from '@angular/core';

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

function portsOf(map: MIDIInputMap | MIDIOutputMap): MidiPort[] {
  return [...map.values()]
    .filter((port) => port.state !== 'disconnected')
    .map((port) => ({ id: port.id, name: port.name ?? port.id }));
}

/**
 * The browser's Web MIDI access with system exclusive, asked for on request, and the input and
 * output ports it offers, kept up to date as devices come and go.
 */
@Injectable()
export class MidiAccess {
  private access: MIDIAccess | null = null;
  readonly state = signal<MidiAccessState>('closed');
  readonly inputs = signal<MidiPort[]>([]);
  readonly outputs = signal<MidiPort[]>([]);

  /** Asks the browser for MIDI with system exclusive; true once granted. */
  async open(): Promise<boolean> {
    if (this.access) return true;
    if (typeof navigator.requestMIDIAccess !== 'function') {
      this.state.set('unsupported');
      return false;
    }
    this.state.set('asking');
    try {
      this.access = await navigator.requestMIDIAccess({ sysex: true });
    } catch {
      this.state.set('refused');
      return false;
    }
    this.access.addEventListener('statechange', () => this.listPorts());
    this.listPorts();
    this.state.set('open');
    return true;
  }

  /** The output port `id` while it is connected, else null. */
  output(id: string): MIDIOutput | null {
    const port = this.access?.outputs.get(id);
    return port && port.state !== 'disconnected' ? port : null;
  }

  input(id: string): MIDIInput | null {
    const port = this.access?.inputs.get(id);
    return port && port.state !== 'disconnected' ? port : null;
  }

  private listPorts(): void {
    if (!this.access) return;
    this.inputs.set(portsOf(this.access.inputs));
    this.outputs.set(portsOf(this.access.outputs));
  }
}
