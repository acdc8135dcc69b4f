import { type FieldError, fail, fieldError, type Result, succeed } from '../result';
import {
  endOfTrackMeta,
  messageKind,
  metaEvent,
  noteOff,
  noteOn,
  pitchBend,
  polyPressure,
  systemExclusive,
} from './midi-bytes';
import { MemberChannelAllocator, mpeSetupMessages, mpeZoneOf } from './mpe';
import {
  bendCentre,
  bendClampWarning,
  bendForPitch,
  bendStepCents,
  centsOfBendValue,
  nearestBendValue,
} from './pitch-bend';
import { readSong } from './smf-reader';
import { standardMidiFile, TrackWriter } from './smf-writer';
import { ChannelState, MemberChannel, type MessageSink } from './channel-state';
import { mergedOrder, SongTrackEvents } from './song-events';
import {
  drumChannelIndex,
  type RetunedSong,
  type SongTuning,
  type StolenNote,
} from './retune-report';
import { unreachableKeysWarning } from './unreachable-keys';

/**
 * Mode `mpe` of song retuning: every note of every channel but 10 moves to a member channel of its
 * own, with the pitch bend that tunes it (plus any bend the song itself gives) sent just before its
 * note-on. Each member channel is brought to the controllers and program of the song channel whose
 * note it plays; changes on a song channel reach the member channels playing it. Registered and
 * non-registered parameters of the song are read (the song's own bend range is honoured) but not
 * passed on: the member channels' bend range is the preset's.
 */

interface SoundingNote {
  /** The song channel (0-15), key and track (0 first) of the note, and when it began. */
  source: number;
  key: number;
  track: number;
  tick: number;
  /** The note sent instead, the bend in cents that tunes it, and its member channel (0-15). */
  played: number;
  tuningCents: number;
  member: number;
}

/** How each key is played: the note sent and the bend in cents that tunes it. */
interface KeyPlaying {
  played: number[];
  tuningCents: number[];
  mapped: boolean[];
  unreachable: number[];
}

/** Unmapped keys play as they are, unbent. */
function keyPlaying(tuning: SongTuning): KeyPlaying {
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

/** The rewriting of the channel messages of a song, event by event in the order they sound. */
class MpeRewrite implements MessageSink {
  private readonly sources = Array.from({ length: 16 }, () => new ChannelState());
  private readonly members = Array.from(
    { length: 16 },
    (_, channelIndex) => new MemberChannel<SoundingNote>(channelIndex),
  );
  private readonly allocator: MemberChannelAllocator<SoundingNote>;
  /** Sounding notes by song channel and key, the earliest first (a key struck twice ends so). */
  private readonly holders = new Map<number, SoundingNote[]>();
  private readonly halfStepCents: number;
  private tick = 0;
  readonly notesStolen: StolenNote[] = [];
  readonly channelUsed = new Array<boolean>(16).fill(false);
  notesRetuned = 0;
  bendsClamped = 0;

  constructor(
    private readonly keys: KeyPlaying,
    private readonly bendRange: number,
    memberChannels: number[],
    private writer: TrackWriter,
  ) {
    this.allocator = new MemberChannelAllocator<SoundingNote>(memberChannels);
    this.halfStepCents = bendStepCents(bendRange) / 2;
  }

  /** Takes one channel message (not on channel 10) of a track at a tick. */
  channelMessage(writer: TrackWriter, tick: number, track: number, message: number): void {
    const status = message >> 16;
    const data1 = (message >> 8) & 0xff;
    const data2 = message & 0xff;
    this.writer = writer;
    this.tick = tick;
    const channel = status & 0x0f;
    const kind = messageKind(status);
    if (kind === noteOn && data2 > 0) this.startNote(channel, data1, data2, track);
    else if (kind === noteOff || kind === noteOn) this.endNote(channel, data1, kind, data2, track);
    else if (kind === polyPressure) {
      for (const note of this.holders.get(channel * 128 + data1) ?? []) {
        this.send(polyPressure | note.member, note.played, data2);
      }
    } else if (kind === pitchBend) {
      this.sources[channel].bend = data1 | (data2 << 7);
      for (const member of this.members) {
        if (member.note?.source === channel) this.sendBend(member.note);
      }
    } else this.channelWide(channel, kind, data1, data2);
  }

  send(status: number, data1: number, data2 = 0): void {
    this.writer.channelMessage(this.tick, status, data1, data2);
  }

  private sendBend(note: SoundingNote): void {
    const source = this.sources[note.source];
    const songBendCents = ((source.bend - bendCentre) / bendCentre) * source.bendRangeCents;
    const cents = note.tuningCents + songBendCents;
    const value = nearestBendValue(cents, this.bendRange);
    if (Math.abs(cents - centsOfBendValue(value, this.bendRange)) > this.halfStepCents + 1e-9) {
      this.bendsClamped++;
    }
    this.send(pitchBend | note.member, value & 0x7f, value >> 7);
  }

  private startNote(channel: number, key: number, velocity: number, track: number): void {
    const { played, tuningCents, mapped } = this.keys;
    const note: SoundingNote = {
      source: channel,
      key,
      track,
      tick: this.tick,
      played: played[key],
      tuningCents: tuningCents[key],
      member: 0,
    };
    const { channel: memberChannel, stolen } = this.allocator.start(note);
    note.member = memberChannel - 1;
    if (stolen) {
      this.send(noteOff | stolen.member, stolen.played, 0x40);
      this.forget(stolen);
      this.notesStolen.push({
        track: stolen.track + 1,
        channel: stolen.source + 1,
        key: stolen.key,
        startTick: stolen.tick,
        stolenAtTick: this.tick,
        memberChannel,
      });
    }
    const member = this.members[note.member];
    member.syncTo(this.sources[channel], channel, this);
    this.sendBend(note);
    this.send(noteOn | note.member, note.played, velocity);
    member.note = note;
    const list = this.holders.get(channel * 128 + key);
    if (list) list.push(note);
    else this.holders.set(channel * 128 + key, [note]);
    this.channelUsed[note.member] = true;
    if (mapped[key]) this.notesRetuned++;
  }

  /**
   * A note-off (or note-on of velocity 0) ends the earliest sounding note of that key, one of its own track first:
   * the merged stream sounds the same either way, and readers that pair notes track by track find every note.
   */
  private endNote(
    channel: number,
    key: number,
    kind: number,
    velocity: number,
    track: number,
  ): void {
    const holders = this.holders.get(channel * 128 + key);
    const note = holders?.find((held) => held.track === track) ?? holders?.[0];
    if (!note) return;
    this.send(kind | note.member, note.played, velocity);
    this.end(note);
  }

  /** Controllers, program changes and channel pressure reach the member channels playing it. */
  private channelWide(channel: number, kind: number, data1: number, data2: number): void {
    const state = this.sources[channel];
    const change = state.apply(kind, data1, data2);
    for (const member of this.members) {
      if (member.source !== channel) continue;
      member.forward(change, state, this);
      if (member.note && change.notesEnd) this.end(member.note);
      else if (member.note && change.bendReset) this.sendBend(member.note);
    }
  }

  private end(note: SoundingNote): void {
    this.allocator.release(note.member + 1);
    this.forget(note);
  }

  /** Forgets a note that no longer sounds (the allocator is told separately). */
  private forget(note: SoundingNote): void {
    if (this.members[note.member].note === note) this.members[note.member].note = null;
    const list = this.holders.get(note.source * 128 + note.key);
    const index = list ? list.indexOf(note) : -1;
    if (list && index >= 0) list.splice(index, 1);
  }
}

export function rewriteAsMpe(song: Uint8Array, tuning: SongTuning): Result<RetunedSong> {
  const tracks: SongTrackEvents[] = [];
  let usesDrums = false;
  const layout = readSong(song, (track, tick, status, data1, data2, start, end) => {
    (tracks[track] ??= new SongTrackEvents()).add(tick, status, data1, data2, start, end);
    if ((status & 0x0f) === drumChannelIndex && status < systemExclusive) usesDrums = true;
  });
  if (!layout.ok) return layout;
  const { trackCount, chunks, format, division } = layout.value;
  for (let track = 0; track < trackCount; track++) tracks[track] ??= new SongTrackEvents();

  const { bendRange } = tuning.output;
  const zone = mpeZoneOf(tuning.output.memberChannels);
  const warnings: FieldError[] = [...zone.warnings];
  const drumChannel = drumChannelIndex + 1;
  const pool = zone.memberChannels.filter((channel) => !(usesDrums && channel === drumChannel));
  if (pool.length === 0) {
    const fault = 'leave no channel for notes besides the drums on channel 10';
    return fail([fieldError('output.memberChannels', fault)]);
  }
  if (pool.length < zone.memberChannels.length) {
    const fault = 'include channel 10, which the song uses for drums: notes were kept off it';
    warnings.push(fieldError('output.memberChannels', fault));
  }
  if (chunks.some((chunk) => !chunk.isTrack)) {
    warnings.push(fieldError('file', 'holds chunks that are not tracks: they were left out'));
  }

  const keys = keyPlaying(tuning);
  const writers = tracks.map((events) => new TrackWriter(true, 64 + events.length * 5));
  const rewrite = new MpeRewrite(keys, bendRange, pool, writers[0]);
  writers[0].channelMessages(0, mpeSetupMessages(zone, bendRange));
  const endTicks = new Array<number>(trackCount).fill(0);
  mergedOrder(tracks, (track, index) => {
    const events = tracks[track];
    const writer = writers[track];
    const tick = events.ticks[index];
    const message = events.messages[index];
    const status = message >> 16;
    if (status >= systemExclusive) {
      const type = (message >> 8) & 0xff;
      if (status === metaEvent && type === endOfTrackMeta) endTicks[track] = tick;
      else writer.copiedEvent(tick, song, events.starts[index], events.ends[index]);
    } else if ((status & 0x0f) === drumChannelIndex) {
      writer.channelMessage(tick, status, (message >> 8) & 0xff, message & 0xff);
    } else rewrite.channelMessage(writer, tick, track, message);
  });
  const finished = writers.map((writer, track) => writer.finish(endTicks[track]));
  const bytes = standardMidiFile({ format, division }, finished);

  warnings.push(...unreachableKeysWarning(keys.unreachable, bendClampWarning(bendRange)));
  if (rewrite.bendsClamped > 0) {
    const fault = `is too narrow for ${rewrite.bendsClamped} bends of the song added to the tuning`;
    warnings.push(fieldError('output.bendRange', `${fault}; they were clamped`));
  }
  const { notesStolen, notesRetuned } = rewrite;
  if (notesStolen.length > 0) {
    const fault =
      `give ${pool.length} channels, but more notes sounded at once: ` +
      `${notesStolen.length} were cut short`;
    warnings.push(fieldError('output.memberChannels', fault));
  }
  const channelsUsed = rewrite.channelUsed.flatMap((used, index) => (used ? [index + 1] : []));
  // Unmapped notes are counted for both modes by retuneSong.
  const report = {
    mode: 'mpe' as const,
    notesRetuned,
    channelsUsed,
    notesStolen,
    notesUnmappedCount: 0,
    notesUnmapped: [],
    warnings,
    leadIn: { ms: 0, ticks: 0 },
  };
  return succeed({ bytes, report });
}
