import { HttpClient } from '@angular/common/http';
import { Injectable, inject } from '@angular/core';
import type { BandSummary } from '@shared/api/bands';
import type { CreatedPreset, ForkedPreset, SavedPreset, SavedRevision } from '@shared/api/presets';
import type { ItemList } from '@shared/api/wire';
import { type Observable, map } from 'rxjs';
import type { DraftDocument } from './draft-document';

/** A band the signed-in member belongs to, with their role in it. */
export type BandMembership = BandSummary;

/** The library calls the designer makes (the library routes of the HTTP API). */
@Injectable({ providedIn: 'root' })
export class PresetApi {
  private readonly http = inject(HttpClient);

  load(id: string): Observable<SavedPreset> {
    return this.http.get<SavedPreset>(`/api/presets/${encodeURIComponent(id)}`);
  }

  create(document: DraftDocument, bandId: string | null, note: string): Observable<CreatedPreset> {
    const body = { document, ...(bandId ? { bandId } : {}), ...(note ? { note } : {}) };
    return this.http.post<CreatedPreset>('/api/presets', body);
  }

  saveRevision(id: string, document: DraftDocument, note: string): Observable<SavedRevision> {
    const body = { document, ...(note ? { note } : {}) };
    const path = `/api/presets/${encodeURIComponent(id)}/revisions`;
    return this.http.post<SavedRevision>(path, body);
  }

  fork(id: string): Observable<ForkedPreset> {
    return this.http.post<ForkedPreset>(`/api/presets/${encodeURIComponent(id)}/fork`, {});
  }

  /** The bands whose library the member may save into: those where they are owner or editor. */
  writableBands(): Observable<BandMembership[]> {
    const writable = (band: BandMembership) => band.role === 'owner' || band.role === 'editor';
    return this.http
      .get<ItemList<BandSummary>>('/api/bands')
      .pipe(map((answer) => answer.items.filter(writable)));
  }
}
