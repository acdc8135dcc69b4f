import { HttpTestingController } from '@angular/common/http/testing';
import { TestBed } from '@angular/core/testing';
import { Member } from '../auth/session';
import { HistoryPage } from './history-page';
import { SavedPreset, RevisionEntry } from './library-api';
import { PageTest } from '../testing/page-test';

const mira: Member = {
  id: 'u-mira',
  login: 'mira-vale',
  name: 'Mira Vale',
  email: null,
  avatarUrl: null,
  siteRole: 'member',
};
const preset: SavedPreset = {
  id: 'p1',
  name: 'Fen Fifths',
  bandId: 'b-fen',
  ownerId: 'u-mira',
  revision: 3,
  note: 'Wolf moved to G sharp',
  document: {},
  createdAt: '2026-11-01T10:00:00Z',
  updatedAt: '2026-11-20T09:30:00Z',
  deletedAt: null,
  forkedFrom: null,
  access: 'edit',
};
const revisions: RevisionEntry[] = [
  {
    revision: 3,
    note: 'Wolf moved to G sharp',
    authorId: 'u-tobias',
    authorLogin: 'tobias-reed',
    authorName: 'Tobias Reed',
    createdAt: '2026-11-20T09:30:00Z',
    name: 'Fen Fifths',
  },
  {
    revision: 2,
    note: 'Twelve tones',
    authorId: 'u-mira',
    authorLogin: 'mira-vale',
    authorName: 'Mira Vale',
    createdAt: '2026-11-12T18:00:00Z',
    name: 'Fen Fifths',
  },
  {
    revision: 1,
    note: null,
    authorId: 'u-mira',
    authorLogin: 'mira-vale',
    authorName: null,
    createdAt: '2026-11-01T11:00:00Z',
    name: 'Fifths from C',
  },
];

describe('HistoryPage', () => {
  let http: HttpTestingController;
  let pages: PageTest;

  beforeEach(() => {
    pages = new PageTest([{ path: 'library/:id/history', component: HistoryPage }]);
    http = pages.http;
  });

  afterEach(() => pages.verify());

  const page = () => pages.page();

  const settle = () => pages.settle();

  async function open(detail = preset) {
    await pages.open('/library/p1/history', mira);
    http.expectOne('/api/presets/p1').flush(detail);
    http.expectOne('/api/presets/p1/revisions').flush({ items: revisions });
    await settle();
  }

  function options(): HTMLElement[] {
    return Array.from(page().querySelectorAll<HTMLElement>('mat-list-option'));
  }

  async function selectRevision(n: number) {
    options()
      .find((o) => o.textContent!.includes(`Revision ${n}`))!
      .click();
    await settle();
  }

  it('lists every revision with its author, date and note, newest first', async () => {
    await open();
    http.expectOne('/api/presets/p1/revisions/3/changes');
    expect(page().querySelector('h1')!.textContent).toContain('History of “Fen Fifths”');
    const texts = options().map((o) => o.textContent!.replace(/\s+/g, ' ').trim());
    expect(texts[0]).toContain('Revision 3 (latest)');
    expect(texts[0]).toContain('Tobias Reed · 20 Nov 2026');
    expect(texts[0]).toContain('Wolf moved to G sharp');
    expect(texts[2]).toContain('mira-vale');
  });

  it('shows what the selected revision changed against the one before', async () => {
    await open();
    http.expectOne('/api/presets/p1/revisions/3/changes').flush({
      from: 2,
      to: 3,
      lines: [
        'Degree 3/2 (701.96c) moved to 696.58c (-5.38c).',
        'output.program changed from 0 to 4.',
      ],
    });
    await settle();
    await selectRevision(2);
    const changes = http.expectOne('/api/presets/p1/revisions/2/changes');
    changes.flush({ from: 1, to: 2, lines: ['Degree 1024/729 (588.27c) added.'] });
    await settle();
    const detail = page().querySelector('.detail')!;
    expect(detail.querySelector('h2')!.textContent).toContain('Revision 2');
    expect(detail.textContent).toContain('Changes from revision 1');
    expect(Array.from(detail.querySelectorAll('.changes li')).map((li) => li.textContent)).toEqual([
      'Degree 1024/729 (588.27c) added.',
    ]);
  });

  it('says the first revision has nothing to compare with, without asking the server', async () => {
    await open();
    http
      .expectOne('/api/presets/p1/revisions/3/changes')
      .flush({ from: 2, to: 3, lines: ['No changes.'] });
    await selectRevision(1);
    http.expectNone((request) => request.url.endsWith('/revisions/1/changes'));
    expect(page().querySelector('.detail')!.textContent).toContain(
      'nothing before it to compare with',
    );
    expect(page().querySelector('.detail')!.textContent).toContain('Fifths from C');
  });

  it('restores an old revision as a new one after saying nothing is overwritten', async () => {
    await open();
    http
      .expectOne('/api/presets/p1/revisions/3/changes')
      .flush({ from: 2, to: 3, lines: ['No changes.'] });
    expect(page().querySelector('button.restore')).toBeNull();
    await selectRevision(1);
    page().querySelector<HTMLButtonElement>('button.restore')!.click();
    await settle();
    const dialog = document.querySelector('mat-dialog-container')!;
    expect(dialog.textContent).toContain('Restore revision 1?');
    expect(dialog.textContent).toContain('Nothing is overwritten');
    const confirm = Array.from(dialog.querySelectorAll<HTMLButtonElement>('button')).find((b) =>
      b.textContent!.includes('Save as revision 4'),
    )!;
    confirm.click();
    await settle();
    const restore = http.expectOne('/api/presets/p1/restore');
    expect(restore.request.method).toBe('POST');
    expect(restore.request.body).toEqual({ revision: 1 });
    restore.flush({ revision: 4 }, { status: 201, statusText: 'Created' });
    await settle();
    expect(await pages.snackBar()).toContain('Revision 1 is saved again as revision 4.');
    http.expectOne('/api/presets/p1');
    http.expectOne('/api/presets/p1/revisions');
  });

  it('does nothing when the restore is cancelled', async () => {
    await open();
    http
      .expectOne('/api/presets/p1/revisions/3/changes')
      .flush({ from: 2, to: 3, lines: ['No changes.'] });
    await selectRevision(2);
    http
      .expectOne('/api/presets/p1/revisions/2/changes')
      .flush({ from: 1, to: 2, lines: ['No changes.'] });
    page().querySelector<HTMLButtonElement>('button.restore')!.click();
    await settle();
    Array.from(document.querySelectorAll<HTMLButtonElement>('mat-dialog-container button'))
      .find((b) => b.textContent!.trim() === 'Cancel')!
      .click();
    await settle();
    http.expectNone('/api/presets/p1/restore');
  });

  it('offers no restore to a member who may only view', async () => {
    await open({ ...preset, access: 'read' });
    http
      .expectOne('/api/presets/p1/revisions/3/changes')
      .flush({ from: 2, to: 3, lines: ['No changes.'] });
    await selectRevision(2);
    http
      .expectOne('/api/presets/p1/revisions/2/changes')
      .flush({ from: 1, to: 2, lines: ['No changes.'] });
    expect(page().querySelector('button.restore')).toBeNull();
    expect(page().textContent).toContain('lets you see the history but not restore it');
  });

  it('says so when the preset cannot be seen', async () => {
    await pages.open('/library/p1/history', mira);
    http
      .expectOne('/api/presets/p1')
      .flush(
        { error: { code: 'not_found', message: 'No such preset.' } },
        { status: 404, statusText: 'Not Found' },
      );
    http.expectOne('/api/presets/p1/revisions');
    await settle();
    expect(page().querySelector('[role="alert"]')!.textContent).toContain(
      'There is no such preset',
    );
  });
});
