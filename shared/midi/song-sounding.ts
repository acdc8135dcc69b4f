import { type Result, succeed } from '../result';
import {
  controlChange,
  endOfTrackMeta,
  messageKind,
  metaEvent,
  noteOff,
  noteOn,
  pitchBend,
  systemExclusive,
  tempoMeta,
} from './midi-bytes';
import { decodeMtsMessage } from './mts-decode';
import { drumChannelIndex } from './retune-report';
import { defaultMicrosecondsPerQuarter, readSong, ticksPerSecond } from './smf-reader';

/**
 * What a song sounds like on an instrument that follows the MIDI Tuning Standard and pitch bend, note by note:
 * when each note starts and stops, in seconds through the song's tempo map, and at what frequency. The retune page
 * plays this through the audition synth, so the player hears the file as written before downloading it.
 *
 * The instrument starts in 12-tone equal temperament at A4 = 440 Hz with a bend range of 2 semitones (the General
 * MIDI default); every MTS message in the song retunes the keys it names, whatever program or bank it writes to;
 * RPN 0 sets a channel's bend range; a note takes its channel's bend when it starts. Channel 10 (drums) is counted,
 * not sounded.
 */

export interface SoundingNote {
  /** Seconds from the start of the song. */
  start: number;
  end: number;
  hz: number;
  /** 1-127. */
  velocity: number;
  /** The key the file plays (0-127) and its channel (0-15) as written; in MPE, a member channel. */
  key: number;
  channel: number;
}

export interface SongSound {
  /** In order of their start. */
  notes: SoundingNote[];
  /** The time of the song's last event, in seconds. */
  seconds: number;
  drumNotes: number;
}

const generalMidiBendRange = 2;

interface TimedEvent {
  tick: number;
  status: number;
  data1: number;
  data2: number;
  start: number;
  end: number;
}

/** Seconds at each tick, from the tempo events of every track (SMF 1.0: tempo is song-wide). */
function tempoMap(
  division: number,
  tempos: { tick: number; microseconds: number }[],
): (tick: number) => number {
  if (division & 0x8000) {
    const perSecond = ticksPerSecond(division);
    return (tick) => tick / perSecond;
  }
  const sorted = [...tempos].sort((a, b) => a.tick - b.tick);
  const spans: { tick: number; seconds: number; secondsPerTick: number }[] = [
    { tick: 0, seconds: 0, secondsPerTick: defaultMicrosecondsPerQuarter / 1e6 / division },
  ];
  for (const { tick, microseconds } of sorted) {
    const last = spans[spans.length - 1];
    spans.push({
      tick,
      seconds: last.seconds + (tick - last.tick) * last.secondsPerTick,
      secondsPerTick: microseconds / 1e6 / division,
    });
  }
  return (tick) => {
    let span = spans[0];
    for (const candidate of spans) {
      if (candidate.tick > tick) break;
      span = candidate;
    }
    return span.seconds + (tick - span.tick) * span.secondsPerTick;
  };
}

/** The whole system exclusive message of an SMF sysex event (F0, a length, then the bytes after F0). */
function exclusiveMessage(song: Uint8Array, start: number, end: number): Uint8Array {
  let at = start + 1;
  while (song[at] & 0x80) at++;
  const message = new Uint8Array(end - at);
  message[0] = systemExclusive;
  message.set(song.subarray(at + 1, end), 1);
  return message;
}

export function songSound(song: Uint8Array): Result<SongSound> {
  const events: TimedEvent[] = [];
  const tempos: { tick: number; microseconds: number }[] = [];
  const layout = readSong(song, (_track, tick, status, data1, data2, start, end) => {
    if (status === metaEvent && data1 === tempoMeta && end - start === 6) {
      tempos.push({
        tick,
        microseconds: (song[end - 3] << 16) | (song[end - 2] << 8) | song[end - 1],
      });
    }
    const isChannelMessage = status >= noteOff && status < systemExclusive;
    const isEndOfTrack = status === metaEvent && data1 === endOfTrackMeta;
    if (status === systemExclusive || isChannelMessage || isEndOfTrack) {
      events.push({ tick, status, data1, data2, start, end });
    }
  });
  if (!layout.ok) return layout;
  const secondsAt = tempoMap(layout.value.division, tempos);
  // Tracks were read one after another: a stable sort by tick keeps, at one tick, the first track's events first.
  events.sort((a, b) => a.tick - b.tick);

  const keyHz = Array.from({ length: 128 }, (_, key) => 440 * 2 ** ((key - 69) / 12));
  const bend = new Array<number>(16).fill(8192);
  const bendRange = new Array<number>(16).fill(generalMidiBendRange);
  const parameter = Array.from({ length: 16 }, () => ({ msb: 127, lsb: 127 }));
  const sounding = new Map<number, SoundingNote[]>();
  const notes: SoundingNote[] = [];
  let drumNotes = 0;
  let lastSeconds = 0;

  const release = (channel: number, key: number, at: number) => {
    const note = sounding.get(channel * 128 + key)?.shift();
    if (note) note.end = at;
  };

  for (const event of events) {
    const at = secondsAt(event.tick);
    lastSeconds = Math.max(lastSeconds, at);
    if (event.status === systemExclusive) {
      const decoded = decodeMtsMessage(exclusiveMessage(song, event.start, event.end));
      if (decoded.ok && decoded.value.kind !== 'dump-request') {
        for (const { key, hz } of decoded.value.keys)
          if (hz !== null && key >= 0 && key < 128) keyHz[key] = hz;
      }
      continue;
    }
    const channel = event.status & 0x0f;
    switch (messageKind(event.status)) {
      case noteOn:
        if (event.data2 > 0) {
          if (channel === drumChannelIndex) {
            drumNotes++;
            break;
          }
          const semitones = ((bend[channel] - 8192) / 8192) * bendRange[channel];
          const hz = keyHz[event.data1] * 2 ** (semitones / 12);
          const note = {
            start: at,
            end: Number.POSITIVE_INFINITY,
            hz,
            velocity: event.data2,
            key: event.data1,
            channel,
          };
          notes.push(note);
          const id = channel * 128 + event.data1;
          sounding.set(id, [...(sounding.get(id) ?? []), note]);
          break;
        }
        release(channel, event.data1, at);
        break;
      case noteOff:
        release(channel, event.data1, at);
        break;
      case pitchBend:
        bend[channel] = event.data2 * 128 + event.data1;
        break;
      case controlChange:
        if (event.data1 === 101) parameter[channel].msb = event.data2;
        else if (event.data1 === 100) parameter[channel].lsb = event.data2;
        else if (
          event.data1 === 6 &&
          parameter[channel].msb === 0 &&
          parameter[channel].lsb === 0
        ) {
          bendRange[channel] = event.data2 + (bendRange[channel] % 1);
        } else if (
          event.data1 === 38 &&
          parameter[channel].msb === 0 &&
          parameter[channel].lsb === 0
        ) {
          bendRange[channel] = Math.floor(bendRange[channel]) + event.data2 / 100;
        }
        break;
    }
  }
  for (const note of notes) if (note.end === Number.POSITIVE_INFINITY) note.end = lastSeconds;
  return succeed({ notes, seconds: lastSeconds, drumNotes });
}
