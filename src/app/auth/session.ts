import { HttpClient } from '@angular/common/http';
import { Injectable, inject, signal } from '@angular/core';
import type { MeAnswer, Member } from '@shared/api/me';
import { firstValueFrom } from 'rxjs';

export type { Member } from '@shared/api/me';

/** Who is signed in, as the server says; `undefined` until the server has answered. */
@Injectable({ providedIn: 'root' })
export class Session {
  private readonly http = inject(HttpClient);
  readonly member = signal<Member | null | undefined>(undefined);

  async refresh(): Promise<void> {
    try {
      const answer = await firstValueFrom(this.http.get<MeAnswer>('/api/me'));
      this.member.set(answer.user);
    } catch {
      this.member.set(null);
    }
  }

  /** Sign-in is a full-page trip through the provider, which comes back to `returnTo` (a path of this app). */
  signInUrl(returnTo: string): string {
    return `/auth/github?next=${encodeURIComponent(returnTo)}`;
  }

  async signOut(): Promise<void> {
    await firstValueFrom(this.http.post('/auth/logout', null));
    this.member.set(null);
  }
}
