// Starts what the browser tests talk to: a database of this run's own with the demo data, the fakes, and the
// server as its own process on a free port, exactly as `npm start` runs it.
import type { TestProject } from 'vitest/node';
import { startFakeGitHub } from '../../fakes/github/fake-github';
import { startMailbox } from '../../fakes/mailbox/fake-mailbox';
import { applyMigrations, createDatabase } from '../../server/db/client';
import { seedDemoData } from '../../scripts/stack/demo-data';
import { ensureCluster } from '../../scripts/stack/postgres';
import { startServerProcess } from '../support/server-process';

declare module 'vitest' {
  export interface ProvidedContext {
    appUrl: string;
    githubUrl: string;
    mailboxUrl: string;
    mailboxSmtpPort: number;
  }
}

export default async function setup(project: TestProject) {
  const cluster = await ensureCluster((line) => console.log(`keyloom: ${line}`), {
    portIfTaken: 'pick-free',
  });
  const name = `keyloom_e2e_${process.pid}_${Date.now().toString(36)}`;
  await cluster.createDatabase(name, { fastCommits: true });
  const db = createDatabase(cluster.url(name));
  await applyMigrations(db);
  await seedDemoData(db);
  await db.$client.end();

  const github = await startFakeGitHub();
  const mailbox = await startMailbox();
  const server = await startServerProcess({
    DATABASE_URL: cluster.url(name),
    FAKE_GITHUB_URL: github.url,
    FAKE_SMTP_PORT: String(mailbox.smtpPort),
  });
  const appUrl = server.url;
  project.provide('appUrl', appUrl);
  project.provide('githubUrl', github.url);
  project.provide('mailboxUrl', mailbox.webUrl);
  project.provide('mailboxSmtpPort', mailbox.smtpPort);

  return async () => {
    await server.stop();
    await github.close();
    await mailbox.close();
    await cluster.dropDatabase(name);
    if (cluster.startedHere) await cluster.stop();
  };
}
