import { HttpClient } from '@angular/common/http';
import { Injectable, inject } from '@angular/core';
import { Observable, map } from 'rxjs';

export type BandRole = 'owner' | 'editor' | 'viewer';

export const bandRoles: readonly BandRole[] = ['owner', 'editor', 'viewer'];

/** How a role reads in a sentence: "as an editor". */
export const roleWithArticle: Record<BandRole, string> = { owner: 'an owner', editor: 'an editor', viewer: 'a viewer' };

export interface BandSummary {
  id: string;
  name: string;
  role: BandRole;
  createdAt: string;
}

export interface BandMember {
  userId: string;
  login: string;
  name: string | null;
  avatarUrl: string | null;
  role: BandRole;
  joinedAt: string;
}

export interface BandDetail {
  id: string;
  name: string;
  createdAt: string;
  role: BandRole;
  canManage: boolean;
  members: BandMember[];
}

export interface PendingInvite {
  id: string;
  email: string;
  role: BandRole;
  createdAt: string;
  expiresAt: string;
}

export interface AuditEntry {
  id: number | string;
  action: string;
  presetId: string | null;
  detail: Record<string, unknown> | null;
  createdAt: string;
  actorLogin: string | null;
  actorName: string | null;
}

/** Bands, their members and roles, invitations and the audit log. */
@Injectable({ providedIn: 'root' })
export class BandsApi {
  private readonly http = inject(HttpClient);

  bands(): Observable<BandSummary[]> {
    return this.http.get<{ items: BandSummary[] }>('/api/bands').pipe(map((answer) => answer.items));
  }

  createBand(name: string): Observable<BandSummary> {
    return this.http.post<BandSummary>('/api/bands', { name });
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
      .get<{ items: PendingInvite[] }>(`${this.bandPath(bandId)}/invites`)
      .pipe(map((answer) => answer.items));
  }

  invite(bandId: string, email: string, role: BandRole): Observable<void> {
    return this.http.post(`${this.bandPath(bandId)}/invites`, { email, role }).pipe(map(() => undefined));
  }

  resendInvite(bandId: string, inviteId: string): Observable<void> {
    return this.http
      .post(`${this.bandPath(bandId)}/invites/${encodeURIComponent(inviteId)}/resend`, {})
      .pipe(map(() => undefined));
  }

  revokeInvite(bandId: string, inviteId: string): Observable<void> {
    return this.http.delete<void>(`${this.bandPath(bandId)}/invites/${encodeURIComponent(inviteId)}`);
  }

  audit(bandId: string): Observable<AuditEntry[]> {
    return this.http.get<{ items: AuditEntry[] }>(`${this.bandPath(bandId)}/audit`).pipe(map((answer) => answer.items));
  }

  private bandPath(id: string): string {
    return `/api/bands/${encodeURIComponent(id)}`;
  }
}
