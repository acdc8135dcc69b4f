import { Midi } from '@tonejs/midi';
import { type MidiControllerEvent, type MidiEvent, parseMidi } from 'midi-file';
import { describe, expect, it } from 'vitest';
import { centsBetween, pureFifthsOnWhiteKeys, twelveEqualKeys } from './key-tables.testing';
import { decodeMtsStream } from './mts-decode';
import { mpePhraseFile, type PhraseTuning, tuningPhraseFile } from './tuning-phrase';

const output = {
  deviceId: 0x7f,
  program: 3,
  bank: 0,
  tuningName: 'FIFTHS C',
  bendRange: 2,
  memberChannels: [2, 16] as const,
};
const fifths: PhraseTuning = {
  keys: pureFifthsOnWhiteKeys,
  mapping: { rootKey: 60, keysPerPeriod: 12 },
  output,
  name: 'Fifths',
};

/** The walk up the white keys from C4 and back, then the chord C E G C. */
const walkKeys = [60, 62, 64, 65, 67, 69, 71, 72, 71, 69, 67, 65, 64, 62, 60];
const chordKeys = [60, 64, 67, 72];
/** One beat of 480 ticks before the phrase, eighth notes of 240 ticks, a chord of 1920 ticks. */
const chordTick = 480 + walkKeys.length * 240;
const walkTicks = walkKeys.map((_, index) => 480 + 240 * index);

function controllers(events: MidiEvent[]): [number, number, number][] {
  return events
    .filter((event): event is MidiControllerEvent => event.type === 'controller')
    .map((event) => [event.channel + 1, event.controllerType, event.value]);
}

function sysexOf(events: MidiEvent[]): number[][] {
  return events.flatMap((event) =>
    event.type === 'sysEx' ? [[0xf0, ...Array.from(event.data)]] : [],
  );
}

describe('the smf phrase file', () => {
  const { bytes, warnings } = tuningPhraseFile(fifths);
  const parsed = parseMidi(bytes);

  it('tunes at tick 0 with a bulk dump and single-note changes that decode to the tuning', () => {
    const atStart = parsed.tracks[0].filter((event) => event.deltaTime === 0);
    const sysex = sysexOf(atStart);
    // SMF 1.0, a bulk dump is stored as F0 83 17 7E ... F7 (407 bytes after F0)
    expect(sysex[0]).toHaveLength(408);
    expect(sysex[0].slice(0, 5)).toEqual([0xf0, 0x7e, 0x7f, 0x08, 0x01]);
    expect(sysex.slice(1).every((message) => message[4] === 0x02)).toBe(true);
    const decoded = decodeMtsStream(Uint8Array.from(sysex.flat()));
    if (!decoded.ok) throw new Error(decoded.errors[0].message);
    const kinds = decoded.value.messages.map((message) => message.kind);
    expect(kinds).toEqual(['bulk-dump', ...new Array(sysex.length - 1).fill('single-note')]);
    for (const entry of pureFifthsOnWhiteKeys) {
      const hz = decoded.value.keys[entry.key].hz;
      if (entry.hz === null) expect(hz).toBeNull();
      // MIDI Tuning specification: rounding to the nearest unit leaves at most 0.0030517578125
      // cents
      else expect(Math.abs(centsBetween(entry.hz, hz ?? 0))).toBeLessThanOrEqual(0.0030518);
    }
    expect(warnings).toEqual([]);
  });

  it('selects the tuning bank and program on channel 1 with RPN 4 and RPN 3', () => {
    // MIDI Tuning specification, selecting a tuning program/bank, Bn 64 03 65 00 06 tt
    // (RPN 3 program, RPN 4 bank)
    expect(controllers(parsed.tracks[0]).slice(0, 6)).toEqual([
      [1, 0x64, 0x04],
      [1, 0x65, 0x00],
      [1, 0x06, 0],
      [1, 0x64, 0x03],
      [1, 0x65, 0x00],
      [1, 0x06, 3],
    ]);
  });

  it('walks the scale and ends on a chord, read back by @tonejs/midi in time', () => {
    const midi = new Midi(bytes);
    const notes = midi.tracks.flatMap((track) =>
      track.notes.map((note) => ({ ...note.toJSON(), channel: track.channel })),
    );
    expect(notes.map((note) => note.midi)).toEqual([...walkKeys, ...chordKeys]);
    const walk = notes.slice(0, walkKeys.length);
    expect(walk.map((note) => [note.ticks, note.durationTicks])).toEqual(
      walkTicks.map((ticks) => [ticks, 240]),
    );
    const chord = notes.slice(walkKeys.length);
    expect(chord.every((note) => note.ticks === chordTick && note.durationTicks === 1920)).toBe(
      true,
    );
    // 120 quarter notes a minute: the phrase starts half a second in
    expect(notes[0].time).toBeCloseTo(0.5, 9);
    expect(new Set(notes.map((note) => note.channel))).toEqual(new Set([0]));
  });

  it('uses the bank forms for a tuning in another bank', () => {
    const inBank = tuningPhraseFile({ ...fifths, output: { ...output, bank: 2 } });
    const sysex = sysexOf(parseMidi(inBank.bytes).tracks[0]);
    // MIDI Tuning specification: MTS 04 key-based dump with bank and 07 single-note change with
    // bank
    expect(sysex.map((message) => message[4])).toEqual([0x04, 0x07, 0x07, 0x07]);
  });

  it('says so when no key near the root is mapped', () => {
    const unmapped = twelveEqualKeys.map((entry) =>
      entry.key >= 60 && entry.key <= 72 ? { ...entry, hz: null } : entry,
    );
    const { warnings: noNotes } = tuningPhraseFile({ ...fifths, keys: unmapped });
    expect(noNotes[0].message).toMatch(/no key from 60 to 72 is mapped/);
  });
});

describe('the mpe-smf phrase file', () => {
  const { bytes, warnings } = mpePhraseFile({ ...fifths, output: { ...output, bendRange: 48 } });
  const parsed = parseMidi(bytes);

  it('configures the zone and sets the bend range on every member channel first', () => {
    const setup = controllers(parsed.tracks[0]);
    // MPE specification (MMA RP-053): configuration on the manager channel, Bn 64 06, Bn 65 00, Bn
    // 06 count (15 members, channels 2-16)
    expect(setup.slice(0, 3)).toEqual([
      [1, 0x64, 0x06],
      [1, 0x65, 0x00],
      [1, 0x06, 15],
    ]);
    // MIDI 1.0 specification: bend range RPN 0, Bn 65 00, Bn 64 00, Bn 06 semitones, Bn 26 cents,
    // null RPN
    for (let channel = 2; channel <= 16; channel++) {
      expect(setup.filter((entry) => entry[0] === channel).slice(0, 6)).toEqual([
        [channel, 0x65, 0],
        [channel, 0x64, 0],
        [channel, 0x06, 48],
        [channel, 0x26, 0],
        [channel, 0x65, 0x7f],
        [channel, 0x64, 0x7f],
      ]);
    }
    const firstNote = parsed.tracks[0].findIndex((event) => event.type === 'noteOn');
    const afterFirstNote = parsed.tracks[0].slice(firstNote);
    expect(afterFirstNote.some((event) => event.type === 'controller')).toBe(false);
    expect(warnings).toEqual([]);
  });

  it('sends each note its bend just before its note-on, on a channel of its own', () => {
    const events = parsed.tracks[0];
    const sounding = new Map<number, number>();
    events.forEach((event, index) => {
      if (event.type === 'noteOn') {
        const before = events[index - 1];
        expect(before.type).toBe('pitchBend');
        expect(event.deltaTime).toBe(0);
        expect('channel' in before && before.channel).toBe(event.channel);
        expect(sounding.has(event.channel)).toBe(false);
        sounding.set(event.channel, event.noteNumber);
      }
      if (event.type === 'noteOff') {
        expect(sounding.get(event.channel)).toBe(event.noteNumber);
        sounding.delete(event.channel);
      }
    });
    expect(sounding.size).toBe(0);
  });

  it('sounds every note of the phrase at its tuned pitch, read back by @tonejs/midi', () => {
    const midi = new Midi(bytes);
    const played = midi.tracks
      .flatMap((track) =>
        track.notes.map((note) => {
          const bend = track.pitchBends.filter((pitchBend) => pitchBend.ticks <= note.ticks).at(-1);
          // @tonejs/midi reads a bend scaled to +-1 of the bend range (here 48), seen in its output
          const semitones = note.midi + (bend?.value ?? 0) * 48;
          return { ticks: note.ticks, semitones, channel: track.channel };
        }),
      )
      .sort((a, b) => a.ticks - b.ticks || a.semitones - b.semitones);
    expect(played.map((note) => note.ticks)).toEqual([
      ...walkTicks,
      ...chordKeys.map(() => chordTick),
    ]);
    const expectedHz = [...walkKeys, ...chordKeys].map((key) => pureFifthsOnWhiteKeys[key].hz ?? 0);
    played.forEach((note, index) => {
      const hz = 440 * 2 ** ((note.semitones - 69) / 12);
      // MIDI 1.0 specification, resolution at +-48 semitones is 0.5859375 cents per step; half a
      // step at most
      const errorCents = Math.abs(centsBetween(expectedHz[index], hz));
      expect(errorCents).toBeLessThanOrEqual(0.5859375 / 2 + 1e-6);
    });
    const chordChannels = new Set(played.slice(walkKeys.length).map((note) => note.channel));
    expect(chordChannels.size).toBe(chordKeys.length);
    expect(played.every((note) => note.channel >= 1 && note.channel <= 15)).toBe(true);
  });

  it('cuts the oldest note off when the chord needs more channels than there are', () => {
    const narrow = mpePhraseFile({ ...fifths, output: { ...output, memberChannels: [2, 3] } });
    const notes = new Midi(narrow.bytes).tracks.flatMap((track) => track.notes);
    const chord = notes.filter((note) => note.ticks === chordTick);
    const lengths = chord.map((note) => note.durationTicks).sort((a, b) => a - b);
    expect(lengths).toEqual([0, 0, 1920, 1920]);
  });
});
