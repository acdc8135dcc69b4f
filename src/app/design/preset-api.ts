import { HttpClient } from '@angular/common/http';
import { Injectable, inject } from '@angular/core';
import type { BandSummary } from '@shared/api/bands';
import type { CreatedPreset, ForkedPreset, SavedPreset, SavedRevision } from '@shared/api/presets';
import type { ItemList } from '@shared/api/wire';
import { firstValueFrom } from 'rxjs';
import type { DraftDocument } from './draft-document';

/** A band the signed-in member belongs to, with their role in it. */
export type BandMembership = BandSummary;

/** The library calls the designer makes (DESIGN.md "HTTP API"). */
@Injectable({ providedIn: 'root' })
export class PresetApi {
  private readonly http = inject(HttpClient);

  load(id: string): Promise<SavedPreset> {
    return firstValueFrom(this.http.get<SavedPreset>(`/api/presets/${encodeURIComponent(id)}`));
  }

  create(document: DraftDocument, bandId: string | null, note: string): Promise<CreatedPreset> {
    const body = { document, ...(bandId ? { bandId } : {}), ...(note ? { note } : {}) };
    return firstValueFrom(this.http.post<CreatedPreset>('/api/presets', body));
  }

  saveRevision(id: string, document: DraftDocument, note: string): Promise<SavedRevision> {
    const body = { document, ...(note ? { note } : {}) };
    return firstValueFrom(this.http.post<SavedRevision>(`/api/presets/${encodeURIComponent(id)}/revisions`, body));
  }

  fork(id: string): Promise<ForkedPreset> {
    return firstValueFrom(this.http.post<ForkedPreset>(`/api/presets/${encodeURIComponent(id)}/fork`, {}));
  }

  /** The bands whose library the member may save into: those where they are owner or editor. */
  async writableBands(): Promise<BandMembership[]> {
    const answer = await firstValueFrom(this.http.get<ItemList<BandSummary>>('/api/bands'));
    return answer.items.filter((band) => band.role === 'owner' || band.role === 'editor');
  }
}
