// Work that takes longer than an event-loop turn should (retuning a song, drawing a PDF) runs on worker threads
// through piscina, so that the server keeps answering everyone else meanwhile.
import { availableParallelism } from 'node:os';
import Piscina from 'piscina';
import { HttpError } from '../http/errors';
import type { BundleEntry } from '../exports/bundle-entries';
import type {
  HeavyTask,
  retune as retuneOnThread,
  syxImport as syxImportOnThread,
} from './heavy-work';

/** Tasks waiting for a thread at most; past that the server says it is busy rather than queueing without end. */
const longestQueue = 64;

let pool: Piscina | undefined;

function workers(): Piscina {
  pool ??= new Piscina({
    filename: new URL('./heavy-work.ts', import.meta.url).href,
    // The worker loads TypeScript the way the server does (tsx), whichever runner started this process.
    execArgv: ['--import', 'tsx'],
    minThreads: 0,
    maxThreads: Math.max(1, availableParallelism() - 1),
    idleTimeout: 60_000,
    maxQueue: longestQueue,
  });
  return pool;
}

/** Runs one task on a worker thread; a full queue answers 503 with a plain message. */
async function offThread(task: HeavyTask): Promise<unknown> {
  try {
    return await workers().run(task);
  } catch (error) {
    if (/queue is at limit/i.test((error as Error).message ?? '')) {
      throw new HttpError(
        503,
        'busy',
        'The server is busy with other long work; try again in a moment.',
      );
    }
    throw error;
  }
}

type TaskOf<K extends HeavyTask['kind']> = Omit<Extract<HeavyTask, { kind: K }>, 'kind'>;

/** A song retuned on a worker thread. */
export function retuneOffThread(
  task: TaskOf<'retune'>,
): Promise<ReturnType<typeof retuneOnThread>> {
  return offThread({ kind: 'retune', ...task }) as Promise<ReturnType<typeof retuneOnThread>>;
}

/** A preset document decoded from an .syx on a worker thread. */
export function syxImportOffThread(
  task: TaskOf<'syx-import'>,
): Promise<ReturnType<typeof syxImportOnThread>> {
  return offThread({ kind: 'syx-import', ...task }) as Promise<
    ReturnType<typeof syxImportOnThread>
  >;
}

/** The tuner sheet PDF drawn on a worker thread. */
export async function tunerSheetOffThread(task: TaskOf<'tuner-sheet'>): Promise<Buffer> {
  const bytes = (await offThread({ kind: 'tuner-sheet', ...task })) as Uint8Array;
  return Buffer.from(bytes.buffer, bytes.byteOffset, bytes.byteLength);
}

/** The files of a bundle rendered on a worker thread. */
export async function bundleEntriesOffThread(
  task: TaskOf<'bundle-entries'>,
): Promise<BundleEntry[]> {
  const entries = (await offThread({ kind: 'bundle-entries', ...task })) as {
    name: string;
    bytes: Uint8Array;
  }[];
  return entries.map(({ name, bytes }) => ({
    name,
    bytes: Buffer.from(bytes.buffer, bytes.byteOffset, bytes.byteLength),
  }));
}

/** Ends the worker threads (tests and shutdown); the next task starts them again. */
export async function stopWorkers(): Promise<void> {
  const stopping = pool;
  pool = undefined;
  await stopping?.destroy();
}
