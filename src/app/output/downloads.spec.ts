import { HttpErrorResponse, HttpHeaders, provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { TestBed } from '@angular/core/testing';
import { exportFormats as catalogue } from '@shared/export/export-catalogue';
import { apiErrorMessage } from '../api/api-error';
import { newDraft } from '../design/draft-document';
import { Downloads, fileNameFrom } from './downloads';
import { exportFormats } from './export-formats';

const format = (id: string) => exportFormats.find((candidate) => candidate.id === id)!;

describe('Downloads', () => {
  let downloads: Downloads;
  let http: HttpTestingController;
  let clicked: HTMLAnchorElement[];

  beforeEach(() => {
    TestBed.configureTestingModule({
      providers: [provideHttpClient(), provideHttpClientTesting()],
    });
    downloads = TestBed.inject(Downloads);
    http = TestBed.inject(HttpTestingController);
    clicked = [];
    spyOn(HTMLAnchorElement.prototype, 'click').and.callFake(function (this: HTMLAnchorElement) {
      clicked.push(this);
    });
  });

  afterEach(() => http.verify());

  it('sends an unsaved design to the preview export and saves the file under the name the server gives', async () => {
    const draft = newDraft();
    const done = downloads.download(format('mts-bulk'), { document: draft });
    const request = http.expectOne('/api/preview/export/mts-bulk');
    expect(request.request.method).toBe('POST');
    expect(request.request.body).toEqual(draft);
    request.flush(new Blob([new Uint8Array([0xf0, 0xf7])]), {
      headers: new HttpHeaders({ 'Content-Disposition': 'attachment; filename="new-scale.syx"' }),
    });
    expect(await done).toEqual({ name: 'new-scale.syx', warnings: [] });
    expect(clicked.length).toBe(1);
    expect(clicked[0].download).toBe('new-scale.syx');
    expect(clicked[0].href).toMatch(/^blob:/);
  });

  it('fetches a saved preset by id, and its bundle from the bundle address', async () => {
    const sfz = downloads.download(format('sfz'), { presetId: 'p-1' });
    http
      .expectOne({ method: 'GET', url: '/api/presets/p-1/export/sfz' })
      .flush(new Blob(['<region>']));
    expect((await sfz).name)
      .withContext('no Content-Disposition: a name of our own')
      .toBe('keyloom-sfz.sfz');

    const bundle = downloads.download(format('bundle'), { presetId: 'p-1' });
    http.expectOne({ method: 'GET', url: '/api/presets/p-1/bundle' }).flush(new Blob(['PK']));
    await bundle;
  });

  it('passes on what the server says about a file it made', async () => {
    const done = downloads.download(format('mts-bulk'), { presetId: 'p-1' });
    const warnings = encodeURIComponent(
      JSON.stringify(['mapping: key 127 lies outside the pitches MTS can express']),
    );
    http
      .expectOne('/api/presets/p-1/export/mts-bulk')
      .flush(new Blob(['x']), { headers: new HttpHeaders({ 'Keyloom-Warnings': warnings }) });
    expect((await done).warnings).toEqual([
      'mapping: key 127 lies outside the pitches MTS can express',
    ]);
  });

  it("passes on the server's refusal in its own words", async () => {
    const done = downloads.download(format('mts-octave-1'), { document: newDraft() });
    const refusal = {
      error: {
        code: 'not_twelve',
        message: 'Scale/octave tuning needs 12 keys per octave.',
        field: 'mapping',
      },
    };
    http.expectOne('/api/preview/export/mts-octave-1').flush(new Blob([JSON.stringify(refusal)]), {
      status: 422,
      statusText: 'Unprocessable Content',
    });
    const error = await done.then(
      () => null,
      (failure: unknown) => failure,
    );
    expect(error).toBeInstanceOf(HttpErrorResponse);
    expect(await apiErrorMessage(error)).toBe('Scale/octave tuning needs 12 keys per octave.');
    expect(clicked).toEqual([]);
  });

  it('offers every export format, each with a line on what it is for', () => {
    expect(exportFormats.map((candidate) => candidate.id)).toEqual([
      'mts-bulk',
      'mts-bulk-bank',
      'mts-notes',
      'mts-octave-1',
      'mts-octave-2',
      'smf',
      'mpe-smf',
      'bend-csv',
      'bend-json',
      'key-csv',
      'sfz',
      'tuner-sheet',
      'preset',
      'bundle',
    ]);
    expect(exportFormats.every((candidate) => candidate.use.length > 20)).toBeTrue();
  });

  it('agrees with the shared export catalogue on every id and file ending', () => {
    for (const entry of catalogue) {
      expect(exportFormats.find((candidate) => candidate.id === entry.id)?.extension)
        .withContext(entry.id)
        .toBe(entry.extension);
    }
  });
});

describe('fileNameFrom', () => {
  it('prefers the UTF-8 name and falls back to the plain one', () => {
    expect(
      fileNameFrom(`attachment; filename="fifths.syx"; filename*=UTF-8''f%C3%BCnftel.syx`),
    ).toBe('fünftel.syx');
    expect(fileNameFrom(`attachment; filename*=UTF-8''%E0%A4%A; filename="plain.syx"`)).toBe(
      'plain.syx',
    );
    expect(fileNameFrom('attachment; filename=bare.mid')).toBe('bare.mid');
    expect(fileNameFrom(null)).toBeNull();
  });
});
