// npm start, after bootstrap.sh: the database, migrations, demo data, the build, the fakes and the server.
import { applyMigrations, createDatabase } from '../server/db/client';
import { ensureBuild } from './stack/build';
import { demoIdentities, demoMembers, seedDemoData } from './stack/demo-data';
import { type Cluster, ensureCluster } from './stack/postgres';
import { ProcessGroup, waitForHttp } from './stack/processes';

const log = (line: string) => console.log(`keyloom: ${line}`);
const env = process.env;
const ports = {
  app: Number(env['PORT'] ?? 3000),
  github: Number(env['FAKE_GITHUB_PORT'] ?? 3101),
  mailbox: Number(env['FAKE_MAILBOX_PORT'] ?? 3102),
  smtp: Number(env['FAKE_SMTP_PORT'] ?? 2525),
};

// The address people connect to stays put: when its port is taken, say what holds it and stop.
let cluster: Cluster;
try {
  cluster = await ensureCluster(log);
} catch (error) {
  console.error(`keyloom: start failed: ${(error as Error).message}`);
  process.exit(1);
}
let group: ProcessGroup | undefined;

let stopping: Promise<void> | undefined;

/** Stops what this start started; safe to call again (Ctrl-C also reaches the children directly). */
function stopEverything(code: number): Promise<void> {
  stopping ??= (async () => {
    await group?.stopAll();
    if (cluster.startedHere) {
      await cluster
        .stop()
        .catch((error: Error) => log(`stopping PostgreSQL: ${error.message.split('\n')[0]}`));
    } else {
      log('PostgreSQL was already running before this start; left running');
    }
    process.exit(code);
  })();
  return stopping;
}
process.once('SIGINT', () => void stopEverything(0));
process.once('SIGTERM', () => void stopEverything(0));

try {
  await cluster.createDatabase('keyloom');
  const databaseUrl = cluster.url('keyloom');
  const db = createDatabase(databaseUrl);
  log('applying migrations and demo data');
  await applyMigrations(db);
  await seedDemoData(db);
  await db.$client.end();

  ensureBuild(log);

  group = new ProcessGroup((name, code) => {
    log(`${name} stopped unexpectedly (exit code ${code}); stopping everything`);
    void stopEverything(1);
  });
  const fakeEnv = {
    FAKE_GITHUB_PORT: String(ports.github),
    FAKE_MAILBOX_PORT: String(ports.mailbox),
    FAKE_SMTP_PORT: String(ports.smtp),
  };
  group.start('fake-github', 'fakes/github/main.ts', fakeEnv);
  group.start('mailbox', 'fakes/mailbox/main.ts', fakeEnv);
  await waitForHttp(`http://127.0.0.1:${ports.github}/health`);
  await waitForHttp(`http://127.0.0.1:${ports.mailbox}/health`);

  group.start('server', 'server/index.ts', {
    ...fakeEnv,
    DATABASE_URL: databaseUrl,
    PORT: String(ports.app),
  });
  const appUrl = env['PUBLIC_URL'] ?? `http://127.0.0.1:${ports.app}`;
  await waitForHttp(`http://127.0.0.1:${ports.app}/api/health`);

  const members = demoMembers.map((member) => {
    const identity = demoIdentities.find((i) => i.login === member.login)!;
    return `    ${identity.name} (${member.role} of Copper Fen): ${appUrl}/auth/github?login=${member.login}`;
  });
  console.log(
    [
      '',
      `Keyloom is running at ${appUrl}`,
      '',
      `  Sign in through the local GitHub stand-in (${`http://127.0.0.1:${ports.github}`}): press "Sign in with GitHub"`,
      '  and pick a demo member, or open one of these addresses to sign in directly:',
      ...members,
      `  Mail the app sends (invites) lands in the local mailbox: http://127.0.0.1:${ports.mailbox}`,
      '',
      '  Ctrl-C stops the app, the stand-ins and PostgreSQL.',
      '',
    ].join('\n'),
  );
} catch (error) {
  console.error(`keyloom: start failed: ${(error as Error).message}`);
  await stopEverything(1);
}
