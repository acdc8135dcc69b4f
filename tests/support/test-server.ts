// Builds the real app against this run's database, with the fakes started in-process on free loopback ports.
import { inject } from 'vitest';
import { createApp } from '../../server/app';
import { loadConfig } from '../../server/config';
import { createDatabase, type Database } from '../../server/db/client';
import { startFakeGitHub } from '../../fakes/github/fake-github';

export async function startTestServer() {
  const github = await startFakeGitHub();
  const databaseUrl = inject('databaseUrl');
  const config = loadConfig({
    DATABASE_URL: databaseUrl,
    PUBLIC_URL: 'http://127.0.0.1:3000',
    FAKE_GITHUB_URL: github.url,
    LOG_REQUESTS: '0',
    STATIC_DIR: 'tests/support/no-build',
  });
  const db: Database = createDatabase(databaseUrl);
  const app = createApp({ db, config });
  return {
    app,
    db,
    config,
    github,
    async close() {
      await github.close();
      await db.$client.end();
    },
  };
}
