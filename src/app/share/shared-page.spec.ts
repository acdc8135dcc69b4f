import { HttpTestingController } from '@angular/common/http/testing';
import { exportFormats as catalogue } from '@shared/export/export-catalogue';
import { fifthsPreset } from '@shared/preset/presets.testing';
import { Member } from '../auth/session';
import { SharedPreset } from './share-api';
import { SharedPage } from './shared-page';
import { PageTest } from '../testing/page-test';
import type { Instrument } from '@shared/api/instruments';
import { browserInstrumentsKey } from '../instruments/my-instruments';
import { waitFor } from '../testing/wait-for';
import { latticeBoard, ondes } from '../testing/example-instruments';

const tobias: Member = {
  id: 'u-tobias',
  login: 'tobias-reed',
  name: 'Tobias Reed',
  email: null,
  avatarUrl: null,
  siteRole: 'member',
};
const fenFifths = {
  ...fifthsPreset('Fen Fifths'),
  notes: 'Stacked pure fifths from C for the drone pieces.',
  mapping: {
    rootKey: 60,
    concertA: 440,
    keysPerPeriod: 12,
    layout: [0, null, 1, null, 2, 3, null, 4, null, 5, null, 6],
  },
};
const shared: SharedPreset = {
  name: 'Fen Fifths',
  revision: 3,
  pinned: true,
  savedAt: '2026-11-20T09:30:00Z',
  document: fenFifths,
};

describe('SharedPage', () => {
  let http: HttpTestingController;
  let pages: PageTest;

  beforeEach(() => {
    pages = new PageTest([{ path: 's/:token', component: SharedPage }]);
    http = pages.http;
  });

  afterEach(() => {
    pages.verify();
    localStorage.removeItem(browserInstrumentsKey);
  });

  const page = () => pages.page();

  const settle = () => pages.settle();

  async function open(
    member: Member | null,
    answer: SharedPreset = shared,
    instruments: Instrument[] = [],
  ) {
    await pages.open('/s/tok-123', member);
    http.expectOne('/api/shared/tok-123').flush(answer);
    if (member) http.expectOne('/api/instruments').flush({ items: instruments });
    await settle();
  }

  it('links to the tuner with the link’s token, for anyone', async () => {
    await open(null);
    const tuner = page().querySelector<HTMLAnchorElement>('a.tuner')!;
    expect(tuner.textContent).toContain('Tune with a microphone');
    expect(new URL(tuner.href).pathname + new URL(tuner.href).search).toBe('/tuner?share=tok-123');
  });

  it('shows the shared preset read-only with its degrees worked out in the browser', async () => {
    await open(null);
    expect(page().querySelector('h1')!.textContent).toContain('Fen Fifths');
    expect(page().querySelector('.about')!.textContent).toContain('Revision 3');
    expect(page().querySelector('.about')!.textContent).toContain('always opens this revision');
    expect(page().querySelector('.summary')!.textContent).toContain('7 degrees in a period of 2/1');
    expect(page().querySelector('.summary')!.textContent).toContain('LLsLLLs');
    // Middle C at A4 = 440 Hz is 261.6256 Hz (MIDI convention).
    expect(page().querySelector('.summary .pitch')!.textContent).toBe(
      'Root key 60 (C4) sounds 261.6256 Hz.',
    );
    // The tuning can be heard here: the play panel (with its volume caution) and the keys to play.
    expect(page().querySelector('.listen app-play-panel')).not.toBeNull();
    const hint = page()
      .querySelector('.listen app-play-panel .hint')
      ?.textContent?.replace(/\s+/g, ' ');
    expect(hint).toContain('Click or touch the keys below.');
    expect(hint).not.toContain('Keys tab');
    expect(page().querySelectorAll('.listen app-keyboard-strip g.key').length).toBe(128);
    const rows = Array.from(page().querySelectorAll('app-degree-table tbody tr')).map((tr) =>
      Array.from(tr.children).map((cell) => cell.textContent!.trim()),
    );
    expect(rows.length).toBe(7);
    // In the designer's style: pure fifth 3/2 = 701.955¢, 1.955¢ above the equal-tempered G
    // (definition: 1200 log2(3/2)), and its pitch from middle C, 392.438 Hz (arithmetic (MIDI
    // convention): G 3/2 = 392.4383 Hz).
    expect(rows[4].slice(0, 7)).toEqual(['4', 'G', '3/2', '701.955¢', '9/8', 'G4', '+2.0¢']);
    expect(rows[4][7]).toBe('392.438');
    expect(rows[3].slice(0, 4)).toEqual(['3', 'F', '4/3', '498.045¢']);
  });

  it('offers every format of the export catalogue and the tuner sheet through the share link, the bundle first', async () => {
    await open(null);
    expect(page().querySelector<HTMLAnchorElement>('a.bundle')!.getAttribute('href')).toBe(
      '/api/shared/tok-123/bundle',
    );
    const hrefs = Array.from(page().querySelectorAll<HTMLAnchorElement>('.downloads li a')).map(
      (a) => a.getAttribute('href'),
    );
    const expected = [...catalogue.map((format) => format.id), 'tuner-sheet'].map(
      (id) => `/api/shared/tok-123/export/${id}`,
    );
    expect([...hrefs].sort()).toEqual(expected.sort());
  });

  it('names the scale/octave formats without a link for a layout that is not twelve keys per octave, saying why', async () => {
    const seven = { ...fenFifths, mapping: { rootKey: 60 } };
    await open(null, { ...shared, document: seven });
    const hrefs = Array.from(page().querySelectorAll<HTMLAnchorElement>('.downloads li a')).map(
      (a) => a.getAttribute('href'),
    );
    expect(hrefs.some((href) => href!.includes('mts-octave'))).toBeFalse();
    expect(hrefs.length).toBe(11);
    const refused = Array.from(page().querySelectorAll('.downloads li')).filter((li) =>
      li.querySelector('.refused-format'),
    );
    expect(refused.map((li) => li.querySelector('.refused-format')!.textContent!.trim())).toEqual([
      'MTS scale/octave, 1-byte (.syx)',
      'MTS scale/octave, 2-byte (.syx)',
    ]);
    expect(refused[0].textContent).toContain(
      'Not for this preset: This layout repeats every 7 keys, and scale/octave tuning needs 12 keys an octave',
    );
  });

  it('asks a signed-out guest to sign in before forking, and to come back here', async () => {
    await open(null);
    const link = page().querySelector<HTMLAnchorElement>('a.sign-in-link')!;
    expect(link.textContent).toContain('Sign in to fork to your library');
    expect(link.getAttribute('href')).toBe('/auth/github?next=%2Fs%2Ftok-123');
    expect(page().querySelector('button.fork-button')).toBeNull();
  });

  it('saves the shared document into my library when I fork it signed in', async () => {
    await open(tobias);
    page().querySelector<HTMLButtonElement>('button.fork-button')!.click();
    const save = http.expectOne('/api/presets');
    expect(save.request.method).toBe('POST');
    expect(save.request.body).toEqual({ document: fenFifths, note: 'Copied from a share link' });
    save.flush({ id: 'p9', revision: 1 }, { status: 201, statusText: 'Created' });
    await settle();
    expect(await pages.snackBar()).toContain('“Fen Fifths” is now in your library.');
  });

  it('says plainly when the link was revoked or never existed', async () => {
    await pages.open('/s/tok-123', null);
    http
      .expectOne('/api/shared/tok-123')
      .flush(
        { error: { code: 'not_found', message: 'No such shared preset.' } },
        { status: 404, statusText: 'Not Found' },
      );
    await settle();
    expect(page().querySelector('h1')!.textContent).toContain('This share link does not work');
    expect(page().querySelector('[role="alert"]')!.textContent).toContain('it was revoked');
  });

  it('names the faults of a document it cannot read instead of guessing', async () => {
    await open(null, { ...shared, document: { ...fenFifths, version: 2 } });
    expect(page().querySelector('.faults')!.textContent).toContain('version');
    expect(page().querySelector('app-degree-table')).toBeNull();
  });

  it("gives a member the file each of their instruments takes, by the instrument's id", async () => {
    await open(tobias, shared, [ondes, latticeBoard]);
    const link = () =>
      page().querySelector<HTMLAnchorElement>('.for-instrument a.instrument-file')!;
    expect(link().getAttribute('href')).toBe(
      '/api/shared/tok-123/export/mts-bulk?instrument=i-ondes',
    );
    expect(link().textContent).toContain('MTS bulk dump (.syx) for Ondes');
    page()
      .querySelector<HTMLElement>('.for-instrument mat-select .mat-mdc-select-trigger')!
      .click();
    await settle();
    Array.from(document.querySelectorAll<HTMLElement>('mat-option'))
      .find((o) => o.textContent!.includes('Lattice board'))!
      .click();
    await settle();
    expect(link().getAttribute('href')).toBe(
      '/api/shared/tok-123/export/mpe-smf?instrument=i-board',
    );
    expect(link().textContent).toContain('MPE MIDI file (.mid) for Lattice board');
  });

  it('lets a guest set up an instrument in this browser and download the dump for it, with its settings', async () => {
    await open(null);
    expect(page().querySelector('.for-instrument a.instrument-file')).toBeNull();
    page().querySelector<HTMLButtonElement>('.for-instrument button.set-up')!.click();
    await settle();
    const dialog = document.querySelector('mat-dialog-container')!;
    expect(dialog.textContent).toContain('kept in this browser only');
    const type = (label: string, value: string) => {
      const field = Array.from(dialog.querySelectorAll('mat-form-field')).find(
        (f) => f.querySelector('mat-label')!.textContent!.trim() === label,
      )!;
      const input = field.querySelector('input')!;
      input.value = value;
      input.dispatchEvent(new Event('input'));
    };
    type('Instrument name', 'Borrowed synth');
    type('Device id', '16');
    type('Tuning program', '5');
    type('Last member channel', '9');
    Array.from(dialog.querySelectorAll('button'))
      .find((b) => b.textContent!.includes('Add instrument'))!
      .click();
    const link = await waitFor(
      'the file for the new instrument',
      () => page().querySelector<HTMLAnchorElement>('a.instrument-file'),
      settle,
    );
    expect(link.getAttribute('href')).toBe(
      '/api/shared/tok-123/export/mts-bulk?receives=mts-bulk&deviceId=16&program=5&bank=0&bendRange=2&memberChannels=2-9',
    );
    const kept = JSON.parse(localStorage.getItem(browserInstrumentsKey)!) as { name: string }[];
    expect(kept.map((instrument) => instrument.name)).toEqual(['Borrowed synth']);
  });
});
