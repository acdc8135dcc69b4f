// The answers of the share-link routes.
import type { Timestamp } from './wire';

/** One row of `GET /api/presets/:id/shares`. */
export interface ShareLink {
  id: string;
  /** null: the link follows the latest revision. */
  revision: number | null;
  createdAt: Timestamp;
  revokedAt: Timestamp | null;
  /** null once the member who made it is gone. */
  createdBy: string | null;
}

/** `POST /api/presets/:id/shares` (201): the token is shown once, in the link. */
export interface NewShareLink {
  id: string;
  token: string;
  url: string;
  revision: number | null;
}

/** `GET /api/shared/:token`: what a link opens, without an account. */
export interface SharedPreset {
  name: string;
  revision: number;
  pinned: boolean;
  savedAt: Timestamp;
  /** As saved: the shared page reads it with parsePresetDocument and names what it cannot read. */
  document: unknown;
}
