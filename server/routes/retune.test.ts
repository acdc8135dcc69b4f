import { type MidiData, type MidiEvent, parseMidi, writeMidi } from 'midi-file';
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { parsePresetDocument } from '../../shared/preset/preset-document';
import { previewTable } from '../../shared/tuning/preview';
import { asBytes } from '../../tests/support/binary-response';
import { startTestServer } from '../../tests/support/test-server';
import { fifthsPreset } from '../../shared/preset/presets.testing';

let server: Awaited<ReturnType<typeof startTestServer>>;
beforeAll(async () => {
  server = await startTestServer();
});
afterAll(() => server.close());

const preset = {
  ...fifthsPreset('Fen Fifths', 8, 3),
  output: { bendRange: 2, memberChannels: [2, 9] },
};
const keysHz = (() => {
  const parsed = parsePresetDocument(preset);
  if (!parsed.ok) throw new Error('bad preset');
  return previewTable(parsed.value).keys.map((k) => k.hz);
})();

/** A small format 1 song written with midi-file (not Keyloom's writer): a chord, a melody, and drums on channel 10. */
function song(): Buffer {
  const notes: MidiEvent[] = [];
  const melody = [60, 62, 64, 65, 67, 69, 71, 72];
  for (const [i, key] of melody.entries()) {
    notes.push({
      deltaTime: i === 0 ? 0 : 240,
      channel: 0,
      type: 'noteOn',
      noteNumber: key,
      velocity: 90,
    } as MidiEvent);
    notes.push({
      deltaTime: 0,
      channel: 0,
      type: 'noteOn',
      noteNumber: key - 12,
      velocity: 70,
    } as MidiEvent);
    notes.push({
      deltaTime: 200,
      channel: 0,
      type: 'noteOff',
      noteNumber: key,
      velocity: 0,
    } as MidiEvent);
    notes.push({
      deltaTime: 0,
      channel: 0,
      type: 'noteOff',
      noteNumber: key - 12,
      velocity: 0,
    } as MidiEvent);
  }
  const data: MidiData = {
    header: { format: 1, numTracks: 3, ticksPerBeat: 480 },
    tracks: [
      [
        { deltaTime: 0, meta: true, type: 'setTempo', microsecondsPerBeat: 500000 } as MidiEvent,
        { deltaTime: 0, meta: true, type: 'endOfTrack' } as MidiEvent,
      ],
      [
        { deltaTime: 0, channel: 0, type: 'programChange', programNumber: 5 } as MidiEvent,
        ...notes,
        { deltaTime: 0, meta: true, type: 'endOfTrack' } as MidiEvent,
      ],
      [
        { deltaTime: 0, channel: 9, type: 'noteOn', noteNumber: 36, velocity: 100 } as MidiEvent,
        { deltaTime: 120, channel: 9, type: 'noteOff', noteNumber: 36, velocity: 0 } as MidiEvent,
        { deltaTime: 0, meta: true, type: 'endOfTrack' } as MidiEvent,
      ],
    ],
  };
  return Buffer.from(writeMidi(data, { running: true }));
}

const retune = (file: Buffer, name: string, fields: Record<string, string>) => {
  let req = request(server.app).post('/api/retune').attach('file', file, name);
  for (const [k, v] of Object.entries(fields)) req = req.field(k, v);
  return asBytes(req);
};

/** The frequency of an MTS word by the formula of the MIDI Tuning specification, worked here
 * without Keyloom's decoder. */
const wordHz = (xx: number, yy: number, zz: number) =>
  440 * 2 ** ((xx + (128 * yy + zz) / 16384 - 69) / 12);

describe('POST /api/retune', () => {
  it('keeps the report header to counts, and gives the whole report in a JSON body to a client that asks for it', async () => {
    // Many notes at once on one channel: every member channel is taken, and more notes are cut short than a header
    // should list.
    const notes: MidiEvent[] = [];
    for (let i = 0; i < 600; i++)
      notes.push({
        deltaTime: 1,
        type: 'noteOn',
        channel: 0,
        noteNumber: 36 + (i % 48),
        velocity: 90,
      });
    const crowded = writeMidi({
      header: { format: 0, numTracks: 1, ticksPerBeat: 480 },
      tracks: [[...notes, { deltaTime: 480, type: 'endOfTrack' }]],
    } as MidiData);
    const asked = await request(server.app)
      .post('/api/retune')
      .set('Accept', 'application/json')
      .field('preset', JSON.stringify(preset))
      .field('mode', 'mpe')
      .attach('file', Buffer.from(crowded), 'crowded.mid')
      .expect(200);
    expect(asked.headers['keyloom-report'].length).toBeLessThan(512);
    const counts = JSON.parse(decodeURIComponent(asked.headers['keyloom-report']));
    expect(counts.notesStolenCount).toBeGreaterThan(100);
    expect(asked.body.report.notesStolen).toHaveLength(100);
    expect(asked.body.report.notesStolenCount).toBe(counts.notesStolenCount);
    expect(asked.body.fileName).toBe('crowded-fen-fifths-mpe.mid');
    // The song in the body reads back with midi-file, an independent reader.
    expect(parseMidi(Buffer.from(asked.body.song, 'base64')).header.format).toBe(0);
  });

  it('mts: puts the tuning at tick 0, selects it on the channels in use, keeps every other event, and each note sounds in tune', async () => {
    const res = await retune(song(), 'my song.mid', {
      preset: JSON.stringify(preset),
      mode: 'mts',
    });
    expect(res.status).toBe(200);
    const report = JSON.parse(decodeURIComponent(res.headers['keyloom-report']));
    expect(report).toMatchObject({
      mode: 'mts',
      notesRetuned: 16,
      channelsUsed: [1],
      notesStolenCount: 0,
    });
    expect(res.headers['content-disposition']).toBe(
      'attachment; filename="my-song-fen-fifths-mts.mid"',
    );

    const original = parseMidi(song());
    const tuned = parseMidi(res.body);
    const events = tuned.tracks.flat();
    const dump = events.find((e) => e.type === 'sysEx' && e.data[3] === 0x01) as
      { data: ArrayLike<number> } | undefined;
    if (!dump) throw new Error('no bulk dump in the retuned song');
    // MIDI Tuning specification: program selection by RPN 3 on each channel that plays: Bn 64 03 65
    // 00 06 tt.
    const rpn = events
      .filter((e) => e.type === 'controller' && (e as { channel: number }).channel === 0)
      .map((e) => [
        (e as { controllerType: number }).controllerType,
        (e as { value: number }).value,
      ]);
    expect(rpn).toEqual(
      expect.arrayContaining([
        [0x64, 0x03],
        [0x65, 0x00],
        [0x06, 0x00],
      ]),
    );
    expect(
      events.some((e) => e.type === 'controller' && (e as { channel: number }).channel === 9),
    ).toBe(false);
    // Every note event of the original is still there, in order, on its channel.
    const notesOf = (song: MidiData) =>
      song.tracks
        .flat()
        .filter((e) => e.type === 'noteOn' || e.type === 'noteOff')
        .map(
          (e) =>
            `${e.type} ${(e as { channel: number }).channel} ${(e as { noteNumber: number }).noteNumber}`,
        );
    expect(notesOf(tuned)).toEqual(notesOf(original));
    // The dump's frequency word for each key played (bytes after F0: 7E dev 08 01 tt name[16] then 3 a key).
    for (const key of [48, 50, 52, 53, 55, 57, 59, 60, 62, 64, 65, 67, 69, 71, 72]) {
      const at = 5 + 16 + 3 * key;
      const hz = wordHz(dump.data[at], dump.data[at + 1], dump.data[at + 2]);
      expect(Math.abs(1200 * Math.log2(hz / keysHz[key]!))).toBeLessThanOrEqual(
        0.0030517578125 + 1e-9,
      );
    }
  });

  it('mpe: one note per member channel, its bend before its note-on, drums left alone, every pitch within half a bend step', async () => {
    const res = await retune(song(), 'song.mid', { preset: JSON.stringify(preset), mode: 'mpe' });
    expect(res.status).toBe(200);
    const tuned = parseMidi(res.body);
    const bend = new Map<number, number>();
    const range = new Map<number, number>();
    let sounded = 0;
    for (const track of tuned.tracks) {
      const rpn = new Map<number, [number, number]>();
      for (const e of track as (MidiEvent & {
        channel: number;
        value: number;
        controllerType: number;
        noteNumber: number;
        velocity: number;
      })[]) {
        if (e.type === 'controller' && e.controllerType === 0x65)
          rpn.set(e.channel, [e.value, rpn.get(e.channel)?.[1] ?? 127]);
        if (e.type === 'controller' && e.controllerType === 0x64)
          rpn.set(e.channel, [rpn.get(e.channel)?.[0] ?? 127, e.value]);
        if (
          e.type === 'controller' &&
          e.controllerType === 0x06 &&
          rpn.get(e.channel)?.join() === '0,0'
        )
          range.set(e.channel, e.value);
        if (e.type === 'pitchBend') bend.set(e.channel, e.value);
        if (e.type === 'noteOn' && e.velocity > 0 && e.channel !== 9) {
          expect(e.channel).toBeGreaterThanOrEqual(1);
          expect(e.channel).toBeLessThanOrEqual(8);
          // MIDI 1.0 specification: pitch bend value - 8192 over 8192 of the bend range, in
          // semitones.
          const semitones = ((bend.get(e.channel) ?? 0) / 8192) * (range.get(e.channel) ?? 2);
          const hz = 440 * 2 ** ((e.noteNumber + semitones - 69) / 12);
          const original = [48, 50, 52, 53, 55, 57, 59, 60, 62, 64, 65, 67, 69, 71, 72].find(
            (k) => Math.abs(1200 * Math.log2(keysHz[k]! / hz)) < 1,
          );
          expect(original).toBeDefined();
          const halfStep = (100 * (range.get(e.channel) ?? 2)) / 8192 / 2;
          expect(Math.abs(1200 * Math.log2(hz / keysHz[original!]!))).toBeLessThanOrEqual(
            halfStep + 1e-9,
          );
          sounded++;
        }
        if (e.type === 'noteOn' && e.channel === 9) expect(e.noteNumber).toBe(36);
      }
    }
    expect(sounded).toBe(16);
  });

  it('refuses what is not a song, and a missing or bad preset or mode, with a 4xx that says so', async () => {
    const cases: [Buffer, Record<string, string>, number, RegExp][] = [
      [
        Buffer.from([0x50, 0x4b, 0x03, 0x04, 1, 2, 3]),
        { preset: JSON.stringify(preset) },
        400,
        /zip archive/,
      ],
      [Buffer.from('%PDF-1.7 ...'), { preset: JSON.stringify(preset) }, 400, /PDF document/],
      [
        Buffer.concat([Buffer.from('MThd'), Buffer.from([0, 0, 0, 6, 0, 1])]),
        { preset: JSON.stringify(preset) },
        400,
        /^file: /,
      ],
      [song(), {}, 400, /^preset: is required/],
      [song(), { preset: '{"format":' }, 400, /^preset: is not valid JSON/],
      [
        song(),
        { preset: JSON.stringify({ ...preset, mapping: { rootKey: 300 } }) },
        400,
        /^preset\.mapping\.rootKey: /,
      ],
      [song(), { preset: JSON.stringify(preset), mode: 'loud' }, 400, /^mode: must be mts or mpe/],
      [
        song(),
        { preset: JSON.stringify(preset), leadInMs: 'soon' },
        400,
        /^leadInMs: must be a number of milliseconds/,
      ],
      [
        song(),
        { preset: JSON.stringify(preset), leadInMs: '9000' },
        400,
        /^leadInMs: must be from 0 to 5000 ms/,
      ],
      [Buffer.alloc(6 * 1024 * 1024, 1), { preset: JSON.stringify(preset) }, 413, /limit of 5 MB/],
    ];
    for (const [file, fields, status, message] of cases) {
      const res = await retune(file, 'x.mid', fields);
      const error = JSON.parse(res.body.toString()).error;
      expect([res.status, error.message]).toEqual([status, expect.stringMatching(message)]);
    }
  });

  it('starts the first note after the lead-in: 100 ms unless set, as set, or none at 0', async () => {
    // The song's tempo is 500,000 microseconds a quarter at 480 ticks a quarter (SMF 1.0): 960 ticks a second.
    for (const [fields, ms, ticks] of [
      [{}, 100, 96],
      [{ leadInMs: '250' }, 250, 240],
      [{ leadInMs: '0' }, 0, 0],
    ] as const) {
      const res = await retune(song(), 'lead.mid', { preset: JSON.stringify(preset), ...fields });
      expect(res.status).toBe(200);
      expect(JSON.parse(decodeURIComponent(res.headers['keyloom-report'])).leadIn).toEqual({
        ms,
        ticks,
      });
      // Read back with midi-file: the first note of the melody track begins `ticks` after tick 0.
      let tick = 0;
      const melody = parseMidi(res.body).tracks[1].map((event) => ({
        tick: (tick += event.deltaTime),
        event,
      }));
      expect(melody.find(({ event }) => event.type === 'noteOn')?.tick).toBe(ticks);
    }
  });

  it("keeps a signed-in player's upload in their history with its checksum", async () => {
    const player = await server.signIn('retune-player');
    const res = await asBytes(
      player.agent
        .post('/api/retune')
        .set('X-XSRF-TOKEN', player.xsrf)
        .attach('file', song(), 'kept.mid')
        .field('preset', JSON.stringify(preset)),
    );
    expect(res.status).toBe(200);
    const rows = await server.db.query.uploads.findMany({
      where: (u, { eq }) => eq(u.userId, player.user.id),
    });
    expect(rows).toHaveLength(1);
    expect(rows[0]).toMatchObject({
      purpose: 'retune',
      fileName: 'kept.mid',
      byteSize: song().length,
    });
    expect(rows[0].sha256).toMatch(/^[0-9a-f]{64}$/);
  });
  it("retunes for the caller's own instrument: its member channels and bend range, MPE as it takes; another's is 404", async () => {
    const ines = await server.signIn('retune-instrument-owner');
    const otto = await server.signIn('retune-instrument-other');
    const created = await ines.agent
      .post('/api/instruments')
      .set('X-XSRF-TOKEN', ines.xsrf)
      .send({ name: 'Wide bender', receives: 'mpe', memberChannels: [2, 9], bendRange: 48 })
      .expect(201);
    const id = created.body.id as string;
    // The preset's own output block asks for other channels and another range, so that only the
    // instrument's settings can explain what comes back.
    const own = { ...preset, output: { bendRange: 12, memberChannels: [10, 16] } };
    const res = await asBytes(
      ines.agent
        .post('/api/retune')
        .set('X-XSRF-TOKEN', ines.xsrf)
        .attach('file', song(), 'for-instrument.mid')
        .field('preset', JSON.stringify(own))
        .field('instrument', id),
    );
    expect(res.status).toBe(200);
    // Read back with midi-file, an independent reader. MPE specification: member channels carry
    // one note each; MIDI 1.0 specification: RPN 0 (CC 101 = 0, CC 100 = 0) then data entry
    // (CC 6) sets the pitch bend sensitivity in semitones.
    const tuned = parseMidi(res.body);
    const noteChannels = new Set<number>();
    const ranges = new Map<number, number>();
    for (const track of tuned.tracks) {
      const rpn = new Map<number, string>();
      for (const e of track as (MidiEvent & {
        channel: number;
        value: number;
        controllerType: number;
        velocity: number;
      })[]) {
        if (e.type === 'controller' && e.controllerType === 0x65)
          rpn.set(e.channel, `${e.value},${rpn.get(e.channel)?.split(',')[1] ?? 127}`);
        if (e.type === 'controller' && e.controllerType === 0x64)
          rpn.set(e.channel, `${rpn.get(e.channel)?.split(',')[0] ?? 127},${e.value}`);
        if (e.type === 'controller' && e.controllerType === 0x06 && rpn.get(e.channel) === '0,0')
          ranges.set(e.channel, e.value);
        if (e.type === 'noteOn' && e.velocity > 0 && e.channel !== 9) noteChannels.add(e.channel);
      }
    }
    // midi-file numbers channels from 0: member channels 2-9 are 1-8.
    expect(noteChannels.size).toBeGreaterThan(1);
    for (const channel of noteChannels) {
      expect(channel).toBeGreaterThanOrEqual(1);
      expect(channel).toBeLessThanOrEqual(8);
      expect(ranges.get(channel)).toBe(48);
    }
    expect([...ranges.values()].every((range) => range === 48)).toBe(true);

    const refused = await otto.agent
      .post('/api/retune')
      .set('X-XSRF-TOKEN', otto.xsrf)
      .attach('file', song(), 'not-mine.mid')
      .field('preset', JSON.stringify(own))
      .field('instrument', id);
    expect(refused.status).toBe(404);
  });
});
