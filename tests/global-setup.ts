// Before the server and shared tests: the project's PostgreSQL cluster and a database of this run's own,
// migrated; dropped again after the run. KEYLOOM_NO_DB=1 skips it for pure tests of shared/ and fakes/.
import type { TestProject } from 'vitest/node';
import { applyMigrations, createDatabase } from '../server/db/client';
import { ensureCluster } from '../scripts/stack/postgres';

declare module 'vitest' {
  export interface ProvidedContext {
    databaseUrl: string;
  }
}

export default async function setup(project: TestProject): Promise<(() => Promise<void>) | void> {
  if (process.env['KEYLOOM_NO_DB'] === '1') return;
  // Started here only when no run started it before: then on a free port if another checkout's cluster holds ours.
  const cluster = await ensureCluster((line) => console.log(`keyloom: ${line}`), {
    portIfTaken: 'pick-free',
  });
  const name = `keyloom_test_${process.pid}_${Date.now().toString(36)}`;
  await cluster.createDatabase(name, { fastCommits: true });
  const db = createDatabase(cluster.url(name));
  await applyMigrations(db);
  await db.$client.end();
  project.provide('databaseUrl', cluster.url(name));
  return async () => {
    await cluster.dropDatabase(name);
    if (cluster.startedHere) await cluster.stop();
  };
}
