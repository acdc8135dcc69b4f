import { eq } from 'drizzle-orm';
import { type MidiEvent, parseMidi } from 'midi-file';
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { asBytes } from '../../tests/support/binary-response';
import { startTestServer } from '../../tests/support/test-server';
import { readZip } from '../../tests/support/zip';
import { instruments, memberships } from '../db/schema';
import { mostInstruments } from './instruments';

let server: Awaited<ReturnType<typeof startTestServer>>;
type Member = Awaited<ReturnType<typeof server.signIn>>;
let ines: Member;
let otto: Member;
let presetId: string;
let shareToken: string;

/**
 * The author's own output block: device 3, program 7, members 2-16 with a 12-semitone bend range.
 */
const authorsOutput = {
  deviceId: 3,
  program: 7,
  bank: 0,
  tuningName: 'AUTHOR',
  bendRange: 12,
  memberChannels: [2, 16],
};
const nineteen = {
  format: 'keyloom.preset',
  version: 1,
  name: 'Nineteen for Gear',
  scale: { kind: 'equal', divisions: 19, period: '2/1' },
  mapping: { rootKey: 60 },
  output: authorsOutput,
};

const synth = { name: 'Desk synth', receives: 'mts-bulk', deviceId: 16, program: 5 };
const mpeController = {
  name: 'Pad controller',
  receives: 'mpe',
  bendRange: 48,
  memberChannels: [2, 9],
};

const post = (who: Member, path: string, body?: object) =>
  who.agent.post(path).set('X-XSRF-TOKEN', who.xsrf).send(body);
const patch = (who: Member, path: string, body: object) =>
  who.agent.patch(path).set('X-XSRF-TOKEN', who.xsrf).send(body);
const remove = (who: Member, path: string) => who.agent.delete(path).set('X-XSRF-TOKEN', who.xsrf);
const download = (who: Member | null, path: string) =>
  asBytes(who ? who.agent.get(path) : request(server.app).get(path));

async function createInstrument(who: Member, settings: object): Promise<string> {
  return (await post(who, '/api/instruments', settings).expect(201)).body.id;
}

beforeAll(async () => {
  server = await startTestServer();
  ines = await server.signIn('instruments-ines');
  otto = await server.signIn('instruments-otto');
  presetId = (await post(ines, '/api/presets', { document: nineteen }).expect(201)).body.id;
  shareToken = (await post(ines, `/api/presets/${presetId}/shares`, {}).expect(201)).body.token;
});
afterAll(() => server.close());

/** Every channel message of a file, with its channel numbered 1-16 as musicians count. */
function channelEvents(bytes: Buffer): (MidiEvent & { channel: number })[] {
  return parseMidi(bytes)
    .tracks.flat()
    .filter(
      (e): e is MidiEvent & { channel: number } => 'channel' in e && typeof e.channel === 'number',
    )
    .map((e) => ({ ...e, channel: e.channel + 1 }));
}

/**
 * The value each channel set each registered parameter to, read as the MIDI 1.0 Detailed
 * Specification has a receiver read it: CC 101 and 100 select the RPN, CC 6 (data entry MSB) sets
 * it.
 */
function rpnValues(events: ReturnType<typeof channelEvents>): Map<string, number> {
  const selected = new Map<number, { msb?: number; lsb?: number }>();
  const values = new Map<string, number>();
  for (const e of events) {
    if (e.type !== 'controller') continue;
    const rpn = selected.get(e.channel) ?? {};
    if (e.controllerType === 101) rpn.msb = e.value;
    if (e.controllerType === 100) rpn.lsb = e.value;
    selected.set(e.channel, rpn);
    if (e.controllerType === 6 && rpn.msb !== 0x7f)
      values.set(`${e.channel}:${rpn.msb}/${rpn.lsb}`, e.value);
  }
  return values;
}

describe('instruments: keeping them', () => {
  it('creates one with the defaults filled in, lists it, changes it and deletes it', async () => {
    const created = await post(ines, '/api/instruments', {
      name: '  Hex keys ',
      receives: 'mts-notes',
    }).expect(201);
    expect(created.body).toMatchObject({
      name: 'Hex keys',
      receives: 'mts-notes',
      deviceId: 127,
      program: 0,
      bank: 0,
      bendRange: 2,
      memberChannels: [2, 16],
      port: null,
    });
    expect(new Date(created.body.createdAt).toISOString()).toBe(created.body.createdAt);
    const id = created.body.id;

    const listed = await ines.agent.get('/api/instruments').expect(200);
    expect(listed.body.items.find((i: { id: string }) => i.id === id)).toEqual(created.body);

    const changed = await patch(ines, `/api/instruments/${id}`, {
      program: 9,
      memberChannels: [3, 6],
      port: 'USB MIDI',
    }).expect(200);
    expect(changed.body).toMatchObject({
      name: 'Hex keys',
      program: 9,
      memberChannels: [3, 6],
      port: 'USB MIDI',
    });
    expect(changed.body.updatedAt >= created.body.updatedAt).toBe(true);
    const cleared = await patch(ines, `/api/instruments/${id}`, { port: null }).expect(200);
    expect(cleared.body).toMatchObject({ port: null, program: 9 });

    await remove(ines, `/api/instruments/${id}`).expect(204);
    const after = await ines.agent.get('/api/instruments').expect(200);
    expect(after.body.items.some((i: { id: string }) => i.id === id)).toBe(false);
    await remove(ines, `/api/instruments/${id}`).expect(404);
  });

  it('refuses bad settings with the field named, on create and on change', async () => {
    const cases: [object, string][] = [
      [{ ...synth, deviceId: 200 }, 'deviceId'],
      [{ ...mpeController, memberChannels: [9, 2] }, 'memberChannels'],
      [{ ...synth, receives: 'loud' }, 'receives'],
      [{ ...synth, volume: 11 }, 'volume'],
      [{ ...synth, name: '' }, 'name'],
      [{ ...synth, bendRange: 0 }, 'bendRange'],
      [{ receives: 'mpe' }, 'name'],
    ];
    for (const [body, field] of cases) {
      const res = await post(ines, '/api/instruments', body);
      expect([field, res.status, res.body.error?.field]).toEqual([field, 400, field]);
      expect(res.body.error.message).toMatch(new RegExp(`^${field}: `));
    }

    const id = await createInstrument(ines, mpeController);
    const changes: [object, string][] = [
      [{ deviceId: 200 }, 'deviceId'],
      [{ memberChannels: [12, 4] }, 'memberChannels'],
      // Laid over the stored 2-9: a first channel above the stored last one is refused too.
      [{ memberChannels: [10, 9] }, 'memberChannels'],
      [{ receives: 'loud' }, 'receives'],
      [{ colour: 'red' }, 'colour'],
      [{ name: null }, 'name'],
    ];
    for (const [body, field] of changes) {
      const res = await patch(ines, `/api/instruments/${id}`, body);
      expect([field, res.status, res.body.error?.field]).toEqual([field, 400, field]);
    }
    const unchanged = (await ines.agent.get('/api/instruments').expect(200)).body.items.find(
      (i: { id: string }) => i.id === id,
    );
    expect(unchanged).toMatchObject({ ...mpeController, deviceId: 127 });
  });

  it('keeps each member to a bounded number of instruments', async () => {
    const crowd = await server.signIn('instruments-crowd');
    await server.db.insert(instruments).values(
      Array.from({ length: mostInstruments }, (_, n) => ({
        ownerId: crowd.user.id,
        name: `Synth ${n}`,
        receives: 'mts-bulk' as const,
        deviceId: 127,
        program: 0,
        bank: 0,
        bendRange: 2,
        firstMemberChannel: 2,
        lastMemberChannel: 16,
      })),
    );
    const res = await post(crowd, '/api/instruments', synth).expect(409);
    expect(res.body.error.code).toBe('too_many');
    const [{ id }] = await server.db
      .select({ id: instruments.id })
      .from(instruments)
      .where(eq(instruments.ownerId, crowd.user.id))
      .limit(1);
    await remove(crowd, `/api/instruments/${id}`).expect(204);
    await post(crowd, '/api/instruments', synth).expect(201);
  });
});

describe('instruments: private to their owner', () => {
  it("answers another member's instrument as an unknown id: read, change, delete", async () => {
    const id = await createInstrument(ines, synth);
    const unknown = '00000000-0000-4000-8000-000000000000';

    const ottosList = await otto.agent.get('/api/instruments').expect(200);
    expect(ottosList.body.items.some((i: { id: string }) => i.id === id)).toBe(false);

    const theirs = await patch(otto, `/api/instruments/${id}`, { name: 'Mine now' }).expect(404);
    const nobodys = await patch(otto, `/api/instruments/${unknown}`, { name: 'Mine now' }).expect(
      404,
    );
    expect(theirs.body).toEqual(nobodys.body);
    const deleted = await remove(otto, `/api/instruments/${id}`).expect(404);
    expect(deleted.body).toEqual(
      (await remove(otto, `/api/instruments/${unknown}`).expect(404)).body,
    );
    // A text that is no id at all is the same 404, not a database fault.
    expect(
      (await patch(otto, '/api/instruments/not-an-id', { name: 'x' }).expect(404)).body,
    ).toEqual(nobodys.body);
    expect((await remove(otto, '/api/instruments/1%27%20or%201=1').expect(404)).body).toEqual(
      nobodys.body,
    );

    const export_ = await download(
      otto,
      `/api/shared/${shareToken}/export/mts-bulk?instrument=${id}`,
    ).expect(404);
    expect(JSON.parse(export_.body.toString()).error.message).toBe('No such instrument.');
    const own = await ines.agent.get('/api/instruments').expect(200);
    expect(own.body.items.find((i: { id: string }) => i.id === id)).toMatchObject({ ...synth });
  });

  it('asks a signed-out caller to sign in; refuses a write without the xsrf token', async () => {
    const id = await createInstrument(ines, synth);
    const guest = request(server.app);
    expect((await guest.get('/api/instruments')).status).toBe(401);
    expect((await guest.patch(`/api/instruments/${id}`).send({ name: 'x' })).status).toBe(401);
    expect((await guest.delete(`/api/instruments/${id}`)).status).toBe(401);
    const shared = await download(
      null,
      `/api/shared/${shareToken}/export/mts-bulk?instrument=${id}`,
    );
    expect(shared.status).toBe(401);

    const noToken = await ines.agent.post('/api/instruments').send(synth).expect(403);
    expect(noToken.body.error.code).toBe('xsrf');
    expect((await ines.agent.delete(`/api/instruments/${id}`).expect(403)).body.error.code).toBe(
      'xsrf',
    );
  });
});

describe('exports for an instrument', () => {
  it("writes the bulk dump with the instrument's device and program", async () => {
    const id = await createInstrument(ines, synth);
    const mine = await download(
      ines,
      `/api/presets/${presetId}/export/mts-bulk?instrument=${id}`,
    ).expect(200);
    // MIDI Tuning Standard (MIDI 1.0 Detailed Specification), bulk tuning dump:
    // F0 7E <device ID> 08 01
    // <tuning program> <16-byte name> ...; the device id 16 is 0x10.
    expect([...mine.body.subarray(0, 6)]).toEqual([0xf0, 0x7e, 0x10, 0x08, 0x01, 5]);
    // The tuning name stays the preset's.
    expect(mine.body.subarray(6, 12).toString('latin1')).toBe('AUTHOR');

    const authors = await download(ines, `/api/presets/${presetId}/export/mts-bulk`).expect(200);
    expect([authors.body[2], authors.body[5]]).toEqual([3, 7]);
    // Same tuning: only the device id, the program and the checksum (byte 406) differ.
    const differ = [...mine.body.keys()].filter((i) => mine.body[i] !== authors.body[i]);
    expect(differ.every((i) => [2, 5, 406].includes(i))).toBe(true);

    const saved = await ines.agent.get(`/api/presets/${presetId}`).expect(200);
    expect(saved.body.revision).toBe(1);
    expect(saved.body.document).toEqual(nineteen);
  });

  it("plays MPE on the instrument's channels with its bend range", async () => {
    const id = await createInstrument(ines, mpeController);
    const mine = channelEvents(
      (await download(ines, `/api/presets/${presetId}/export/mpe-smf?instrument=${id}`).expect(200))
        .body,
    );
    const sounding = mine.filter((e) => e.type === 'noteOn' || e.type === 'pitchBend');
    expect(sounding.length).toBeGreaterThan(0);
    // MPE specification (MMA RP-053): notes and their bends go on the member channels only, 2-9
    // here, and the lower zone's manager channel 1 carries the zone's configuration (RPN 6 = the
    // number of member channels).
    expect(new Set(sounding.map((e) => e.channel))).toEqual(new Set([2, 3, 4, 5, 6, 7, 8, 9]));
    expect(mine.every((e) => e.channel <= 9)).toBe(true);
    const rpn = rpnValues(mine);
    expect(rpn.get('1:0/6')).toBe(8);
    // MIDI 1.0 Detailed Specification: RPN 0 (MSB 0, LSB 0) is the pitch bend sensitivity, in
    // semitones.
    for (let channel = 2; channel <= 9; channel++) expect(rpn.get(`${channel}:0/0`)).toBe(48);

    const authors = channelEvents(
      (await download(ines, `/api/presets/${presetId}/export/mpe-smf`).expect(200)).body,
    );
    const authorsRpn = rpnValues(authors);
    expect(authorsRpn.get('1:0/6')).toBe(15);
    for (let channel = 2; channel <= 16; channel++)
      expect(authorsRpn.get(`${channel}:0/0`)).toBe(12);

    const saved = await ines.agent.get(`/api/presets/${presetId}/revisions`).expect(200);
    expect(saved.body.items.map((r: { revision: number }) => r.revision)).toEqual([1]);
  });

  it("picks the export of the instrument's own form with for-instrument", async () => {
    const bulk = await createInstrument(ines, synth);
    const mpe = await createInstrument(ines, mpeController);
    const dump = await download(
      ines,
      `/api/presets/${presetId}/export/for-instrument?instrument=${bulk}`,
    ).expect(200);
    expect(dump.headers['content-disposition']).toMatch(/\.syx"$/);
    expect([dump.body[2], dump.body[5]]).toEqual([16, 5]);
    const song = await download(
      ines,
      `/api/presets/${presetId}/export/for-instrument?instrument=${mpe}`,
    ).expect(200);
    expect(song.headers['content-disposition']).toMatch(/\.mid"$/);
    expect(rpnValues(channelEvents(song.body)).get('9:0/0')).toBe(48);

    const none = await download(ines, `/api/presets/${presetId}/export/for-instrument`).expect(400);
    expect(JSON.parse(none.body.toString()).error.field).toBe('instrument');
  });

  it("puts the instrument's settings into every file of the bundle", async () => {
    const id = await createInstrument(ines, { ...synth, bendRange: 48, memberChannels: [2, 9] });
    const zip = await download(ines, `/api/presets/${presetId}/bundle?instrument=${id}`).expect(
      200,
    );
    const files = await readZip(zip.body);
    const dump = files.get('nineteen-for-gear.syx');
    expect(dump && [dump[2], dump[5]]).toEqual([16, 5]);
    const mpe = files.get('nineteen-for-gear-mpe.mid');
    expect(mpe && rpnValues(channelEvents(mpe)).get('9:0/0')).toBe(48);

    const otherwise = await readZip(
      (await download(ines, `/api/presets/${presetId}/bundle`).expect(200)).body,
    );
    const authorsDump = otherwise.get('nineteen-for-gear.syx');
    expect(authorsDump && [authorsDump[2], authorsDump[5]]).toEqual([3, 7]);
  });

  it("takes a guest's instrument from the query on shared and preview routes", async () => {
    const settings =
      'receives=mts-bulk&deviceId=16&program=5&bank=0&bendRange=48&memberChannels=2-9';
    const shared = await download(
      null,
      `/api/shared/${shareToken}/export/mts-bulk?${settings}`,
    ).expect(200);
    expect([...shared.body.subarray(0, 6)]).toEqual([0xf0, 0x7e, 0x10, 0x08, 0x01, 5]);
    const zip = await readZip(
      (await download(null, `/api/shared/${shareToken}/bundle?${settings}`).expect(200)).body,
    );
    const dump = zip.get('nineteen-for-gear.syx');
    expect(dump && dump[2]).toBe(16);

    const mpeQuery = 'receives=mpe&memberChannels=2-9&bendRange=48';
    const forMpe = `/api/shared/${shareToken}/export/for-instrument?${mpeQuery}`;
    const mpe = await download(null, forMpe).expect(200);
    expect(rpnValues(channelEvents(mpe.body)).get('9:0/0')).toBe(48);

    const preview = await asBytes(
      request(server.app).post(`/api/preview/export/for-instrument?${settings}`).send(nineteen),
    ).expect(200);
    expect([preview.body[2], preview.body[5]]).toEqual([16, 5]);

    const faults: [string, string][] = [
      ['receives=mts-bulk&deviceId=200', 'deviceId'],
      ['receives=mts-bulk&deviceId=sixteen', 'deviceId'],
      ['receives=loud', 'receives'],
      ['receives=mpe&memberChannels=9-2', 'memberChannels'],
      ['deviceId=16', 'receives'],
    ];
    for (const [query, field] of faults) {
      const res = await download(null, `/api/shared/${shareToken}/export/mts-bulk?${query}`);
      expect([query, res.status, JSON.parse(res.body.toString()).error.field]).toEqual([
        query,
        400,
        field,
      ]);
      const onPreview = await request(server.app)
        .post(`/api/preview/export/mts-bulk?${query}`)
        .send(nineteen);
      expect([query, onPreview.status, onPreview.body.error.field]).toEqual([query, 400, field]);
    }
  });

  it("takes a member's saved instrument on shared and preview routes", async () => {
    const id = await createInstrument(otto, synth);
    const shared = await download(
      otto,
      `/api/shared/${shareToken}/export/mts-bulk?instrument=${id}`,
    ).expect(200);
    expect([shared.body[2], shared.body[5]]).toEqual([16, 5]);
    const preview = await asBytes(
      otto.agent
        .post(`/api/preview/export/mts-bulk?instrument=${id}`)
        .set('X-XSRF-TOKEN', otto.xsrf)
        .send(nineteen),
    ).expect(200);
    expect([preview.body[2], preview.body[5]]).toEqual([16, 5]);
    const both = await download(
      otto,
      `/api/shared/${shareToken}/export/mts-bulk?instrument=${id}&deviceId=1`,
    ).expect(400);
    expect(JSON.parse(both.body.toString()).error.field).toBe('instrument');
  });

  it("answers 404 for another member's instrument on the preset routes", async () => {
    const band = (await post(ines, '/api/bands', { name: 'Gear Band' }).expect(201)).body.id;
    const bandPreset = (
      await post(ines, '/api/presets', { document: nineteen, bandId: band }).expect(201)
    ).body.id;
    await server.db
      .insert(memberships)
      .values({ bandId: band, userId: otto.user.id, role: 'viewer' });
    const inesSynth = await createInstrument(ines, synth);
    await download(otto, `/api/presets/${bandPreset}/export/mts-bulk`).expect(200);
    const theirs = await download(
      otto,
      `/api/presets/${bandPreset}/export/mts-bulk?instrument=${inesSynth}`,
    ).expect(404);
    const unknown = await download(
      otto,
      `/api/presets/${bandPreset}/export/mts-bulk?instrument=nonsense`,
    ).expect(404);
    expect(theirs.body.toString()).toBe(unknown.body.toString());
    await download(otto, `/api/presets/${bandPreset}/bundle?instrument=${inesSynth}`).expect(404);
  });
});
