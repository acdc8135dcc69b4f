import { type FieldError, fail, fieldError, type Result, succeed } from '../result';
import { MemberChannelAllocator, mpeSetupMessages, mpeZoneOf } from './mpe';
import { bendCentre, bendForPitch, bendStepCents, centsOfBendValue, nearestBendValue } from './pitch-bend';
import { readSong } from './smf-reader';
import { standardMidiFile, TrackWriter } from './smf-writer';
import type { RetunedSong, SongTuning, StolenNote } from './song-retune';
import { ChannelState, MemberChannel, mergedOrder, SongTrackEvents } from './song-channel-state';
import { unreachableKeysWarning } from './unreachable-keys';

/**
 * Mode `mpe` of song retuning: every note of every channel but 10 moves to a member channel of its own, with the
 * pitch bend that tunes it (plus any bend the song itself gives) sent just before its note-on. Each member channel
 * is brought to the controllers and program of the song channel whose note it plays; changes on a song channel
 * reach the member channels playing it. Registered and non-registered parameters of the song are read (the song's
 * own bend range is honoured) but not passed on: the member channels' bend range is the preset's.
 */

/** General MIDI's drum kit, left as it is. */
export const drumChannelIndex = 9;

const noteOff = 0x80;
const noteOn = 0x90;
const polyPressure = 0xa0;
const controlChange = 0xb0;
const programChange = 0xc0;
const channelPressure = 0xd0;
const pitchBend = 0xe0;

interface SoundingNote {
  source: number;
  key: number;
  played: number;
  tuningCents: number;
  track: number;
  tick: number;
  member: number;
}

/** How each key is played: the note sent and the bend in cents that tunes it; unmapped keys play as they are. */
function keyPlaying(tuning: SongTuning) {
  const { bendRange } = tuning.output;
  const played = Array.from({ length: 128 }, (_, key) => key);
  const tuningCents = new Array<number>(128).fill(0);
  const mapped = new Array<boolean>(128).fill(false);
  const unreachable: number[] = [];
  for (const { key, hz } of tuning.keys) {
    if (hz === null || key < 0 || key > 127) continue;
    const bent = bendForPitch(hz, bendRange);
    played[key] = bent.note;
    tuningCents[key] = bent.residualCents + centsOfBendValue(bent.bendValue14, bendRange);
    mapped[key] = true;
    if (bent.clamped) unreachable.push(key);
  }
  return { played, tuningCents, mapped, unreachable };
}

export function rewriteAsMpe(song: Uint8Array, tuning: SongTuning): Result<RetunedSong> {
  const tracks: SongTrackEvents[] = [];
  let usesDrums = false;
  const layout = readSong(song, (track, tick, status, data1, data2, start, end) => {
    (tracks[track] ??= new SongTrackEvents()).add(tick, status, data1, data2, start, end);
    if ((status & 0x0f) === drumChannelIndex && status < 0xf0) usesDrums = true;
  });
  if (!layout.ok) return layout;
  const { trackCount, chunks, format, division } = layout.value;
  for (let track = 0; track < trackCount; track++) tracks[track] ??= new SongTrackEvents();

  const { bendRange } = tuning.output;
  const zone = mpeZoneOf(tuning.output.memberChannels);
  const warnings: FieldError[] = [...zone.warnings];
  const pool = zone.memberChannels.filter((channel) => !(usesDrums && channel === drumChannelIndex + 1));
  if (pool.length === 0) {
    return fail([fieldError('output.memberChannels', 'leave no channel for notes besides the drums on channel 10')]);
  }
  if (pool.length < zone.memberChannels.length) {
    warnings.push(fieldError('output.memberChannels', 'include channel 10, which the song uses for drums: notes were kept off it'));
  }
  if (chunks.some((chunk) => !chunk.isTrack)) warnings.push(fieldError('file', 'holds chunks that are not tracks: they were left out'));
  const { played, tuningCents, mapped, unreachable } = keyPlaying(tuning);

  const writers = tracks.map((events) => new TrackWriter(true, 64 + events.length * 5));
  writers[0].channelMessages(0, mpeSetupMessages(zone, bendRange));
  const sources = Array.from({ length: 16 }, () => new ChannelState());
  const members = Array.from({ length: 16 }, () => new MemberChannel<SoundingNote>());
  const allocator = new MemberChannelAllocator<SoundingNote>(pool);
  /** Sounding notes by song channel and key, the earliest first (a key struck twice ends in that order). */
  const holders = new Map<number, SoundingNote[]>();
  const endTicks = new Array<number>(trackCount).fill(0);
  const notesStolen: StolenNote[] = [];
  const channelUsed = new Array<boolean>(16).fill(false);
  const halfStepCents = bendStepCents(bendRange) / 2;
  let notesRetuned = 0;
  let bendsClamped = 0;
  let writer = writers[0];
  let tick = 0;

  const sendBend = (note: SoundingNote) => {
    const source = sources[note.source];
    const cents = note.tuningCents + ((source.bend - bendCentre) / bendCentre) * source.bendRangeCents;
    const value = nearestBendValue(cents, bendRange);
    if (Math.abs(cents - centsOfBendValue(value, bendRange)) > halfStepCents + 1e-9) bendsClamped++;
    writer.channelMessage(tick, pitchBend | note.member, value & 0x7f, value >> 7);
  };
  /** Forgets a note that no longer sounds; the allocator is told separately. */
  const forget = (note: SoundingNote) => {
    if (members[note.member].note === note) members[note.member].note = null;
    const list = holders.get(note.source * 128 + note.key);
    const index = list ? list.indexOf(note) : -1;
    if (list && index >= 0) list.splice(index, 1);
  };
  const end = (note: SoundingNote) => {
    allocator.release(note.member + 1);
    forget(note);
  };

  const startNote = (channel: number, key: number, velocity: number, track: number) => {
    const note: SoundingNote = { source: channel, key, played: played[key], tuningCents: tuningCents[key], track, tick, member: 0 };
    const { channel: memberChannel, stolen } = allocator.start(note);
    note.member = memberChannel - 1;
    if (stolen) {
      writer.channelMessage(tick, noteOff | stolen.member, stolen.played, 0x40);
      forget(stolen);
      notesStolen.push({
        track: stolen.track + 1,
        channel: stolen.source + 1,
        key: stolen.key,
        startTick: stolen.tick,
        stolenAtTick: tick,
        memberChannel,
      });
    }
    const member = members[note.member];
    member.syncTo(sources[channel], channel, writer, tick, note.member);
    sendBend(note);
    writer.channelMessage(tick, noteOn | note.member, note.played, velocity);
    member.note = note;
    const list = holders.get(channel * 128 + key);
    if (list) list.push(note);
    else holders.set(channel * 128 + key, [note]);
    channelUsed[note.member] = true;
    if (mapped[key]) notesRetuned++;
  };

  mergedOrder(tracks, (track, index) => {
    const events = tracks[track];
    writer = writers[track];
    tick = events.ticks[index];
    const message = events.messages[index];
    const status = message >> 16;
    const data1 = (message >> 8) & 0xff;
    const data2 = message & 0xff;
    if (status >= 0xf0) {
      if (status === 0xff && data1 === 0x2f) endTicks[track] = tick;
      else writer.copiedEvent(tick, song, events.starts[index], events.ends[index]);
      return;
    }
    const channel = status & 0x0f;
    const kind = status & 0xf0;
    if (channel === drumChannelIndex) {
      writer.channelMessage(tick, status, data1, data2);
    } else if (kind === noteOn && data2 > 0) {
      startNote(channel, data1, data2, track);
    } else if (kind === noteOff || kind === noteOn) {
      const note = holders.get(channel * 128 + data1)?.[0];
      if (!note) return;
      writer.channelMessage(tick, kind | note.member, note.played, data2);
      end(note);
    } else if (kind === polyPressure) {
      for (const note of holders.get(channel * 128 + data1) ?? []) {
        writer.channelMessage(tick, polyPressure | note.member, note.played, data2);
      }
    } else if (kind === pitchBend) {
      sources[channel].bend = data1 | (data2 << 7);
      for (const member of members) if (member.note?.source === channel) sendBend(member.note);
    } else {
      const state = sources[channel];
      const versionBefore = state.version;
      const change = state.apply(kind, data1, data2);
      members.forEach((member, memberIndex) => {
        if (member.source !== channel) return;
        member.forward(kind, data1, change, state, versionBefore, writer, tick, memberIndex);
        if (member.note && change.notesEnd) end(member.note);
        else if (member.note && change.bendReset) sendBend(member.note);
      });
    }
  });

  const bytes = standardMidiFile({ format, division }, writers.map((trackWriter, track) => trackWriter.finish(endTicks[track])));
  warnings.push(
    ...unreachableKeysWarning(unreachable, `lie beyond what keys 0-127 bent by ±${bendRange} semitones can reach; their bends were clamped`),
  );
  if (bendsClamped > 0) {
    warnings.push(fieldError('output.bendRange', `is too narrow for ${bendsClamped} bends of the song added to the tuning; they were clamped`));
  }
  if (notesStolen.length > 0) {
    warnings.push(
      fieldError('output.memberChannels', `give ${pool.length} channels, but more notes sounded at once: ${notesStolen.length} were cut short`),
    );
  }
  const channelsUsed = channelUsed.flatMap((used, index) => (used ? [index + 1] : []));
  return succeed({ bytes, report: { mode: 'mpe', notesRetuned, channelsUsed, notesStolen, warnings } });
}
