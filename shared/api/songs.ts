// The answers of the routes that take a file: importing a tuning, retuning a song.
import type { LeadIn } from '../midi/lead-in';
import type { RetuneMode, RetuneReport } from '../midi/retune-report';
import type { PresetDocument } from '../preset/preset-document';

/** What `POST /api/import` found in a file: MTS messages, a preset document, or a list of intervals. */
export const importKinds = ['syx', 'preset', 'intervals'] as const;
export type ImportKind = (typeof importKinds)[number];

/** `POST /api/import`. */
export interface ImportedTuning {
  kind: ImportKind;
  document: PresetDocument;
}

/** The whole report of `POST /api/retune`: every stolen note counted, the first hundred listed. */
export interface SongReport extends RetuneReport {
  notesStolenCount: number;
  uploadSha256: string;
}

/** The `Keyloom-Report` header of `POST /api/retune`: counts only, a few hundred bytes whatever the song. */
export interface SongReportCounts {
  mode: RetuneMode;
  notesRetuned: number;
  channelsUsed: number[];
  notesStolenCount: number;
  notesUnmappedCount: number;
  warningsCount: number;
  leadIn: LeadIn;
  uploadSha256: string;
}

/** `POST /api/retune` to a client that accepts JSON: the song as base64 beside the whole report. */
export interface RetuneAnswer {
  fileName: string;
  report: SongReport;
  song: string;
}
