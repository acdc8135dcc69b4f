// Runs in a worker thread (see worker-pool.ts): the work that takes longer than an event-loop turn should, so that
// one big song or PDF never holds up the requests of everyone else.
import { retuneSong, type RetuneMode } from '../../shared/midi/song-retune';
import type { KeyTable } from '../../shared/tuning/key-table';
import type { ResolvedPreset } from '../../shared/preset/preset-document';
import { bundleEntries } from '../exports/bundle';
import { type SheetRevision, renderTunerSheet } from '../exports/tuner-sheet';

export type HeavyTask =
  | { kind: 'retune'; song: Uint8Array; keys: KeyTable; output: ResolvedPreset['output']; keysPerPeriod: number; mode: RetuneMode }
  | { kind: 'tuner-sheet'; preset: ResolvedPreset; at: SheetRevision }
  | { kind: 'bundle-entries'; preset: ResolvedPreset; at: SheetRevision };

/** The stolen notes a retune answer lists at most; the count is always whole. */
export const listedStolenNotes = 100;

/** A retuned song as the route sends it: the bytes moved back without a copy, the report's lists cut short. */
export function retune(task: Extract<HeavyTask, { kind: 'retune' }>) {
  const retuned = retuneSong(task.song, { keys: task.keys, output: task.output, keysPerPeriod: task.keysPerPeriod }, task.mode);
  if (!retuned.ok) return retuned;
  const { bytes, report } = retuned.value;
  const listed = { ...report, notesStolen: report.notesStolen.slice(0, listedStolenNotes), notesStolenCount: report.notesStolen.length };
  return { ok: true as const, value: { song: bytes, report: listed } };
}

export default async function heavyWork(task: HeavyTask) {
  switch (task.kind) {
    case 'retune':
      return retune(task);
    case 'tuner-sheet':
      return new Uint8Array(await renderTunerSheet(task.preset, task.at));
    case 'bundle-entries':
      return (await bundleEntries(task.preset, task.at)).map((entry) => ({ name: entry.name, bytes: new Uint8Array(entry.bytes) }));
  }
}
