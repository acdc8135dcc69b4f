import { and, asc, desc, eq, ilike, inArray, isNotNull, isNull, lt, or, sql } from 'drizzle-orm';
import { Router } from 'express';
import {
  createPresetRequest,
  forkPresetRequest,
  parseRequest,
  presetListQuery,
  restoreRevisionRequest,
  saveRevisionRequest,
} from '../../shared/api/requests';
import type {
  CreatedPreset,
  ForkedPreset,
  PresetPage,
  RevisionChanges,
  RevisionDocument,
  RevisionEntry,
  SavedPreset,
  SavedRevision,
  UntrashedPreset,
} from '../../shared/api/presets';
import type { ItemList } from '../../shared/api/wire';
import { summarizeChanges } from '../../shared/library/revision-changes';
import type { Database } from '../db/client';
import { bands, memberships, presetRevisions, presets, users } from '../db/schema';
import { documentOrThrow } from '../http/documents';
import { HttpError } from '../http/errors';
import { valueOrThrow } from '../http/validation';
import { iso } from '../http/wire';
import { recordAudit } from '../library/audit';
import { appendRevision, createPreset, readRevision } from '../library/revisions';
import {
  authorizeBandLibrary,
  authorizePreset,
  listedPresetAccess,
  requireUser,
} from '../policy/policy';

/** How long a deleted preset waits in the trash before it is gone for good. */
const trashDays = 30;
const trashMs = trashDays * 24 * 3600 * 1000;

/** A revision number from the address; readRevision answers 404 for one that no revision has. */
function revisionNumber(text: string): number {
  return /^\d{1,10}$/.test(text) ? Number(text) : 0;
}

/** Deletes presets that have waited in the trash longer than `trashDays`; their revisions and links go with them. */
export async function purgeExpiredTrash(db: Database): Promise<number> {
  const gone = await db
    .delete(presets)
    .where(and(isNotNull(presets.deletedAt), lt(presets.deletedAt, new Date(Date.now() - trashMs))))
    .returning({ id: presets.id });
  return gone.length;
}

export function presetsRouter(db: Database): Router {
  const router = Router();

  router.post('/api/presets', async (req, res) => {
    const user = requireUser(req.user);
    const body = valueOrThrow(parseRequest(createPresetRequest, req.body));
    const preset = documentOrThrow(body.document);
    if (body.bandId) await authorizeBandLibrary(db, user, body.bandId);
    const id = await createPreset(db, {
      ownerId: user.id,
      bandId: body.bandId ?? null,
      name: preset.name,
      document: body.document,
      note: body.note ?? null,
    });
    res.status(201).json({ id, revision: 1 } satisfies CreatedPreset);
  });

  router.get('/api/presets', async (req, res) => {
    const user = requireUser(req.user);
    const query = valueOrThrow(parseRequest(presetListQuery, req.query));
    const myBands = db
      .select({ id: memberships.bandId })
      .from(memberships)
      .where(eq(memberships.userId, user.id));
    const where = and(
      or(
        and(eq(presets.ownerId, user.id), isNull(presets.bandId)),
        inArray(presets.bandId, myBands),
      ),
      query.bandId ? eq(presets.bandId, query.bandId) : undefined,
      query.q ? ilike(presets.name, `%${query.q.replace(/[\\%_]/g, (c) => `\\${c}`)}%`) : undefined,
      query.trash === '1' ? isNotNull(presets.deletedAt) : isNull(presets.deletedAt),
    );
    const order = {
      name: [asc(presets.name), asc(presets.id)],
      '-name': [desc(presets.name), asc(presets.id)],
      updated: [asc(presets.updatedAt), asc(presets.id)],
      '-updated': [desc(presets.updatedAt), asc(presets.id)],
    }[query.sort];
    const rows = await db
      .select({
        id: presets.id,
        name: presets.name,
        bandId: presets.bandId,
        bandName: bands.name,
        ownerId: presets.ownerId,
        ownerLogin: users.login,
        revision: presets.latestRevision,
        updatedAt: presets.updatedAt,
        deletedAt: presets.deletedAt,
        role: memberships.role,
        total: sql<number>`count(*) over ()`.mapWith(Number),
      })
      .from(presets)
      .leftJoin(bands, eq(bands.id, presets.bandId))
      .leftJoin(
        memberships,
        and(eq(memberships.bandId, presets.bandId), eq(memberships.userId, user.id)),
      )
      .innerJoin(users, eq(users.id, presets.ownerId))
      .where(where)
      .orderBy(...order)
      .limit(query.pageSize)
      .offset((query.page - 1) * query.pageSize);
    const total = rows[0]?.total ?? (query.page === 1 ? 0 : await countVisible());
    const items = rows.map(({ total: _, role, ...row }) => ({
      ...row,
      updatedAt: iso(row.updatedAt),
      deletedAt: iso(row.deletedAt),
      access: listedPresetAccess(user, row, role),
    }));
    res.json({ items, total, page: query.page, pageSize: query.pageSize } satisfies PresetPage);

    async function countVisible(): Promise<number> {
      const [row] = await db
        .select({ n: sql<number>`count(*)`.mapWith(Number) })
        .from(presets)
        .where(where);
      return row.n;
    }
  });

  router.get('/api/presets/:id', async (req, res) => {
    const { preset, access } = await authorizePreset(db, req.user, req.params['id'], 'read');
    const latest = await readRevision(db, preset.id, preset.latestRevision);
    res.json({
      id: preset.id,
      name: preset.name,
      bandId: preset.bandId,
      ownerId: preset.ownerId,
      revision: preset.latestRevision,
      note: latest.note,
      document: latest.document,
      createdAt: iso(preset.createdAt),
      updatedAt: iso(preset.updatedAt),
      deletedAt: iso(preset.deletedAt),
      forkedFrom: preset.forkedFromId
        ? { id: preset.forkedFromId, revision: preset.forkedFromRevision }
        : null,
      access,
    } satisfies SavedPreset);
  });

  router.post('/api/presets/:id/revisions', async (req, res) => {
    const user = requireUser(req.user);
    const { preset } = await authorizePreset(db, user, req.params['id'], 'edit');
    const body = valueOrThrow(parseRequest(saveRevisionRequest, req.body));
    const resolved = documentOrThrow(body.document);
    const revision = await appendRevision(db, {
      presetId: preset.id,
      authorId: user.id,
      name: resolved.name,
      document: body.document,
      note: body.note ?? null,
      action: 'preset.save',
      bandId: preset.bandId,
    });
    res.status(201).json({ revision } satisfies SavedRevision);
  });

  router.get('/api/presets/:id/revisions', async (req, res) => {
    const { preset } = await authorizePreset(db, req.user, req.params['id'], 'read');
    const rows = await db
      .select({
        revision: presetRevisions.revision,
        note: presetRevisions.note,
        authorId: presetRevisions.authorId,
        authorLogin: users.login,
        authorName: users.name,
        createdAt: presetRevisions.createdAt,
        name: sql<string>`${presetRevisions.document}->>'name'`,
      })
      .from(presetRevisions)
      .leftJoin(users, eq(users.id, presetRevisions.authorId))
      .where(eq(presetRevisions.presetId, preset.id))
      .orderBy(desc(presetRevisions.revision));
    res.json({
      items: rows.map((row) => ({ ...row, createdAt: iso(row.createdAt) })),
    } satisfies ItemList<RevisionEntry>);
  });

  router.get('/api/presets/:id/revisions/:n', async (req, res) => {
    const { preset } = await authorizePreset(db, req.user, req.params['id'], 'read');
    const row = await readRevision(db, preset.id, revisionNumber(req.params['n']));
    res.json({
      presetId: preset.id,
      revision: row.revision,
      note: row.note,
      authorId: row.authorId,
      createdAt: iso(row.createdAt),
      document: row.document,
    } satisfies RevisionDocument);
  });

  router.get('/api/presets/:id/revisions/:n/changes', async (req, res) => {
    const { preset } = await authorizePreset(db, req.user, req.params['id'], 'read');
    const after = await readRevision(db, preset.id, revisionNumber(req.params['n']));
    const to = after.revision;
    if (req.query['from'] === undefined && to === 1) {
      throw new HttpError(
        400,
        'invalid',
        'from: revision 1 has nothing before it to compare with.',
        'from',
      );
    }
    const from =
      req.query['from'] === undefined ? to - 1 : revisionNumber(String(req.query['from']));
    const before = await readRevision(db, preset.id, from);
    const changes = summarizeChanges(
      documentOrThrow(before.document),
      documentOrThrow(after.document),
    );
    res.json({ from, to, ...changes } satisfies RevisionChanges);
  });

  router.post('/api/presets/:id/restore', async (req, res) => {
    const user = requireUser(req.user);
    const { preset } = await authorizePreset(db, user, req.params['id'], 'edit');
    const body = valueOrThrow(parseRequest(restoreRevisionRequest, req.body));
    const old = await readRevision(db, preset.id, body.revision);
    const revision = await appendRevision(db, {
      presetId: preset.id,
      authorId: user.id,
      name: documentOrThrow(old.document).name,
      document: old.document,
      note: `Restored revision ${body.revision}`,
      action: 'preset.restore',
      bandId: preset.bandId,
    });
    res.status(201).json({ revision } satisfies SavedRevision);
  });

  router.post('/api/presets/:id/fork', async (req, res) => {
    const user = requireUser(req.user);
    const { preset } = await authorizePreset(db, user, req.params['id'], 'read');
    const body = valueOrThrow(parseRequest(forkPresetRequest, req.body));
    if (body.bandId) await authorizeBandLibrary(db, user, body.bandId);
    const latest = await readRevision(db, preset.id, preset.latestRevision);
    const id = await createPreset(
      db,
      {
        ownerId: user.id,
        bandId: body.bandId ?? null,
        name: preset.name,
        document: latest.document,
        note: `Forked from revision ${preset.latestRevision}`,
        forkedFrom: { id: preset.id, revision: preset.latestRevision },
      },
      'preset.fork',
    );
    res.status(201).json({ id } satisfies ForkedPreset);
  });

  router.delete('/api/presets/:id', async (req, res) => {
    const user = requireUser(req.user);
    const { preset } = await authorizePreset(db, user, req.params['id'], 'edit');
    if (!preset.deletedAt) {
      await db.transaction(async (tx) => {
        await tx.update(presets).set({ deletedAt: new Date() }).where(eq(presets.id, preset.id));
        await recordAudit(tx, {
          actorId: user.id,
          action: 'preset.delete',
          bandId: preset.bandId,
          presetId: preset.id,
        });
      });
    }
    res.status(204).end();
  });

  router.post('/api/presets/:id/untrash', async (req, res) => {
    const user = requireUser(req.user);
    const { preset } = await authorizePreset(db, user, req.params['id'], 'edit');
    if (preset.deletedAt && Date.now() - preset.deletedAt.getTime() > trashMs) {
      throw new HttpError(
        410,
        'expired',
        `This preset was deleted more than ${trashDays} days ago and cannot come back.`,
      );
    }
    if (preset.deletedAt) {
      await db.transaction(async (tx) => {
        await tx.update(presets).set({ deletedAt: null }).where(eq(presets.id, preset.id));
        await recordAudit(tx, {
          actorId: user.id,
          action: 'preset.untrash',
          bandId: preset.bandId,
          presetId: preset.id,
        });
      });
    }
    res.json({ id: preset.id, deletedAt: null } satisfies UntrashedPreset);
  });

  return router;
}
