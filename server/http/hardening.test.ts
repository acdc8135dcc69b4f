// Faults found by trying Keyloom as an attacker and as a careless user would; each test failed before its fix.
import { gzipSync } from 'node:zlib';
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { asBytes } from '../../tests/support/binary-response';
import { startTestServer } from '../../tests/support/test-server';
import { readZip } from '../../tests/support/zip';
import { fifthsPreset } from '../../shared/preset/presets.testing';

let server: Awaited<ReturnType<typeof startTestServer>>;
let owner: Awaited<ReturnType<typeof server.signIn>>;

const doc = (name = 'Hardened Fifths', extra: object = {}) => ({ ...fifthsPreset(name), ...extra });
const post = (path: string, body?: object) =>
  owner.agent.post(path).set('X-XSRF-TOKEN', owner.xsrf).send(body);

beforeAll(async () => {
  server = await startTestServer();
  owner = await server.signIn('hardening-owner');
});
afterAll(() => server.close());

function expectJsonError(answer: request.Response, status: number, field?: string) {
  expect(answer.status).toBe(status);
  expect(answer.type).toBe('application/json');
  expect(answer.body.error.code).not.toBe('internal');
  if (field) expect(answer.body.error.field).toBe(field);
}

describe('an interval list upload', () => {
  it('is refused unread when it is larger than any list written by hand', async () => {
    const text = Buffer.from('3/2\n'.repeat(1_280_000));
    const answer = await request(server.app).post('/api/import').attach('file', text, 'fifths.txt');
    expectJsonError(answer, 413, 'file');
    expect(answer.body.error.message).toBe(
      'file: a preset or a list of intervals is at most 256 kB; this file is 4.9 MB.',
    );
  });

  it('is refused at the first line past the largest scale', async () => {
    const text = Buffer.from('# fifths\n' + '3/2\n'.repeat(1000));
    const answer = await request(server.app).post('/api/import').attach('file', text, 'fifths.txt');
    // The refusal names the line where reading stopped: the 257th entry (room is kept for a leading 1/1), on line
    // 258 after the comment.
    expectJsonError(answer, 400, 'line 258');
    expect(answer.body.error.message).toBe(
      'line 258: more than 255 degrees: a scale holds at most 256 with its tonic',
    );
    expect(answer.body.error.details).toHaveLength(1);
  });

  it('stops reading after 20 lines at fault', async () => {
    const text = Buffer.from('1.5\n'.repeat(100));
    const answer = await request(server.app)
      .post('/api/import')
      .attach('file', text, 'decimals.txt');
    expectJsonError(answer, 400, 'line 1');
    expect(answer.body.error.details).toHaveLength(20);
    expect(answer.body.error.details[19].path).toBe('line 20');
  });
});

describe('a huge list in a preset document', () => {
  it('is refused by its length before its entries are checked, with a short answer', async () => {
    const degrees = Array.from({ length: 250_000 }, () => 1.5);
    const body = doc('Many', { scale: { kind: 'list', degrees } });
    const answer = await request(server.app).post('/api/preview/table').send(body);
    expectJsonError(answer, 400, 'scale.degrees');
    expect(answer.body.error.message).toBe('scale.degrees: must have at most 255 entries');
    expect(JSON.stringify(answer.body).length).toBeLessThan(10_000);
  });

  it('caps the faults of many bad entries at 20, with the count of the rest', async () => {
    const degrees = Array.from({ length: 200 }, () => 1.5);
    const answer = await request(server.app)
      .post('/api/preview/table')
      .send(doc('Many', { scale: { kind: 'list', degrees } }));
    expectJsonError(answer, 400, 'scale.degrees[0]');
    expect(answer.body.error.details).toHaveLength(20);
    expect(answer.body.error.more).toBe(180);
  });
});

describe('a comma fraction too large to mean anything', () => {
  const huge = doc('Huge', {
    scale: {
      kind: 'generated',
      generator: '3/2',
      up: 11,
      temper: { comma: '81/80', fraction: '9'.repeat(400) },
    },
  });

  it('is refused on scale.temper.fraction by preview, save and every download', async () => {
    expectJsonError(
      await request(server.app).post('/api/preview/table').send(huge),
      400,
      'scale.temper.fraction',
    );
    expectJsonError(
      await post('/api/presets', { document: huge }),
      400,
      'document.scale.temper.fraction',
    );
    for (const format of ['sfz', 'bend-csv', 'mts-bulk', 'tuner-sheet', 'bundle']) {
      expectJsonError(
        await request(server.app).post(`/api/preview/export/${format}`).send(huge),
        400,
        'scale.temper.fraction',
      );
    }
  });
});

describe('NUL characters and lone surrogates', () => {
  it('are refused with 400 naming the field, in names, notes, band names and queries', async () => {
    expectJsonError(
      await post('/api/presets', { document: doc('a\u0000b') }),
      400,
      'document.name',
    );
    expectJsonError(
      await post('/api/presets', { document: doc('a\ud800b') }),
      400,
      'document.name',
    );
    expectJsonError(
      await post('/api/presets', { document: doc('ok', { notes: 'x\u0000y' }) }),
      400,
      'document.notes',
    );
    expectJsonError(await post('/api/bands', { name: 'Band\u0000' }), 400, 'name');
    expectJsonError(await owner.agent.get('/api/presets?q=%00'), 400, 'q');
    const saved = await post('/api/presets', { document: doc('fine'), note: 'n\u0000' });
    expectJsonError(saved, 400, 'note');
  });

  it('are taken out of an upload file name, or refused with the multipart body that holds them raw', async () => {
    const boundary = 'keyloom-boundary';
    const multipart = (disposition: string) =>
      Buffer.from(
        `--${boundary}\r\nContent-Disposition: form-data; name="file"; ${disposition}\r\n` +
          `Content-Type: text/plain\r\n\r\n9/8\n5/4\n\r\n--${boundary}--\r\n`,
      );
    const upload = (body: Buffer) =>
      owner.agent
        .post('/api/import')
        .set('X-XSRF-TOKEN', owner.xsrf)
        .set('Content-Type', `multipart/form-data; boundary=${boundary}`)
        .send(body);
    const encoded = await upload(multipart("filename*=utf-8''my%00list.txt"));
    expect(encoded.status).toBe(200);
    expect(encoded.body.document.name).toBe('mylist');
    expectJsonError(await upload(multipart('filename="my\u0000list.txt"')), 400, 'file');
  });
});

describe('integers past what the database holds', () => {
  it('answer 404 or 400, never 500', async () => {
    const { id } = (await post('/api/presets', { document: doc() }).expect(201)).body;
    expectJsonError(await owner.agent.get(`/api/presets/${id}/revisions/2147483648`), 404);
    expectJsonError(
      await owner.agent.get(`/api/presets/${id}/export/preset?revision=3000000000`),
      404,
    );
    expectJsonError(
      await owner.agent.get(`/api/presets/${id}/revisions/1/changes?from=3000000000`),
      404,
    );
    expectJsonError(
      await post(`/api/presets/${id}/restore`, { revision: 3_000_000_000 }),
      400,
      'revision',
    );
    expectJsonError(
      await post(`/api/presets/${id}/shares`, { revision: 3_000_000_000 }),
      400,
      'revision',
    );
  });
});

describe('malformed requests', () => {
  it('answer 400 or 415 in the JSON error shape', async () => {
    const app = request(server.app);
    expectJsonError(await app.get('/api/presets/%ZZ'), 400);
    expect((await app.get('/%ZZ')).status).toBe(400);
    expect((await app.get('/s/%ZZ')).status).toBe(400);
    const bogus = await app
      .post('/api/preview/table')
      .set('Content-Type', 'application/json; charset=bogus')
      .send('{}');
    expectJsonError(bogus, 415);
    const plain = await app
      .post('/api/preview/table')
      .set('Content-Type', 'application/json')
      .set('Content-Encoding', 'gzip')
      .send('{}');
    expectJsonError(plain, 400);
    const unknown = await app
      .post('/api/preview/table')
      .set('Content-Type', 'application/json')
      .set('Content-Encoding', 'bogus')
      .send('{}');
    expectJsonError(unknown, 415);
    // A body that really is gzip still reads (sent through fetch, which leaves the bytes as they are).
    const listening = server.app.listen(0, '127.0.0.1');
    await new Promise((resolve) => listening.once('listening', resolve));
    const { port } = listening.address() as { port: number };
    const zipped = await fetch(`http://127.0.0.1:${port}/api/preview/table`, {
      method: 'POST',
      headers: { 'Content-Type': 'application/json', 'Content-Encoding': 'gzip' },
      body: gzipSync(JSON.stringify(doc())),
    });
    listening.close();
    expect(zipped.status).toBe(200);
    expect((await zipped.json()).keys).toHaveLength(128);
  });

  it('answer 400 for truncated or boundary-less multipart', async () => {
    const app = request(server.app);
    const noBoundary = await app
      .post('/api/retune')
      .set('Content-Type', 'multipart/form-data')
      .send('--x\r\n');
    expectJsonError(noBoundary, 400, 'file');
    const truncated = await app
      .post('/api/retune')
      .set('Content-Type', 'multipart/form-data; boundary=xyz')
      .send('--xyz\r\nContent-Disposition: form-data; name="file"; filename="a.mid"\r\n\r\nMThd');
    expectJsonError(truncated, 400, 'file');
  });

  it('a sign-in with a bogus code returns to the app with a message', async () => {
    const agent = request.agent(server.app);
    const start = await agent.get('/auth/github?login=bogus-code');
    const state = new URL(start.headers['location']).searchParams.get('state');
    const back = await agent.get(`/auth/github/callback?code=bogus&state=${state}`);
    expect(back.status).toBe(302);
    expect(back.headers['location']).toMatch(/^\/\?signin=failed/);
  });
});

describe('the cross-site token', () => {
  it("is bound to the session: a token of the attacker's choosing is refused", async () => {
    const victim = await server.signIn('hardening-victim');
    const sid = victim.agent.jar.getCookie('keyloom.sid', {
      domain: '127.0.0.1',
      path: '/',
      secure: false,
      script: false,
    })!.value;
    const forged = await request(server.app)
      .post('/api/bands')
      .set('Cookie', `keyloom.sid=${sid}; XSRF-TOKEN=chosen`)
      .set('X-XSRF-TOKEN', 'chosen')
      .send({ name: 'Forged' });
    expectJsonError(forged, 403);
    await victim.agent
      .post('/api/bands')
      .set('X-XSRF-TOKEN', victim.xsrf)
      .send({ name: 'Real' })
      .expect(201);
  });

  it('is new after sign-in and after sign-out', async () => {
    const agent = request.agent(server.app);
    await agent.get('/api/me');
    const read = () =>
      agent.jar.getCookie('XSRF-TOKEN', {
        domain: '127.0.0.1',
        path: '/',
        secure: false,
        script: false,
      })?.value;
    const before = read();
    expect(before).toBeTruthy();
    const start = await agent.get('/auth/github?login=hardening-token');
    const answer = await fetch(start.headers['location'], { redirect: 'manual' });
    const callback = new URL(answer.headers.get('location')!);
    await agent.get(callback.pathname + callback.search).expect(302);
    const signedIn = read();
    expect(signedIn).not.toBe(before);
    await agent.post('/auth/logout').set('X-XSRF-TOKEN', signedIn!).expect(204);
    expect(read()).not.toBe(signedIn);
  });
});

describe('a pinned share link', () => {
  it("shows the pinned revision's own name", async () => {
    const { id } = (await post('/api/presets', { document: doc('First Name') }).expect(201)).body;
    await post(`/api/presets/${id}/revisions`, { document: doc('Second Name') }).expect(201);
    const pinned = (await post(`/api/presets/${id}/shares`, { revision: 1 }).expect(201)).body;
    const seen = await request(server.app).get(`/api/shared/${pinned.token}`).expect(200);
    expect(seen.body.name).toBe('First Name');
  });
});

describe('names written into text files and mail', () => {
  it('lose their line breaks and control characters in the bundle read-me', async () => {
    const answer = await asBytes(
      request(server.app)
        .post('/api/preview/export/bundle')
        .send(doc('Evil\r\nInjected line\tTab')),
    ).expect(200);
    const files = await readZip(answer.body as Buffer);
    const readMe = files.get('READ-ME.txt')!.toString('utf8');
    expect(readMe.split('\r\n')[0]).toBe('Evil Injected line Tab: files made by Keyloom');
  });

  it('lose their line breaks in invite mails', async () => {
    const band = (await post('/api/bands', { name: 'Line\nBreak Band' }).expect(201)).body;
    await post(`/api/bands/${band.id}/invites`, {
      email: 'newline@example.test',
      role: 'viewer',
    }).expect(201);
    const mail = server.mailbox.messages().find((m) => m.to.includes('newline@example.test'))!;
    expect(mail.text).toContain('the band Line Break Band on Keyloom');
    expect(mail.subject).not.toMatch(/[\r\n]/);
  });
});

describe('share ids', () => {
  it("answer the same 404 for another preset's share and an unknown one", async () => {
    const other = await server.signIn('hardening-other');
    const { id } = (
      await other.agent
        .post('/api/presets')
        .set('X-XSRF-TOKEN', other.xsrf)
        .send({ document: doc() })
    ).body;
    const share = (
      await other.agent.post(`/api/presets/${id}/shares`).set('X-XSRF-TOKEN', other.xsrf).send({})
    ).body;
    const probed = await owner.agent
      .delete(`/api/shares/${share.id}`)
      .set('X-XSRF-TOKEN', owner.xsrf);
    const unknown = await owner.agent
      .delete('/api/shares/00000000-0000-4000-8000-000000000000')
      .set('X-XSRF-TOKEN', owner.xsrf);
    expect(probed.status).toBe(404);
    expect(probed.body).toEqual(unknown.body);
  });
});

describe('messages name the fault of the value sent', () => {
  it('for a fractional revision, an unknown role, a huge page and a text/plain body', async () => {
    const { id } = (await post('/api/presets', { document: doc() }).expect(201)).body;
    const fractional = await post(`/api/presets/${id}/restore`, { revision: 1.5 });
    expectJsonError(fractional, 400, 'revision');
    expect(fractional.body.error.message).toBe('revision: must be a whole number (got 1.5)');

    const band = (await post('/api/bands', { name: 'Roles' }).expect(201)).body;
    const role = await post(`/api/bands/${band.id}/invites`, {
      email: 'a@example.test',
      role: 'admin',
    });
    expect(role.body.error.message).toBe('role: must be owner, editor or viewer (got "admin")');

    const page = await owner.agent.get('/api/presets?page=1e308');
    expectJsonError(page, 400, 'page');
    expect(page.body.error.message).toMatch(/^page: must be at most \d+ \(got 1e\+308\)$/);

    const plain = await owner.agent
      .post('/api/presets')
      .set('X-XSRF-TOKEN', owner.xsrf)
      .set('Content-Type', 'text/plain')
      .send(JSON.stringify({ document: doc() }));
    expectJsonError(plain, 415);
  });

  it('for a truncated song, says the fault once', async () => {
    const song = Buffer.from(
      'MThd\x00\x00\x00\x06\x00\x00\x00\x01\x00\x60MTrk\x00\x00\x00\x20\x00\x90',
      'latin1',
    );
    const answer = await request(server.app)
      .post('/api/retune')
      .field('preset', JSON.stringify(doc()))
      .attach('file', song, 'cut.mid');
    expectJsonError(answer, 400);
    expect(answer.body.error.message).toMatch(/^file: /);
    expect(answer.body.error.message).not.toMatch(/^file: file/);
  });
});
