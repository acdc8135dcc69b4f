import { TestbedHarnessEnvironment } from '@angular/cdk/testing/testbed';
import { MatSnackBarHarness } from '@angular/material/snack-bar/testing';
import { provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { TestBed } from '@angular/core/testing';
import { DesignState } from '../design/design-state';
import { newDraft } from '../design/draft-document';
import { DownloadMenu } from './download-menu';
import type { Instrument } from '@shared/api/instruments';
import { type Member, Session } from '../auth/session';
import { browserInstrumentsKey } from '../instruments/my-instruments';
import { latticeBoard, ondes } from '../testing/example-instruments';

const mira: Member = {
  id: 'u-mira',
  login: 'mira-vale',
  name: 'Mira Vale',
  email: null,
  avatarUrl: null,
  siteRole: 'member',
};

/** Lets the download's promise chain finish before the test moves on. */
async function settled(fixture: { whenStable(): Promise<unknown> }) {
  await new Promise((resolve) => setTimeout(resolve));
  await fixture.whenStable();
}

describe('DownloadMenu', () => {
  let http: HttpTestingController;

  async function render() {
    TestBed.configureTestingModule({
      imports: [DownloadMenu],
      providers: [DesignState, provideHttpClient(), provideHttpClientTesting()],
    });
    http = TestBed.inject(HttpTestingController);
    spyOn(HTMLAnchorElement.prototype, 'click');
    const fixture = TestBed.createComponent(DownloadMenu);
    await fixture.whenStable();
    const element = fixture.nativeElement as HTMLElement;
    return {
      fixture,
      element,
      button: element.querySelector<HTMLButtonElement>('button.download')!,
      state: TestBed.inject(DesignState),
    };
  }

  afterEach(() => http.verify());

  it('lists every format with a line on what it is for, the bundle last', async () => {
    const { fixture, button } = await render();
    button.click();
    await fixture.whenStable();
    const items = Array.from(
      document.querySelectorAll<HTMLButtonElement>('.download-formats button[mat-menu-item]'),
    );
    expect(items.length).toBe(14);
    expect(items[0].querySelector('.format-name')?.textContent).toContain('MTS bulk dump');
    expect(items[0].querySelector('.format-use')?.textContent).toContain(
      'All 128 keys in one message',
    );
    expect(items[13].getAttribute('aria-label')).toContain('Bundle of everything (.zip)');
  });

  it('greys out the formats a design cannot be written in, saying why in plain words', async () => {
    const { fixture, button, state } = await render();
    state.chooseKind('equal');
    state.setScaleField('divisions', 31);
    button.click();
    await fixture.whenStable();
    const items = Array.from(
      document.querySelectorAll<HTMLButtonElement>('.download-formats button[mat-menu-item]'),
    );
    const disabled = items
      .filter((item) => item.disabled)
      .map((item) => item.querySelector('.format-name')?.textContent?.trim());
    expect(disabled).toEqual(['MTS scale/octave, 1-byte .syx', 'MTS scale/octave, 2-byte .syx']);
    const octave = items.find((item) => item.disabled)!;
    expect(octave.querySelector('.format-use')?.textContent).toContain(
      'Not for this design: This layout repeats every 31 keys, and scale/octave tuning needs 12 keys an octave',
    );
    expect(octave.getAttribute('aria-label')).toContain('not for this design');
    expect(items.filter((item) => !item.disabled).length).toBe(12);
  });

  it('downloads a saved preset as saved, and a changed one as it stands', async () => {
    const { fixture, button, state } = await render();
    state.open(newDraft(), { id: 'p-3', revision: 2, bandId: null, access: 'own' });
    button.click();
    await fixture.whenStable();
    document.querySelector<HTMLButtonElement>('.download-formats button[mat-menu-item]')!.click();
    http
      .expectOne({ method: 'GET', url: '/api/presets/p-3/export/mts-bulk' })
      .flush(new Blob(['x']));
    await settled(fixture);
    const snackBar =
      await TestbedHarnessEnvironment.documentRootLoader(fixture).getHarness(MatSnackBarHarness);
    expect(await snackBar.getMessage()).toContain('Downloaded keyloom-mts-bulk.syx');

    state.rename('Changed');
    button.click();
    await fixture.whenStable();
    document
      .querySelectorAll<HTMLButtonElement>('.download-formats button[mat-menu-item]')[13]
      .click();
    const request = http.expectOne({ method: 'POST', url: '/api/preview/export/bundle' });
    expect(request.request.body).toEqual(jasmine.objectContaining({ name: 'Changed' }));
    request.flush(new Blob(['PK']));
    await settled(fixture);
  });

  it('cannot be used while the design has a fault, and says why', async () => {
    const { fixture, button, state } = await render();
    state.setScaleField('generator', '1.5');
    await fixture.whenStable();
    expect(button.disabled).toBeTrue();
    expect(button.getAttribute('aria-label')).toBe('Download (fix the faults in the design first)');
  });

  async function openInstrumentMenu(
    fixture: { whenStable(): Promise<unknown> },
    element: HTMLElement,
  ) {
    element.querySelector<HTMLButtonElement>('button.for-instrument')!.click();
    await fixture.whenStable();
    return () =>
      Array.from(
        document.querySelectorAll<HTMLButtonElement>('.instrument-downloads button[mat-menu-item]'),
      );
  }

  it("downloads a saved preset in each member instrument's own form, by its id, leaving the preset as it is", async () => {
    const { fixture, element, state } = await render();
    TestBed.inject(Session).member.set(mira);
    state.open(newDraft(), { id: 'p-3', revision: 2, bandId: null, access: 'own' });
    const output = structuredClone(state.draft().output);
    let items = await openInstrumentMenu(fixture, element);
    http
      .expectOne({ method: 'GET', url: '/api/instruments' })
      .flush({ items: [ondes, latticeBoard] });
    await fixture.whenStable();
    expect(items().map((item) => item.textContent!.replace(/\s+/g, ' ').trim())).toEqual([
      'For Ondes MTS bulk dump .syx, with its own settings',
      'For Lattice board MPE MIDI file .mid, with its own settings',
      'add Set up an instrument…',
    ]);
    items()[0].click();
    const bulk = http.expectOne((r) => r.url === '/api/presets/p-3/export/mts-bulk');
    expect(bulk.request.params.keys()).toEqual(['instrument']);
    expect(bulk.request.params.get('instrument')).toBe('i-ondes');
    bulk.flush(new Blob(['x']));
    await settled(fixture);

    items = await openInstrumentMenu(fixture, element);
    items()[1].click();
    const mpe = http.expectOne((r) => r.url === '/api/presets/p-3/export/mpe-smf');
    expect(mpe.request.urlWithParams).toBe('/api/presets/p-3/export/mpe-smf?instrument=i-board');
    mpe.flush(new Blob(['MThd']));
    await settled(fixture);
    expect(state.draft().output).toEqual(output);
    expect(state.dirty()).toBeFalse();
  });

  it("sends a guest instrument's settings with a design that is not saved", async () => {
    const {
      createdAt: _,
      updatedAt: __,
      ...settings
    } = { ...latticeBoard, id: 'browser-1', receives: 'mts-bulk-bank', bank: 3 };
    localStorage.setItem(browserInstrumentsKey, JSON.stringify([settings]));
    const { fixture, element, state } = await render();
    TestBed.inject(Session).member.set(null);
    state.rename('Fen draft');
    const items = await openInstrumentMenu(fixture, element);
    expect(items()[0].textContent).toContain('MTS bulk dump with bank .syx');
    items()[0].click();
    const request = http.expectOne((r) => r.url === '/api/preview/export/mts-bulk-bank');
    expect(request.request.method).toBe('POST');
    expect(request.request.urlWithParams).toBe(
      '/api/preview/export/mts-bulk-bank?receives=mts-bulk-bank&deviceId=16&program=5&bank=3&bendRange=48&memberChannels=2-9',
    );
    expect(request.request.body).toEqual(jasmine.objectContaining({ name: 'Fen draft' }));
    request.flush(new Blob(['x']));
    await settled(fixture);
    localStorage.removeItem(browserInstrumentsKey);
  });
});
