import { HttpClient } from '@angular/common/http';
import { Injectable, inject } from '@angular/core';
import { Observable } from 'rxjs';
import type { AcceptedInvite, InviteSummary } from '@shared/api/bands';

export type { InviteSummary } from '@shared/api/bands';

/** What an invite link is for, and accepting it. */
@Injectable({ providedIn: 'root' })
export class InviteApi {
  private readonly http = inject(HttpClient);

  invite(token: string): Observable<InviteSummary> {
    return this.http.get<InviteSummary>(this.invitePath(token));
  }

  accept(token: string): Observable<AcceptedInvite> {
    return this.http.post<AcceptedInvite>(`${this.invitePath(token)}/accept`, {});
  }

  private invitePath(token: string): string {
    return `/api/invites/${encodeURIComponent(token)}`;
  }
}
