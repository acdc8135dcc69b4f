import type { TrackWriter } from './smf-writer';

/**
 * The state of MIDI channels while a song is rewritten one note per channel: what each song channel has set
 * (controllers, program, pressure, its own bend and bend range), what each member channel has been sent, and the
 * order the song's events sound in across tracks.
 */

/**
 * A track's events as columns of typed arrays, in file order: the tick, the status and data bytes packed into one
 * number, and where each event's bytes lie in the song (`start`..`end`). Grows by doubling.
 */
export class SongTrackEvents {
  length = 0;
  ticks = new Float64Array(256);
  /** status << 16 | data1 << 8 | data2 */
  messages = new Int32Array(256);
  starts = new Int32Array(256);
  ends = new Int32Array(256);

  add(tick: number, status: number, data1: number, data2: number, start: number, end: number): void {
    if (this.length === this.ticks.length) this.grow();
    const index = this.length++;
    this.ticks[index] = tick;
    this.messages[index] = (status << 16) | (data1 << 8) | data2;
    this.starts[index] = start;
    this.ends[index] = end;
  }

  private grow(): void {
    const capacity = this.ticks.length * 2;
    const grown = <T extends Float64Array | Int32Array>(column: T, make: new (size: number) => T): T => {
      const larger = new make(capacity);
      larger.set(column);
      return larger;
    };
    this.ticks = grown(this.ticks, Float64Array);
    this.messages = grown(this.messages, Int32Array);
    this.starts = grown(this.starts, Int32Array);
    this.ends = grown(this.ends, Int32Array);
  }
}

/**
 * Visits the events of all tracks in the order they sound: by tick, and at one tick the earlier track first (as
 * players merge format 1 tracks). A heap over the tracks keeps it O(events x log tracks).
 */
export function mergedOrder(tracks: readonly SongTrackEvents[], visit: (track: number, index: number) => void): void {
  const positions = new Array<number>(tracks.length).fill(0);
  const heap = tracks.flatMap((events, track) => (events.length > 0 ? [track] : []));
  const before = (a: number, b: number) => {
    const tickA = tracks[a].ticks[positions[a]];
    const tickB = tracks[b].ticks[positions[b]];
    return tickA < tickB || (tickA === tickB && a < b);
  };
  const siftDown = (from: number) => {
    let at = from;
    for (;;) {
      const left = 2 * at + 1;
      const right = left + 1;
      let first = at;
      if (left < heap.length && before(heap[left], heap[first])) first = left;
      if (right < heap.length && before(heap[right], heap[first])) first = right;
      if (first === at) return;
      [heap[at], heap[first]] = [heap[first], heap[at]];
      at = first;
    }
  };
  for (let index = Math.floor(heap.length / 2) - 1; index >= 0; index--) siftDown(index);
  while (heap.length > 0) {
    const track = heap[0];
    visit(track, positions[track]);
    positions[track]++;
    if (positions[track] >= tracks[track].length) {
      const last = heap.pop() as number;
      if (heap.length === 0) break;
      heap[0] = last;
    }
    siftDown(0);
  }
}

const resetAllControllers = 121;
const allSoundOff = 120;
const localControl = 122;
const allNotesOff = 123;

/** Power-on values: volume 100, balance and pan centred, expression full, sound controllers 71-79 centred. */
function defaultControllers(): Uint8Array {
  const controllers = new Uint8Array(128);
  controllers[7] = 100;
  controllers[8] = 64;
  controllers[10] = 64;
  controllers[11] = 127;
  controllers.fill(64, 71, 80);
  return controllers;
}

/** What "reset all controllers" resets (RP-015): modulation, pedals, expression, pressure, bend. */
function resetControllers(controllers: Uint8Array): void {
  controllers[1] = 0;
  controllers.fill(0, 64, 68);
  controllers[11] = 127;
}

/** Data entry, increment/decrement and parameter selection: read for the bend range, never passed on. */
function isParameterController(controller: number): boolean {
  return controller === 6 || controller === 38 || (controller >= 96 && controller <= 101);
}

/** What a channel-wide event of a song channel asks of the member channels playing it. */
export interface ChannelChange {
  /** Control changes to send on, in order. */
  controllers: [number, number][];
  /** The event ends the channel's notes (all sound off, all notes off, a mode change). */
  notesEnd: boolean;
  /** The event put the bend back to centre: sounding notes need their tuning bend again. */
  bendReset: boolean;
}

const nothing: ChannelChange = { controllers: [], notesEnd: false, bendReset: false };

/** A channel of the song: what it has set, and a version that counts its changes. */
export class ChannelState {
  readonly controllers = defaultControllers();
  program = 0;
  pressure = 0;
  /** The song's own bend on this channel, and its bend range in cents (RPN 0; 2 semitones until set). */
  bend = 8192;
  bendRangeCents = 200;
  version = 0;
  /** The selected parameter number, MSB and LSB; 3FFF is the null parameter. */
  private parameter = 0x3fff;
  private registered = false;

  /** Takes a control change, program change or channel pressure of the song channel. */
  apply(kind: number, data1: number, data2: number): ChannelChange {
    if (kind === 0xc0) {
      this.program = data1;
      this.version++;
      return nothing;
    }
    if (kind === 0xd0) {
      this.pressure = data1;
      this.version++;
      return nothing;
    }
    if (isParameterController(data1)) {
      this.applyParameter(data1, data2);
      return nothing;
    }
    if (data1 === resetAllControllers) {
      resetControllers(this.controllers);
      this.pressure = 0;
      this.bend = 8192;
      this.parameter = 0x3fff;
      this.version++;
      return { controllers: [[resetAllControllers, 0]], notesEnd: false, bendReset: true };
    }
    if (data1 === allSoundOff) return { controllers: [[allSoundOff, 0]], notesEnd: true, bendReset: false };
    if (data1 === localControl) return { controllers: [[localControl, data2]], notesEnd: false, bendReset: false };
    if (data1 >= allNotesOff) return { controllers: [[allNotesOff, 0]], notesEnd: true, bendReset: false };
    this.controllers[data1] = data2;
    this.version++;
    return { controllers: [[data1, data2]], notesEnd: false, bendReset: false };
  }

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

/** A member channel: what it has been sent, which song channel it plays for, and the note sounding on it. */
export class MemberChannel<Note> {
  private readonly controllers = defaultControllers();
  private program = 0;
  private pressure = 0;
  /** The song channel (0-15) whose notes it last played, or -1. */
  source = -1;
  private syncedVersion = -1;
  note: Note | null = null;

  /** Sends what differs from the song channel about to play on it: controllers, then program, then pressure. */
  syncTo(state: ChannelState, source: number, writer: TrackWriter, tick: number, channelIndex: number): void {
    if (this.source === source && this.syncedVersion === state.version) return;
    for (let controller = 0; controller < 120; controller++) {
      const value = state.controllers[controller];
      if (this.controllers[controller] === value) continue;
      this.controllers[controller] = value;
      writer.channelMessage(tick, 0xb0 | channelIndex, controller, value);
    }
    if (this.program !== state.program) writer.channelMessage(tick, 0xc0 | channelIndex, (this.program = state.program));
    if (this.pressure !== state.pressure) writer.channelMessage(tick, 0xd0 | channelIndex, (this.pressure = state.pressure));
    this.source = source;
    this.syncedVersion = state.version;
  }

  /**
   * Passes a change of its song channel on. `versionBefore` is the song channel's version before the change: a
   * member that was in step stays in step.
   */
  forward(kind: number, data1: number, change: ChannelChange, state: ChannelState, versionBefore: number, writer: TrackWriter, tick: number, channelIndex: number): void {
    for (const [controller, value] of change.controllers) {
      if (controller === resetAllControllers) {
        resetControllers(this.controllers);
        this.pressure = 0;
      } else if (controller < 120) this.controllers[controller] = value;
      writer.channelMessage(tick, 0xb0 | channelIndex, controller, value);
    }
    if (kind === 0xc0) writer.channelMessage(tick, 0xc0 | channelIndex, (this.program = data1));
    if (kind === 0xd0) writer.channelMessage(tick, 0xd0 | channelIndex, (this.pressure = data1));
    if (this.syncedVersion === versionBefore) this.syncedVersion = state.version;
  }
}
