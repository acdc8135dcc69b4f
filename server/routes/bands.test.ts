import { eq } from 'drizzle-orm';
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { startTestServer } from '../../tests/support/test-server';
import { invites } from '../db/schema';

let server: Awaited<ReturnType<typeof startTestServer>>;
type Member = Awaited<ReturnType<typeof server.signIn>>;
let owner: Member;
let second: Member;

const send = (who: Member, method: 'post' | 'patch' | 'delete', path: string, body?: object) =>
  who.agent[method](path).set('X-XSRF-TOKEN', who.xsrf).send(body);

/** The token in the link of the newest message to `to` in the local mailbox. */
function inviteToken(to: string): {
  token: string;
  message: ReturnType<typeof server.mailbox.messages>[number];
} {
  const message = server.mailbox.messages().find((m) => m.to.includes(to));
  if (!message) throw new Error(`no message to ${to}`);
  const link = message.text.match(/http:\/\/127\.0\.0\.1:3000\/invites\/([\w-]+)/);
  if (!link) throw new Error(`no invite link in: ${message.text}`);
  return { token: link[1], message };
}

beforeAll(async () => {
  server = await startTestServer();
  owner = await server.signIn('bands-owner');
  second = await server.signIn('bands-second');
});
afterAll(() => server.close());

async function newBand(name: string): Promise<string> {
  return (await send(owner, 'post', '/api/bands', { name }).expect(201)).body.id;
}

describe('bands', () => {
  it('makes the creator its owner, renames, and refuses an empty name by field', async () => {
    const id = await newBand('Salt Marsh');
    await send(owner, 'patch', `/api/bands/${id}`, { name: 'Salt Marsh Trio' }).expect(200);
    const band = await owner.agent.get(`/api/bands/${id}`).expect(200);
    expect(band.body).toMatchObject({ name: 'Salt Marsh Trio', role: 'owner', canManage: true });
    expect(
      band.body.members.map((m: { login: string; role: string }) => [m.login, m.role]),
    ).toEqual([['bands-owner', 'owner']]);
    const bad = await send(owner, 'patch', `/api/bands/${id}`, { name: '  ' }).expect(400);
    expect(bad.body.error.field).toBe('name');
  });

  it('always keeps one owner: the last owner can neither step down nor leave', async () => {
    const id = await newBand('Lone Owner');
    const demote = await send(owner, 'patch', `/api/bands/${id}/members/${owner.user.id}`, {
      role: 'editor',
    }).expect(409);
    expect(demote.body.error.code).toBe('last_owner');
    await send(owner, 'delete', `/api/bands/${id}/members/${owner.user.id}`).expect(409);
  });
});

describe('e-mail invites', () => {
  it('sends a message naming band, inviter and role; its link joins the band once', async () => {
    const id = await newBand('Copper Test');
    server.mailbox.clear();
    await send(owner, 'post', `/api/bands/${id}/invites`, {
      email: 'second@example.org',
      role: 'editor',
    }).expect(201);

    const { token, message } = inviteToken('second@example.org');
    expect(message.subject).toContain('Copper Test');
    expect(message.text).toContain('as an editor');
    expect(message.text).toContain('bands-owner');

    const about = await second.agent.get(`/api/invites/${token}`).expect(200);
    expect(about.body).toMatchObject({
      bandName: 'Copper Test',
      role: 'editor',
      status: 'pending',
    });
    const accepted = await send(second, 'post', `/api/invites/${token}/accept`).expect(200);
    expect(accepted.body).toMatchObject({ bandId: id, role: 'editor' });
    const band = await second.agent.get(`/api/bands/${id}`).expect(200);
    expect(band.body.role).toBe('editor');

    const again = await send(second, 'post', `/api/invites/${token}/accept`).expect(410);
    expect(again.body.error.code).toBe('invite_accepted');
  });

  it('stores only a hash of the token', async () => {
    const id = await newBand('Hash Check');
    await send(owner, 'post', `/api/bands/${id}/invites`, {
      email: 'hash@example.org',
      role: 'viewer',
    }).expect(201);
    const { token } = inviteToken('hash@example.org');
    const rows = await server.db.query.invites.findMany();
    expect(rows.some((r) => r.tokenHash === token)).toBe(false);
    expect(rows.some((r) => r.tokenHash.length === 64)).toBe(true);
  });

  it('resending makes a new link and the old one stops working; revoking stops the new one', async () => {
    const id = await newBand('Resend Band');
    const created = await send(owner, 'post', `/api/bands/${id}/invites`, {
      email: 'resend@example.org',
      role: 'viewer',
    }).expect(201);
    const first = inviteToken('resend@example.org').token;
    server.mailbox.clear();
    await send(owner, 'post', `/api/bands/${id}/invites/${created.body.id}/resend`).expect(200);
    const second_ = inviteToken('resend@example.org').token;
    expect(second_).not.toBe(first);
    await second.agent.get(`/api/invites/${first}`).expect(404);

    const pending = await owner.agent.get(`/api/bands/${id}/invites`).expect(200);
    expect(pending.body.items.map((i: { email: string }) => i.email)).toEqual([
      'resend@example.org',
    ]);
    await send(owner, 'delete', `/api/bands/${id}/invites/${created.body.id}`).expect(204);
    expect((await second.agent.get(`/api/invites/${second_}`).expect(200)).body.status).toBe(
      'revoked',
    );
    await send(second, 'post', `/api/invites/${second_}/accept`).expect(410);
  });

  it('refuses a link whose invite has expired', async () => {
    const id = await newBand('Late Band');
    await send(owner, 'post', `/api/bands/${id}/invites`, {
      email: 'late@example.org',
      role: 'viewer',
    }).expect(201);
    const { token } = inviteToken('late@example.org');
    await server.db
      .update(invites)
      .set({ expiresAt: new Date(Date.now() - 1000) })
      .where(eq(invites.bandId, id));
    const res = await send(second, 'post', `/api/invites/${token}/accept`).expect(410);
    expect(res.body.error.code).toBe('invite_expired');
  });

  it('refuses an invite to something that is not an e-mail address, by field', async () => {
    const id = await newBand('Bad Address');
    const res = await send(owner, 'post', `/api/bands/${id}/invites`, {
      email: 'not-an-address',
      role: 'editor',
    }).expect(400);
    expect(res.body.error.field).toBe('email');
  });
});

describe('members and the audit log', () => {
  it('lets owners change roles and remove members, members leave, and owners read who did what', async () => {
    const id = await newBand('Audit Band');
    await send(owner, 'post', `/api/bands/${id}/invites`, {
      email: 'audit@example.org',
      role: 'viewer',
    }).expect(201);
    await send(
      second,
      'post',
      `/api/invites/${inviteToken('audit@example.org').token}/accept`,
    ).expect(200);
    await send(owner, 'patch', `/api/bands/${id}/members/${second.user.id}`, {
      role: 'owner',
    }).expect(200);
    // Now two owners: the first may step down.
    await send(owner, 'patch', `/api/bands/${id}/members/${owner.user.id}`, {
      role: 'editor',
    }).expect(200);
    await owner.agent.get(`/api/bands/${id}/audit`).expect(403);

    const audit = await second.agent.get(`/api/bands/${id}/audit`).expect(200);
    expect(
      audit.body.items.map(
        (e: { action: string; actorLogin: string }) => `${e.actorLogin} ${e.action}`,
      ),
    ).toEqual([
      'bands-owner member.role',
      'bands-owner member.role',
      'bands-second invite.accept',
      'bands-owner invite.create',
      'bands-owner band.create',
    ]);
    await send(owner, 'delete', `/api/bands/${id}/members/${owner.user.id}`).expect(204);
    await owner.agent.get(`/api/bands/${id}`).expect(404);
  });
});

describe('rate limits', () => {
  it('answers 429 in the JSON error shape once invite lookups pass the limit', async () => {
    const limited = await startTestServer({ RATE_LIMIT_PER_MINUTE: '5' });
    const statuses: number[] = [];
    for (let i = 0; i < 7; i++)
      statuses.push((await request(limited.app).get('/api/invites/guess')).status);
    await limited.close();
    expect(statuses).toEqual([404, 404, 404, 404, 404, 429, 429]);
  });
});
