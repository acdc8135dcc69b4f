import { HttpClient } from '@angular/common/http';
import { Injectable, inject } from '@angular/core';
import type { Instrument } from '@shared/api/instruments';
import type { RevisionDocument } from '@shared/api/presets';
import type { Setlist } from '@shared/api/setlists';
import type { ItemList } from '@shared/api/wire';
import { Observable, map } from 'rxjs';

export type { Instrument } from '@shared/api/instruments';
export type { Setlist, SetlistEntry, StagePosition } from '@shared/api/setlists';

/** What the stage page asks the server: the setlist, its moves, the member's instruments. */
@Injectable({ providedIn: 'root' })
export class StageApi {
  private readonly http = inject(HttpClient);

  setlist(id: string): Observable<Setlist> {
    return this.http.get<Setlist>(this.setlistPath(id));
  }

  /** Moves the stage (editors); the answer is the setlist at its new position. */
  move(id: string, position: number): Observable<Setlist> {
    return this.http.post<Setlist>(`${this.setlistPath(id)}/position`, { position });
  }

  /** The address of the setlist's live stream (Server-Sent Events). */
  livePath(id: string): string {
    return `${this.setlistPath(id)}/live`;
  }

  /** The document of one revision of a preset. */
  revision(presetId: string, revision: number): Observable<unknown> {
    const path = `/api/presets/${encodeURIComponent(presetId)}/revisions/${revision}`;
    return this.http.get<RevisionDocument>(path).pipe(map((answer) => answer.document));
  }

  instruments(): Observable<Instrument[]> {
    return this.http
      .get<ItemList<Instrument>>('/api/instruments')
      .pipe(map((answer) => answer.items));
  }

  private setlistPath(id: string): string {
    return `/api/setlists/${encodeURIComponent(id)}`;
  }
}
