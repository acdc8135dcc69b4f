// The files of the bundle: every export that applies to a preset, the tuner sheet and a read-me.
// Made on a worker thread (server/work/heavy-work.ts); bundle.ts zips what it returns.
import { exportFormats, renderExport } from '../../shared/export/export-catalogue';
import type { ResolvedPreset } from '../../shared/preset/preset-document';
import { type SheetRevision, renderTunerSheet } from './tuner-sheet';
import { exportFileName } from '../../shared/export/export-file-name';
import { singleLine } from '../../shared/text/plain-text';

/** Which instruments take each file, for the read-me. */
const takenBy: Record<string, string> = {
  'mts-bulk': 'hardware and software synths that receive MTS bulk dumps',
  'mts-bulk-bank': 'synths that keep tuning programs in banks',
  'mts-notes':
    'synths that retune sounding notes in real time (also software synths that ignore bulk dumps)',
  'mts-octave-1': 'synths with a 12-note-per-octave tuning table, coarse form (1 cent steps)',
  'mts-octave-2': 'synths with a 12-note-per-octave tuning table, fine form',
  smf: 'any sequencer or player: the tuning messages at the start, then a short phrase to check it by ear',
  'mpe-smf': 'MPE instruments and synths without MTS: one note per channel with pitch bends',
  'bend-csv': 'your own scripts and spreadsheets: the note and pitch bend that sound each key',
  'bend-json': 'your own scripts: the same table as JSON',
  'key-csv': 'your own scripts and spreadsheets, and printing: the pitch every key plays',
  sfz: 'samplers that read SFZ maps: one region per key with its pitch centre and fine tune',
  preset: 'Keyloom itself: import it to get this exact preset back',
};

export interface BundleEntry {
  name: string;
  bytes: Buffer;
}

/** The files of the bundle, in order; formats that do not apply to this preset are listed in the read-me. */
export async function bundleEntries(
  preset: ResolvedPreset,
  at: SheetRevision,
): Promise<BundleEntry[]> {
  const base = exportFileName(preset.name, '');
  const entries: BundleEntry[] = [];
  const lines = [
    `${singleLine(preset.name)}${at.revision ? `, revision ${at.revision}` : ''}: files made by Keyloom`,
    '',
  ];
  const skipped: string[] = [];
  for (const format of exportFormats) {
    const file = renderExport(preset, format.id);
    if (!file.ok) {
      skipped.push(`${format.id}: ${file.errors.map((e) => e.message).join('; ')}`);
      continue;
    }
    const name = file.value.fileName;
    entries.push({ name, bytes: Buffer.from(file.value.bytes) });
    lines.push(
      `${name}`,
      `    ${format.description}`,
      `    For ${takenBy[format.id] ?? 'any program that reads this format'}.`,
    );
    for (const warning of file.value.warnings) lines.push(`    Note: ${warning.message}`);
    lines.push('');
  }
  const sheetName = `${base}-tuner-sheet.pdf`;
  entries.push({ name: sheetName, bytes: await renderTunerSheet(preset, at) });
  lines.push(
    sheetName,
    '    A printable sheet: the degrees, and what to dial into a chromatic tuner for each key.',
    '',
  );
  if (skipped.length > 0)
    lines.push(
      'Not included, because they do not apply to this preset:',
      ...skipped.map((s) => `    ${s}`),
      '',
    );
  lines.push(
    'Sending a tuning to an instrument overwrites the tuning program it is sent to: back that program up first.',
  );
  entries.unshift({ name: 'READ-ME.txt', bytes: Buffer.from(lines.join('\r\n') + '\r\n', 'utf8') });
  return entries;
}
