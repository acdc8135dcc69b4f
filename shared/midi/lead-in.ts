import { fail, fieldError, type Result, succeed } from '../result';
import { messageKind, metaEvent, noteOn, tempoMeta } from './midi-bytes';
import { defaultMicrosecondsPerQuarter, readSong, ticksPerSecond } from './smf-reader';
import { ByteBuffer } from './smf-writer';

/**
 * The lead-in of a retuned song: instruments need a moment to apply a tuning dump, so everything after the
 * song's setup at tick 0 (names, tempo, programs, controllers) moves later by a settable time (the lead-in:
 * 100 ms unless set, 0 allowed). Only one delta time per track changes: the one before its
 * first note or first event after tick 0.
 */

export const defaultLeadInMs = 100;
export const longestLeadInMs = 5000;

export interface LeadIn {
  ms: number;
  /** The same time in the song's ticks, at the tempo in force at tick 0. */
  ticks: number;
}

/** The longest delta time four bytes of a variable-length quantity hold. */
const longestDelta = 0x0fffffff;

/** The lead-in time as a whole field fault, or null when `ms` is one. */
export function leadInFault(ms: unknown): string | null {
  if (typeof ms !== 'number' || !Number.isFinite(ms)) return 'must be a number of milliseconds';
  if (ms < 0 || ms > longestLeadInMs) return `must be from 0 to ${longestLeadInMs} ms (got ${ms})`;
  return null;
}

interface ShiftPoint {
  /** Where the delta time to lengthen starts and ends, and its value. */
  deltaStart: number;
  deltaEnd: number;
}

/** The song with its lead-in, or the song as it was for 0 ms. */
export function withLeadIn(
  song: Uint8Array,
  ms: number,
): Result<{ bytes: Uint8Array; leadIn: LeadIn }> {
  const fault = leadInFault(ms);
  if (fault) return fail([fieldError('leadInMs', fault)]);
  const points = new Map<number, ShiftPoint>();
  const previousEnd = new Map<number, number>();
  let tempo = defaultMicrosecondsPerQuarter;
  const layout = readSong(song, (track, tick, status, data1, data2, start, end) => {
    const deltaStart = previousEnd.get(track) ?? -1;
    previousEnd.set(track, end);
    if (status === metaEvent && data1 === tempoMeta && tick === 0 && end - start === 6) {
      tempo = (song[end - 3] << 16) | (song[end - 2] << 8) | song[end - 1];
    }
    const isNoteOn = messageKind(status) === noteOn && data2 > 0;
    if (points.has(track) || (tick === 0 && !isNoteOn)) return;
    points.set(track, { deltaStart, deltaEnd: start });
  });
  if (!layout.ok) return layout;
  const ticks = Math.round(
    (ms / 1000) * ticksPerSecond(layout.value.division, tempo || defaultMicrosecondsPerQuarter),
  );
  if (ticks === 0) return succeed({ bytes: song, leadIn: { ms, ticks: 0 } });

  const file = new ByteBuffer(song.length + 4 * layout.value.trackCount);
  let at = 0;
  let track = 0;
  for (const chunk of layout.value.chunks) {
    file.bytes(song, at, chunk.start);
    const point = chunk.isTrack ? points.get(track++) : undefined;
    if (!point) {
      file.bytes(song, chunk.start, chunk.end);
      at = chunk.end;
      continue;
    }
    const deltaStart = point.deltaStart < 0 ? chunk.dataStart : point.deltaStart;
    let delta = 0;
    for (let index = deltaStart; index < point.deltaEnd; index++)
      delta = delta * 128 + (song[index] & 0x7f);
    if (delta + ticks > longestDelta) {
      return fail([
        fieldError(
          'leadInMs',
          `does not fit: track ${track} would need a delta time over ${longestDelta} ticks`,
        ),
      ]);
    }
    const lengthened = new ByteBuffer(8);
    lengthened.variableLength(delta + ticks);
    const deltaBytes = lengthened.toBytes();
    const grownBy = deltaBytes.length - (point.deltaEnd - deltaStart);
    file.bytes(song, chunk.start, chunk.start + 4);
    file.uint32(chunk.end - chunk.dataStart + grownBy);
    file.bytes(song, chunk.dataStart, deltaStart);
    file.bytes(deltaBytes);
    file.bytes(song, point.deltaEnd, chunk.end);
    at = chunk.end;
  }
  file.bytes(song, at, song.length);
  return succeed({ bytes: file.toBytes(), leadIn: { ms, ticks } });
}
