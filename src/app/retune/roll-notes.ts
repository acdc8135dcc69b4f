import { drumChannelIndex } from '@shared/midi/retune-report';
import { songSound } from '@shared/midi/song-sounding';
import { singleLine } from '@shared/text/plain-text';
import { Midi } from '@tonejs/midi';

/**
 * One note of a piano roll: its track (an index into the roll's tracks), key and time in seconds.
 */
export interface RollNote {
  track: number;
  key: number;
  start: number;
  end: number;
  /** On channel 10 (General MIDI's drums): a drum sound, not a pitch. */
  drum: boolean;
  /** Retuned songs only: cents from the key's pitch in 12-tone equal temperament at A4 = 440 Hz. */
  cents: number | null;
}

export interface RollTrack {
  name: string;
  /** 1-16, as a musician counts channels. */
  channel: number;
  drums: boolean;
}

/**
 * A song as a piano roll draws it: the song as written, or the retuned song as an instrument sounds
 * it.
 */
export interface SongRollNotes {
  kind: 'written' | 'retuned';
  tracks: RollTrack[];
  /** In order of their start. */
  notes: RollNote[];
  seconds: number;
  /** Drum notes counted but not in `notes` (the retuned song's reading leaves them out). */
  drumNotesLeftOut: number;
}

export type RollReading = { ok: true; roll: SongRollNotes } | { ok: false; message: string };

/** Track names are the song's own text: one line, and short enough for a legend. */
function trackName(name: string, index: number): string {
  const line = singleLine(name);
  if (!line) return `Track ${index + 1}`;
  return line.length > 40 ? `${line.slice(0, 39)}…` : line;
}

/**
 * The notes of a chosen song, track by track, read by @tonejs/midi in the browser (it keeps one
 * channel to a track, splitting a track that plays on several); tracks without notes are left out.
 */
export function writtenRoll(bytes: Uint8Array): RollReading {
  let midi: Midi;
  try {
    midi = new Midi(bytes);
  } catch (error) {
    return {
      ok: false,
      message: `it cannot be read as a Standard MIDI File (${(error as Error).message}).`,
    };
  }
  const tracks: RollTrack[] = [];
  const notes: RollNote[] = [];
  let seconds = 0;
  for (const track of midi.tracks) {
    if (track.notes.length === 0) continue;
    const index = tracks.length;
    const drums = track.channel === drumChannelIndex;
    tracks.push({ name: trackName(track.name, index), channel: track.channel + 1, drums });
    for (const note of track.notes) {
      const end = note.time + note.duration;
      seconds = Math.max(seconds, end);
      notes.push({ track: index, key: note.midi, start: note.time, end, drum: drums, cents: null });
    }
  }
  notes.sort((a, b) => a.start - b.start || a.key - b.key);
  return { ok: true, roll: { kind: 'written', tracks, notes, seconds, drumNotesLeftOut: 0 } };
}

/**
 * The notes of a retuned song as an MTS and pitch-bend instrument sounds them
 * (shared/midi/song-sounding.ts), each with how far it lies from its key's 12-tone equal-tempered
 * pitch: 1200 * log2(hz / (440 * 2^((key - 69) / 12))). In MPE the key is the one the file plays,
 * the nearest to the note's pitch, and the bend makes up the rest.
 */
export function retunedRoll(bytes: Uint8Array): RollReading {
  const sound = songSound(bytes);
  if (!sound.ok) return { ok: false, message: sound.errors[0].message };
  const { notes, seconds, drumNotes } = sound.value;
  return {
    ok: true,
    roll: {
      kind: 'retuned',
      tracks: [],
      notes: notes.map((note) => ({
        track: 0,
        key: note.key,
        start: note.start,
        end: note.end,
        drum: false,
        cents: 1200 * Math.log2(note.hz / (440 * 2 ** ((note.key - 69) / 12))),
      })),
      seconds,
      drumNotesLeftOut: drumNotes,
    },
  };
}

/** Reads a chosen or retuned song for its roll; whatever goes wrong is said, never thrown. */
export async function readRoll(
  song: Blob,
  read: (bytes: Uint8Array) => RollReading,
): Promise<RollReading> {
  try {
    return read(new Uint8Array(await song.arrayBuffer()));
  } catch (error) {
    return { ok: false, message: `it could not be read (${(error as Error).message}).` };
  }
}
