// What the server benchmarks run against: a database of their own in the project's cluster, the GitHub
// stand-in, and the server as its own process, as `npm start` runs it.
import { startFakeGitHub } from '../../fakes/github/fake-github';
import { applyMigrations, createDatabase } from '../../server/db/client';
import { ensureCluster } from '../../scripts/stack/postgres';
import { startServerProcess } from '../../tests/support/server-process';

export async function startBenchStack(name: string, env: Record<string, string> = {}) {
  const cluster = await ensureCluster((line) => console.log(`keyloom: ${line}`), {
    portIfTaken: 'pick-free',
  });
  const database = `keyloom_bench_${name}_${process.pid}`;
  await cluster.createDatabase(database);
  const db = createDatabase(cluster.url(database));
  await applyMigrations(db);
  await db.$client.end();
  const github = await startFakeGitHub();
  const serverEnv = {
    DATABASE_URL: cluster.url(database),
    FAKE_GITHUB_URL: github.url,
    RATE_LIMIT_PER_MINUTE: '1000000',
    KEYLOOM_BENCH_ROUTES: '1',
    ...env,
  };
  const stack = {
    /** The running server; a benchmark that restarts it puts the new one here so that stop() ends it. */
    server: await startServerProcess(serverEnv),
    serverEnv,
    async stop() {
      await stack.server.stop();
      await github.close();
      await cluster.dropDatabase(database);
      if (cluster.startedHere) await cluster.stop();
    },
  };
  return stack;
}
