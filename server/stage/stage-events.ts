// The stage's events in PostgreSQL: each change followers must hear is a numbered row, announced
// with NOTIFY. The notice carries ids only (a NOTIFY payload holds at most 8000 bytes); listeners
// read the rows.
import { and, eq, isNull, sql } from 'drizzle-orm';
import type { StagePosition } from '../../shared/api/setlists';
import type { Database } from '../db/client';
import { setlistEntries, setlists, stageEvents } from '../db/schema';
import type { Writer } from '../library/audit';

/** The channel every instance listens on. */
export const stageChannel = 'keyloom_stage';

/** A notice's payload: `<setlist id>:<stage event id>`. */
export function stageNotice(setlistId: string, eventId: number): string {
  return `${setlistId}:${eventId}`;
}

export function readStageNotice(
  payload: string | undefined,
): { setlistId: string; eventId: number } | null {
  const match = /^([0-9a-f-]{36}):(\d{1,19})$/i.exec(payload ?? '');
  return match ? { setlistId: match[1], eventId: Number(match[2]) } : null;
}

/**
 * Records a stage event for the setlist inside the caller's transaction and announces it;
 * PostgreSQL delivers the notice when the transaction commits, and not at all when it rolls back.
 * The caller holds the setlist's row lock, so that one setlist's events commit in the order of
 * their ids.
 */
export async function recordStageEvent(
  tx: Writer,
  setlistId: string,
  position: number,
): Promise<number> {
  const [event] = await tx
    .insert(stageEvents)
    .values({ setlistId, position })
    .returning({ id: stageEvents.id });
  await tx.execute(sql`SELECT pg_notify(${stageChannel}, ${stageNotice(setlistId, event.id)})`);
  return event.id;
}

/**
 * Tells followers of a setlist being deleted to read it again: they find it gone, and their streams
 * end.
 */
export async function announceSetlistGone(tx: Writer, setlistId: string): Promise<void> {
  const notice = stageNotice(setlistId, Number.MAX_SAFE_INTEGER);
  await tx.execute(sql`SELECT pg_notify(${stageChannel}, ${notice})`);
}

/**
 * After a new revision of a preset: a stage event for every setlist whose current entry follows
 * that preset's latest revision. Runs inside the transaction that saves the revision.
 */
export async function recordFollowingEvents(tx: Writer, presetId: string): Promise<void> {
  const following = await tx
    .select({ id: setlists.id, position: setlists.position })
    .from(setlists)
    .innerJoin(
      setlistEntries,
      and(eq(setlistEntries.setlistId, setlists.id), eq(setlistEntries.place, setlists.position)),
    )
    .where(and(eq(setlistEntries.presetId, presetId), isNull(setlistEntries.revision)))
    .orderBy(setlists.id)
    .for('update', { of: setlists });
  for (const setlist of following) await recordStageEvent(tx, setlist.id, setlist.position);
}

/**
 * What a follower hears: the newest event id, and the entry at the position (null when the list is
 * empty).
 */
export interface StageState {
  eventId: number;
  stage: StagePosition | null;
}

/**
 * The setlist's stage now, read in one statement so that the event id and the position come from
 * one snapshot; null when the setlist is gone. A setlist never moved has event id 0.
 */
export async function readStage(db: Database, setlistId: string): Promise<StageState | null> {
  const { rows } = await db.$client.query<{
    position: number;
    preset_id: string | null;
    revision: number | null;
    document: unknown;
    event_id: string;
  }>(
    `SELECT s.position, e.preset_id, r.revision, r.document,
       (SELECT coalesce(max(id), 0) FROM stage_events WHERE setlist_id = s.id) AS event_id
     FROM setlists s
     LEFT JOIN setlist_entries e ON e.setlist_id = s.id AND e.place = s.position
     LEFT JOIN presets p ON p.id = e.preset_id
     LEFT JOIN preset_revisions r
       ON r.preset_id = e.preset_id AND r.revision = coalesce(e.revision, p.latest_revision)
     WHERE s.id = $1`,
    [setlistId],
  );
  const [row] = rows;
  if (!row) return null;
  const stage =
    row.preset_id !== null && row.revision !== null
      ? {
          position: row.position,
          presetId: row.preset_id,
          revision: row.revision,
          document: row.document,
        }
      : null;
  return { eventId: Number(row.event_id), stage };
}
