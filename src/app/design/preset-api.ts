import { HttpClient } from '@angular/common/http';
import { Injectable, inject } from '@angular/core';
import type { PresetDocument } from '@shared/preset/preset-document';
import { firstValueFrom } from 'rxjs';
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

/** The library calls the designer makes (the library routes of the HTTP API). */
@Injectable({ providedIn: 'root' })
export class PresetApi {
  private readonly http = inject(HttpClient);

  load(id: string): Promise<SavedPresetAnswer> {
    return firstValueFrom(this.http.get<SavedPresetAnswer>(`/api/presets/${encodeURIComponent(id)}`));
  }

  create(document: DraftDocument, bandId: string | null, note: string): Promise<{ id: string; revision: number }> {
    const body = { document, ...(bandId ? { bandId } : {}), ...(note ? { note } : {}) };
    return firstValueFrom(this.http.post<{ id: string; revision: number }>('/api/presets', body));
  }

  saveRevision(id: string, document: DraftDocument, note: string): Promise<{ revision: number }> {
    const body = { document, ...(note ? { note } : {}) };
    return firstValueFrom(this.http.post<{ revision: number }>(`/api/presets/${encodeURIComponent(id)}/revisions`, body));
  }

  fork(id: string): Promise<{ id: string }> {
    return firstValueFrom(this.http.post<{ id: string }>(`/api/presets/${encodeURIComponent(id)}/fork`, {}));
  }

  /** The bands whose library the member may save into: those where they are owner or editor. */
  async writableBands(): Promise<BandMembership[]> {
    const answer = await firstValueFrom(this.http.get<{ items: BandMembership[] }>('/api/bands'));
    return answer.items.filter((band) => band.role === 'owner' || band.role === 'editor');
  }
}
