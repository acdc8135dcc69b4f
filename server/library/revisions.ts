import type { AuditAction } from '../../shared/api/audit';
// Presets and their revisions: every save is a new row, numbered in the order saves land.
import { and, eq, sql } from 'drizzle-orm';
import type { Database } from '../db/client';
import { presetRevisions, presets } from '../db/schema';
import { largestRevision } from '../../shared/api/requests';
import { notFound } from '../http/errors';
import { recordFollowingEvents } from '../stage/stage-events';
import { recordAudit, type Writer } from './audit';

export interface NewPreset {
  ownerId: string;
  bandId: string | null;
  name: string;
  document: unknown;
  note: string | null;
  forkedFrom?: { id: string; revision: number };
}

export async function createPreset(
  db: Database,
  input: NewPreset,
  action: AuditAction = 'preset.create',
): Promise<string> {
  return db.transaction(async (tx) => {
    const [preset] = await tx
      .insert(presets)
      .values({
        ownerId: input.ownerId,
        bandId: input.bandId,
        name: input.name,
        latestRevision: 1,
        forkedFromId: input.forkedFrom?.id,
        forkedFromRevision: input.forkedFrom?.revision,
      })
      .returning({ id: presets.id });
    await tx.insert(presetRevisions).values({
      presetId: preset.id,
      revision: 1,
      document: input.document,
      note: input.note,
      authorId: input.ownerId,
    });
    await recordAudit(tx, {
      actorId: input.ownerId,
      action,
      bandId: input.bandId,
      presetId: preset.id,
      detail: { name: input.name, ...(input.forkedFrom ? { forkedFrom: input.forkedFrom } : {}) },
    });
    return preset.id;
  });
}

/**
 * Appends a revision. The update takes the preset's row lock, so saves that arrive together are numbered one
 * after the other and none is lost.
 */
export async function appendRevision(
  db: Database,
  input: {
    presetId: string;
    authorId: string;
    name: string;
    document: unknown;
    note: string | null;
    action: AuditAction;
    bandId: string | null;
  },
): Promise<number> {
  return db.transaction(async (tx) => {
    const [row] = await tx
      .update(presets)
      .set({
        latestRevision: sql`${presets.latestRevision} + 1`,
        name: input.name,
        updatedAt: new Date(),
      })
      .where(eq(presets.id, input.presetId))
      .returning({ revision: presets.latestRevision });
    await tx.insert(presetRevisions).values({
      presetId: input.presetId,
      revision: row.revision,
      document: input.document,
      note: input.note,
      authorId: input.authorId,
    });
    await recordAudit(tx, {
      actorId: input.authorId,
      action: input.action,
      bandId: input.bandId,
      presetId: input.presetId,
      detail: { revision: row.revision, ...(input.note ? { note: input.note } : {}) },
    });
    // Setlists whose current entry follows this preset's latest revision: their followers hear the new one.
    await recordFollowingEvents(tx, input.presetId);
    return row.revision;
  });
}

/** One revision of a preset, or 404 when there is none by that number (a number no revision can have included). */
export async function readRevision(writer: Writer, presetId: string, revision: number) {
  if (!Number.isInteger(revision) || revision < 1 || revision > largestRevision)
    throw notFound('revision');
  const [row] = await writer
    .select()
    .from(presetRevisions)
    .where(and(eq(presetRevisions.presetId, presetId), eq(presetRevisions.revision, revision)));
  if (!row) throw notFound('revision');
  return row;
}
