import { HttpClient } from '@angular/common/http';
import { Injectable, inject } from '@angular/core';
import type { AuditEntry } from '@shared/api/audit';
import type { BandDetail, BandSummary, CreatedBand, PendingInvite } from '@shared/api/bands';
import type { BandRole } from '@shared/api/roles';
import type { ItemList } from '@shared/api/wire';
import { Observable, map } from 'rxjs';

export type { AuditEntry } from '@shared/api/audit';
export type { BandDetail, BandMember, BandSummary, PendingInvite } from '@shared/api/bands';
export { type BandRole, bandRoles } from '@shared/api/roles';

/** How a role reads in a sentence: "as an editor". */
export const roleWithArticle: Record<BandRole, string> = {
  owner: 'an owner',
  editor: 'an editor',
  viewer: 'a viewer',
};

/** Bands, their members and roles, invitations and the audit log. */
@Injectable({ providedIn: 'root' })
export class BandsApi {
  private readonly http = inject(HttpClient);

  bands(): Observable<BandSummary[]> {
    return this.http.get<ItemList<BandSummary>>('/api/bands').pipe(map((answer) => answer.items));
  }

  createBand(name: string): Observable<CreatedBand> {
    return this.http.post<CreatedBand>('/api/bands', { name });
  }

  band(id: string): Observable<BandDetail> {
    return this.http.get<BandDetail>(this.bandPath(id));
  }

  changeRole(bandId: string, userId: string, role: BandRole): Observable<void> {
    return this.http
      .patch(`${this.bandPath(bandId)}/members/${encodeURIComponent(userId)}`, { role })
      .pipe(map(() => undefined));
  }

  /** Removes a member; removing myself is leaving the band. */
  removeMember(bandId: string, userId: string): Observable<void> {
    return this.http.delete<void>(`${this.bandPath(bandId)}/members/${encodeURIComponent(userId)}`);
  }

  invites(bandId: string): Observable<PendingInvite[]> {
    return this.http
      .get<ItemList<PendingInvite>>(`${this.bandPath(bandId)}/invites`)
      .pipe(map((answer) => answer.items));
  }

  invite(bandId: string, email: string, role: BandRole): Observable<void> {
    return this.http
      .post(`${this.bandPath(bandId)}/invites`, { email, role })
      .pipe(map(() => undefined));
  }

  resendInvite(bandId: string, inviteId: string): Observable<void> {
    return this.http
      .post(`${this.bandPath(bandId)}/invites/${encodeURIComponent(inviteId)}/resend`, {})
      .pipe(map(() => undefined));
  }

  revokeInvite(bandId: string, inviteId: string): Observable<void> {
    return this.http.delete<void>(
      `${this.bandPath(bandId)}/invites/${encodeURIComponent(inviteId)}`,
    );
  }

  audit(bandId: string): Observable<AuditEntry[]> {
    return this.http
      .get<ItemList<AuditEntry>>(`${this.bandPath(bandId)}/audit`)
      .pipe(map((answer) => answer.items));
  }

  private bandPath(id: string): string {
    return `/api/bands/${encodeURIComponent(id)}`;
  }
}
