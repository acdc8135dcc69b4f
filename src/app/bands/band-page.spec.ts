import { HttpTestingController } from '@angular/common/http/testing';
import { ChangeDetectionStrategy, Component } from '@angular/core';
import { TestBed } from '@angular/core/testing';
import { Router } from '@angular/router';
import { patientSpecMs, waitFor } from '../testing/wait-for';
import { Member } from '../auth/session';
import { PresetRow } from '../library/library-api';
import { BandPage } from './band-page';
import { AuditEntry, BandDetail, PendingInvite } from './bands-api';
import { PageTest } from '../testing/page-test';

const mira: Member = {
  id: 'u-mira',
  login: 'mira-vale',
  name: 'Mira Vale',
  email: null,
  avatarUrl: null,
  siteRole: 'member',
};
const tobias: Member = { ...mira, id: 'u-tobias', login: 'tobias-reed', name: 'Tobias Reed' };
const copperFen: BandDetail = {
  id: 'b-fen',
  name: 'Copper Fen',
  createdAt: '2026-11-01T10:00:00Z',
  role: 'owner',
  canManage: true,
  members: [
    {
      userId: 'u-mira',
      login: 'mira-vale',
      name: 'Mira Vale',
      avatarUrl: null,
      role: 'owner',
      joinedAt: '2026-11-01T10:00:00Z',
    },
    {
      userId: 'u-tobias',
      login: 'tobias-reed',
      name: 'Tobias Reed',
      avatarUrl: null,
      role: 'editor',
      joinedAt: '2026-11-03T10:00:00Z',
    },
  ],
};
const asEditor: BandDetail = { ...copperFen, role: 'editor', canManage: false };
const fenFifths: PresetRow = {
  id: 'p1',
  name: 'Fen Fifths',
  bandId: 'b-fen',
  bandName: 'Copper Fen',
  ownerId: 'u-mira',
  ownerLogin: 'mira-vale',
  revision: 3,
  updatedAt: '2026-11-20T09:30:00Z',
  deletedAt: null,
  access: 'own',
};
const pending: PendingInvite[] = [
  {
    id: 'i1',
    email: 'ada.quill@example.org',
    role: 'viewer',
    createdAt: '2026-11-20T10:00:00Z',
    expiresAt: '2026-11-27T10:00:00Z',
  },
];
const audit: AuditEntry[] = [
  {
    id: 2,
    action: 'preset.save',
    presetId: 'p1',
    detail: { revision: 3 },
    createdAt: '2026-11-20T09:30:00Z',
    actorId: 'u-mira',
    actorLogin: 'mira-vale',
    actorName: 'Mira Vale',
  },
  {
    id: 1,
    action: 'member.role',
    presetId: null,
    detail: { userId: 'u-tobias', from: 'viewer', to: 'editor' },
    createdAt: '2026-11-04T09:30:00Z',
    actorId: 'u-mira',
    actorLogin: 'mira-vale',
    actorName: 'Mira Vale',
  },
];

@Component({
  selector: 'app-bands-stub',
  template: 'bands',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
class BandsStub {}

describe('BandPage', () => {
  let http: HttpTestingController;
  let pages: PageTest;

  beforeEach(() => {
    pages = new PageTest([
      { path: 'bands/:id', component: BandPage },
      { path: 'bands', component: BandsStub },
    ]);
    http = pages.http;
  });

  afterEach(() => pages.verify());

  const page = () => pages.page();

  const settle = () => pages.settle();

  /**
   * Answers the band page's reads: the band, its presets and trash, and for owners its log and (on first load)
   * its pending invites.
   */
  async function answerBand(band: BandDetail, firstLoad = false) {
    http.expectOne('/api/bands/b-fen').flush(band);
    const presetReads = http.match((request) => request.url === '/api/presets');
    expect(presetReads.map((r) => r.request.params.get('bandId'))).toEqual(['b-fen', 'b-fen']);
    for (const read of presetReads) {
      const trash = read.request.params.get('trash') === '1';
      read.flush({ items: trash ? [] : [fenFifths], total: trash ? 0 : 1, page: 1, pageSize: 100 });
    }
    await settle();
    // The setlists are read once, when the band first shows (setlists/band-setlists.spec.ts).
    if (firstLoad) http.expectOne('/api/bands/b-fen/setlists').flush({ items: [] });
    if (band.canManage) {
      if (firstLoad) http.expectOne('/api/bands/b-fen/invites').flush({ items: pending });
      http.expectOne('/api/bands/b-fen/audit').flush({ items: audit });
      await settle();
    }
  }

  async function open(me: Member, band: BandDetail) {
    await pages.open('/bands/b-fen', me);
    await answerBand(band, true);
  }

  function button(within: ParentNode, label: string): HTMLButtonElement {
    return Array.from(within.querySelectorAll<HTMLButtonElement>('button')).find((b) =>
      b.textContent!.includes(label),
    )!;
  }

  async function confirmDialog(label: string) {
    await settle();
    button(document.querySelector('mat-dialog-container')!, label).click();
    await settle();
  }

  it('shows an owner the members, pending invites, presets and the log in plain words', async () => {
    await open(mira, copperFen);
    expect(page().querySelector('h1')!.textContent).toContain('Copper Fen');
    const members = Array.from(page().querySelectorAll('.members li'));
    expect(members[0].textContent).toContain('Mira Vale (you)');
    expect(members[1].querySelector('mat-select')!.getAttribute('aria-label')).toBe(
      'Role of Tobias Reed',
    );
    expect(
      members[1].querySelector('button[aria-label="Remove Tobias Reed from the band"]'),
    ).not.toBeNull();
    expect(members[0].querySelector('button[aria-label^="Remove"]')).toBeNull();
    expect(page().querySelector('.pending')!.textContent).toContain('ada.quill@example.org');
    expect(page().querySelector('.pending')!.textContent).toContain('as a viewer');
    const log = Array.from(page().querySelectorAll('.audit li span')).map((s) => s.textContent);
    expect(log).toEqual([
      'Mira Vale saved revision 3 of Fen Fifths.',
      'Mira Vale made Tobias Reed an editor.',
    ]);
    const library = Array.from(page().querySelectorAll<HTMLAnchorElement>('.presets a')).map((a) =>
      a.getAttribute('href'),
    );
    expect(library).toEqual(['/presets/p1', '/library?band=b-fen']);
  });

  it("lets an owner change a member's role", async () => {
    await open(mira, copperFen);
    page().querySelectorAll<HTMLElement>('.members mat-select')[1].click();
    await settle();
    Array.from(document.querySelectorAll<HTMLElement>('mat-option'))
      .find((o) => o.textContent!.includes('Owner'))!
      .click();
    await settle();
    const patch = http.expectOne('/api/bands/b-fen/members/u-tobias');
    expect(patch.request.method).toBe('PATCH');
    expect(patch.request.body).toEqual({ role: 'owner' });
    patch.flush({ userId: 'u-tobias', role: 'owner' });
    await settle();
    expect(await pages.snackBar()).toContain('Tobias Reed is now an owner.');
    await answerBand({
      ...copperFen,
      members: [copperFen.members[0], { ...copperFen.members[1], role: 'owner' }],
    });
    expect(page().querySelectorAll('.members mat-select')[1].textContent).toContain('Owner');
  });

  it('removes a member once the owner confirms', async () => {
    await open(mira, copperFen);
    page()
      .querySelector<HTMLButtonElement>('button[aria-label="Remove Tobias Reed from the band"]')!
      .click();
    await confirmDialog('Remove from band');
    const removal = http.expectOne('/api/bands/b-fen/members/u-tobias');
    expect(removal.request.method).toBe('DELETE');
    removal.flush(null, { status: 204, statusText: 'No Content' });
    await settle();
    await answerBand({ ...copperFen, members: [copperFen.members[0]] });
    expect(page().querySelectorAll('.members li').length).toBe(1);
  });

  it(
    "gives the last owner the server's reason when they try to leave",
    async () => {
      await open(mira, copperFen);
      button(page(), 'Leave band').click();
      await settle();
      expect(document.querySelector('mat-dialog-container')!.textContent).toContain(
        'Leave Copper Fen?',
      );
      await confirmDialog('Leave band');
      http.expectOne('/api/bands/b-fen/members/u-mira').flush(
        {
          error: {
            code: 'last_owner',
            message: 'A band always keeps at least one owner: make another member an owner first.',
          },
        },
        { status: 409, statusText: 'Conflict' },
      );
      await waitFor('the reason', () => page().querySelector('[role="alert"]'), settle);
      expect(
        page().querySelector('.members + [role="alert"], [role="alert"]')!.textContent,
      ).toContain('A band always keeps at least one owner');
      expect(TestBed.inject(Router).url).toBe('/bands/b-fen');
    },
    patientSpecMs,
  );

  it('shows an editor the roles as words, lets them leave, and hides invites and the log', async () => {
    await open(tobias, asEditor);
    expect(page().querySelector('.members mat-select')).toBeNull();
    expect(page().querySelector('.members .role-text')!.textContent).toContain('Owner');
    expect(page().querySelector('app-band-invites')).toBeNull();
    expect(page().querySelector('app-band-audit')).toBeNull();
    button(page(), 'Leave band').click();
    await confirmDialog('Leave band');
    http
      .expectOne('/api/bands/b-fen/members/u-tobias')
      .flush(null, { status: 204, statusText: 'No Content' });
    await settle();
    expect(TestBed.inject(Router).url).toBe('/bands');
  });

  it('checks the e-mail address before sending an invite, then sends it with the role', async () => {
    await open(mira, copperFen);
    const email = page().querySelector<HTMLInputElement>('input[formcontrolname="email"]')!;
    email.value = 'not an address';
    email.dispatchEvent(new Event('input'));
    button(page(), 'Send invite').click();
    await settle();
    expect(page().querySelector('.invite mat-error')!.textContent).toContain(
      'This must be an e-mail address.',
    );
    http.expectNone('/api/bands/b-fen/invites');

    email.value = 'ada.quill@example.org';
    email.dispatchEvent(new Event('input'));
    button(page(), 'Send invite').click();
    await settle();
    const invite = http.expectOne('/api/bands/b-fen/invites');
    expect(invite.request.method).toBe('POST');
    expect(invite.request.body).toEqual({ email: 'ada.quill@example.org', role: 'editor' });
    invite.flush({ id: 'i2' }, { status: 201, statusText: 'Created' });
    await settle();
    expect(await pages.snackBar()).toContain('Invite sent to ada.quill@example.org.');
    http.expectOne('/api/bands/b-fen/invites').flush({ items: pending });
  });

  it('sends a pending invite again and revokes it', async () => {
    await open(mira, copperFen);
    page()
      .querySelector<HTMLButtonElement>(
        'button[aria-label="Send the invite to ada.quill@example.org again"]',
      )!
      .click();
    const resend = http.expectOne('/api/bands/b-fen/invites/i1/resend');
    expect(resend.request.method).toBe('POST');
    resend.flush({ id: 'i1' });
    await settle();
    http.expectOne('/api/bands/b-fen/invites').flush({ items: pending });
    await settle();
    page()
      .querySelector<HTMLButtonElement>(
        'button[aria-label="Revoke the invite to ada.quill@example.org"]',
      )!
      .click();
    const revoke = http.expectOne('/api/bands/b-fen/invites/i1');
    expect(revoke.request.method).toBe('DELETE');
    revoke.flush(null, { status: 204, statusText: 'No Content' });
    await settle();
    http.expectOne('/api/bands/b-fen/invites').flush({ items: [] });
    await settle();
    expect(page().querySelector('.pending')!.textContent).toContain('No invites are waiting.');
  });

  it('says so when the band cannot be seen', async () => {
    await pages.open('/bands/b-fen', mira);
    http
      .expectOne('/api/bands/b-fen')
      .flush(
        { error: { code: 'not_found', message: 'No such band.' } },
        { status: 404, statusText: 'Not Found' },
      );
    http.match((request) => request.url === '/api/presets');
    await settle();
    expect(page().querySelector('[role="alert"]')!.textContent).toContain(
      'There is no such band, or you are not in it.',
    );
  });
});
