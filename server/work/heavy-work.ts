// Runs in a worker thread (see worker-pool.ts): the work that takes longer than an event-loop turn should, so that
// one big song or PDF never holds up the requests of everyone else.
import { presetFromKeys } from '../../shared/import/tuning-from-keys';
import { decodeMtsStream } from '../../shared/midi/mts-decode';
import type { RetuneMode } from '../../shared/midi/retune-report';
import { retuneSong } from '../../shared/midi/song-retune';
import type { Result } from '../../shared/result';
import type { KeyTable } from '../../shared/tuning/key-table';
import type { ResolvedPreset } from '../../shared/preset/preset-document';
import { bundleEntries } from '../exports/bundle-entries';
import { type SheetRevision, renderTunerSheet } from '../exports/tuner-sheet';

export type HeavyTask =
  | {
      kind: 'retune';
      song: Uint8Array;
      keys: KeyTable;
      output: ResolvedPreset['output'];
      keysPerPeriod: number;
      mode: RetuneMode;
      leadInMs: number;
    }
  | { kind: 'tuner-sheet'; preset: ResolvedPreset; at: SheetRevision }
  | { kind: 'bundle-entries'; preset: ResolvedPreset; at: SheetRevision }
  | { kind: 'syx-import'; bytes: Uint8Array; name: string };

/** The stolen notes a retune answer lists at most; the count is always whole. */
export const listedStolenNotes = 100;

/** A retuned song as the route sends it: the bytes moved back without a copy, the report's lists cut short. */
export function retune(task: Extract<HeavyTask, { kind: 'retune' }>) {
  const retuned = retuneSong(
    task.song,
    { keys: task.keys, output: task.output, keysPerPeriod: task.keysPerPeriod },
    task.mode,
    task.leadInMs,
  );
  if (!retuned.ok) return retuned;
  const { bytes, report } = retuned.value;
  const listed = {
    ...report,
    notesStolen: report.notesStolen.slice(0, listedStolenNotes),
    notesStolenCount: report.notesStolen.length,
  };
  return { ok: true as const, value: { song: bytes, report: listed } };
}

/** A preset document from an .syx of MTS messages (thousands of dumps take a while to decode). */
export function syxImport(task: Extract<HeavyTask, { kind: 'syx-import' }>): Result<unknown> {
  const decoded = decodeMtsStream(task.bytes);
  const imported = decoded.ok ? presetFromKeys(decoded.value.keys, task.name) : decoded;
  return imported.ok ? { ok: true, value: imported.value.document } : imported;
}

export default async function heavyWork(task: HeavyTask) {
  switch (task.kind) {
    case 'syx-import':
      return syxImport(task);
    case 'retune':
      return retune(task);
    case 'tuner-sheet':
      return new Uint8Array(await renderTunerSheet(task.preset, task.at));
    case 'bundle-entries':
      return (await bundleEntries(task.preset, task.at)).map((entry) => ({
        name: entry.name,
        bytes: new Uint8Array(entry.bytes),
      }));
  }
}
