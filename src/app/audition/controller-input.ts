import { Injectable, inject, signal } from '@angular/core';
import type { Listener } from 'webmidi';
import { MidiAccess } from '../hardware/midi-access';
import { Audition } from './audition';

/** A MIDI controller's notes, from the chosen input port, playing the audition synth in the tuning. */
@Injectable()
export class ControllerInput {
  private readonly midi = inject(MidiAccess);
  private readonly audition = inject(Audition);
  private listeners: Listener[] = [];
  readonly inputId = signal<string | null>(null);

  /**
   * Listens to input port `id` (null: to none): note-on and note-off by key number, and the
   * sustain pedal. webmidi reads the bytes; a note-on at velocity 0 comes as the note-off it means.
   */
  choose(id: string | null): void {
    for (const listener of this.listeners) listener.remove();
    this.listeners = [];
    this.inputId.set(id);
    const input = id ? this.midi.input(id) : null;
    if (!input) return;
    this.listeners = [
      input.addListener('noteon', (event) => this.audition.pressKey(event.note.number)),
      input.addListener('noteoff', (event) => this.audition.releaseKey(event.note.number)),
      // MIDI 1.0 Detailed Specification: control change 64 is the damper (sustain) pedal, on from
      // 64 up. (An Input takes 'controlchange' for all channels, but 'controlchange-controller64'
      // only on each InputChannel.)
      input.addListener('controlchange', (event) => {
        if (event.controller.number === 64) this.audition.setSustain((event.rawValue ?? 0) >= 64);
      }),
    ].flat();
  }
}
