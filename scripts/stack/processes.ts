// Child processes of a run (the fakes, the server), their output prefixed, stopped together.
import { spawn, type ChildProcess } from 'node:child_process';
import { createInterface } from 'node:readline';
import { repoRoot } from './postgres';

export class ProcessGroup {
  private readonly children = new Map<string, ChildProcess>();
  private stopping = false;

  constructor(private readonly onUnexpectedExit: (name: string, code: number | null) => void) {}

  /** Runs a TypeScript entry point of the project under Node with tsx. */
  start(
    name: string,
    entry: string,
    env: Record<string, string>,
    options: { quiet?: boolean } = {},
  ): ChildProcess {
    const child = spawn(process.execPath, ['--import', 'tsx', entry], {
      cwd: repoRoot,
      env: { ...process.env, ...env },
      stdio: ['ignore', 'pipe', 'pipe'],
    });
    for (const stream of [child.stdout!, child.stderr!]) {
      createInterface({ input: stream }).on('line', (line) => {
        if (!options.quiet || stream === child.stderr) console.log(`[${name}] ${line}`);
      });
    }
    child.on('exit', (code) => {
      this.children.delete(name);
      if (!this.stopping) this.onUnexpectedExit(name, code);
    });
    this.children.set(name, child);
    return child;
  }

  async stopAll(): Promise<void> {
    this.stopping = true;
    await Promise.all(
      [...this.children.values()].map(
        (child) =>
          new Promise<void>((resolve) => {
            if (child.exitCode !== null) return resolve();
            const force = setTimeout(() => child.kill('SIGKILL'), 5_000);
            child.once('exit', () => {
              clearTimeout(force);
              resolve();
            });
            child.kill('SIGTERM');
          }),
      ),
    );
  }
}

/** Polls a URL until it answers 200, or fails after the timeout (a minute: a busy machine starts a server slowly). */
export async function waitForHttp(url: string, timeoutMs = 60_000): Promise<void> {
  const deadline = Date.now() + timeoutMs;
  let last = '';
  while (Date.now() < deadline) {
    try {
      const res = await fetch(url);
      if (res.ok) return;
      last = `status ${res.status}`;
    } catch (error) {
      last = (error as Error).message;
    }
    await new Promise((r) => setTimeout(r, 150));
  }
  throw new Error(`${url} did not answer within ${timeoutMs / 1000} s (${last})`);
}
