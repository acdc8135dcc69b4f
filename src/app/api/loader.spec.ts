import { HttpClient, provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { type WritableSignal, signal } from '@angular/core';
import { TestBed } from '@angular/core/testing';
import { map } from 'rxjs';
import { patientSpecMs, waitFor } from '../testing/wait-for';
import { type Loaded, loader } from './loader';

interface Band {
  id: string;
  name: string;
}

describe('loader', () => {
  let http: HttpTestingController;
  let client: HttpClient;

  beforeEach(() => {
    TestBed.configureTestingModule({
      providers: [provideHttpClient(), provideHttpClientTesting()],
    });
    http = TestBed.inject(HttpTestingController);
    client = TestBed.inject(HttpClient);
  });

  afterEach(() => http.verify());

  /** A loader of one band, made as a page makes it: in an injection context. */
  function bandLoader(id: WritableSignal<string | null>, notFound?: string): Loaded<Band> {
    return TestBed.runInInjectionContext(() =>
      loader(
        () => {
          const band = id();
          return band === null ? null : client.get<Band>(`/api/bands/${band}`);
        },
        { fallback: 'The band could not be loaded.', notFound },
      ),
    );
  }

  it('is loading, then holds the value', () => {
    const band = bandLoader(signal('b-fen'));
    expect(band.loading()).toBeFalse();
    TestBed.tick();
    expect(band.loading()).toBeTrue();
    expect(band.value()).toBeUndefined();
    http.expectOne('/api/bands/b-fen').flush({ id: 'b-fen', name: 'Copper Fen' });
    expect(band.loading()).toBeFalse();
    expect(band.value()).toEqual({ id: 'b-fen', name: 'Copper Fen' });
    expect(band.failure()).toBeNull();
  });

  it(
    'says why a load failed in the words of a JSON error body',
    async () => {
      const band = bandLoader(signal('b-fen'));
      TestBed.tick();
      const body = { error: { code: 'forbidden', message: 'Only owners see the log.' } };
      http.expectOne('/api/bands/b-fen').flush(body, { status: 403, statusText: 'Forbidden' });
      expect(await waitFor('the failure', () => band.failure())).toBe('Only owners see the log.');
      expect(band.loading()).toBeFalse();
      expect(band.value()).toBeUndefined();
    },
    patientSpecMs,
  );

  it(
    'reads the error body of a Blob request',
    async () => {
      const file = TestBed.runInInjectionContext(() =>
        loader(() => client.get('/api/presets/p-1/export/mts-bulk', { responseType: 'blob' }), {
          fallback: 'The file could not be made.',
        }),
      );
      TestBed.tick();
      // A refusal as server/http/errors.ts writes it.
      const refusal = { error: { code: 'not_found', message: 'No such preset.' } };
      const body = new Blob([JSON.stringify(refusal)], { type: 'application/json' });
      http
        .expectOne('/api/presets/p-1/export/mts-bulk')
        .flush(body, { status: 404, statusText: 'Not Found' });
      expect(await waitFor('the failure', () => file.failure())).toBe('No such preset.');
    },
    patientSpecMs,
  );

  it(
    'says the fallback when the server gave no message, and its own words for a 404',
    async () => {
      const id = signal<string | null>('b-fen');
      const band = bandLoader(id, 'There is no such band, or you are not in it.');
      TestBed.tick();
      http.expectOne('/api/bands/b-fen').flush(null, { status: 500, statusText: 'Server Error' });
      const fallback = await waitFor('the fallback', () => band.failure());
      expect(fallback).toBe('The band could not be loaded.');
      id.set('b-gone');
      TestBed.tick();
      http.expectOne('/api/bands/b-gone').flush(null, { status: 404, statusText: 'Not Found' });
      const notFound = () => band.failure()?.startsWith('There is no such band');
      await waitFor('the words for a 404', notFound);
      expect(band.failure()).toBe('There is no such band, or you are not in it.');
    },
    patientSpecMs,
  );

  it(
    'fetches again on reload, keeping the value meanwhile and after a failure',
    async () => {
      const band = bandLoader(signal('b-fen'));
      TestBed.tick();
      http.expectOne('/api/bands/b-fen').flush({ id: 'b-fen', name: 'Copper Fen' });
      band.reload();
      TestBed.tick();
      expect(band.loading()).toBeTrue();
      expect(band.value()?.name).toBe('Copper Fen');
      const refusal = { error: { code: 'unavailable', message: 'The database is not answering.' } };
      const unavailable = { status: 503, statusText: 'Service Unavailable' };
      http.expectOne('/api/bands/b-fen').flush(refusal, unavailable);
      await waitFor('the failure', () => band.failure());
      expect(band.value()?.name).toBe('Copper Fen');
      band.reload();
      TestBed.tick();
      http.expectOne('/api/bands/b-fen').flush({ id: 'b-fen', name: 'Copper Fen Quartet' });
      expect(band.value()?.name).toBe('Copper Fen Quartet');
      expect(band.failure()).toBeNull();
    },
    patientSpecMs,
  );

  it('drops a load under way when the request changes, and clears all when there is none', () => {
    const id = signal<string | null>('b-fen');
    const band = bandLoader(id);
    TestBed.tick();
    const first = http.expectOne('/api/bands/b-fen');
    id.set('b-reed');
    TestBed.tick();
    expect(first.cancelled).toBeTrue();
    http.expectOne('/api/bands/b-reed').flush({ id: 'b-reed', name: 'Reed Hollow' });
    expect(band.value()?.name).toBe('Reed Hollow');
    id.set(null);
    TestBed.tick();
    expect(band.value()).toBeUndefined();
    expect(band.loading()).toBeFalse();
    http.expectNone(() => true);
  });

  it('gives what the request maps the answer to', () => {
    const bands = TestBed.runInInjectionContext(() =>
      loader(
        () => client.get<{ items: Band[] }>('/api/bands').pipe(map((answer) => answer.items)),
        { fallback: 'Your bands could not be loaded.' },
      ),
    );
    TestBed.tick();
    http.expectOne('/api/bands').flush({ items: [{ id: 'b-fen', name: 'Copper Fen' }] });
    expect(bands.value()).toEqual([{ id: 'b-fen', name: 'Copper Fen' }]);
  });
});
