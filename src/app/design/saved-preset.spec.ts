import { provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { TestBed } from '@angular/core/testing';
import { MatDialog } from '@angular/material/dialog';
import { Router, provideRouter } from '@angular/router';
import { of } from 'rxjs';
import { Session } from '../auth/session';
import { DesignState } from './design-state';
import { newDraft } from './draft-document';
import type { SaveChoice } from './save-dialog';
import { SavedPreset } from './saved-preset';

const member = {
  id: 'u1',
  login: 'mira-vale',
  name: 'Mira Vale',
  email: null,
  avatarUrl: null,
  siteRole: 'member' as const,
};

describe('SavedPreset', () => {
  let http: HttpTestingController;
  let state: DesignState;
  let saved: SavedPreset;
  let choice: SaveChoice | undefined;
  let dialogData: unknown;
  let navigate: jasmine.Spy;

  beforeEach(() => {
    TestBed.configureTestingModule({
      providers: [
        provideHttpClient(),
        provideHttpClientTesting(),
        provideRouter([]),
        DesignState,
        SavedPreset,
        {
          provide: MatDialog,
          useValue: {
            open: (_: unknown, config: { data: unknown }) => (
              (dialogData = config.data),
              { afterClosed: () => of(choice) }
            ),
          },
        },
      ],
    });
    http = TestBed.inject(HttpTestingController);
    state = TestBed.inject(DesignState);
    saved = TestBed.inject(SavedPreset);
    TestBed.inject(Session).member.set(member);
    navigate = spyOn(TestBed.inject(Router), 'navigate').and.resolveTo(true);
  });

  afterEach(() => http.verify());

  async function flushing<T>(
    work: Promise<T>,
    answer: (http: HttpTestingController) => void,
  ): Promise<T> {
    await new Promise((resolve) => setTimeout(resolve));
    answer(http);
    return work;
  }

  it('saves a new preset into the chosen band with the note, then opens it by id', async () => {
    choice = { name: 'Fifths from C', bandId: 'b-2', note: 'first try' };
    const done = saved.save();
    await new Promise((resolve) => setTimeout(resolve));
    http.expectOne('/api/bands').flush({
      items: [
        { id: 'b-1', name: 'Listeners', role: 'viewer' },
        { id: 'b-2', name: 'Copper Fen', role: 'editor' },
      ],
    });
    await flushing(done, (mock) => {
      const request = mock.expectOne('/api/presets');
      expect(request.request.method).toBe('POST');
      expect(request.request.body).toEqual({
        document: { ...newDraft(), name: 'Fifths from C' },
        bandId: 'b-2',
        note: 'first try',
      });
      request.flush({ id: 'p-9', revision: 1 }, { status: 201, statusText: 'Created' });
    });
    expect(dialogData).toEqual(
      jasmine.objectContaining({ bands: [{ id: 'b-2', name: 'Copper Fen', role: 'editor' }] }),
    );
    expect(navigate).toHaveBeenCalledWith(['/presets', 'p-9']);
  });

  it('saves a loaded preset as its next revision, and nothing is saved when the dialog is cancelled', async () => {
    state.open(newDraft(), { id: 'p-1', revision: 4, bandId: null, access: 'own' });
    state.rename('Renamed');
    choice = undefined;
    await saved.save();
    http.expectNone('/api/presets/p-1/revisions');

    choice = { name: 'Renamed', bandId: null, note: '' };
    await flushing(saved.save(), (mock) => {
      const request = mock.expectOne('/api/presets/p-1/revisions');
      expect(request.request.body).toEqual({ document: { ...newDraft(), name: 'Renamed' } });
      request.flush({ revision: 5 }, { status: 201, statusText: 'Created' });
    });
    expect(dialogData).toEqual(jasmine.objectContaining({ bands: null, nextRevision: 5 }));
    expect(state.origin()?.revision).toBe(5);
    expect(state.dirty()).toBeFalse();
  });

  it('opens a preset a reader may only read, read-only, and forks it into their library', async () => {
    const opened = saved.open('p-7');
    http.expectOne('/api/presets/p-7').flush({
      id: 'p-7',
      name: 'Guest tuning',
      bandId: 'b-1',
      revision: 2,
      document: { ...newDraft(), name: 'Guest tuning' },
      access: 'read',
    });
    expect(await opened).toBeTrue();
    expect(state.readOnly()).toBeTrue();
    expect(saved.canSave()).toBeFalse();

    await flushing(saved.fork(), (mock) => {
      const request = mock.expectOne('/api/presets/p-7/fork');
      expect(request.request.body).toEqual({});
      request.flush({ id: 'p-8' }, { status: 201, statusText: 'Created' });
    });
    expect(navigate).toHaveBeenCalledWith(['/presets', 'p-8']);
  });

  it("keeps the server's words when a preset cannot be opened", async () => {
    const opened = saved.open('nope');
    http
      .expectOne('/api/presets/nope')
      .flush(
        { error: { code: 'not_found', message: 'No such preset.' } },
        { status: 404, statusText: 'Not Found' },
      );
    expect(await opened).toBeFalse();
    expect(saved.loadFault()).toBe('No such preset.');
  });
});
