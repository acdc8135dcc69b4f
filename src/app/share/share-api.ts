import { HttpClient } from '@angular/common/http';
import { Injectable, inject } from '@angular/core';
import type { NewShareLink, ShareLink, SharedPreset } from '@shared/api/shares';
import type { ItemList } from '@shared/api/wire';
import { Observable, map } from 'rxjs';

export type { NewShareLink, ShareLink, SharedPreset } from '@shared/api/shares';

/** Read-only links to a preset that open without an account, and what such a link opens. */
@Injectable({ providedIn: 'root' })
export class ShareApi {
  private readonly http = inject(HttpClient);

  links(presetId: string): Observable<ShareLink[]> {
    return this.http
      .get<ItemList<ShareLink>>(`/api/presets/${encodeURIComponent(presetId)}/shares`)
      .pipe(map((answer) => answer.items));
  }

  /** A link to the latest revision, or pinned to `revision` when one is given. */
  createLink(presetId: string, revision: number | null): Observable<NewShareLink> {
    return this.http.post<NewShareLink>(
      `/api/presets/${encodeURIComponent(presetId)}/shares`,
      revision === null ? {} : { revision },
    );
  }

  revokeLink(shareId: string): Observable<void> {
    return this.http.delete<void>(`/api/shares/${encodeURIComponent(shareId)}`);
  }

  shared(token: string): Observable<SharedPreset> {
    return this.http.get<SharedPreset>(this.sharedPath(token));
  }

  exportUrl(token: string, format: string): string {
    return `${this.sharedPath(token)}/export/${encodeURIComponent(format)}`;
  }

  bundleUrl(token: string): string {
    return `${this.sharedPath(token)}/bundle`;
  }

  private sharedPath(token: string): string {
    return `/api/shared/${encodeURIComponent(token)}`;
  }
}
