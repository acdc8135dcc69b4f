// Starts the Keyloom server: applies migrations, then listens.
import { createApp } from './app';
import { loadConfig } from './config';
import { applyMigrations, createDatabase } from './db/client';

const config = loadConfig();
const db = createDatabase(config.databaseUrl);
await applyMigrations(db);
const server = createApp({ db, config }).listen(config.port, config.host, () => {
  console.log(`Keyloom listening on ${config.publicUrl}`);
});

function shutDown(signal: string) {
  console.log(`${signal}: closing`);
  server.close(() => void db.$client.end().then(() => process.exit(0)));
  server.closeAllConnections();
  setTimeout(() => process.exit(0), 5_000).unref();
}
process.on('SIGINT', () => shutDown('SIGINT'));
process.on('SIGTERM', () => shutDown('SIGTERM'));
