import { type FieldError, fail, fieldError, type Result, succeed } from '../result';
import type { KeyPitch } from './frequency-word';
import { defaultLeadInMs, withLeadIn } from './lead-in';
import { messageKind, noteOn, textMeta } from './midi-bytes';
import { rewriteAsMpe } from './mpe-song-rewrite';
import { tuningSelectionMessages } from './registered-parameters';
import { readSong } from './smf-reader';
import { ByteBuffer, metaText, TrackWriter } from './smf-writer';
import {
  drumChannelIndex,
  type RetunedSong,
  type RetuneMode,
  type SongTuning,
  type UnmappedNote,
} from './retune-report';
import { tuningSysex } from './tuning-setup';

/**
 * Retuning a song (a format 0 or 1 Standard MIDI File). Mode `mts` puts the tuning at tick 0 of the
 * first track and selects it on every channel that plays notes, leaving every other byte as it was.
 * Mode `mpe` moves each note to a member channel of its own with its pitch bend, for instruments
 * without MTS. Channel 10, the drum kit of General MIDI, is left alone in both.
 */

/** The unmapped notes a report names at most; the count is always whole. */
const listedUnmappedNotes = 5;

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
    const isNoteOn = messageKind(status) === noteOn && velocity > 0;
    if (!isNoteOn || channelIndex === drumChannelIndex) return;
    playsNotes[channelIndex] = true;
    if (mapped[key]) notesRetuned++;
  });
  if (!layout.ok) return layout;
  const channelsUsed = playsNotes.flatMap((plays, index) => (plays ? [index + 1] : []));

  const setup = new TrackWriter();
  setup.meta(0, textMeta, metaText(`Keyloom: tuning ${tuning.output.tuningName}`));
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
    report: {
      mode: 'mts',
      notesRetuned,
      channelsUsed,
      notesStolen: [],
      notesUnmappedCount: 0,
      notesUnmapped: [],
      warnings,
      leadIn: { ms: 0, ticks: 0 },
    },
  });
}

/**
 * Notes the tuning cannot retune, and whether the song fits the layout: a song written for 12 keys an octave on a
 * layout of another size lands its notes on consecutive steps of the tuning, not on the notes it was written for.
 */
function fitOfSong(
  song: Uint8Array,
  tuning: SongTuning,
): { unmapped: UnmappedNote[]; count: number; warnings: FieldError[] } {
  const mapped = mappedKeys(tuning.keys);
  const unmapped: UnmappedNote[] = [];
  let count = 0;
  let lowest = 128;
  let highest = -1;
  readSong(song, (track, tick, status, key, velocity) => {
    const isNoteOn = messageKind(status) === noteOn && velocity > 0;
    if (!isNoteOn || (status & 0x0f) === drumChannelIndex) return;
    lowest = Math.min(lowest, key);
    highest = Math.max(highest, key);
    if (mapped[key]) return;
    count++;
    if (unmapped.length < listedUnmappedNotes) unmapped.push({ track: track + 1, tick, key });
  });
  const warnings: FieldError[] = [];
  if (count > 0) {
    const first = unmapped
      .map((note) => `key ${note.key} in track ${note.track} at tick ${note.tick}`)
      .join(', ');
    warnings.push(
      fieldError(
        'file',
        `${count} note${count === 1 ? ' falls' : 's fall'} on keys the tuning leaves unmapped and keep their old pitch (first: ${first})`,
      ),
    );
  }
  const keys = tuning.keysPerPeriod;
  if (keys !== undefined && keys !== 12 && highest >= lowest) {
    warnings.push(
      fieldError(
        'mapping.keysPerPeriod',
        `the tuning repeats every ${keys} keys, so a song written for 12 keys an octave (keys ${lowest}-${highest} here) ` +
          'plays its notes on consecutive steps of the tuning; to hear it as written, lay the tuning on its nearest ' +
          'keys (Keys tab, "Place degrees on nearest keys") and retune again',
      ),
    );
  }
  return { unmapped, count, warnings };
}

/**
 * Retunes a song; faults in the file are answered with what is wrong and where, never thrown. The song first
 * moves `leadInMs` later (see lead-in.ts); the ticks a report names are those of the retuned file.
 */
export function retuneSong(
  original: Uint8Array,
  tuning: SongTuning,
  mode: RetuneMode,
  leadInMs = defaultLeadInMs,
): Result<RetunedSong> {
  const shifted = withLeadIn(original, leadInMs);
  if (!shifted.ok) return shifted;
  const song = shifted.value.bytes;
  const retuned = mode === 'mts' ? retuneWithMts(song, tuning) : rewriteAsMpe(song, tuning);
  if (!retuned.ok) return retuned;
  const fit = fitOfSong(song, tuning);
  const { report } = retuned.value;
  return succeed({
    ...retuned.value,
    report: {
      ...report,
      notesUnmappedCount: fit.count,
      notesUnmapped: fit.unmapped,
      warnings: [...report.warnings, ...fit.warnings],
      leadIn: shifted.value.leadIn,
    },
  });
}
