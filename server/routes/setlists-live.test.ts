// The stage's live stream, read byte for byte over a raw socket as a browser's EventSource reads
// it.
import type { AddressInfo } from 'node:net';
import type { Server } from 'node:http';
import { sql } from 'drizzle-orm';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { type EventStream, openEventStream } from '../../tests/support/event-stream';
import { startTestServer } from '../../tests/support/test-server';
import { memberships } from '../db/schema';

let server: Awaited<ReturnType<typeof startTestServer>>;
type Member = Awaited<ReturnType<typeof server.signIn>>;
let owner: Member;
let editor: Member;
let viewer: Member;
let listening: Server;
let base: string;
let bandId: string;
const streams: EventStream[] = [];

const send = (who: Member, method: 'post' | 'put' | 'delete', path: string, body?: object) =>
  who.agent[method](path).set('X-XSRF-TOKEN', who.xsrf).send(body);

const fifths = (name: string, up = 5) => ({
  format: 'keyloom.preset',
  version: 1,
  name,
  scale: { kind: 'generated', generator: '3/2', period: '2/1', up, down: 1 },
  mapping: { rootKey: 60 },
});

async function newPreset(name: string): Promise<string> {
  return (await send(owner, 'post', '/api/presets', { document: fifths(name), bandId }).expect(201))
    .body.id;
}

async function newSetlist(entries: object[]): Promise<string> {
  return (
    await send(owner, 'post', `/api/bands/${bandId}/setlists`, { name: 'Live', entries }).expect(
      201,
    )
  ).body.id;
}

async function follow(who: Member, setlistId: string, lastEventId?: string): Promise<EventStream> {
  const headers: Record<string, string> = { cookie: who.cookie() };
  if (lastEventId !== undefined) headers['last-event-id'] = lastEventId;
  const stream = await openEventStream(`${base}/api/setlists/${setlistId}/live`, headers);
  streams.push(stream);
  return stream;
}

const move = (who: Member, setlistId: string, position: number) =>
  send(who, 'post', `/api/setlists/${setlistId}/position`, { position });

beforeAll(async () => {
  server = await startTestServer();
  owner = await server.signIn('live-owner');
  editor = await server.signIn('live-editor');
  viewer = await server.signIn('live-viewer');
  bandId = (await send(owner, 'post', '/api/bands', { name: 'Live Band' }).expect(201)).body.id;
  await server.db.insert(memberships).values([
    { bandId, userId: editor.user.id, role: 'editor' },
    { bandId, userId: viewer.user.id, role: 'viewer' },
  ]);
  listening = server.app.listen(0, '127.0.0.1');
  await new Promise((resolve) => listening.once('listening', resolve));
  base = `http://127.0.0.1:${(listening.address() as AddressInfo).port}`;
});
afterAll(async () => {
  for (const stream of streams) stream.close();
  await new Promise((resolve) => listening?.close(resolve));
  await server.close();
});

describe('the live stream', () => {
  it('answers a viewer at once with the position, uncompressed and unbuffered', async () => {
    const a = await newPreset('Live Opening');
    const id = await newSetlist([{ presetId: a }]);
    const stream = await follow(viewer, id);
    expect(stream.status).toBe(200);
    expect(stream.headers['content-type']).toMatch(/^text\/event-stream/);
    expect(stream.headers['x-accel-buffering']).toBe('no');
    expect(stream.headers['cache-control']).toMatch(/no-cache/);
    expect(stream.headers['content-encoding']).toBeUndefined();
    const first = await stream.next();
    expect(first.type).toBe('position');
    expect(JSON.parse(first.data)).toEqual({
      position: 0,
      presetId: a,
      revision: 1,
      document: fifths('Live Opening'),
    });
    expect(first.id).toMatch(/^\d+$/);
    expect(stream.retry).toBeGreaterThanOrEqual(1000);
  });

  it('sends exactly one event per move, with rising ids; a viewer cannot move', async () => {
    const [a, b, c] = [
      await newPreset('Move A'),
      await newPreset('Move B'),
      await newPreset('Move C'),
    ];
    const id = await newSetlist([{ presetId: a }, { presetId: b }, { presetId: c }]);
    const stream = await follow(viewer, id);
    await stream.next();
    await move(viewer, id, 1).expect(403);
    await move(editor, id, 1).expect(200);
    const second = await stream.next();
    expect(JSON.parse(second.data)).toMatchObject({ position: 1, presetId: b, revision: 1 });
    await move(owner, id, 2).expect(200);
    const third = await stream.next();
    expect(JSON.parse(third.data)).toMatchObject({ position: 2, presetId: c });
    // Moving to where it already is still tells everyone (to resend a tuning).
    await move(editor, id, 2).expect(200);
    const fourth = await stream.next();
    expect(JSON.parse(fourth.data).position).toBe(2);
    const ids = stream.events.map((event) => Number(event.id));
    expect(ids).toEqual([...ids].sort((x, y) => x - y));
    expect(new Set(ids).size).toBe(4);
    expect(stream.events).toHaveLength(4);
  });

  it('carries the pinned or the latest revision; a save of a followed entry is heard', async () => {
    const follows = await newPreset('Follows Latest');
    const pinned = await newPreset('Pinned Down');
    await send(owner, 'post', `/api/presets/${pinned}/revisions`, {
      document: fifths('Pinned Down', 7),
    }).expect(201);
    const id = await newSetlist([{ presetId: follows }, { presetId: pinned, revision: 1 }]);
    const stream = await follow(editor, id);
    expect(JSON.parse((await stream.next()).data)).toMatchObject({
      presetId: follows,
      revision: 1,
    });

    await send(editor, 'post', `/api/presets/${follows}/revisions`, {
      document: fifths('Follows Latest', 6),
    }).expect(201);
    const saved = JSON.parse((await stream.next()).data);
    expect(saved).toEqual({
      position: 0,
      presetId: follows,
      revision: 2,
      document: fifths('Follows Latest', 6),
    });

    await move(editor, id, 1).expect(200);
    const pinnedEvent = JSON.parse((await stream.next()).data);
    expect(pinnedEvent).toEqual({
      position: 1,
      presetId: pinned,
      revision: 1,
      document: fifths('Pinned Down'),
    });
    // A save of the pinned preset, or of an entry that is not current, tells no one: the next event
    // is the move.
    await send(owner, 'post', `/api/presets/${pinned}/revisions`, {
      document: fifths('Pinned Down', 8),
    }).expect(201);
    await send(owner, 'post', `/api/presets/${follows}/revisions`, {
      document: fifths('Follows Latest', 9),
    }).expect(201);
    await move(editor, id, 0).expect(200);
    expect(JSON.parse((await stream.next()).data)).toMatchObject({
      position: 0,
      presetId: follows,
      revision: 3,
    });
    expect(stream.events).toHaveLength(4);
  });

  it('resumes with Last-Event-ID: nothing when in step, else the state now', async () => {
    const [a, b, c] = [
      await newPreset('Resume A'),
      await newPreset('Resume B'),
      await newPreset('Resume C'),
    ];
    const id = await newSetlist([{ presetId: a }, { presetId: b }, { presetId: c }]);
    await move(owner, id, 1).expect(200);
    const first = await follow(viewer, id);
    const seen = await first.next();
    first.close();

    // In step: the first thing the resumed stream says is the next move, not the state it already
    // had.
    const inStep = await follow(viewer, id, seen.id);
    await move(owner, id, 2).expect(200);
    const next = await inStep.next();
    expect(JSON.parse(next.data).position).toBe(2);
    expect(Number(next.id)).toBeGreaterThan(Number(seen.id));
    expect(inStep.events).toHaveLength(1);
    inStep.close();

    // Behind by two moves: one event, the state now.
    await move(owner, id, 0).expect(200);
    await move(owner, id, 1).expect(200);
    const behind = await follow(viewer, id, next.id);
    const caughtUp = await behind.next();
    expect(JSON.parse(caughtUp.data)).toMatchObject({ position: 1, presetId: b });
    await move(owner, id, 2).expect(200);
    expect(JSON.parse((await behind.next()).data).position).toBe(2);
    expect(behind.events.map((event) => JSON.parse(event.data).position)).toEqual([1, 2]);
  });

  it('follows a list changed under it, and ends when the setlist is deleted', async () => {
    const [a, b] = [await newPreset('Change A'), await newPreset('Change B')];
    const id = await newSetlist([{ presetId: a }]);
    const stream = await follow(viewer, id);
    await stream.next();
    await send(owner, 'put', `/api/setlists/${id}`, {
      name: 'Live',
      entries: [{ presetId: b }, { presetId: a }],
    }).expect(200);
    expect(JSON.parse((await stream.next()).data)).toMatchObject({ position: 0, presetId: b });
    await send(owner, 'delete', `/api/setlists/${id}`).expect(204);
    await stream.ended;
    expect(stream.events).toHaveLength(2);
    const gone = await follow(viewer, id);
    expect(gone.status).toBe(404);
    expect(JSON.parse(await gone.body()).error.code).toBe('not_found');
  });

  it('hears moves again after its listening connection was cut', async () => {
    const [a, b] = [await newPreset('Cut A'), await newPreset('Cut B')];
    const id = await newSetlist([{ presetId: a }, { presetId: b }]);
    const stream = await follow(viewer, id);
    await stream.next();
    const cut = await server.db.execute(
      sql`SELECT pg_terminate_backend(pid) AS done FROM pg_stat_activity
          WHERE application_name = ${`keyloom-stage-${process.pid}`}`,
    );
    expect(cut.rows).toHaveLength(1);
    await move(editor, id, 1).expect(200);
    expect(JSON.parse((await stream.next()).data)).toMatchObject({ position: 1, presetId: b });
  });
});
