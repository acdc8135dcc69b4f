import { channelPressure, controlChange, programChange } from './midi-bytes';

/**
 * MIDI channels while a song is rewritten one note per channel: what each song channel has set
 * (controllers, program, pressure, its own bend and bend range), and what each member channel has
 * been sent, so that a member channel can be brought to the song channel whose note it plays.
 */

/** Where channel messages go: a status byte and its data bytes, at the current tick. */
export interface MessageSink {
  send(status: number, data1: number, data2?: number): void;
}

const allSoundOff = 120;
const resetAllControllers = 121;
const localControl = 122;
const allNotesOff = 123;
/** The selected parameter number when none is: 7F 7F. */
const nullParameter = 0x3fff;

/**
 * Power-on values: volume 100, balance and pan centred, expression full, sound controllers 71-79
 * centred, everything else 0.
 */
function defaultControllers(): Uint8Array {
  const controllers = new Uint8Array(128);
  controllers[7] = 100;
  controllers[8] = 64;
  controllers[10] = 64;
  controllers[11] = 127;
  controllers.fill(64, 71, 80);
  return controllers;
}

/** What "reset all controllers" resets (RP-015): modulation, pedals, expression. */
function resetControllers(controllers: Uint8Array): void {
  controllers[1] = 0;
  controllers.fill(0, 64, 68);
  controllers[11] = 127;
}

/** Data entry, increment/decrement and parameter selection: read, never passed on. */
function isParameterController(controller: number): boolean {
  return controller === 6 || controller === 38 || (controller >= 96 && controller <= 101);
}

/** What a channel-wide event of a song channel asks of the member channels playing it. */
export interface ChannelChange {
  /** Control changes to send on, in order. */
  controllers: [number, number][];
  program: number | null;
  pressure: number | null;
  /** The event ends the channel's notes (all sound off, all notes off, a mode change). */
  notesEnd: boolean;
  /** The event put the bend back to centre: sounding notes need their tuning bend again. */
  bendReset: boolean;
  /** The song channel's version before the change. */
  versionBefore: number;
}

/** A channel of the song: what it has set, and a version that counts its changes. */
export class ChannelState {
  readonly controllers = defaultControllers();
  program = 0;
  pressure = 0;
  /** The song's own bend on this channel, and its bend range in cents (RPN 0; 2 semitones). */
  bend = 8192;
  bendRangeCents = 200;
  version = 0;
  private parameter = nullParameter;
  private registered = false;

  /** Takes a control change, program change or channel pressure of the song channel. */
  apply(kind: number, data1: number, data2: number): ChannelChange {
    const change: ChannelChange = {
      controllers: [],
      program: null,
      pressure: null,
      notesEnd: false,
      bendReset: false,
      versionBefore: this.version,
    };
    if (kind === programChange) {
      change.program = this.program = data1;
      this.version++;
    } else if (kind === channelPressure) {
      change.pressure = this.pressure = data1;
      this.version++;
    } else if (isParameterController(data1)) {
      this.applyParameter(data1, data2);
    } else if (data1 === resetAllControllers) {
      resetControllers(this.controllers);
      this.pressure = 0;
      this.bend = 8192;
      this.parameter = nullParameter;
      this.version++;
      change.controllers.push([resetAllControllers, 0]);
      change.bendReset = true;
    } else if (data1 === allSoundOff || data1 >= allNotesOff) {
      change.controllers.push([data1 === allSoundOff ? allSoundOff : allNotesOff, 0]);
      change.notesEnd = true;
    } else if (data1 === localControl) {
      change.controllers.push([localControl, data2]);
    } else {
      this.controllers[data1] = data2;
      this.version++;
      change.controllers.push([data1, data2]);
    }
    return change;
  }

  /** Follows RPN 0 (MSB 101, LSB 100, data entry 6 and 38) for the song's own bend range. */
  private applyParameter(controller: number, value: number): void {
    if (controller === 101) {
      this.parameter = (value << 7) | (this.parameter & 0x7f);
      this.registered = true;
    } else if (controller === 100) {
      this.parameter = (this.parameter & 0x3f80) | value;
      this.registered = true;
    } else if (controller === 99 || controller === 98) {
      this.registered = false;
    } else if (this.registered && this.parameter === 0 && controller === 6) {
      this.bendRangeCents = value * 100 + (this.bendRangeCents % 100);
    } else if (this.registered && this.parameter === 0 && controller === 38) {
      this.bendRangeCents = Math.floor(this.bendRangeCents / 100) * 100 + value;
    }
  }
}

/**
 * A member channel: what it has been sent, the song channel it plays for, and the note sounding on
 * it. Messages go out through a sink whose status bytes carry this channel (`channelIndex`, 0-15).
 */
export class MemberChannel<Note> {
  private readonly controllers = defaultControllers();
  private program = 0;
  private pressure = 0;
  /** The song channel (0-15) whose notes it last played, or -1. */
  source = -1;
  private syncedVersion = -1;
  note: Note | null = null;

  constructor(private readonly channelIndex: number) {}

  /** Sends what differs from the song channel about to play on it. */
  syncTo(state: ChannelState, source: number, sink: MessageSink): void {
    if (this.source === source && this.syncedVersion === state.version) return;
    for (let controller = 0; controller < allSoundOff; controller++) {
      const value = state.controllers[controller];
      if (this.controllers[controller] === value) continue;
      this.controllers[controller] = value;
      sink.send(controlChange | this.channelIndex, controller, value);
    }
    if (this.program !== state.program) {
      this.program = state.program;
      sink.send(programChange | this.channelIndex, this.program);
    }
    if (this.pressure !== state.pressure) {
      this.pressure = state.pressure;
      sink.send(channelPressure | this.channelIndex, this.pressure);
    }
    this.source = source;
    this.syncedVersion = state.version;
  }

  /** Passes a change of its song channel on; a member that was in step stays in step. */
  forward(change: ChannelChange, state: ChannelState, sink: MessageSink): void {
    for (const [controller, value] of change.controllers) {
      if (controller === resetAllControllers) {
        resetControllers(this.controllers);
        this.pressure = 0;
      } else if (controller < allSoundOff) this.controllers[controller] = value;
      sink.send(controlChange | this.channelIndex, controller, value);
    }
    if (change.program !== null) {
      this.program = change.program;
      sink.send(programChange | this.channelIndex, this.program);
    }
    if (change.pressure !== null) {
      this.pressure = change.pressure;
      sink.send(channelPressure | this.channelIndex, this.pressure);
    }
    if (this.syncedVersion === change.versionBefore) this.syncedVersion = state.version;
  }
}
