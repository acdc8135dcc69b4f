// A band's setlists and the stage's live position. Viewers read, editors change.
import * as z from 'zod';
import { storableString } from '../text/plain-text';
import type { Timestamp } from './wire';

/** The most entries one setlist holds: a long evening. */
export const longestSetlist = 200;

const entry = z.strictObject({
  presetId: z.uuid({ error: 'must be an id as the API gives them' }),
  /** Pinned to this revision; absent or null: follows the latest. */
  revision: z.int().min(1).max(2_147_483_647).nullable().default(null),
  /** A MIDI program-change number that selects this entry from a foot controller. */
  trigger: z
    .int({ error: 'must be a program number from 0 to 127' })
    .min(0)
    .max(127)
    .nullable()
    .default(null),
});

/** `POST /api/bands/:id/setlists` and `PUT /api/setlists/:id`: the whole list, in order. */
export const setlistRequest = z
  .strictObject({
    name: storableString()
      .trim()
      .min(1, { error: 'must not be empty' })
      .max(80, { error: 'must be at most 80 characters' }),
    entries: z
      .array(entry)
      .max(longestSetlist, { error: `must hold at most ${longestSetlist} entries` }),
  })
  .superRefine(({ entries }, context) => {
    const seen = new Map<number, number>();
    entries.forEach(({ trigger }, index) => {
      if (trigger === null) return;
      const first = seen.get(trigger);
      if (first !== undefined) {
        context.addIssue({
          code: 'custom',
          path: ['entries', index, 'trigger'],
          message: `is ${trigger}, already the trigger of entry ${first + 1}; each program number selects one entry`,
        });
      } else seen.set(trigger, index);
    });
  });
export type SetlistBody = z.output<typeof setlistRequest>;

/** `POST /api/setlists/:id/position` (editors). */
export const positionRequest = z.strictObject({
  position: z.int({ error: 'must be an entry number from 0' }).min(0),
});

export interface SetlistEntry {
  presetId: string;
  revision: number | null;
  trigger: number | null;
  /** The preset's current name and latest revision, for showing the list. */
  presetName: string;
  latestRevision: number;
}

/**
 * `GET /api/setlists/:id`, rows of `GET /api/bands/:id/setlists`, `POST` (201), `PUT`, and the answer to
 * `POST /api/setlists/:id/position`.
 */
export interface Setlist {
  id: string;
  bandId: string;
  name: string;
  entries: SetlistEntry[];
  /** The stage's live position: an index into `entries`. */
  position: number;
  createdAt: Timestamp;
  updatedAt: Timestamp;
  /** What the caller may do: read (viewers) or edit (editors and owners). */
  access: 'read' | 'edit';
}

/**
 * One event of `GET /api/setlists/:id/live` (Server-Sent Events, `event: position`, `id:` for Last-Event-ID): at once
 * on connect, on every move, and when the current entry follows the latest revision and a new one is saved; none
 * while the list is empty. A stream ends when its setlist is deleted or its server stops (the browser reconnects).
 */
export interface StagePosition {
  position: number;
  presetId: string;
  revision: number;
  /** The preset document of that revision, as saved. */
  document: unknown;
}
