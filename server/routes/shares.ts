import { and, desc, eq, isNull } from 'drizzle-orm';
import { Router } from 'express';
import { createShareRequest, parseRequest } from '../../shared/api/requests';
import type { NewShareLink, ShareLink, SharedPreset } from '../../shared/api/shares';
import type { ItemList } from '../../shared/api/wire';
import type { Config } from '../config';
import type { Database } from '../db/client';
import { presets, shareLinks } from '../db/schema';
import { HttpError, notFound } from '../http/errors';
import { valueOrThrow } from '../http/validation';
import { iso } from '../http/wire';
import { recordAudit } from '../library/audit';
import { readRevision } from '../library/revisions';
import { hashToken, newToken } from '../library/tokens';
import { authorizePreset, isId, requireUser } from '../policy/policy';

/** The preset revision a share link opens, or 404 when the link is unknown, revoked or its preset deleted. */
export async function resolveShareToken(db: Database, token: string) {
  const [share] = await db
    .select()
    .from(shareLinks)
    .where(and(eq(shareLinks.tokenHash, hashToken(token)), isNull(shareLinks.revokedAt)));
  const preset =
    share && (await db.query.presets.findFirst({ where: eq(presets.id, share.presetId) }));
  if (!share || !preset || preset.deletedAt) throw notFound('shared preset');
  const revision = await readRevision(db, preset.id, share.revision ?? preset.latestRevision);
  return { share, preset, revision };
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

  router.get('/api/shared/:token', async (req, res) => {
    const { share, revision } = await resolveShareToken(db, req.params['token']);
    res.json({
      // The revision's own name: a link pinned to revision 1 shows nothing of what came later.
      name: (revision.document as { name: string }).name,
      revision: revision.revision,
      pinned: share.revision !== null,
      savedAt: iso(revision.createdAt),
      document: revision.document,
    } satisfies SharedPreset);
  });

  return router;
}
