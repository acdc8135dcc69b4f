// Builds the real app against this run's database, with the fakes started in-process on free loopback ports.
import request from 'supertest';
import { inject } from 'vitest';
import { startFakeGitHub } from '../../fakes/github/fake-github';
import { startMailbox } from '../../fakes/mailbox/fake-mailbox';
import { createApp } from '../../server/app';
import { loadConfig } from '../../server/config';
import { createDatabase, type Database } from '../../server/db/client';
import { createMailer } from '../../server/mail/mailer';
import { createStageHub } from '../../server/stage/stage-hub';
import { stopWorkers } from '../../server/work/worker-pool';

export async function startTestServer(env: Record<string, string> = {}) {
  const github = await startFakeGitHub();
  const mailbox = await startMailbox();
  const databaseUrl = env['DATABASE_URL'] ?? inject('databaseUrl');
  const config = loadConfig({
    DATABASE_URL: databaseUrl,
    PUBLIC_URL: 'http://127.0.0.1:3000',
    FAKE_GITHUB_URL: github.url,
    FAKE_SMTP_PORT: String(mailbox.smtpPort),
    LOG_REQUESTS: '0',
    STATIC_DIR: 'tests/support/built-app',
    RATE_LIMIT_PER_MINUTE: '1000',
    ...env,
  });
  const db: Database = createDatabase(databaseUrl);
  const stage = createStageHub(databaseUrl, db);
  const app = createApp({ db, config, mailer: createMailer(config.smtp), stage });

  /** A supertest agent signed in as `login` through the GitHub stand-in, sending the cross-site token on writes. */
  async function signIn(login: string) {
    const agent = request.agent(app);
    const start = await agent.get(`/auth/github?login=${encodeURIComponent(login)}`);
    const answer = await fetch(start.headers['location'], { redirect: 'manual' });
    const callback = new URL(answer.headers.get('location')!);
    await agent.get(callback.pathname + callback.search).expect(302);
    const me = await agent.get('/api/me');
    const xsrf = agent.jar.getCookie('XSRF-TOKEN', {
      domain: '127.0.0.1',
      path: '/',
      secure: false,
      script: false,
    })!.value;
    /** The Cookie header a browser would send, for requests made without the agent (a raw event stream). */
    const cookie = () =>
      agent.jar
        .getCookies({ domain: '127.0.0.1', path: '/', secure: false, script: false })
        .toValueString();
    return { agent, user: me.body.user as { id: string; login: string }, xsrf, cookie };
  }

  return {
    app,
    db,
    config,
    github,
    mailbox,
    signIn,
    async close() {
      await github.close();
      await mailbox.close();
      await stage.close();
      await db.$client.end();
      await stopWorkers();
    },
  };
}
