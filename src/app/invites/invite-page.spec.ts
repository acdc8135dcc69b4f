import { HttpTestingController } from '@angular/common/http/testing';
import { ChangeDetectionStrategy, Component } from '@angular/core';
import { TestBed } from '@angular/core/testing';
import { Router } from '@angular/router';
import { Member } from '../auth/session';
import { InviteSummary } from './invite-api';
import { InvitePage } from './invite-page';
import { PageTest } from '../testing/page-test';

const ada: Member = {
  id: 'u-ada',
  login: 'ada-quill',
  name: 'Ada Quill',
  email: null,
  avatarUrl: null,
  siteRole: 'member',
};
const invite: InviteSummary = {
  bandName: 'Copper Fen',
  inviter: 'Mira Vale',
  role: 'editor',
  email: 'ada.quill@example.org',
  expiresAt: '2026-11-27T10:00:00Z',
  status: 'pending',
};

@Component({
  selector: 'app-band-stub',
  template: 'band',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
class BandStub {}

describe('InvitePage', () => {
  let http: HttpTestingController;
  let pages: PageTest;

  beforeEach(() => {
    pages = new PageTest([
      { path: 'invites/:token', component: InvitePage },
      { path: 'bands/:id', component: BandStub },
    ]);
    http = pages.http;
  });

  afterEach(() => pages.verify());

  const page = () => pages.page();

  const settle = () => pages.settle();

  async function open(member: Member | null, answer: InviteSummary = invite) {
    await pages.open('/invites/tok-abc', member);
    http.expectOne('/api/invites/tok-abc').flush(answer);
    await settle();
  }

  it('says who invites me to which band and in what role', async () => {
    await open(null);
    expect(page().querySelector('h1')!.textContent).toContain('Join Copper Fen');
    expect(page().querySelector('.what')!.textContent!.replace(/\s+/g, ' ')).toContain(
      'Mira Vale invites you to the band Copper Fen on Keyloom as an editor.',
    );
  });

  it('shows "Sign in to join" to a signed-out visitor, coming back to this invite', async () => {
    await open(null);
    const link = page().querySelector<HTMLAnchorElement>('a.sign-in-link')!;
    expect(link.textContent).toContain('Sign in to join');
    expect(link.getAttribute('href')).toBe('/auth/github?next=%2Finvites%2Ftok-abc');
    expect(page().querySelector('button.join')).toBeNull();
  });

  it('accepts when the signed-in member presses Join, then opens the band', async () => {
    await open(ada);
    const join = page().querySelector<HTMLButtonElement>('button.join')!;
    expect(join.textContent).toContain('Join Copper Fen');
    join.click();
    const accept = http.expectOne('/api/invites/tok-abc/accept');
    expect(accept.request.method).toBe('POST');
    accept.flush({ bandId: 'b-fen', role: 'editor', alreadyMember: false });
    await settle();
    expect(TestBed.inject(Router).url).toBe('/bands/b-fen');
  });

  it("shows the server's message when the invite can no longer be accepted", async () => {
    await open(ada);
    page().querySelector<HTMLButtonElement>('button.join')!.click();
    http.expectOne('/api/invites/tok-abc/accept').flush(
      {
        error: {
          code: 'invite_revoked',
          message: "This invite was revoked; ask the band's owner for a new one.",
        },
      },
      { status: 410, statusText: 'Gone' },
    );
    await settle();
    expect(page().querySelector('[role="alert"]')!.textContent).toContain(
      'This invite was revoked',
    );
    expect(TestBed.inject(Router).url).toBe('/invites/tok-abc');
  });

  for (const [status, words] of [
    ['accepted', 'already been used'],
    ['revoked', 'Mira Vale withdrew this invite'],
    ['expired', 'This invite ran out on'],
  ] as const) {
    it(`explains an invite that was ${status}, with nothing to press`, async () => {
      await open(ada, { ...invite, status });
      expect(page().querySelector('[role="status"]')!.textContent).toContain(words);
      expect(page().querySelector('button.join')).toBeNull();
      expect(page().querySelector('a.sign-in-link')).toBeNull();
    });
  }

  it('says when the invite link is not known', async () => {
    await pages.open('/invites/tok-abc', null);
    http
      .expectOne('/api/invites/tok-abc')
      .flush(
        { error: { code: 'not_found', message: 'No such invite.' } },
        { status: 404, statusText: 'Not Found' },
      );
    await settle();
    expect(page().querySelector('h1')!.textContent).toContain('This invite does not work');
    expect(page().querySelector('[role="alert"]')!.textContent).toContain(
      'This invite link is not known',
    );
  });
});
