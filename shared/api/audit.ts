// The band's audit log: every action the server records, declared once.
import type { Timestamp } from './wire';

export const auditActions = [
  'band.create',
  'band.rename',
  'invite.create',
  'invite.resend',
  'invite.revoke',
  'invite.accept',
  'member.role',
  'member.remove',
  'member.leave',
  'preset.create',
  'preset.fork',
  'preset.save',
  'preset.restore',
  'preset.delete',
  'preset.untrash',
  'share.create',
  'share.revoke',
  'setlist.create',
  'setlist.change',
  'setlist.delete',
] as const;
export type AuditAction = (typeof auditActions)[number];

/** One entry of `GET /api/bands/:id/audit`. */
export interface AuditEntry {
  id: number;
  action: AuditAction;
  presetId: string | null;
  detail: Record<string, unknown> | null;
  createdAt: Timestamp;
  actorId: string | null;
  actorLogin: string | null;
  actorName: string | null;
}
