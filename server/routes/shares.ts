import { and, desc, eq, isNull, sql } from 'drizzle-orm';
import { createHash } from 'node:crypto';
import { Router } from 'express';
import { createShareRequest, parseRequest } from '../../shared/api/requests';
import type { NewShareLink, ShareLink, SharedPreset } from '../../shared/api/shares';
import type { ItemList } from '../../shared/api/wire';
import type { Config } from '../config';
import type { Database } from '../db/client';
import { presetRevisions, presets, shareLinks } from '../db/schema';
import { HttpError, notFound } from '../http/errors';
import { valueOrThrow } from '../http/validation';
import { iso } from '../http/wire';
import { recordAudit } from '../library/audit';
import { hashToken, newToken } from '../library/tokens';
import { authorizePreset, isId, requireUser } from '../policy/policy';

/** The one query behind a link: the link, its preset and the revision it opens, joined; prepared once per pool. */
function shareQuery(db: Database) {
  return db
    .select({
      shareId: shareLinks.id,
      pinned: shareLinks.revision,
      revision: presetRevisions.revision,
      document: presetRevisions.document,
      createdAt: presetRevisions.createdAt,
    })
    .from(shareLinks)
    .innerJoin(presets, and(eq(presets.id, shareLinks.presetId), isNull(presets.deletedAt)))
    .innerJoin(
      presetRevisions,
      and(
        eq(presetRevisions.presetId, shareLinks.presetId),
        eq(
          presetRevisions.revision,
          sql`coalesce(${shareLinks.revision}, ${presets.latestRevision})`,
        ),
      ),
    )
    .where(and(eq(shareLinks.tokenHash, sql.placeholder('hash')), isNull(shareLinks.revokedAt)))
    .prepare('share_link_by_token');
}

const preparedShareQueries = new WeakMap<Database, ReturnType<typeof shareQuery>>();

interface SharedRevision {
  shareId: string;
  /** The revision the link is pinned to; null when it follows the latest. */
  pinned: number | null;
  revision: number;
  document: unknown;
  createdAt: Date;
}

/**
 * The preset revision a share link opens, in one query, or 404 when the link is unknown, revoked, or its preset
 * in the trash or deleted.
 */
export async function resolveShareToken(db: Database, token: string): Promise<SharedRevision> {
  let query = preparedShareQueries.get(db);
  if (!query) {
    query = shareQuery(db);
    preparedShareQueries.set(db, query);
  }
  const [found] = await query.execute({ hash: hashToken(token) });
  if (!found) throw notFound('shared preset');
  return found;
}

/** Bumped when the answer's shape changes, so that a cached answer of the old shape is not revalidated. */
const sharedAnswerVersion = 1;

/**
 * How long a cache may keep the answer of a link pinned to a revision before asking again. The revision never
 * changes, but the link can be revoked and its preset trashed: for at most this long a cache that already holds the
 * answer keeps showing it. Links that follow the latest revision are revalidated on every use instead.
 */
export const pinnedLinkMaxAgeSeconds = 300;

/**
 * `GET /api/shared/:token`, what a posted link opens. It reads no session and sets no cookie (app.ts mounts it
 * before the session), so a burst of strangers clicking a link costs one query each and a cache may keep the
 * answer: a strong ETag made from the link and the revision (never by hashing the body), `public` with
 * `max-age` for a pinned link, `no-cache` (revalidated each time) for one that follows the latest revision, and
 * 304 for an If-None-Match that still matches.
 */
export function sharedLinkRouter(db: Database): Router {
  return Router().get('/api/shared/:token', async (req, res) => {
    const shared = await resolveShareToken(db, req.params['token']);
    const tag = createHash('sha256')
      .update(`${sharedAnswerVersion}:${shared.shareId}:${shared.revision}`)
      .digest('base64url')
      .slice(0, 27);
    res.setHeader('ETag', `"${tag}"`);
    res.setHeader(
      'Cache-Control',
      shared.pinned === null
        ? 'public, no-cache'
        : `public, max-age=${pinnedLinkMaxAgeSeconds}, must-revalidate`,
    );
    if (req.fresh) {
      res.status(304).end();
      return;
    }
    res.json({
      // The revision's own name: a link pinned to revision 1 shows nothing of what came later.
      name: (shared.document as { name: string }).name,
      revision: shared.revision,
      pinned: shared.pinned !== null,
      savedAt: iso(shared.createdAt),
      document: shared.document,
    } satisfies SharedPreset);
  });
}

export function sharesRouter(db: Database, config: Config): Router {
  const router = Router();

  router.post('/api/presets/:id/shares', async (req, res) => {
    const user = requireUser(req.user);
    const { preset } = await authorizePreset(db, user, req.params['id'], 'edit');
    const body = valueOrThrow(parseRequest(createShareRequest, req.body));
    if (body.revision !== undefined && body.revision > preset.latestRevision) {
      throw new HttpError(
        400,
        'invalid',
        `revision: this preset has revisions 1 to ${preset.latestRevision}.`,
        'revision',
      );
    }
    const { token, hash } = newToken();
    const share = await db.transaction(async (tx) => {
      const [row] = await tx
        .insert(shareLinks)
        .values({
          presetId: preset.id,
          revision: body.revision ?? null,
          tokenHash: hash,
          createdBy: user.id,
        })
        .returning({ id: shareLinks.id });
      await recordAudit(tx, {
        actorId: user.id,
        action: 'share.create',
        bandId: preset.bandId,
        presetId: preset.id,
        detail: { shareId: row.id, revision: body.revision ?? null },
      });
      return row;
    });
    const url = `${config.publicUrl}/s/${token}`;
    res
      .status(201)
      .json({ id: share.id, token, url, revision: body.revision ?? null } satisfies NewShareLink);
  });

  router.get('/api/presets/:id/shares', async (req, res) => {
    const { preset } = await authorizePreset(db, req.user, req.params['id'], 'edit');
    const rows = await db
      .select({
        id: shareLinks.id,
        revision: shareLinks.revision,
        createdAt: shareLinks.createdAt,
        revokedAt: shareLinks.revokedAt,
        createdBy: shareLinks.createdBy,
      })
      .from(shareLinks)
      .where(eq(shareLinks.presetId, preset.id))
      .orderBy(desc(shareLinks.createdAt));
    const items = rows.map((row) => ({
      ...row,
      createdAt: iso(row.createdAt),
      revokedAt: iso(row.revokedAt),
    }));
    res.json({ items } satisfies ItemList<ShareLink>);
  });

  router.delete('/api/shares/:id', async (req, res) => {
    const user = requireUser(req.user);
    const id = req.params['id'];
    const share = isId(id)
      ? await db.query.shareLinks.findFirst({ where: eq(shareLinks.id, id) })
      : undefined;
    if (!share) throw notFound('share link');
    // Another preset's link answers as an unknown one does, so that share ids cannot be probed.
    const { preset } = await authorizePreset(db, user, share.presetId, 'edit').catch(
      (error: unknown) => {
        throw error instanceof HttpError && error.status === 404 ? notFound('share link') : error;
      },
    );
    if (!share.revokedAt) {
      await db.transaction(async (tx) => {
        await tx
          .update(shareLinks)
          .set({ revokedAt: new Date() })
          .where(eq(shareLinks.id, share.id));
        await recordAudit(tx, {
          actorId: user.id,
          action: 'share.revoke',
          bandId: preset.bandId,
          presetId: preset.id,
          detail: { shareId: share.id },
        });
      });
    }
    res.status(204).end();
  });

  return router;
}
