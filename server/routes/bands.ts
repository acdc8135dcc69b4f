import { and, asc, count, desc, eq, gt, isNull } from 'drizzle-orm';
import { Router } from 'express';
import type { AuditEntry } from '../../shared/api/audit';
import type {
  BandDetail,
  BandSummary,
  ChangedRole,
  CreatedBand,
  PendingInvite,
  RenamedBand,
} from '../../shared/api/bands';
import { bandNameRequest, memberRoleRequest, parseRequest } from '../../shared/api/requests';
import type { ItemList } from '../../shared/api/wire';
import type { Database } from '../db/client';
import { auditLog, bands, invites, memberships, users } from '../db/schema';
import { HttpError, notFound } from '../http/errors';
import { iso } from '../http/wire';
import { valueOrThrow } from '../http/validation';
import { recordAudit, type Writer } from '../library/audit';
import { authorizeBand, isId, requireUser } from '../policy/policy';

async function ownerCount(writer: Writer, bandId: string): Promise<number> {
  const [row] = await writer
    .select({ n: count() })
    .from(memberships)
    .where(and(eq(memberships.bandId, bandId), eq(memberships.role, 'owner')));
  return row.n;
}

const lastOwner = () =>
  new HttpError(
    409,
    'last_owner',
    'A band always keeps at least one owner: make another member an owner first.',
  );

export function bandsRouter(db: Database): Router {
  const router = Router();

  router.post('/api/bands', async (req, res) => {
    const user = requireUser(req.user);
    const { name } = valueOrThrow(parseRequest(bandNameRequest, req.body));
    const id = await db.transaction(async (tx) => {
      const [band] = await tx
        .insert(bands)
        .values({ name, createdBy: user.id })
        .returning({ id: bands.id });
      await tx.insert(memberships).values({ bandId: band.id, userId: user.id, role: 'owner' });
      await recordAudit(tx, {
        actorId: user.id,
        action: 'band.create',
        bandId: band.id,
        detail: { name },
      });
      return band.id;
    });
    res.status(201).json({ id, name, role: 'owner' } satisfies CreatedBand);
  });

  router.get('/api/bands', async (req, res) => {
    const user = requireUser(req.user);
    const rows = await db
      .select({
        id: bands.id,
        name: bands.name,
        role: memberships.role,
        createdAt: bands.createdAt,
      })
      .from(memberships)
      .innerJoin(bands, eq(bands.id, memberships.bandId))
      .where(eq(memberships.userId, user.id))
      .orderBy(asc(bands.name));
    res.json({
      items: rows.map((row) => ({ ...row, createdAt: iso(row.createdAt) })),
    } satisfies ItemList<BandSummary>);
  });

  router.get('/api/bands/:id', async (req, res) => {
    const { band, role, access } = await authorizeBand(db, req.user, req.params['id'], 'member');
    const members = await db
      .select({
        userId: users.id,
        login: users.login,
        name: users.name,
        avatarUrl: users.avatarUrl,
        role: memberships.role,
        joinedAt: memberships.createdAt,
      })
      .from(memberships)
      .innerJoin(users, eq(users.id, memberships.userId))
      .where(eq(memberships.bandId, band.id))
      .orderBy(asc(users.login));
    res.json({
      id: band.id,
      name: band.name,
      createdAt: iso(band.createdAt),
      role,
      canManage: access === 'owner',
      members: members.map((member) => ({ ...member, joinedAt: iso(member.joinedAt) })),
    } satisfies BandDetail);
  });

  router.patch('/api/bands/:id', async (req, res) => {
    const user = requireUser(req.user);
    const { band } = await authorizeBand(db, user, req.params['id'], 'owner');
    const { name } = valueOrThrow(parseRequest(bandNameRequest, req.body));
    await db.transaction(async (tx) => {
      await tx.update(bands).set({ name }).where(eq(bands.id, band.id));
      await recordAudit(tx, {
        actorId: user.id,
        action: 'band.rename',
        bandId: band.id,
        detail: { from: band.name, to: name },
      });
    });
    res.json({ id: band.id, name } satisfies RenamedBand);
  });

  router.patch('/api/bands/:id/members/:userId', async (req, res) => {
    const user = requireUser(req.user);
    const { band } = await authorizeBand(db, user, req.params['id'], 'owner');
    const { role } = valueOrThrow(parseRequest(memberRoleRequest, req.body));
    const memberId = req.params['userId'];
    await db.transaction(async (tx) => {
      const [member] = isId(memberId)
        ? await tx
            .select()
            .from(memberships)
            .where(and(eq(memberships.bandId, band.id), eq(memberships.userId, memberId)))
            .for('update')
        : [];
      if (!member) throw notFound('member');
      if (member.role === 'owner' && role !== 'owner' && (await ownerCount(tx, band.id)) <= 1)
        throw lastOwner();
      await tx
        .update(memberships)
        .set({ role })
        .where(and(eq(memberships.bandId, band.id), eq(memberships.userId, memberId)));
      await recordAudit(tx, {
        actorId: user.id,
        action: 'member.role',
        bandId: band.id,
        detail: { userId: memberId, from: member.role, to: role },
      });
    });
    res.json({ userId: memberId, role } satisfies ChangedRole);
  });

  /** Owners remove members; any member removes themself (leaves). */
  router.delete('/api/bands/:id/members/:userId', async (req, res) => {
    const user = requireUser(req.user);
    const memberId = req.params['userId'];
    const leaving = memberId === user.id;
    const { band } = await authorizeBand(db, user, req.params['id'], leaving ? 'member' : 'owner');
    await db.transaction(async (tx) => {
      // Lock the band's owner rows so that two owners leaving together cannot both go.
      await tx
        .select()
        .from(memberships)
        .where(and(eq(memberships.bandId, band.id), eq(memberships.role, 'owner')))
        .for('update');
      const [member] = isId(memberId)
        ? await tx
            .select()
            .from(memberships)
            .where(and(eq(memberships.bandId, band.id), eq(memberships.userId, memberId)))
        : [];
      if (!member) throw notFound('member');
      if (member.role === 'owner' && (await ownerCount(tx, band.id)) <= 1) throw lastOwner();
      await tx
        .delete(memberships)
        .where(and(eq(memberships.bandId, band.id), eq(memberships.userId, memberId)));
      await recordAudit(tx, {
        actorId: user.id,
        action: leaving ? 'member.leave' : 'member.remove',
        bandId: band.id,
        detail: { userId: memberId, role: member.role },
      });
    });
    res.status(204).end();
  });

  router.get('/api/bands/:id/audit', async (req, res) => {
    const { band } = await authorizeBand(db, req.user, req.params['id'], 'owner');
    const rows = await db
      .select({
        id: auditLog.id,
        action: auditLog.action,
        presetId: auditLog.presetId,
        detail: auditLog.detail,
        createdAt: auditLog.createdAt,
        actorId: auditLog.actorId,
        actorLogin: users.login,
        actorName: users.name,
      })
      .from(auditLog)
      .leftJoin(users, eq(users.id, auditLog.actorId))
      .where(eq(auditLog.bandId, band.id))
      .orderBy(desc(auditLog.id))
      .limit(200);
    res.json({
      items: rows.map((row) => ({ ...row, createdAt: iso(row.createdAt) })),
    } satisfies ItemList<AuditEntry>);
  });

  router.get('/api/bands/:id/invites', async (req, res) => {
    const { band } = await authorizeBand(db, req.user, req.params['id'], 'owner');
    const rows = await db
      .select({
        id: invites.id,
        email: invites.email,
        role: invites.role,
        createdAt: invites.createdAt,
        expiresAt: invites.expiresAt,
      })
      .from(invites)
      .where(
        and(
          eq(invites.bandId, band.id),
          isNull(invites.acceptedAt),
          isNull(invites.revokedAt),
          gt(invites.expiresAt, new Date()),
        ),
      )
      .orderBy(desc(invites.createdAt));
    const items = rows.map((row) => ({
      ...row,
      createdAt: iso(row.createdAt),
      expiresAt: iso(row.expiresAt),
    }));
    res.json({ items } satisfies ItemList<PendingInvite>);
  });

  return router;
}
