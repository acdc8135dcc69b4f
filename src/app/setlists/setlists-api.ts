import { HttpClient } from '@angular/common/http';
import { Injectable, inject } from '@angular/core';
import type { Setlist, SetlistBody } from '@shared/api/setlists';
import type { ItemList } from '@shared/api/wire';
import { Observable, map } from 'rxjs';

export type { Setlist, SetlistBody, SetlistEntry } from '@shared/api/setlists';

/** A band's setlists: ordered presets, each following the latest revision or pinned, each with its trigger. */
@Injectable({ providedIn: 'root' })
export class SetlistsApi {
  private readonly http = inject(HttpClient);

  setlists(bandId: string): Observable<Setlist[]> {
    return this.http
      .get<ItemList<Setlist>>(this.bandPath(bandId))
      .pipe(map((answer) => answer.items));
  }

  create(bandId: string, body: SetlistBody): Observable<Setlist> {
    return this.http.post<Setlist>(this.bandPath(bandId), body);
  }

  setlist(id: string): Observable<Setlist> {
    return this.http.get<Setlist>(this.path(id));
  }

  /** Replaces the whole list: its name and its entries, in order. */
  save(id: string, body: SetlistBody): Observable<Setlist> {
    return this.http.put<Setlist>(this.path(id), body);
  }

  remove(id: string): Observable<void> {
    return this.http.delete<void>(this.path(id));
  }

  private bandPath(bandId: string): string {
    return `/api/bands/${encodeURIComponent(bandId)}/setlists`;
  }

  private path(id: string): string {
    return `/api/setlists/${encodeURIComponent(id)}`;
  }
}
