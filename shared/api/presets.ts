// The answers of the library routes (/api/presets...): what the server sends and the app reads.
import type { RevisionChanges as ChangeSummary } from '../library/revision-changes';
import type { PresetAccess } from './roles';
import type { Timestamp } from './wire';

/** One row of `GET /api/presets`, with what the caller may do with it. */
export interface PresetRow {
  id: string;
  name: string;
  bandId: string | null;
  bandName: string | null;
  ownerId: string;
  ownerLogin: string;
  revision: number;
  updatedAt: Timestamp;
  deletedAt: Timestamp | null;
  access: PresetAccess;
}

/** `GET /api/presets`: one page of the caller's presets and their bands'. */
export interface PresetPage {
  items: PresetRow[];
  total: number;
  page: number;
  pageSize: number;
}

/** `GET /api/presets/:id`: the latest revision of a preset. */
export interface SavedPreset {
  id: string;
  name: string;
  bandId: string | null;
  ownerId: string;
  revision: number;
  note: string | null;
  /**
   * The preset document as saved: the server saves only documents that parsePresetDocument accepts, and readers
   * read it again with parsePresetDocument (a later version of the format may read it differently).
   */
  document: unknown;
  createdAt: Timestamp;
  updatedAt: Timestamp;
  deletedAt: Timestamp | null;
  forkedFrom: { id: string; revision: number | null } | null;
  access: PresetAccess;
}

/** `POST /api/presets` (201). */
export interface CreatedPreset {
  id: string;
  revision: number;
}

/** `POST /api/presets/:id/revisions` and `POST /api/presets/:id/restore` (201). */
export interface SavedRevision {
  revision: number;
}

/** `POST /api/presets/:id/fork` (201). */
export interface ForkedPreset {
  id: string;
}

/** `POST /api/presets/:id/untrash`. */
export interface UntrashedPreset {
  id: string;
  deletedAt: null;
}

/** One entry of `GET /api/presets/:id/revisions`, newest first. */
export interface RevisionEntry {
  revision: number;
  note: string | null;
  authorId: string | null;
  authorLogin: string | null;
  authorName: string | null;
  createdAt: Timestamp;
  /** The preset's name in that revision. */
  name: string;
}

/** `GET /api/presets/:id/revisions/:n`. */
export interface RevisionDocument {
  presetId: string;
  revision: number;
  note: string | null;
  authorId: string | null;
  createdAt: Timestamp;
  document: unknown;
}

/** `GET /api/presets/:id/revisions/:n/changes`: what changed from revision `from` to `to`. */
export interface RevisionChanges extends ChangeSummary {
  from: number;
  to: number;
}
