// Every API route against every kind of caller: who gets through and who is turned away. Built from the router's
// own route list, so a route added without a line here fails the first test.
import { eq } from 'drizzle-orm';
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { listRoutes } from '../../tests/support/route-list';
import { startTestServer } from '../../tests/support/test-server';
import {
  bands,
  instruments,
  invites,
  memberships,
  presetRevisions,
  presets,
  setlistEntries,
  setlists,
  shareLinks,
  users,
} from '../db/schema';
import { hashToken } from '../library/tokens';
import { fifthsPreset } from '../../shared/preset/presets.testing';

type Actor = 'anonymous' | 'stranger' | 'viewer' | 'editor' | 'owner' | 'admin' | 'linkHolder';
const actors: Actor[] = [
  'anonymous',
  'stranger',
  'viewer',
  'editor',
  'owner',
  'admin',
  'linkHolder',
];

const everyone = actors;
const signedIn: Actor[] = ['stranger', 'viewer', 'editor', 'owner', 'admin'];
const readers: Actor[] = ['viewer', 'editor', 'owner', 'admin'];
const editors: Actor[] = ['editor', 'owner', 'admin'];
const owners: Actor[] = ['owner', 'admin'];

interface Fixture {
  bandId: string;
  presetId: string;
  shareId: string;
  shareToken: string;
  inviteId: string;
  inviteToken: string;
  viewerId: string;
  /** An instrument of the owner's: private to them, admins included. */
  instrumentId: string;
  setlistId: string;
}

interface Case {
  allowed: Actor[];
  path: (f: Fixture, actor: Actor) => string;
  body?: (f: Fixture) => object;
  /** A Server-Sent Events stream: read up to its first event, then hung up. */
  stream?: true;
}

const doc = fifthsPreset('Matrix Fifths');

const matrix: Record<string, Case> = {
  'GET /api/health': { allowed: everyone, path: () => '/api/health' },
  'GET /auth/github': { allowed: everyone, path: () => '/auth/github' },
  'GET /auth/github/callback': { allowed: everyone, path: () => '/auth/github/callback' },
  'POST /auth/logout': { allowed: everyone, path: () => '/auth/logout' },
  'GET /api/me': { allowed: everyone, path: () => '/api/me' },
  'POST /api/preview/table': {
    allowed: everyone,
    path: () => '/api/preview/table',
    body: () => doc,
  },
  'POST /api/temperaments': {
    allowed: everyone,
    path: () => '/api/temperaments',
    body: () => ({ limit: 5, commas: ['81/80'] }),
  },
  'POST /api/presets': {
    allowed: editors,
    path: () => '/api/presets',
    body: (f) => ({ document: doc, bandId: f.bandId }),
  },
  'GET /api/presets': { allowed: signedIn, path: () => '/api/presets' },
  'GET /api/presets/:id': { allowed: readers, path: (f) => `/api/presets/${f.presetId}` },
  'POST /api/presets/:id/revisions': {
    allowed: editors,
    path: (f) => `/api/presets/${f.presetId}/revisions`,
    body: () => ({ document: doc, note: 'matrix' }),
  },
  'GET /api/presets/:id/revisions': {
    allowed: readers,
    path: (f) => `/api/presets/${f.presetId}/revisions`,
  },
  'GET /api/presets/:id/revisions/:n': {
    allowed: readers,
    path: (f) => `/api/presets/${f.presetId}/revisions/1`,
  },
  'GET /api/presets/:id/revisions/:n/changes': {
    allowed: readers,
    path: (f) => `/api/presets/${f.presetId}/revisions/2/changes`,
  },
  'POST /api/presets/:id/restore': {
    allowed: editors,
    path: (f) => `/api/presets/${f.presetId}/restore`,
    body: () => ({ revision: 1 }),
  },
  'POST /api/presets/:id/fork': {
    allowed: readers,
    path: (f) => `/api/presets/${f.presetId}/fork`,
    body: () => ({}),
  },
  'DELETE /api/presets/:id': { allowed: editors, path: (f) => `/api/presets/${f.presetId}` },
  'POST /api/presets/:id/untrash': {
    allowed: editors,
    path: (f) => `/api/presets/${f.presetId}/untrash`,
  },
  'POST /api/presets/:id/shares': {
    allowed: editors,
    path: (f) => `/api/presets/${f.presetId}/shares`,
    body: () => ({}),
  },
  'GET /api/presets/:id/shares': {
    allowed: editors,
    path: (f) => `/api/presets/${f.presetId}/shares`,
  },
  'DELETE /api/shares/:id': { allowed: editors, path: (f) => `/api/shares/${f.shareId}` },
  // Only the holder of the link's token gets in; everyone else tries a token of their own making.
  'GET /api/shared/:token': {
    allowed: ['linkHolder'],
    path: (f, actor) => `/api/shared/${actor === 'linkHolder' ? f.shareToken : 'guessed-token'}`,
  },
  'POST /api/bands': {
    allowed: signedIn,
    path: () => '/api/bands',
    body: () => ({ name: 'Matrix Band' }),
  },
  'GET /api/bands': { allowed: signedIn, path: () => '/api/bands' },
  'GET /api/bands/:id': { allowed: readers, path: (f) => `/api/bands/${f.bandId}` },
  'PATCH /api/bands/:id': {
    allowed: owners,
    path: (f) => `/api/bands/${f.bandId}`,
    body: () => ({ name: 'Renamed' }),
  },
  'PATCH /api/bands/:id/members/:userId': {
    allowed: owners,
    path: (f) => `/api/bands/${f.bandId}/members/${f.viewerId}`,
    body: () => ({ role: 'editor' }),
  },
  // The viewer may remove themself: that is leaving the band.
  'DELETE /api/bands/:id/members/:userId': {
    allowed: [...owners, 'viewer'],
    path: (f) => `/api/bands/${f.bandId}/members/${f.viewerId}`,
  },
  'GET /api/bands/:id/audit': { allowed: owners, path: (f) => `/api/bands/${f.bandId}/audit` },
  'GET /api/bands/:id/invites': { allowed: owners, path: (f) => `/api/bands/${f.bandId}/invites` },
  'POST /api/bands/:id/invites': {
    allowed: owners,
    path: (f) => `/api/bands/${f.bandId}/invites`,
    body: () => ({ email: 'new.player@example.org', role: 'viewer' }),
  },
  'POST /api/bands/:id/invites/:inviteId/resend': {
    allowed: owners,
    path: (f) => `/api/bands/${f.bandId}/invites/${f.inviteId}/resend`,
  },
  'DELETE /api/bands/:id/invites/:inviteId': {
    allowed: owners,
    path: (f) => `/api/bands/${f.bandId}/invites/${f.inviteId}`,
  },
  // An invite link is for whoever the mail reached: reading it needs the token, accepting it a signed-in member.
  'GET /api/invites/:token': { allowed: everyone, path: (f) => `/api/invites/${f.inviteToken}` },
  'POST /api/invites/:token/accept': {
    allowed: signedIn,
    path: (f) => `/api/invites/${f.inviteToken}/accept`,
  },
  'POST /api/preview/export/:format': {
    allowed: everyone,
    path: () => '/api/preview/export/mts-bulk',
    body: () => doc,
  },
  'GET /api/presets/:id/export/:format': {
    allowed: readers,
    path: (f) => `/api/presets/${f.presetId}/export/mts-bulk`,
  },
  'GET /api/presets/:id/bundle': {
    allowed: readers,
    path: (f) => `/api/presets/${f.presetId}/bundle`,
  },
  'GET /api/shared/:token/export/:format': {
    allowed: ['linkHolder'],
    path: (f, actor) =>
      `/api/shared/${actor === 'linkHolder' ? f.shareToken : 'guessed-token'}/export/sfz`,
  },
  'GET /api/shared/:token/bundle': {
    allowed: ['linkHolder'],
    path: (f, actor) =>
      `/api/shared/${actor === 'linkHolder' ? f.shareToken : 'guessed-token'}/bundle`,
  },
  'GET /api/instruments': { allowed: signedIn, path: () => '/api/instruments' },
  'POST /api/instruments': {
    allowed: signedIn,
    path: () => '/api/instruments',
    body: () => ({ name: 'Matrix synth', receives: 'mts-bulk' }),
  },
  'PATCH /api/instruments/:id': {
    allowed: ['owner'],
    path: (f) => `/api/instruments/${f.instrumentId}`,
    body: () => ({ program: 9 }),
  },
  'DELETE /api/instruments/:id': {
    allowed: ['owner'],
    path: (f) => `/api/instruments/${f.instrumentId}`,
  },
  'POST /api/retune': { allowed: everyone, path: () => '/api/retune' },
  'POST /api/import': { allowed: everyone, path: () => '/api/import' },
  'POST /api/bands/:id/setlists': {
    allowed: editors,
    path: (f) => `/api/bands/${f.bandId}/setlists`,
    body: (f) => ({ name: 'Matrix Set', entries: [{ presetId: f.presetId }] }),
  },
  'GET /api/bands/:id/setlists': {
    allowed: readers,
    path: (f) => `/api/bands/${f.bandId}/setlists`,
  },
  'GET /api/setlists/:id': { allowed: readers, path: (f) => `/api/setlists/${f.setlistId}` },
  'PUT /api/setlists/:id': {
    allowed: editors,
    path: (f) => `/api/setlists/${f.setlistId}`,
    body: (f) => ({ name: 'Matrix Set', entries: [{ presetId: f.presetId, revision: 1 }] }),
  },
  'DELETE /api/setlists/:id': { allowed: editors, path: (f) => `/api/setlists/${f.setlistId}` },
  'POST /api/setlists/:id/position': {
    allowed: editors,
    path: (f) => `/api/setlists/${f.setlistId}/position`,
    body: () => ({ position: 0 }),
  },
  'GET /api/setlists/:id/live': {
    allowed: readers,
    path: (f) => `/api/setlists/${f.setlistId}/live`,
    stream: true,
  },
  'GET /{*splat}': { allowed: everyone, path: () => '/library' },
};

let server: Awaited<ReturnType<typeof startTestServer>>;
const agents = new Map<Actor, { agent: request.Agent; xsrf: string }>();
const ids = new Map<Actor, string>();
let serial = 0;

beforeAll(async () => {
  server = await startTestServer();
  for (const actor of ['stranger', 'viewer', 'editor', 'owner', 'admin'] as const) {
    const { agent, user, xsrf } = await server.signIn(`matrix-${actor}`);
    agents.set(actor, { agent, xsrf });
    ids.set(actor, user.id);
  }
  await server.db
    .update(users)
    .set({ siteRole: 'admin' })
    .where(eq(users.id, ids.get('admin')!));
});
afterAll(() => server.close());

/** A band with an owner, an editor and a viewer, a preset of two revisions, a share link and a pending invite. */
async function freshFixture(): Promise<Fixture> {
  const n = ++serial;
  const { db } = server;
  const [band] = await db
    .insert(bands)
    .values({ name: `Matrix ${n}`, createdBy: ids.get('owner') })
    .returning();
  await db.insert(memberships).values([
    { bandId: band.id, userId: ids.get('owner')!, role: 'owner' },
    { bandId: band.id, userId: ids.get('editor')!, role: 'editor' },
    { bandId: band.id, userId: ids.get('viewer')!, role: 'viewer' },
  ]);
  const [preset] = await db
    .insert(presets)
    .values({ ownerId: ids.get('owner')!, bandId: band.id, name: doc.name, latestRevision: 2 })
    .returning();
  await db.insert(presetRevisions).values([
    { presetId: preset.id, revision: 1, document: doc, authorId: ids.get('owner') },
    {
      presetId: preset.id,
      revision: 2,
      document: { ...doc, mapping: { rootKey: 62 } },
      authorId: ids.get('owner'),
    },
  ]);
  const shareToken = `share-token-${n}-${Math.random()}`;
  const [share] = await db
    .insert(shareLinks)
    .values({ presetId: preset.id, tokenHash: hashToken(shareToken) })
    .returning();
  const inviteToken = `invite-token-${n}-${Math.random()}`;
  const [invite] = await db
    .insert(invites)
    .values({
      bandId: band.id,
      email: 'someone@example.org',
      role: 'viewer',
      tokenHash: hashToken(inviteToken),
      invitedBy: ids.get('owner'),
      expiresAt: new Date(Date.now() + 86_400_000),
    })
    .returning();
  const [setlist] = await db
    .insert(setlists)
    .values({ bandId: band.id, name: `Matrix Set ${n}` })
    .returning();
  await db.insert(setlistEntries).values({ setlistId: setlist.id, place: 0, presetId: preset.id });
  const [instrument] = await db
    .insert(instruments)
    .values({
      ownerId: ids.get('owner')!,
      name: `Matrix synth ${n}`,
      receives: 'mts-bulk',
      deviceId: 16,
      program: 5,
      bank: 0,
      bendRange: 2,
      firstMemberChannel: 2,
      lastMemberChannel: 16,
    })
    .returning();
  return {
    bandId: band.id,
    presetId: preset.id,
    shareId: share.id,
    shareToken,
    inviteId: invite.id,
    inviteToken,
    viewerId: ids.get('viewer')!,
    instrumentId: instrument.id,
    setlistId: setlist.id,
  };
}

async function send(actor: Actor, route: string, fixture: Fixture, withXsrf = true) {
  // Callers without an account carry no cookies from one request to the next; signing out uses a session of its own.
  const { agent, xsrf } =
    route === 'POST /auth/logout' && agents.has(actor)
      ? await server.signIn(`matrix-${actor}`)
      : (agents.get(actor) ?? { agent: request.agent(server.app), xsrf: undefined });
  const [method] = route.split(' ');
  const c = matrix[route];
  let req = agent[method.toLowerCase() as 'get' | 'post' | 'put' | 'patch' | 'delete'](
    c.path(fixture, actor),
  );
  if (xsrf && withXsrf) req = req.set('X-XSRF-TOKEN', xsrf);
  if (c.body) req = req.send(c.body(fixture));
  if (c.stream) req = req.buffer(true).parse(untilFirstEvent);
  return req;
}

/** Reads a stream's answer up to its first event and hangs up; any other answer to its end. */
function untilFirstEvent(
  answer: request.Response,
  done: (error: Error | null, body: string) => void,
) {
  // superagent hands its parsers Node's own message.
  const res = answer as unknown as import('node:http').IncomingMessage;
  let text = '';
  let answered = false;
  const finish = () => {
    if (answered) return;
    answered = true;
    done(null, text);
  };
  res.on('data', (chunk: Buffer) => {
    text += chunk.toString('utf8');
    if (res.statusCode === 200 && /\n\n[^]*\n\n/.test(text)) {
      finish();
      res.destroy();
    }
  });
  res.on('end', finish);
  res.on('close', finish);
}

const denied = (status: number) => status === 401 || status === 403 || status === 404;

describe('the role matrix', () => {
  it('has a line for every route the app answers, and no line for a route it does not', () => {
    expect(listRoutes(server.app).sort()).toEqual(Object.keys(matrix).sort());
  });

  for (const route of Object.keys(matrix)) {
    it(`${route}: lets ${matrix[route].allowed.join(', ')} through and turns the others away`, async () => {
      const outcome: Record<string, string> = {};
      const expected: Record<string, string> = {};
      for (const actor of actors) {
        const res = await send(actor, route, await freshFixture());
        expect(res.status, `${actor}: ${String(res.text ?? '').slice(0, 200)}`).toBeLessThan(500);
        outcome[actor] = denied(res.status) ? 'denied' : 'allowed';
        expected[actor] = matrix[route].allowed.includes(actor) ? 'allowed' : 'denied';
      }
      expect(outcome).toEqual(expected);
    });
  }

  it('refuses every cookie-authenticated write that lacks the cross-site token', async () => {
    for (const route of Object.keys(matrix).filter((r) => !r.startsWith('GET '))) {
      const res = await send('owner', route, await freshFixture(), false);
      expect([route, res.status, res.body.error?.code]).toEqual([route, 403, 'xsrf']);
    }
  });
});
