// Starts the Keyloom server: applies migrations, then listens.
import { createApp } from './app';
import { loadConfig } from './config';
import { applyMigrations, createDatabase } from './db/client';
import { createMailer } from './mail/mailer';
import { purgeExpiredTrash } from './routes/presets';
import { createStageHub } from './stage/stage-hub';
import { stopWorkers } from './work/worker-pool';

const config = loadConfig();
const db = createDatabase(config.databaseUrl);
await applyMigrations(db);
const mailer = createMailer(config.smtp);

const purge = () =>
  purgeExpiredTrash(db).then(
    (n) => n > 0 && console.log(`Removed ${n} presets that stayed in the trash past their time`),
    (error: Error) => console.error(`Trash purge failed: ${error.message}`),
  );
void purge();
setInterval(purge, 3600_000).unref();

// One listener per instance: the stage's live streams hear every instance's moves through PostgreSQL.
const stage = createStageHub(config.databaseUrl, db);
const server = createApp({ db, config, mailer, stage }).listen(config.port, config.host, () => {
  console.log(`Keyloom listening on ${config.publicUrl}`);
});

function shutDown(signal: string) {
  console.log(`${signal}: closing`);
  // Open streams end now, so that their browsers reconnect to another instance.
  void stage.close();
  server.close(
    () => void Promise.all([db.$client.end(), stopWorkers()]).then(() => process.exit(0)),
  );
  server.closeAllConnections();
  setTimeout(() => process.exit(0), 5_000).unref();
}
process.on('SIGINT', () => shutDown('SIGINT'));
process.on('SIGTERM', () => shutDown('SIGTERM'));
