import { and, eq } from 'drizzle-orm';
import { type RequestHandler, Router } from 'express';
import type {
  AcceptedInvite,
  CreatedInvite,
  InviteSummary,
  ResentInvite,
} from '../../shared/api/bands';
import { inviteRequest, parseRequest } from '../../shared/api/requests';
import { singleLine } from '../../shared/text/plain-text';
import type { Config } from '../config';
import type { Database } from '../db/client';
import { bands, invites, memberships, users } from '../db/schema';
import { HttpError, notFound } from '../http/errors';
import { valueOrThrow } from '../http/validation';
import { iso } from '../http/wire';
import type { Mailer } from '../mail/mailer';
import { recordAudit } from '../library/audit';
import { hashToken, newToken } from '../library/tokens';
import { authorizeBand, isId, requireUser } from '../policy/policy';

/** How long an invitation link works. */
const inviteDays = 7;
const roleWords = { owner: 'an owner', editor: 'an editor', viewer: 'a viewer' } as const;
type Role = keyof typeof roleWords;

/** The invitation mail; names people typed are put on one line, so that they cannot add lines of their own. */
function inviteMail(written: {
  to: string;
  bandName: string;
  inviter: string;
  role: Role;
  link: string;
  expiresAt: Date;
}) {
  const input = {
    ...written,
    bandName: singleLine(written.bandName),
    inviter: singleLine(written.inviter),
  };
  return {
    to: input.to,
    subject: `${input.inviter} invites you to the band ${input.bandName} on Keyloom`,
    text: [
      `${input.inviter} invites you to join the band ${input.bandName} on Keyloom as ${roleWords[input.role]}.`,
      '',
      `Open this link, sign in, and you are in the band's library:`,
      input.link,
      '',
      `The link works once and until ${input.expiresAt.toUTCString()}.`,
      'If you did not expect this, ignore this message: nothing happens unless the link is opened.',
    ].join('\n'),
  };
}

function inviteStatus(
  invite: typeof invites.$inferSelect,
): 'pending' | 'accepted' | 'revoked' | 'expired' {
  if (invite.acceptedAt) return 'accepted';
  if (invite.revokedAt) return 'revoked';
  return invite.expiresAt.getTime() < Date.now() ? 'expired' : 'pending';
}

export function invitesRouter(
  db: Database,
  config: Config,
  mailer: Mailer,
  limit: RequestHandler,
): Router {
  const router = Router();
  const link = (token: string) => `${config.publicUrl}/invites/${token}`;

  async function findInvite(bandId: string, inviteId: string) {
    const invite = isId(inviteId)
      ? await db.query.invites.findFirst({
          where: and(eq(invites.id, inviteId), eq(invites.bandId, bandId)),
        })
      : undefined;
    if (!invite) throw notFound('invite');
    return invite;
  }

  router.post('/api/bands/:id/invites', limit, async (req, res) => {
    const user = requireUser(req.user);
    const { band } = await authorizeBand(db, user, String(req.params['id']), 'owner');
    const { email, role } = valueOrThrow(parseRequest(inviteRequest, req.body));
    const { token, hash } = newToken();
    const expiresAt = new Date(Date.now() + inviteDays * 24 * 3600 * 1000);
    // The message goes out inside the transaction: when the mail server refuses it, no invite is left behind.
    const invite = await db.transaction(async (tx) => {
      const [row] = await tx
        .insert(invites)
        .values({ bandId: band.id, email, role, tokenHash: hash, invitedBy: user.id, expiresAt })
        .returning();
      await recordAudit(tx, {
        actorId: user.id,
        action: 'invite.create',
        bandId: band.id,
        detail: { inviteId: row.id, email, role },
      });
      await mailer.send(
        inviteMail({
          to: email,
          bandName: band.name,
          inviter: user.name ?? user.login,
          role,
          link: link(token),
          expiresAt,
        }),
      );
      return row;
    });
    res
      .status(201)
      .json({ id: invite.id, email, role, expiresAt: iso(expiresAt) } satisfies CreatedInvite);
  });

  router.post('/api/bands/:id/invites/:inviteId/resend', limit, async (req, res) => {
    const user = requireUser(req.user);
    const { band } = await authorizeBand(db, user, String(req.params['id']), 'owner');
    const invite = await findInvite(band.id, String(req.params['inviteId']));
    if (invite.acceptedAt || invite.revokedAt) {
      throw new HttpError(
        409,
        'not_pending',
        `This invite was already ${inviteStatus(invite)}; send a new one instead.`,
      );
    }
    // A fresh token: the link in the earlier message stops working.
    const { token, hash } = newToken();
    const expiresAt = new Date(Date.now() + inviteDays * 24 * 3600 * 1000);
    await db.transaction(async (tx) => {
      await tx.update(invites).set({ tokenHash: hash, expiresAt }).where(eq(invites.id, invite.id));
      await recordAudit(tx, {
        actorId: user.id,
        action: 'invite.resend',
        bandId: band.id,
        detail: { inviteId: invite.id, email: invite.email },
      });
      await mailer.send(
        inviteMail({
          to: invite.email,
          bandName: band.name,
          inviter: user.name ?? user.login,
          role: invite.role,
          link: link(token),
          expiresAt,
        }),
      );
    });
    res.json({ id: invite.id, expiresAt: iso(expiresAt) } satisfies ResentInvite);
  });

  router.delete('/api/bands/:id/invites/:inviteId', async (req, res) => {
    const user = requireUser(req.user);
    const { band } = await authorizeBand(db, user, String(req.params['id']), 'owner');
    const invite = await findInvite(band.id, String(req.params['inviteId']));
    if (!invite.revokedAt && !invite.acceptedAt) {
      await db.transaction(async (tx) => {
        await tx.update(invites).set({ revokedAt: new Date() }).where(eq(invites.id, invite.id));
        await recordAudit(tx, {
          actorId: user.id,
          action: 'invite.revoke',
          bandId: band.id,
          detail: { inviteId: invite.id, email: invite.email },
        });
      });
    }
    res.status(204).end();
  });

  /** What an invite link is for, so that its page can say so before asking for sign-in. */
  router.get('/api/invites/:token', limit, async (req, res) => {
    const [row] = await db
      .select({
        invite: invites,
        bandName: bands.name,
        inviterName: users.name,
        inviterLogin: users.login,
      })
      .from(invites)
      .innerJoin(bands, eq(bands.id, invites.bandId))
      .leftJoin(users, eq(users.id, invites.invitedBy))
      .where(eq(invites.tokenHash, hashToken(String(req.params['token']))));
    if (!row) throw notFound('invite');
    res.json({
      bandName: row.bandName,
      inviter: row.inviterName ?? row.inviterLogin,
      role: row.invite.role,
      email: row.invite.email,
      expiresAt: iso(row.invite.expiresAt),
      status: inviteStatus(row.invite),
    } satisfies InviteSummary);
  });

  router.post('/api/invites/:token/accept', limit, async (req, res) => {
    const user = requireUser(req.user);
    const result = await db.transaction(async (tx) => {
      const [invite] = await tx
        .select()
        .from(invites)
        .where(eq(invites.tokenHash, hashToken(String(req.params['token']))))
        .for('update');
      if (!invite) throw notFound('invite');
      const status = inviteStatus(invite);
      if (status !== 'pending')
        throw new HttpError(
          410,
          `invite_${status}`,
          `This invite was ${status}; ask the band's owner for a new one.`,
        );
      const [existing] = await tx
        .select({ role: memberships.role })
        .from(memberships)
        .where(and(eq(memberships.bandId, invite.bandId), eq(memberships.userId, user.id)));
      if (!existing)
        await tx
          .insert(memberships)
          .values({ bandId: invite.bandId, userId: user.id, role: invite.role });
      await tx
        .update(invites)
        .set({ acceptedAt: new Date(), acceptedBy: user.id })
        .where(eq(invites.id, invite.id));
      await recordAudit(tx, {
        actorId: user.id,
        action: 'invite.accept',
        bandId: invite.bandId,
        detail: { inviteId: invite.id, role: existing?.role ?? invite.role },
      });
      return {
        bandId: invite.bandId,
        role: existing?.role ?? invite.role,
        alreadyMember: Boolean(existing),
      };
    });
    res.json(result satisfies AcceptedInvite);
  });

  return router;
}
