import { Injectable, inject, signal } from '@angular/core';
import { MidiAccess } from '../hardware/midi-access';
import { Audition } from './audition';

const noteOff = 0x80;
const noteOn = 0x90;
const controlChange = 0xb0;
const sustainPedal = 64;

/** A MIDI controller's notes, from the chosen input port, playing the audition synth in the tuning. */
@Injectable()
export class ControllerInput {
  private readonly midi = inject(MidiAccess);
  private readonly audition = inject(Audition);
  private listening: MIDIInput | null = null;
  readonly inputId = signal<string | null>(null);

  /** Listens to input port `id` (null: to none). */
  choose(id: string | null): void {
    if (this.listening) this.listening.onmidimessage = null;
    this.inputId.set(id);
    this.listening = id ? this.midi.input(id) : null;
    if (this.listening) this.listening.onmidimessage = (event) => this.play(event.data);
  }

  /** Plays one incoming message: note-on and note-off by key number, and the sustain pedal. */
  play(data: Uint8Array | null): void {
    if (!data || data.length < 3) return;
    const kind = data[0] & 0xf0;
    if (kind === noteOn && data[2] > 0) this.audition.pressKey(data[1]);
    else if (kind === noteOff || kind === noteOn) this.audition.releaseKey(data[1]);
    else if (kind === controlChange && data[1] === sustainPedal) this.audition.setSustain(data[2] >= 64);
  }
}
