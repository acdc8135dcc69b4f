// What retuning a song takes and gives back: the tuning it needs from a preset, the mode, and the
// report. Both ways of retuning (song-retune.ts with MTS, mpe-song-rewrite.ts with MPE) and the
// song's sounding (song-sounding.ts) stand on it.
import type { FieldError } from '../result';
import type { KeyPitch } from './frequency-word';
import type { LeadIn } from './lead-in';
import type { MtsOutput } from './tuning-setup';

/** General MIDI's drum kit (channel 10), left as it is. */
export const drumChannelIndex = 9;

export type RetuneMode = 'mts' | 'mpe';

/** What a song needs from a preset: the keys' pitches and the output settings. */
export interface SongTuning {
  keys: readonly KeyPitch[];
  output: MtsOutput & { bendRange: number; memberChannels: readonly [number, number] };
  /** How many keys the tuning's layout repeats every (12 for a keyboard in octaves); unknown when absent. */
  keysPerPeriod?: number;
}

/** A note on a key the tuning leaves unmapped: it plays at whatever pitch the instrument had. */
export interface UnmappedNote {
  /** Track (1 first), the tick the note began, and its key. */
  track: number;
  tick: number;
  key: number;
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
  /** Notes on keys the tuning leaves unmapped (outside channel 10): how many, and the first few. */
  notesUnmappedCount: number;
  notesUnmapped: UnmappedNote[];
  warnings: FieldError[];
  /** How much later than written the song starts, so that the instrument applies the tuning first. */
  leadIn: LeadIn;
}

export interface RetunedSong {
  bytes: Uint8Array;
  report: RetuneReport;
}
