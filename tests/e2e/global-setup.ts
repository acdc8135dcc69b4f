// Starts what the browser tests talk to: a database of this run's own with the demo data, the fakes, and the
// server as its own process on a free port, exactly as `npm start` runs it.
import { spawn, type ChildProcess } from 'node:child_process';
import { createServer } from 'node:net';
import type { TestProject } from 'vitest/node';
import { startFakeGitHub } from '../../fakes/github/fake-github';
import { startMailbox } from '../../fakes/mailbox/fake-mailbox';
import { applyMigrations, createDatabase } from '../../server/db/client';
import { seedDemoData } from '../../scripts/stack/demo-data';
import { ensureCluster, repoRoot } from '../../scripts/stack/postgres';
import { waitForHttp } from '../../scripts/stack/processes';

declare module 'vitest' {
  export interface ProvidedContext {
    appUrl: string;
    githubUrl: string;
    mailboxUrl: string;
    mailboxSmtpPort: number;
  }
}

function freePort(): Promise<number> {
  return new Promise((resolve, reject) => {
    const server = createServer();
    server.listen(0, '127.0.0.1', () => {
      const { port } = server.address() as { port: number };
      server.close(() => resolve(port));
    });
    server.on('error', reject);
  });
}

export default async function setup(project: TestProject) {
  const cluster = await ensureCluster();
  const name = `keyloom_e2e_${process.pid}_${Date.now().toString(36)}`;
  await cluster.createDatabase(name, { fastCommits: true });
  const db = createDatabase(cluster.url(name));
  await applyMigrations(db);
  await seedDemoData(db);
  await db.$client.end();

  const github = await startFakeGitHub();
  const mailbox = await startMailbox();
  const port = await freePort();
  const appUrl = `http://127.0.0.1:${port}`;
  const server: ChildProcess = spawn(process.execPath, ['--import', 'tsx', 'server/index.ts'], {
    cwd: repoRoot,
    env: {
      ...process.env,
      PORT: String(port),
      DATABASE_URL: cluster.url(name),
      FAKE_GITHUB_URL: github.url,
      FAKE_SMTP_PORT: String(mailbox.smtpPort),
      LOG_REQUESTS: '0',
    },
    stdio: ['ignore', 'inherit', 'inherit'],
  });
  await waitForHttp(`${appUrl}/api/health`);
  project.provide('appUrl', appUrl);
  project.provide('githubUrl', github.url);
  project.provide('mailboxUrl', mailbox.webUrl);
  project.provide('mailboxSmtpPort', mailbox.smtpPort);

  return async () => {
    await new Promise<void>((resolve) => {
      if (server.exitCode !== null) return resolve();
      server.once('exit', () => resolve());
      server.kill('SIGTERM');
    });
    await github.close();
    await mailbox.close();
    await cluster.dropDatabase(name);
    if (cluster.startedHere) await cluster.stop();
  };
}
