import { Clipboard } from '@angular/cdk/clipboard';
import { provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { ApplicationRef } from '@angular/core';
import { TestBed } from '@angular/core/testing';
import { MATERIAL_ANIMATIONS } from '@angular/material/core';
import { MatDialog } from '@angular/material/dialog';
import { ShareLink } from './share-api';
import { ShareDialog, ShareDialogData } from './share-dialog';

const links: ShareLink[] = [
  {
    id: 's2',
    revision: 3,
    createdAt: '2026-11-21T10:00:00Z',
    revokedAt: null,
    createdBy: 'u-mira',
  },
  {
    id: 's1',
    revision: null,
    createdAt: '2026-11-15T10:00:00Z',
    revokedAt: null,
    createdBy: 'u-mira',
  },
  {
    id: 's0',
    revision: null,
    createdAt: '2026-11-02T10:00:00Z',
    revokedAt: '2026-11-03T10:00:00Z',
    createdBy: 'u-mira',
  },
];

describe('ShareDialog', () => {
  let http: HttpTestingController;

  beforeEach(() => {
    TestBed.configureTestingModule({
      providers: [
        provideHttpClient(),
        provideHttpClientTesting(),
        { provide: MATERIAL_ANIMATIONS, useValue: { animationsDisabled: true } },
      ],
    });
    http = TestBed.inject(HttpTestingController);
  });

  afterEach(() => http.verify());

  async function settle() {
    await TestBed.inject(ApplicationRef).whenStable();
  }

  async function open() {
    const data: ShareDialogData = { presetId: 'p1', revision: 3, name: 'Fen Fifths' };
    TestBed.inject(MatDialog).open(ShareDialog, { data });
    await settle();
    http.expectOne('/api/presets/p1/shares').flush({ items: links });
    await settle();
    return document.querySelector('mat-dialog-container') as HTMLElement;
  }

  function button(dialog: HTMLElement, label: string): HTMLButtonElement {
    return Array.from(dialog.querySelectorAll<HTMLButtonElement>('button')).find((b) =>
      b.textContent!.includes(label),
    )!;
  }

  it('lists the links to the preset, revoked ones without a revoke button', async () => {
    const dialog = await open();
    expect(dialog.querySelector('h2')!.textContent).toContain('Share “Fen Fifths”');
    const items = Array.from(dialog.querySelectorAll('.links li'));
    expect(items.map((li) => li.querySelector('strong')!.textContent)).toEqual([
      'Revision 3',
      'Latest revision',
      'Latest revision',
    ]);
    expect(items[2].textContent).toContain('revoked');
    expect(items.map((li) => li.querySelector('button.revoke') !== null)).toEqual([
      true,
      true,
      false,
    ]);
    expect(items[0].querySelector('button')!.getAttribute('aria-label')).toMatch(
      /^Revoke the link to revision 3 made \d+ Nov 2026, \d\d:\d\d$/,
    );
  });

  it('revokes a link and reads the list again', async () => {
    const dialog = await open();
    dialog.querySelector<HTMLButtonElement>('.links li button.revoke')!.click();
    const revoke = http.expectOne('/api/shares/s2');
    expect(revoke.request.method).toBe('DELETE');
    revoke.flush(null, { status: 204, statusText: 'No Content' });
    await settle();
    http
      .expectOne('/api/presets/p1/shares')
      .flush({ items: [{ ...links[0], revokedAt: '2026-11-22T10:00:00Z' }, links[1]] });
    await settle();
    expect(dialog.querySelectorAll('.links button.revoke').length).toBe(1);
    expect(document.querySelector('mat-snack-bar-container')!.textContent).toContain(
      'Link revoked',
    );
  });

  it('makes a link that follows the latest revision and copies it', async () => {
    const copy = spyOn(TestBed.inject(Clipboard), 'copy').and.returnValue(true);
    const dialog = await open();
    button(dialog, 'Create link').click();
    const create = http.expectOne('/api/presets/p1/shares');
    expect(create.request.method).toBe('POST');
    expect(create.request.body).toEqual({});
    create.flush(
      { id: 's3', token: 'tok3', url: 'http://127.0.0.1:3000/s/tok3', revision: null },
      { status: 201, statusText: 'Created' },
    );
    await settle();
    http.expectOne('/api/presets/p1/shares').flush({ items: links });
    await settle();
    expect(dialog.querySelector<HTMLInputElement>('.created input')!.value).toBe(
      'http://127.0.0.1:3000/s/tok3',
    );
    button(dialog, 'Copy link').click();
    await settle();
    expect(copy).toHaveBeenCalledWith('http://127.0.0.1:3000/s/tok3');
    expect(document.querySelector('mat-snack-bar-container')!.textContent).toContain(
      'Link copied.',
    );
  });

  it('pins a link to the revision on screen when asked', async () => {
    const dialog = await open();
    dialog.querySelectorAll<HTMLInputElement>('mat-radio-button input')[1].click();
    await settle();
    button(dialog, 'Create link').click();
    const create = http.expectOne('/api/presets/p1/shares');
    expect(create.request.body).toEqual({ revision: 3 });
  });

  it("shows the server's message when a link cannot be made", async () => {
    const dialog = await open();
    button(dialog, 'Create link').click();
    http.expectOne('/api/presets/p1/shares').flush(
      {
        error: {
          code: 'forbidden',
          message: 'Your role lets you see this preset but not change it.',
        },
      },
      { status: 403, statusText: 'Forbidden' },
    );
    await settle();
    expect(dialog.querySelector('[role="alert"]')!.textContent).toContain(
      'Your role lets you see this preset but not change it.',
    );
    expect(dialog.querySelector('.created')).toBeNull();
  });
});
