import { type FieldError, fail, fieldError, type Result, succeed } from '../result';
import type { KeyPitch } from './frequency-word';
import { drumChannelIndex, rewriteAsMpe } from './mpe-song-rewrite';
import { tuningSelectionMessages } from './registered-parameters';
import { readSong } from './smf-reader';
import { ByteBuffer, metaText, TrackWriter } from './smf-writer';
import { type MtsOutput, tuningSysex } from './tuning-setup';

/**
 * Retuning a song (a format 0 or 1 Standard MIDI File). Mode `mts` puts the tuning at tick 0 of the
 * first track and selects it on every channel that plays notes, leaving every other byte as it was.
 * Mode `mpe` moves each note to a member channel of its own with its pitch bend, for instruments
 * without MTS. Channel 10, the drum kit of General MIDI, is left alone in both.
 */

export type RetuneMode = 'mts' | 'mpe';

/** What a song needs from a preset: the keys' pitches and the output settings. */
export interface SongTuning {
  keys: readonly KeyPitch[];
  output: MtsOutput & { bendRange: number; memberChannels: readonly [number, number] };
}

/** A note cut off because every member channel was sounding when another note began. */
export interface StolenNote {
  /** Track (1 first), source channel (1-16) and key of the note, and the tick it began. */
  track: number;
  channel: number;
  key: number;
  startTick: number;
  /** The tick it was cut off, and the member channel it was sounding on. */
  stolenAtTick: number;
  memberChannel: number;
}

export interface RetuneReport {
  mode: RetuneMode;
  /** Notes whose key the tuning maps (other notes keep the pitch they had). */
  notesRetuned: number;
  /**
   * `mts`: the channels the tuning was selected on; `mpe`: the member channels notes were moved to
   * (1-16).
   */
  channelsUsed: number[];
  notesStolen: StolenNote[];
  warnings: FieldError[];
}

export interface RetunedSong {
  bytes: Uint8Array;
  report: RetuneReport;
}

/** Keys the tuning maps, by key number. */
function mappedKeys(keys: readonly KeyPitch[]): boolean[] {
  const mapped = new Array<boolean>(128).fill(false);
  for (const { key, hz } of keys) if (key >= 0 && key < 128 && hz !== null) mapped[key] = true;
  return mapped;
}

function retuneWithMts(song: Uint8Array, tuning: SongTuning): Result<RetunedSong> {
  const mapped = mappedKeys(tuning.keys);
  const playsNotes = new Array<boolean>(16).fill(false);
  let notesRetuned = 0;
  const layout = readSong(song, (_track, _tick, status, key, velocity) => {
    const channelIndex = status & 0x0f;
    const isNoteOn = (status & 0xf0) === 0x90 && velocity > 0;
    if (!isNoteOn || channelIndex === drumChannelIndex) return;
    playsNotes[channelIndex] = true;
    if (mapped[key]) notesRetuned++;
  });
  if (!layout.ok) return layout;
  const channelsUsed = playsNotes.flatMap((plays, index) => (plays ? [index + 1] : []));

  const setup = new TrackWriter();
  setup.meta(0, 0x01, metaText(`Keyloom: tuning ${tuning.output.tuningName}`));
  const sysex = tuningSysex(tuning.keys, tuning.output);
  for (const message of sysex.messages) setup.systemExclusive(0, message);
  for (const channel of channelsUsed) {
    setup.channelMessages(0, tuningSelectionMessages(channel, tuning.output));
  }
  const inserted = setup.eventBytes();

  const first = layout.value.chunks.find((chunk) => chunk.isTrack);
  if (!first) return fail([fieldError('file', 'holds no track (no MTrk chunk)')]);
  const file = new ByteBuffer(song.length + inserted.length);
  file.bytes(song, 0, first.start);
  file.bytes(song, first.start, first.start + 4);
  file.uint32(first.end - first.dataStart + inserted.length);
  file.bytes(inserted);
  file.bytes(song, first.dataStart, song.length);

  const warnings = [...sysex.warnings];
  if (channelsUsed.length === 0) {
    const fault =
      'plays no notes outside channel 10 (drums): the tuning was added, but no channel selects it';
    warnings.push(fieldError('file', fault));
  }
  return succeed({
    bytes: file.toBytes(),
    report: { mode: 'mts', notesRetuned, channelsUsed, notesStolen: [], warnings },
  });
}

/** Retunes a song; faults in the file are answered with what is wrong and where, never thrown. */
export function retuneSong(
  song: Uint8Array,
  tuning: SongTuning,
  mode: RetuneMode,
): Result<RetunedSong> {
  return mode === 'mts' ? retuneWithMts(song, tuning) : rewriteAsMpe(song, tuning);
}
