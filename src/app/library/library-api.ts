import { HttpClient, HttpParams } from '@angular/common/http';
import { Injectable, inject } from '@angular/core';
import type {
  CreatedPreset,
  ForkedPreset,
  PresetPage,
  RevisionChanges,
  RevisionDocument,
  RevisionEntry,
  SavedPreset,
  SavedRevision,
} from '@shared/api/presets';
import type { ItemList } from '@shared/api/wire';
import { Observable, map } from 'rxjs';

export type PresetSort = 'name' | '-name' | 'updated' | '-updated';

export interface PresetQuery {
  q: string;
  sort: PresetSort;
  page: number;
  pageSize: number;
  bandId: string | null;
  trash: boolean;
}

export type {
  PresetPage,
  PresetRow,
  RevisionChanges,
  RevisionEntry,
  SavedPreset,
} from '@shared/api/presets';

/** The library of saved presets: mine and my bands', their revisions, forks and the trash. */
@Injectable({ providedIn: 'root' })
export class LibraryApi {
  private readonly http = inject(HttpClient);

  presets(query: PresetQuery): Observable<PresetPage> {
    let params = new HttpParams()
      .set('sort', query.sort)
      .set('page', query.page)
      .set('pageSize', query.pageSize);
    if (query.q) params = params.set('q', query.q);
    if (query.bandId) params = params.set('bandId', query.bandId);
    if (query.trash) params = params.set('trash', '1');
    return this.http.get<PresetPage>('/api/presets', { params });
  }

  preset(id: string): Observable<SavedPreset> {
    return this.http.get<SavedPreset>(`/api/presets/${encodeURIComponent(id)}`);
  }

  /** One revision of a preset, its document as saved. */
  revision(id: string, revision: number): Observable<RevisionDocument> {
    return this.http.get<RevisionDocument>(
      `/api/presets/${encodeURIComponent(id)}/revisions/${revision}`,
    );
  }

  revisions(id: string): Observable<RevisionEntry[]> {
    return this.http
      .get<ItemList<RevisionEntry>>(`/api/presets/${encodeURIComponent(id)}/revisions`)
      .pipe(map((answer) => answer.items));
  }

  /** What changed from the revision before `revision` to it. */
  changes(id: string, revision: number): Observable<RevisionChanges> {
    return this.http.get<RevisionChanges>(
      `/api/presets/${encodeURIComponent(id)}/revisions/${revision}/changes`,
    );
  }

  /** Saves an old revision again as the newest one; answers the new revision's number. */
  restore(id: string, revision: number): Observable<number> {
    return this.http
      .post<SavedRevision>(`/api/presets/${encodeURIComponent(id)}/restore`, { revision })
      .pipe(map((answer) => answer.revision));
  }

  /** Copies the latest revision into my library (no band) or a band's; answers the new preset's id. */
  fork(id: string, bandId: string | null): Observable<string> {
    return this.http
      .post<ForkedPreset>(`/api/presets/${encodeURIComponent(id)}/fork`, bandId ? { bandId } : {})
      .pipe(map((answer) => answer.id));
  }

  /** Saves a preset document as a new preset in my library; answers its id. */
  saveCopy(document: unknown, note: string): Observable<string> {
    return this.http
      .post<CreatedPreset>('/api/presets', { document, note })
      .pipe(map((answer) => answer.id));
  }

  moveToTrash(id: string): Observable<void> {
    return this.http.delete<void>(`/api/presets/${encodeURIComponent(id)}`);
  }

  restoreFromTrash(id: string): Observable<void> {
    return this.http
      .post(`/api/presets/${encodeURIComponent(id)}/untrash`, {})
      .pipe(map(() => undefined));
  }
}
