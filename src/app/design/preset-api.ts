import { HttpClient } from '@angular/common/http';
import { Injectable, inject } from '@angular/core';
import type { PresetDocument } from '@shared/preset/preset-document';
import { type Observable, map } from 'rxjs';
import type { DraftDocument } from './draft-document';

/** A saved preset as `GET /api/presets/:id` answers it (the latest revision). */
interface SavedPresetAnswer {
  id: string;
  name: string;
  bandId: string | null;
  revision: number;
  document: PresetDocument;
  access: 'read' | 'edit' | 'own';
}

/** A band the signed-in member belongs to, with their role in it. */
export interface BandMembership {
  id: string;
  name: string;
  role: 'owner' | 'editor' | 'viewer';
}

/** The library calls the designer makes (DESIGN.md "HTTP API"). */
@Injectable({ providedIn: 'root' })
export class PresetApi {
  private readonly http = inject(HttpClient);

  load(id: string): Observable<SavedPresetAnswer> {
    return this.http.get<SavedPresetAnswer>(`/api/presets/${encodeURIComponent(id)}`);
  }

  create(
    document: DraftDocument,
    bandId: string | null,
    note: string,
  ): Observable<{ id: string; revision: number }> {
    const body = { document, ...(bandId ? { bandId } : {}), ...(note ? { note } : {}) };
    return this.http.post<{ id: string; revision: number }>('/api/presets', body);
  }

  saveRevision(
    id: string,
    document: DraftDocument,
    note: string,
  ): Observable<{ revision: number }> {
    const body = { document, ...(note ? { note } : {}) };
    const path = `/api/presets/${encodeURIComponent(id)}/revisions`;
    return this.http.post<{ revision: number }>(path, body);
  }

  fork(id: string): Observable<{ id: string }> {
    return this.http.post<{ id: string }>(`/api/presets/${encodeURIComponent(id)}/fork`, {});
  }

  /** The bands whose library the member may save into: those where they are owner or editor. */
  writableBands(): Observable<BandMembership[]> {
    const writable = (band: BandMembership) => band.role === 'owner' || band.role === 'editor';
    return this.http
      .get<{ items: BandMembership[] }>('/api/bands')
      .pipe(map((answer) => answer.items.filter(writable)));
  }
}
