import { fail, type FieldError, fieldError, type Result, succeed } from '../result';
import {
  dataLengthOf,
  endOfExclusive,
  endOfTrackMeta,
  metaEvent,
  systemExclusive,
} from './midi-bytes';

/**
 * A strict, linear reader of Standard MIDI Files (SMF 1.0), format 0 and 1: running status, system
 * exclusive (F0 and F7 escapes) and meta events. It walks the bytes once, hands each event to a
 * visitor, and answers with where the chunks lie, or with the first fault; random or truncated
 * bytes give an error, never a hang.
 */

/** A tempo of 120 quarter notes a minute, which SMF 1.0 assumes until a tempo event says otherwise. */
export const defaultMicrosecondsPerQuarter = 500_000;

/**
 * Ticks a second for a header's division: ticks per quarter note at `microsecondsPerQuarter`, or, in the SMPTE
 * form, frames a second times ticks a frame (SMF 1.0; the -29 frame rate is 29.97 drop-frame).
 */
export function ticksPerSecond(
  division: number,
  microsecondsPerQuarter = defaultMicrosecondsPerQuarter,
): number {
  if (division & 0x8000) {
    const frames = 256 - (division >> 8);
    return (frames === 29 ? 29.97 : frames) * (division & 0xff);
  }
  return (division * 1_000_000) / microsecondsPerQuarter;
}

export interface SongChunk {
  /** `MTrk` chunks are tracks; any other chunk is passed over, as SMF 1.0 asks of readers. */
  isTrack: boolean;
  /** Where the chunk's 8-byte header starts, where its data starts, and where it ends. */
  start: number;
  dataStart: number;
  end: number;
}

export interface SongLayout {
  format: 0 | 1;
  /** Ticks per quarter note, or the SMPTE form, as the 16 bits of the header hold it. */
  division: number;
  chunks: SongChunk[];
  trackCount: number;
  /** Bytes after the last whole chunk (padding some writers leave), from here to the end. */
  trailingStart: number;
}

/**
 * Called once per event in file order, track by track: the absolute tick, the status (80-EF for
 * channel messages with running status resolved, F0/F7 for system exclusive, FF for meta), the data
 * bytes (for meta, the type in `data1`), and the event's bytes after its delta time,
 * `song[start..end)` (under running status they start at the first data byte). A track's
 * end-of-track event is the last one it reports.
 */
export type SongEventVisitor = (
  track: number,
  tick: number,
  status: number,
  data1: number,
  data2: number,
  start: number,
  end: number,
) => void;

function songFault(fault: string): FieldError {
  return fieldError('file', fault);
}

function text(bytes: Uint8Array, start: number): string {
  return String.fromCharCode(bytes[start], bytes[start + 1], bytes[start + 2], bytes[start + 3]);
}

function uint32(bytes: Uint8Array, at: number): number {
  return ((bytes[at] << 24) >>> 0) + (bytes[at + 1] << 16) + (bytes[at + 2] << 8) + bytes[at + 3];
}

/** Reads one track's events; answers with a fault, or null. */
function readTrack(
  bytes: Uint8Array,
  track: number,
  start: number,
  end: number,
  visit: SongEventVisitor,
): string | null {
  const name = `track ${track + 1}`;
  let at = start;
  let tick = 0;
  let runningStatus = -1;
  while (at < end) {
    let delta = 0;
    let length = 0;
    do {
      if (at >= end) return `${name} is cut short in a delta time at byte ${at}`;
      if (++length > 4) return `${name} has a delta time longer than 4 bytes at byte ${at}`;
      delta = delta * 128 + (bytes[at] & 0x7f);
    } while (bytes[at++] & 0x80);
    tick += delta;
    const eventStart = at;
    if (at >= end) return `${name} ends after a delta time, with no event`;
    let status = bytes[at];
    if (status < 0x80) {
      if (runningStatus < 0) {
        return `${name} uses running status before any status byte, at byte ${at}`;
      }
      status = runningStatus;
    } else at++;
    if (status < systemExclusive) {
      runningStatus = status;
      const dataLength = dataLengthOf(status);
      if (at + dataLength > end) {
        return `${name} is cut short inside an event at byte ${eventStart}`;
      }
      const data1 = bytes[at];
      const data2 = dataLength === 2 ? bytes[at + 1] : 0;
      if (data1 > 0x7f || data2 > 0x7f) {
        return `${name} has a status byte where data should be, at byte ${at}`;
      }
      at += dataLength;
      visit(track, tick, status, data1, data2, eventStart, at);
      continue;
    }
    let type = 0;
    if (status === metaEvent) {
      if (at >= end) return `${name} is cut short inside a meta event at byte ${eventStart}`;
      type = bytes[at++];
    } else if (status !== systemExclusive && status !== endOfExclusive) {
      const byte = status.toString(16).toUpperCase();
      return (
        `${name} holds the byte ${byte} at ${eventStart}, ` +
        'which no event in a MIDI file starts with'
      );
    }
    let dataLength = 0;
    length = 0;
    do {
      if (at >= end) return `${name} is cut short in an event length at byte ${at}`;
      if (++length > 4) return `${name} has an event length longer than 4 bytes at byte ${at}`;
      dataLength = dataLength * 128 + (bytes[at] & 0x7f);
    } while (bytes[at++] & 0x80);
    if (at + dataLength > end) {
      const left = end - at;
      return (
        `${name} is cut short: an event at byte ${eventStart} needs ${dataLength} bytes, ` +
        `${left} are left`
      );
    }
    at += dataLength;
    visit(track, tick, status, type, 0, eventStart, at);
    if (status === metaEvent && type === endOfTrackMeta) return null;
  }
  return null;
}

/** Reads a song, calling `visit` for every event; faults name the file and where in it. */
export function readSong(bytes: Uint8Array, visit: SongEventVisitor): Result<SongLayout> {
  if (bytes.length < 14 || text(bytes, 0) !== 'MThd') {
    return fail([
      songFault(
        'is not a Standard MIDI File: it does not start with an MThd header of 14 bytes or more',
      ),
    ]);
  }
  const headerLength = uint32(bytes, 4);
  if (headerLength < 6 || 8 + headerLength > bytes.length) {
    return fail([songFault(`has a header of ${headerLength} bytes, which does not fit the file`)]);
  }
  const format = (bytes[8] << 8) | bytes[9];
  if (format !== 0 && format !== 1) {
    return fail([
      songFault(
        format === 2
          ? 'is a format 2 MIDI file (independent patterns); ' +
              'only format 0 and 1 songs can be retuned'
          : `declares MIDI file format ${format}, which does not exist`,
      ),
    ]);
  }
  const division = (bytes[12] << 8) | bytes[13];
  const chunks: SongChunk[] = [];
  let at = 8 + headerLength;
  let trackCount = 0;
  while (at + 8 <= bytes.length) {
    const dataStart = at + 8;
    const end = dataStart + uint32(bytes, at + 4);
    if (end > bytes.length) {
      const missing = end - bytes.length;
      return fail([songFault(`is cut short: the chunk at byte ${at} needs ${missing} more bytes`)]);
    }
    const isTrack = text(bytes, at) === 'MTrk';
    if (isTrack) {
      const fault = readTrack(bytes, trackCount, dataStart, end, visit);
      if (fault) return fail([songFault(fault)]);
      trackCount++;
    }
    chunks.push({ isTrack, start: at, dataStart, end });
    at = end;
  }
  if (trackCount === 0) return fail([songFault('holds no track (no MTrk chunk)')]);
  return succeed({ format, division, chunks, trackCount, trailingStart: at });
}
