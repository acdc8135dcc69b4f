// The answers of the band routes (/api/bands..., /api/invites...).
import type { BandRole } from './roles';
import type { Timestamp } from './wire';

/** One row of `GET /api/bands`: a band the caller belongs to, with their role. */
export interface BandSummary {
  id: string;
  name: string;
  role: BandRole;
  createdAt: Timestamp;
}

/** `POST /api/bands` (201). */
export interface CreatedBand {
  id: string;
  name: string;
  role: 'owner';
}

/** `PATCH /api/bands/:id`. */
export interface RenamedBand {
  id: string;
  name: string;
}

export interface BandMember {
  userId: string;
  login: string;
  name: string | null;
  avatarUrl: string | null;
  role: BandRole;
  joinedAt: Timestamp;
}

/** `GET /api/bands/:id`. */
export interface BandDetail {
  id: string;
  name: string;
  createdAt: Timestamp;
  role: BandRole | null;
  canManage: boolean;
  members: BandMember[];
}

/** `PATCH /api/bands/:id/members/:userId`. */
export interface ChangedRole {
  userId: string;
  role: BandRole;
}

/** One row of `GET /api/bands/:id/invites`: an invite not yet accepted, withdrawn or expired. */
export interface PendingInvite {
  id: string;
  email: string;
  role: BandRole;
  createdAt: Timestamp;
  expiresAt: Timestamp;
}

/** `POST /api/bands/:id/invites` (201). */
export interface CreatedInvite {
  id: string;
  email: string;
  role: BandRole;
  expiresAt: Timestamp;
}

/** `POST /api/bands/:id/invites/:inviteId/resend`. */
export interface ResentInvite {
  id: string;
  expiresAt: Timestamp;
}

export const inviteStatuses = ['pending', 'accepted', 'revoked', 'expired'] as const;
export type InviteStatus = (typeof inviteStatuses)[number];

/** `GET /api/invites/:token`: what an invite link is for, before sign-in. */
export interface InviteSummary {
  bandName: string;
  inviter: string | null;
  role: BandRole;
  email: string;
  expiresAt: Timestamp;
  status: InviteStatus;
}

/** `POST /api/invites/:token/accept`. */
export interface AcceptedInvite {
  bandId: string;
  role: BandRole;
  alreadyMember: boolean;
}
