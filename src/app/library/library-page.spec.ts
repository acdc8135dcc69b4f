import { HttpTestingController, TestRequest } from '@angular/common/http/testing';
import { TestBed } from '@angular/core/testing';
import { MatMenuHarness, MatMenuItemHarness } from '@angular/material/menu/testing';
import { MatPaginatorHarness } from '@angular/material/paginator/testing';
import { MatSnackBarHarness } from '@angular/material/snack-bar/testing';
import { MatTableHarness } from '@angular/material/table/testing';
import { Router } from '@angular/router';
import { Member } from '../auth/session';
import { BandSummary } from '../bands/bands-api';
import { PresetRow } from './library-api';
import { LibraryPage } from './library-page';
import { PageTest } from '../testing/page-test';
import { latticeBoard, ondes } from '../testing/example-instruments';

const mira: Member = {
  id: 'u-mira',
  login: 'mira-vale',
  name: 'Mira Vale',
  email: null,
  avatarUrl: null,
  siteRole: 'member',
};
const bands: BandSummary[] = [
  { id: 'b-fen', name: 'Copper Fen', role: 'editor', createdAt: '2026-11-01T10:00:00Z' },
  { id: 'b-reed', name: 'Reed Hollow', role: 'viewer', createdAt: '2026-11-02T10:00:00Z' },
];
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
  access: 'edit',
};
const reedOrgan: PresetRow = {
  id: 'p2',
  name: 'Reed Organ Meantone',
  bandId: null,
  bandName: null,
  ownerId: 'u-mira',
  ownerLogin: 'mira-vale',
  revision: 1,
  updatedAt: '2026-11-18T15:00:00Z',
  deletedAt: null,
  access: 'own',
};
const hollowDrone: PresetRow = {
  id: 'p3',
  name: 'Hollow Drone',
  bandId: 'b-reed',
  bandName: 'Reed Hollow',
  ownerId: 'u-tobias',
  ownerLogin: 'tobias-reed',
  revision: 2,
  updatedAt: '2026-11-10T15:00:00Z',
  deletedAt: null,
  access: 'read',
};

describe('LibraryPage', () => {
  let http: HttpTestingController;
  let pages: PageTest;

  beforeEach(async () => {
    pages = new PageTest([{ path: 'library', component: LibraryPage }]);
    http = pages.http;
  });

  afterEach(() => pages.verify());

  const page = () => pages.page();

  const settle = () => pages.settle();

  function presetRequest(): TestRequest {
    return http.expectOne((request) => request.url === '/api/presets');
  }

  async function open(url: string, rows = [fenFifths, reedOrgan, hollowDrone]) {
    await pages.open(url, mira);
    http.expectOne('/api/bands').flush({ items: bands });
    const request = presetRequest();
    request.flush({ items: rows, total: 41, page: 1, pageSize: 20 });
    await settle();
    return request;
  }

  async function rowTexts(): Promise<string[]> {
    const rows = await (await pages.loader.getHarness(MatTableHarness)).getRows();
    return Promise.all(rows.map(async (row) => (await row.getCellTextByIndex()).join(' ')));
  }

  function menuItem(label: string): Promise<MatMenuItemHarness> {
    return pages.loader.getHarness(MatMenuItemHarness.with({ text: new RegExp(label) }));
  }

  async function openRowMenu(name: string) {
    const selector = `[aria-label="Actions for ${name}"]`;
    await (await pages.loader.getHarness(MatMenuHarness.with({ selector }))).open();
    await settle();
  }

  it('asks a signed-out visitor to sign in and come back to the library', async () => {
    await pages.open('/library', null);
    const link = page().querySelector<HTMLAnchorElement>('a.sign-in-link')!;
    expect(link.textContent).toContain('Sign in to see your library');
    expect(link.getAttribute('href')).toBe('/auth/github?next=%2Flibrary');
    expect(page().querySelector('table')).toBeNull();
  });

  it("shows my presets and my bands' from the server, newest first", async () => {
    const request = await open('/library');
    expect(request.request.params.get('sort')).toBe('-updated');
    expect(request.request.params.get('page')).toBe('1');
    expect(request.request.params.get('pageSize')).toBe('20');
    expect(request.request.params.has('trash')).toBeFalse();
    const rows = await rowTexts();
    expect(rows.length).toBe(3);
    expect(rows[0]).toContain('Fen Fifths');
    expect(rows[0]).toContain('Copper Fen');
    expect(rows[0]).toContain('you');
    expect(rows[1]).toContain('My library');
    expect(rows[2]).toContain('tobias-reed');
    expect(page().querySelector<HTMLAnchorElement>('a.name')!.getAttribute('href')).toBe(
      '/presets/p1',
    );
    expect(await (await pages.loader.getHarness(MatPaginatorHarness)).getRangeLabel()).toContain(
      '41',
    );
  });

  it('asks the server to sort by name when the name header is clicked', async () => {
    await open('/library');
    page().querySelector<HTMLElement>('th.mat-column-name')!.click();
    await settle();
    const request = presetRequest();
    expect(request.request.params.get('sort')).toBe('name');
    expect(request.request.params.get('page')).toBe('1');
    request.flush({ items: [fenFifths], total: 1, page: 1, pageSize: 20 });
    page().querySelector<HTMLElement>('th.mat-column-name')!.click();
    await settle();
    expect(presetRequest().request.params.get('sort')).toBe('-name');
  });

  it('searches by name once typing pauses', async () => {
    // The page's time is the test's to move, so "not yet" holds however slow the machine is.
    jasmine.clock().install();
    jasmine.clock().mockDate();
    const noPresetRequest = () => http.expectNone((request) => request.url === '/api/presets');
    try {
      await open('/library');
      // The empty search the page starts with passes its pause and asks for nothing new.
      jasmine.clock().tick(300);
      pages.harness.detectChanges();
      noPresetRequest();
      const input = page().querySelector<HTMLInputElement>('input[type="search"]')!;
      for (const text of ['f', 'fe', 'fen']) {
        input.value = text;
        input.dispatchEvent(new Event('input'));
        pages.harness.detectChanges();
        jasmine.clock().tick(100);
        pages.harness.detectChanges();
        noPresetRequest();
      }
      // 300 ms after the first key the search waits still: it counts its pause from the last key.
      jasmine.clock().tick(199);
      pages.harness.detectChanges();
      noPresetRequest();
      jasmine.clock().tick(1);
      pages.harness.detectChanges();
      // Runs the change detection Angular scheduled on the test's clock before that clock goes.
      jasmine.clock().tick(0);
    } finally {
      jasmine.clock().uninstall();
    }
    const request = presetRequest();
    expect(request.request.params.get('q')).toBe('fen');
    request.flush({ items: [], total: 0, page: 1, pageSize: 20 });
    await settle();
    expect(page().querySelector('tr.empty')!.textContent).toContain('No presets match “fen”');
  });

  it("shows only one band's presets when the address names the band", async () => {
    const request = await open('/library?band=b-fen');
    expect(request.request.params.get('bandId')).toBe('b-fen');
    expect(page().querySelector('caption')!.textContent).toContain('of Copper Fen');
  });

  it('filters by band from the select and keeps the choice in the address', async () => {
    await open('/library');
    expect(page().querySelector('mat-select')!.textContent).toContain("Mine and all my bands'");
    page().querySelector<HTMLElement>('mat-select')!.click();
    await settle();
    Array.from(document.querySelectorAll<HTMLElement>('mat-option'))
      .find((o) => o.textContent!.includes('Copper Fen'))!
      .click();
    await settle();
    expect(TestBed.inject(Router).url).toBe('/library?band=b-fen');
    const request = presetRequest();
    expect(request.request.params.get('bandId')).toBe('b-fen');
    expect(request.request.params.get('page')).toBe('1');
  });

  it('lists the trash and restores a preset from it', async () => {
    const trashed = { ...reedOrgan, deletedAt: '2026-11-25T08:00:00Z' };
    const request = await open('/library?view=trash', [trashed]);
    expect(request.request.params.get('trash')).toBe('1');
    expect(page().textContent).toContain('wait here for 30 days');
    page()
      .querySelector<HTMLButtonElement>(
        'button[aria-label="Restore Reed Organ Meantone from the trash"]',
      )!
      .click();
    const untrash = http.expectOne('/api/presets/p2/untrash');
    expect(untrash.request.method).toBe('POST');
    untrash.flush({ id: 'p2', deletedAt: null });
    await settle();
    presetRequest().flush({ items: [], total: 0, page: 1, pageSize: 20 });
    await settle();
    expect(page().querySelector('tr.empty')!.textContent).toContain('The trash is empty');
  });

  it('moves a preset to the trash and brings it back with Undo', async () => {
    await open('/library');
    await openRowMenu('Reed Organ Meantone');
    await (await menuItem('Move to trash')).click();
    const deletion = http.expectOne('/api/presets/p2');
    expect(deletion.request.method).toBe('DELETE');
    deletion.flush(null, { status: 204, statusText: 'No Content' });
    await settle();
    presetRequest().flush({ items: [fenFifths], total: 1, page: 1, pageSize: 20 });
    await settle();
    const snackBar = await pages.loader.getHarness(MatSnackBarHarness);
    expect(await snackBar.getMessage()).toContain(
      '“Reed Organ Meantone” is in the trash for 30 days.',
    );
    await snackBar.dismissWithAction();
    expect(http.expectOne('/api/presets/p2/untrash').request.method).toBe('POST');
  });

  it('will not offer to share or delete a preset of a band where I only view', async () => {
    await open('/library');
    await openRowMenu('Hollow Drone');
    expect(await (await menuItem('Share')).isDisabled()).toBeTrue();
    expect(await (await menuItem('Move to trash')).isDisabled()).toBeTrue();
    expect(await (await menuItem('Fork')).isDisabled()).toBeFalse();
  });

  it('forks into a band where I may save, and not into one where I only view', async () => {
    await open('/library');
    await openRowMenu('Hollow Drone');
    await (await menuItem('Fork')).click();
    await settle();
    const dialog = document.querySelector('mat-dialog-container')!;
    const options = Array.from(dialog.querySelectorAll('mat-radio-button')).map((o) =>
      o.textContent!.trim(),
    );
    expect(options).toEqual(['My library', 'Copper Fen (band)']);
    dialog.querySelectorAll<HTMLInputElement>('mat-radio-button input')[1].click();
    await settle();
    Array.from(dialog.querySelectorAll<HTMLButtonElement>('button'))
      .find((b) => b.textContent!.trim() === 'Fork')!
      .click();
    await settle();
    const fork = http.expectOne('/api/presets/p3/fork');
    expect(fork.request.body).toEqual({ bandId: 'b-fen' });
    fork.flush({ id: 'p9' }, { status: 201, statusText: 'Created' });
    await settle();
    presetRequest().flush({ items: [], total: 0, page: 1, pageSize: 20 });
    await settle();
    expect(await pages.snackBar()).toContain('Forked “Hollow Drone” into Copper Fen (band).');
  });

  it('opens the share dialog for a preset I may change', async () => {
    await open('/library');
    await openRowMenu('Fen Fifths');
    await (await menuItem('Share')).click();
    await settle();
    expect(document.querySelector('mat-dialog-container h2')!.textContent).toContain(
      'Share “Fen Fifths”',
    );
    http.expectOne('/api/presets/p1/shares').flush({ items: [] });
  });

  it("downloads a preset for one of my instruments in its own form, by the instrument's id", async () => {
    await open('/library');
    await openRowMenu('Fen Fifths');
    await (await menuItem('Download for my instrument')).click();
    await settle();
    http
      .expectOne({ method: 'GET', url: '/api/instruments' })
      .flush({ items: [ondes, latticeBoard] });
    await settle();
    const labels = Array.from(
      document.querySelectorAll('.instrument-downloads [mat-menu-item]'),
      (item) => item.textContent!.replace(/\s+/g, ' ').trim(),
    );
    expect(labels).toEqual([
      'For Ondes MTS bulk dump .syx',
      'For Lattice board MPE MIDI file .mid',
    ]);
    await (await menuItem('For Lattice board')).click();
    const request = http.expectOne((r) => r.url === '/api/presets/p1/export/mpe-smf');
    expect(request.request.method).toBe('GET');
    expect(request.request.urlWithParams).toBe('/api/presets/p1/export/mpe-smf?instrument=i-board');
    request.flush(new Blob(['MThd']), {
      headers: { 'Content-Disposition': 'attachment; filename="fen-fifths-mpe.mid"' },
    });
    await settle();
    const snackBar = await pages.loader.getHarness(MatSnackBarHarness);
    expect(await snackBar.getMessage()).toContain('Downloaded fen-fifths-mpe.mid');
  });

  it("shows the server's message when the library cannot be read", async () => {
    await pages.open('/library', mira);
    http.expectOne('/api/bands').flush({ items: [] });
    presetRequest().flush(
      { error: { code: 'invalid', message: 'pageSize: must be at most 100' } },
      { status: 400, statusText: 'Bad Request' },
    );
    await settle();
    expect(page().querySelector('[role="alert"]')!.textContent).toContain(
      'pageSize: must be at most 100',
    );
  });
});
