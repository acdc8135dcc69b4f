// The bundle: every export that applies to a preset, the tuner sheet and a read-me, in one zip streamed with
// archiver. Entries carry the revision's date and a fixed order, so the same revision always gives the same bytes.
import { ZipArchive } from 'archiver';
import type { Writable } from 'node:stream';
import type { ResolvedPreset } from '../../shared/preset/preset-document';
import { bundleEntriesOffThread } from '../work/worker-pool';
import type { SheetRevision } from './tuner-sheet';

/** Streams the bundle's zip into `out` (an HTTP response or a file). */
export async function streamBundle(
  preset: ResolvedPreset,
  at: SheetRevision,
  out: Writable,
): Promise<void> {
  const entries = await bundleEntriesOffThread({ preset, at });
  const archive = new ZipArchive({ zlib: { level: 9 } });
  const finished = new Promise<void>((resolve, reject) => {
    archive.on('error', reject);
    out.on('finish', resolve);
    out.on('error', reject);
  });
  archive.pipe(out);
  const date = at.savedAt ?? new Date(Date.UTC(2000, 0, 1));
  for (const entry of entries) archive.append(entry.bytes, { name: entry.name, date });
  await archive.finalize();
  await finished;
}
