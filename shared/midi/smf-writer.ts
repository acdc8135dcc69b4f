import { dataLengthOf, endOfTrackMeta, metaEvent, systemExclusive } from './midi-bytes';
/**
 * A Standard MIDI File writer (SMF 1.0) that runs in time linear in what it writes: events go into
 * a byte buffer that doubles when full, each delta time as a variable-length quantity, channel
 * messages with running status.
 */

/** Bytes appended in amortised constant time. */
export class ByteBuffer {
  private storage: Uint8Array;
  length = 0;

  constructor(initialCapacity = 256) {
    this.storage = new Uint8Array(Math.max(16, initialCapacity));
  }

  private reserve(extra: number): void {
    const needed = this.length + extra;
    if (needed <= this.storage.length) return;
    let capacity = this.storage.length * 2;
    while (capacity < needed) capacity *= 2;
    const grown = new Uint8Array(capacity);
    grown.set(this.storage.subarray(0, this.length));
    this.storage = grown;
  }

  byte(value: number): void {
    this.reserve(1);
    this.storage[this.length++] = value;
  }

  bytes(source: ArrayLike<number>, start = 0, end = source.length): void {
    this.reserve(end - start);
    if (source instanceof Uint8Array) this.storage.set(source.subarray(start, end), this.length);
    else {
      for (let index = start; index < end; index++) {
        this.storage[this.length + index - start] = source[index];
      }
    }
    this.length += end - start;
  }

  /**
   * A variable-length quantity: 7 bits a byte, most significant first, bit 7 set on all but the
   * last.
   */
  variableLength(value: number): void {
    if (value < 0x80) {
      this.byte(value);
      return;
    }
    const groups: number[] = [];
    for (let rest = value; rest > 0; rest = Math.floor(rest / 0x80)) groups.push(rest % 0x80);
    for (let index = groups.length - 1; index >= 0; index--) {
      this.byte(index > 0 ? groups[index] | 0x80 : groups[index]);
    }
  }

  uint16(value: number): void {
    this.bytes([(value >> 8) & 0xff, value & 0xff]);
  }

  uint32(value: number): void {
    this.bytes([(value >>> 24) & 0xff, (value >> 16) & 0xff, (value >> 8) & 0xff, value & 0xff]);
  }

  toBytes(): Uint8Array {
    return this.storage.slice(0, this.length);
  }
}

/** The largest tick count a variable-length quantity holds (4 bytes of 7 bits). */
const largestDelta = 0x0fffffff;

/**
 * One track's events in time order. Ticks are absolute; the writer turns them into delta times.
 * System exclusive and meta events cancel running status, as SMF 1.0 requires.
 */
export class TrackWriter {
  private readonly buffer: ByteBuffer;
  private lastTick = 0;
  private runningStatus = -1;

  constructor(
    private readonly useRunningStatus = true,
    initialCapacity = 1024,
  ) {
    this.buffer = new ByteBuffer(initialCapacity);
  }

  private delta(tick: number): void {
    const delta = tick - this.lastTick;
    if (!(delta >= 0 && delta <= largestDelta)) {
      throw new RangeError(
        `events must come in time order: tick ${tick} after tick ${this.lastTick}`,
      );
    }
    this.buffer.variableLength(delta);
    this.lastTick = tick;
  }

  /** A channel message by its status byte (80-EF) and data bytes. */
  channelMessage(tick: number, status: number, data1: number, data2 = 0): void {
    this.delta(tick);
    if (status !== this.runningStatus || !this.useRunningStatus) this.buffer.byte(status);
    this.runningStatus = status;
    this.buffer.byte(data1);
    if (dataLengthOf(status) === 2) this.buffer.byte(data2);
  }

  /** Channel messages given as byte lists, all at one tick. */
  channelMessages(tick: number, messages: readonly (readonly number[])[]): void {
    for (const message of messages) this.channelMessage(tick, message[0], message[1], message[2]);
  }

  /** A whole system exclusive message, F0 to F7, stored as `F0 <length> <the bytes after F0>`. */
  systemExclusive(tick: number, message: Uint8Array): void {
    this.delta(tick);
    this.buffer.byte(systemExclusive);
    this.buffer.variableLength(message.length - 1);
    this.buffer.bytes(message, 1);
    this.runningStatus = -1;
  }

  /** A meta event `FF type <length> data`. */
  meta(tick: number, type: number, data: ArrayLike<number>): void {
    this.delta(tick);
    this.buffer.byte(metaEvent);
    this.buffer.byte(type);
    this.buffer.variableLength(data.length);
    this.buffer.bytes(data);
    this.runningStatus = -1;
  }

  /**
   * A meta or system exclusive event copied byte for byte from another file (`source[start..end)`,
   * no delta).
   */
  copiedEvent(tick: number, source: Uint8Array, start: number, end: number): void {
    this.delta(tick);
    this.buffer.bytes(source, start, end);
    this.runningStatus = -1;
  }

  /** The events written so far, with no end of track: to go in front of another track's events. */
  eventBytes(): Uint8Array {
    return this.buffer.toBytes();
  }

  /**
   * The track's bytes, closed by an end-of-track event at `endTick` (or at the last event if
   * earlier).
   */
  finish(endTick = this.lastTick): Uint8Array {
    this.meta(Math.max(endTick, this.lastTick), endOfTrackMeta, []);
    return this.buffer.toBytes();
  }
}

/** Text as the bytes of a meta event: printable ASCII kept, anything else as "?". */
export function metaText(text: string): number[] {
  return Array.from(text, (character) => {
    const code = character.charCodeAt(0);
    return code >= 0x20 && code < 0x7f ? code : 0x3f;
  });
}

/**
 * A whole file: the header chunk `MThd` (format, track count, division), then one `MTrk` chunk per
 * track.
 */
export function standardMidiFile(
  header: { format: 0 | 1; division: number },
  tracks: readonly Uint8Array[],
): Uint8Array {
  const file = new ByteBuffer(14 + tracks.reduce((sum, track) => sum + 8 + track.length, 0));
  file.bytes(metaText('MThd'));
  file.uint32(6);
  file.uint16(header.format);
  file.uint16(tracks.length);
  file.uint16(header.division);
  for (const track of tracks) {
    file.bytes(metaText('MTrk'));
    file.uint32(track.length);
    file.bytes(track);
  }
  return file.toBytes();
}
