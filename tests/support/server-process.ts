// The server as its own process, exactly as `npm start` runs it, on a free loopback port.
import { spawn } from 'node:child_process';
import { createServer } from 'node:net';
import { repoRoot } from '../../scripts/stack/postgres';
import { waitForHttp } from '../../scripts/stack/processes';

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

export interface ServerProcess {
  url: string;
  port: number;
  /** Stops the process with the signal (SIGTERM: a clean shutdown; SIGKILL: a crash) and waits for it. */
  stop(signal?: NodeJS.Signals): Promise<void>;
}

export async function startServerProcess(
  env: Record<string, string>,
  port?: number,
): Promise<ServerProcess> {
  const chosen = port ?? (await freePort());
  const url = `http://127.0.0.1:${chosen}`;
  const child = spawn(process.execPath, ['--import', 'tsx', 'server/index.ts'], {
    cwd: repoRoot,
    env: { ...process.env, LOG_REQUESTS: '0', ...env, PORT: String(chosen) },
    stdio: ['ignore', 'inherit', 'inherit'],
  });
  await waitForHttp(`${url}/api/health`);
  return {
    url,
    port: chosen,
    stop: (signal = 'SIGTERM') =>
      new Promise<void>((resolve) => {
        if (child.exitCode !== null || child.signalCode !== null) return resolve();
        child.once('exit', () => resolve());
        child.kill(signal);
      }),
  };
}
