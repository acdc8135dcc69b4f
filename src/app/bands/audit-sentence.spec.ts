import type { AuditAction } from '@shared/api/audit';
import { AuditNames, auditSentence } from './audit-sentence';
import { AuditEntry } from './bands-api';

const names: AuditNames = {
  presets: new Map([
    ['p1', 'Fen Fifths'],
    ['p2', 'Reed Organ Meantone'],
  ]),
  members: new Map([['u-tobias', 'Tobias Reed']]),
};

function entry(
  action: AuditAction,
  detail: Record<string, unknown> | null,
  presetId: string | null = 'p1',
): AuditEntry {
  return {
    id: 1,
    action,
    presetId,
    detail,
    createdAt: '2026-11-20T09:30:00Z',
    actorId: 'u-mira',
    actorLogin: 'mira-vale',
    actorName: 'Mira Vale',
  };
}

describe('auditSentence', () => {
  it('names who saved which revision of which preset', () => {
    expect(auditSentence(entry('preset.save', { revision: 3 }), names)).toBe(
      'Mira Vale saved revision 3 of Fen Fifths.',
    );
    expect(
      auditSentence(entry('preset.save', { revision: 4, note: 'Wolf on G sharp' }), names),
    ).toBe('Mira Vale saved revision 4 of Fen Fifths (“Wolf on G sharp”).');
  });

  it('tells a restore by the revision it brought back', () => {
    expect(
      auditSentence(entry('preset.restore', { revision: 5, note: 'Restored revision 2' }), names),
    ).toBe('Mira Vale brought back revision 2 of Fen Fifths as revision 5.');
  });

  it('names forks, the trash and share links', () => {
    expect(
      auditSentence(
        entry(
          'preset.fork',
          { name: 'Fen Fifths (mine)', forkedFrom: { id: 'p2', revision: 1 } },
          'p9',
        ),
        names,
      ),
    ).toBe('Mira Vale forked revision 1 of Reed Organ Meantone into Fen Fifths (mine).');
    expect(auditSentence(entry('preset.delete', null), names)).toBe(
      'Mira Vale moved Fen Fifths to the trash.',
    );
    expect(auditSentence(entry('preset.untrash', null), names)).toBe(
      'Mira Vale brought Fen Fifths back from the trash.',
    );
    expect(auditSentence(entry('share.create', { shareId: 's1', revision: 3 }), names)).toBe(
      'Mira Vale made a share link to Fen Fifths (revision 3 only).',
    );
    expect(auditSentence(entry('share.create', { shareId: 's1', revision: null }), names)).toBe(
      'Mira Vale made a share link to Fen Fifths.',
    );
  });

  it('names members and roles in plain words', () => {
    expect(
      auditSentence(
        entry('member.role', { userId: 'u-tobias', from: 'editor', to: 'owner' }, null),
        names,
      ),
    ).toBe('Mira Vale made Tobias Reed an owner.');
    expect(
      auditSentence(entry('member.remove', { userId: 'u-gone', role: 'viewer' }, null), names),
    ).toBe('Mira Vale removed a former member from the band.');
    expect(
      auditSentence(
        entry('invite.create', { email: 'tobias.reed@copperfen.example', role: 'editor' }, null),
        names,
      ),
    ).toBe('Mira Vale invited tobias.reed@copperfen.example as an editor.');
    expect(auditSentence(entry('invite.accept', { role: 'viewer' }, null), names)).toBe(
      'Mira Vale joined the band as a viewer.',
    );
    expect(auditSentence(entry('band.create', { name: 'Copper Fen' }, null), names)).toBe(
      'Mira Vale started the band Copper Fen.',
    );
  });

  it('names the setlist started, changed or deleted', () => {
    const friday = { setlistId: 's1', name: 'Friday', entries: 3 };
    expect(auditSentence(entry('setlist.create', friday, null), names)).toBe(
      'Mira Vale started the setlist Friday.',
    );
    expect(auditSentence(entry('setlist.change', friday, null), names)).toBe(
      'Mira Vale changed the setlist Friday.',
    );
    expect(
      auditSentence(entry('setlist.delete', { setlistId: 's1', name: 'Friday' }, null), names),
    ).toBe('Mira Vale deleted the setlist Friday.');
  });

  it('falls back to plain placeholders for what it cannot name', () => {
    const unknown = {
      ...entry('preset.delete', null, 'p-gone'),
      actorName: null,
      actorLogin: null,
    };
    expect(auditSentence(unknown, names)).toBe('A former member moved a preset to the trash.');
    // An action a newer server may record, which this app does not know yet.
    expect(auditSentence(entry('band.archive' as AuditAction, null, null), names)).toBe(
      'Mira Vale: band.archive.',
    );
  });
});
