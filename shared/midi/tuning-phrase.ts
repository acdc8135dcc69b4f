import { type FieldError, fieldError } from '../result';
import type { KeyEntry } from '../tuning/key-table';
import { noteOff, noteOn, tempoMeta, trackNameMeta } from './midi-bytes';
import { MemberChannelAllocator, mpeSetupMessages, mpeZoneOf } from './mpe';
import { bendClampWarning, bendForPitch, pitchBendMessage } from './pitch-bend';
import { tuningSelectionMessages } from './registered-parameters';
import { metaText, standardMidiFile, TrackWriter } from './smf-writer';
import { type MtsOutput, tuningSysex } from './tuning-setup';
import { unreachableKeysWarning } from './unreachable-keys';

/**
 * Short demonstration files of a tuning: the scale walked up one period from the root key and down
 * again, then a chord of the root, the degrees nearest a just major third and a just fifth, and the
 * period. `smf` tunes the receiver with MTS and plays on channel 1; `mpe-smf` plays each note on a
 * member channel of its own, bent.
 */

const ticksPerQuarter = 480;
/** 120 quarter notes a minute. */
const microsecondsPerQuarter = 500_000;
/** The phrase starts one beat after the tuning, so that receivers have applied it. */
const phraseStartTick = ticksPerQuarter;
const chordTicks = 4 * ticksPerQuarter;
const walkVelocity = 80;
const chordVelocity = 72;
const justMajorThirdCents = 1200 * Math.log2(5 / 4);
const justFifthCents = 1200 * Math.log2(3 / 2);

export interface PhraseTuning {
  keys: readonly KeyEntry[];
  mapping: { rootKey: number; keysPerPeriod: number };
  output: MtsOutput & { bendRange: number; memberChannels: readonly [number, number] };
  name: string;
}

interface PhraseNote {
  key: number;
  hz: number;
  startTick: number;
  endTick: number;
  velocity: number;
}

function scalePhrase({ keys, mapping: { rootKey, keysPerPeriod } }: PhraseTuning): PhraseNote[] {
  const top = Math.min(127, rootKey + keysPerPeriod);
  const walk = keys.filter(
    (entry): entry is KeyEntry & { hz: number } =>
      entry.key >= rootKey && entry.key <= top && entry.hz !== null,
  );
  if (walk.length === 0) return [];
  const stepTicks = walk.length > 24 ? ticksPerQuarter / 4 : ticksPerQuarter / 2;
  const upAndDown = [...walk, ...walk.slice(0, -1).reverse()];
  const notes: PhraseNote[] = upAndDown.map((entry, index) => ({
    key: entry.key,
    hz: entry.hz,
    startTick: phraseStartTick + index * stepTicks,
    endTick: phraseStartTick + (index + 1) * stepTicks,
    velocity: walkVelocity,
  }));
  const rootCents = walk[0].centsFromRoot ?? 0;
  const distance = (entry: KeyEntry, cents: number) =>
    Math.abs((entry.centsFromRoot ?? 0) - rootCents - cents);
  const nearest = (cents: number) =>
    walk.reduce((best, entry) => (distance(entry, cents) < distance(best, cents) ? entry : best));
  const third = nearest(justMajorThirdCents);
  const fifth = nearest(justFifthCents);
  const chordKeys = new Set([walk[0], third, fifth, walk[walk.length - 1]]);
  const chordStart = notes[notes.length - 1].endTick;
  for (const entry of [...chordKeys].sort((a, b) => a.key - b.key)) {
    const { key, hz } = entry;
    const endTick = chordStart + chordTicks;
    notes.push({ key, hz, startTick: chordStart, endTick, velocity: chordVelocity });
  }
  return notes;
}

type PhraseEvent = { tick: number; note: PhraseNote; on: boolean };

/** Note-ons and note-offs in time order, the note-offs of a tick before its note-ons. */
function phraseEvents(notes: PhraseNote[]): PhraseEvent[] {
  const events = notes.flatMap((note) => [
    { tick: note.startTick, note, on: true },
    { tick: note.endTick, note, on: false },
  ]);
  return events.sort((a, b) => a.tick - b.tick || Number(a.on) - Number(b.on));
}

function startTrack(tuning: PhraseTuning): TrackWriter {
  const track = new TrackWriter();
  track.meta(0, trackNameMeta, metaText(tuning.output.tuningName));
  const tempo = microsecondsPerQuarter;
  track.meta(0, tempoMeta, [tempo >> 16, (tempo >> 8) & 0xff, tempo & 0xff]);
  return track;
}

function emptyPhraseWarning(notes: PhraseNote[], tuning: PhraseTuning): FieldError[] {
  if (notes.length > 0) return [];
  const { rootKey, keysPerPeriod } = tuning.mapping;
  const fault = `no key from ${rootKey} to ${rootKey + keysPerPeriod} is mapped`;
  return [fieldError('mapping', `${fault}: the file holds no notes`)];
}

export interface PhraseFile {
  bytes: Uint8Array;
  warnings: FieldError[];
}

/**
 * `smf`: at tick 0 the tuning as a bulk dump and as real-time single-note changes, and the tuning
 * bank and program selected on channel 1 (RPN 4, RPN 3); then the phrase on channel 1.
 */
export function tuningPhraseFile(tuning: PhraseTuning): PhraseFile {
  const channel = 1;
  const track = startTrack(tuning);
  const sysex = tuningSysex(tuning.keys, tuning.output);
  for (const message of sysex.messages) track.systemExclusive(0, message);
  track.channelMessages(0, tuningSelectionMessages(channel, tuning.output));
  const notes = scalePhrase(tuning);
  for (const { tick, note, on } of phraseEvents(notes)) {
    const status = (on ? noteOn : noteOff) | (channel - 1);
    track.channelMessage(tick, status, note.key, on ? note.velocity : 0x40);
  }
  const bytes = standardMidiFile({ format: 0, division: ticksPerQuarter }, [track.finish()]);
  return { bytes, warnings: [...sysex.warnings, ...emptyPhraseWarning(notes, tuning)] };
}

/**
 * `mpe-smf`: the zone configured and the bend range set on every member channel at tick 0, then the
 * phrase with each note on a member channel of its own (least recently used first), its pitch bend
 * just before its note-on.
 */
export function mpePhraseFile(tuning: PhraseTuning): PhraseFile {
  const { bendRange, memberChannels } = tuning.output;
  const zone = mpeZoneOf(memberChannels);
  const track = startTrack(tuning);
  track.channelMessages(0, mpeSetupMessages(zone, bendRange));
  const allocator = new MemberChannelAllocator<PhraseNote>(zone.memberChannels);
  const channelOf = new Map<PhraseNote, number>();
  const clamped = new Set<number>();
  const notes = scalePhrase(tuning);
  for (const { tick, note, on } of phraseEvents(notes)) {
    if (!on) {
      const channel = channelOf.get(note);
      if (channel === undefined) continue;
      const released = bendForPitch(note.hz, bendRange).note;
      track.channelMessage(tick, noteOff | (channel - 1), released, 0x40);
      allocator.release(channel);
      channelOf.delete(note);
      continue;
    }
    const bent = bendForPitch(note.hz, bendRange);
    if (bent.clamped) clamped.add(note.key);
    const { channel, stolen } = allocator.start(note);
    if (stolen) {
      const stolenNote = bendForPitch(stolen.hz, bendRange).note;
      track.channelMessage(tick, noteOff | (channel - 1), stolenNote, 0x40);
      channelOf.delete(stolen);
    }
    channelOf.set(note, channel);
    track.channelMessages(tick, [
      pitchBendMessage(channel, bent.bendValue14),
      [noteOn | (channel - 1), bent.note, note.velocity],
    ]);
  }
  const bytes = standardMidiFile({ format: 0, division: ticksPerQuarter }, [track.finish()]);
  const clampedKeys = [...clamped].sort((a, b) => a - b);
  const unreachable = unreachableKeysWarning(clampedKeys, bendClampWarning(bendRange));
  return {
    bytes,
    warnings: [...zone.warnings, ...unreachable, ...emptyPhraseWarning(notes, tuning)],
  };
}
