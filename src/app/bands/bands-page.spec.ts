import { HttpTestingController } from '@angular/common/http/testing';
import { ChangeDetectionStrategy, Component } from '@angular/core';
import { TestBed } from '@angular/core/testing';
import { Router } from '@angular/router';
import { Member } from '../auth/session';
import { BandsPage } from './bands-page';
import { PageTest } from '../testing/page-test';

const mira: Member = {
  id: 'u-mira',
  login: 'mira-vale',
  name: 'Mira Vale',
  email: null,
  avatarUrl: null,
  siteRole: 'member',
};

@Component({
  template: 'band',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
class BandStub {}

describe('BandsPage', () => {
  let http: HttpTestingController;
  let pages: PageTest;

  beforeEach(() => {
    pages = new PageTest([
      { path: 'bands', component: BandsPage },
      { path: 'bands/:id', component: BandStub },
    ]);
    http = pages.http;
  });

  afterEach(() => pages.verify());

  const page = () => pages.page();

  const settle = () => pages.settle();

  async function open(member: Member | null) {
    await pages.open('/bands', member);
  }

  async function typeName(name: string) {
    const input = page().querySelector<HTMLInputElement>('input[formcontrolname="name"]')!;
    input.value = name;
    input.dispatchEvent(new Event('input'));
    await settle();
  }

  function submit() {
    page().querySelector<HTMLButtonElement>('form.create button[type="submit"]')!.click();
  }

  it('asks a signed-out visitor to sign in', async () => {
    await open(null);
    expect(page().querySelector('a.sign-in-link')!.getAttribute('href')).toBe(
      '/auth/github?next=%2Fbands',
    );
  });

  it('lists my bands with my role in each, linking to the band', async () => {
    await open(mira);
    http.expectOne('/api/bands').flush({
      items: [
        { id: 'b-fen', name: 'Copper Fen', role: 'owner', createdAt: '2026-11-01T10:00:00Z' },
        { id: 'b-reed', name: 'Reed Hollow', role: 'viewer', createdAt: '2026-11-02T10:00:00Z' },
      ],
    });
    await settle();
    const links = Array.from(page().querySelectorAll<HTMLAnchorElement>('.bands a'));
    expect(links.map((a) => a.getAttribute('href'))).toEqual(['/bands/b-fen', '/bands/b-reed']);
    expect(links[0].textContent).toContain('Copper Fen');
    expect(links[0].textContent).toContain('You are an owner');
    expect(links[1].textContent).toContain('You are a viewer');
  });

  it('says so when I am in no band', async () => {
    await open(mira);
    http.expectOne('/api/bands').flush({ items: [] });
    await settle();
    expect(page().textContent).toContain('You are in no band yet');
  });

  it('refuses an empty band name without asking the server', async () => {
    await open(mira);
    http.expectOne('/api/bands').flush({ items: [] });
    await typeName('   ');
    submit();
    await settle();
    http.expectNone('/api/bands');
    expect(page().querySelector('mat-error')!.textContent).toContain(
      'The band name must not be empty.',
    );
  });

  it('creates a band and opens its page', async () => {
    await open(mira);
    http.expectOne('/api/bands').flush({ items: [] });
    await typeName('Copper Fen ');
    submit();
    const create = http.expectOne('/api/bands');
    expect(create.request.method).toBe('POST');
    expect(create.request.body).toEqual({ name: 'Copper Fen' });
    create.flush(
      { id: 'b-new', name: 'Copper Fen', role: 'owner' },
      { status: 201, statusText: 'Created' },
    );
    await settle();
    expect(TestBed.inject(Router).url).toBe('/bands/b-new');
  });
});
