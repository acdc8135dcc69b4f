import { AuditEntry, BandRole, roleWithArticle } from './bands-api';

/** Names the audit log refers to by id: the band's presets and its members. */
export interface AuditNames {
  presets: ReadonlyMap<string, string>;
  members: ReadonlyMap<string, string>;
}

const text = (value: unknown): string | null => (typeof value === 'string' && value ? value : null);
const role = (value: unknown): string =>
  typeof value === 'string' && value in roleWithArticle
    ? roleWithArticle[value as BandRole]
    : 'a member';

/** One entry of a band's audit log in plain words: "Mira Vale saved revision 3 of Fen Fifths." */
export function auditSentence(entry: AuditEntry, names: AuditNames): string {
  const actor = entry.actorName ?? entry.actorLogin ?? 'A former member';
  const detail = entry.detail ?? {};
  const preset =
    (entry.presetId && names.presets.get(entry.presetId)) ?? text(detail['name']) ?? 'a preset';
  const member = names.members.get(String(detail['userId'])) ?? 'a former member';
  const email = text(detail['email']) ?? 'someone';
  const revision = detail['revision'];
  const setlist = text(detail['name']) ?? 'a setlist';
  switch (entry.action) {
    case 'band.create':
      return `${actor} started the band${text(detail['name']) ? ` ${detail['name']}` : ''}.`;
    case 'band.rename':
      return `${actor} renamed the band from ${text(detail['from'])} to ${text(detail['to'])}.`;
    case 'invite.create':
      return `${actor} invited ${email} as ${role(detail['role'])}.`;
    case 'invite.resend':
      return `${actor} sent the invite to ${email} again.`;
    case 'invite.revoke':
      return `${actor} withdrew the invite to ${email}.`;
    case 'invite.accept':
      return `${actor} joined the band as ${role(detail['role'])}.`;
    case 'member.role':
      return `${actor} made ${member} ${role(detail['to'])}.`;
    case 'member.remove':
      return `${actor} removed ${member} from the band.`;
    case 'member.leave':
      return `${actor} left the band.`;
    case 'preset.create':
      return `${actor} saved a new preset, ${preset}.`;
    case 'preset.fork': {
      const from = detail['forkedFrom'] as { id?: string; revision?: number } | undefined;
      const original = (from?.id && names.presets.get(from.id)) || 'another preset';
      return `${actor} forked revision ${from?.revision ?? '?'} of ${original} into ${preset}.`;
    }
    case 'preset.save': {
      const note = text(detail['note']);
      return `${actor} saved revision ${revision} of ${preset}${note ? ` (“${note}”)` : ''}.`;
    }
    case 'preset.restore': {
      const old = /(\d+)/.exec(text(detail['note']) ?? '')?.[1];
      return old
        ? `${actor} brought back revision ${old} of ${preset} as revision ${revision}.`
        : `${actor} brought back an earlier revision of ${preset} as revision ${revision}.`;
    }
    case 'preset.delete':
      return `${actor} moved ${preset} to the trash.`;
    case 'preset.untrash':
      return `${actor} brought ${preset} back from the trash.`;
    case 'share.create': {
      const pinned = typeof revision === 'number' ? ` (revision ${revision} only)` : '';
      return `${actor} made a share link to ${preset}${pinned}.`;
    }
    case 'share.revoke':
      return `${actor} revoked a share link to ${preset}.`;
    case 'setlist.create':
      return `${actor} started the setlist ${setlist}.`;
    case 'setlist.change':
      return `${actor} changed the setlist ${setlist}.`;
    case 'setlist.delete':
      return `${actor} deleted the setlist ${setlist}.`;
    default:
      return `${actor}: ${entry.action}.`;
  }
}
