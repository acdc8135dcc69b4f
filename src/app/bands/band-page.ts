import { ChangeDetectionStrategy, Component, computed, inject, input } from '@angular/core';
import { MatButtonModule } from '@angular/material/button';
import { MatIconModule } from '@angular/material/icon';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { RouterLink } from '@angular/router';
import { catchError, forkJoin, of } from 'rxjs';
import { loader } from '../api/loader';
import { Session } from '../auth/session';
import { LibraryApi, PresetPage, PresetQuery } from '../library/library-api';
import { SignInPrompt } from '../library/sign-in-prompt';
import { BandSetlists } from '../setlists/band-setlists';
import { BandAudit } from './band-audit';
import { BandInvites } from './band-invites';
import { BandMembers } from './band-members';
import { BandDetail, BandsApi, roleWithArticle } from './bands-api';

const noPresets: PresetPage = { items: [], total: 0, page: 1, pageSize: 100 };

/** One band: members and roles, invites, its presets and (for owners) what happened in it. */
@Component({
  selector: 'app-band-page',
  changeDetection: ChangeDetectionStrategy.OnPush,
  imports: [
    RouterLink,
    MatButtonModule,
    MatIconModule,
    MatProgressBarModule,
    SignInPrompt,
    BandMembers,
    BandInvites,
    BandAudit,
    BandSetlists,
  ],
  templateUrl: './band-page.html',
  styleUrl: './band-page.scss',
})
export class BandPage {
  private readonly bandsApi = inject(BandsApi);
  private readonly libraryApi = inject(LibraryApi);
  protected readonly session = inject(Session);
  protected readonly roleWithArticle = roleWithArticle;

  /** The band's id, from the address. */
  readonly id = input.required<string>();

  private readonly loaded = loader(
    () => {
      const id = this.id();
      if (!this.session.member()) return null;
      return forkJoin({
        band: this.bandsApi.band(id),
        presets: this.bandPresets(id, false),
        trashed: this.bandPresets(id, true),
      });
    },
    {
      fallback: 'The band could not be loaded.',
      notFound: 'There is no such band, or you are not in it.',
    },
  );
  protected readonly band = computed<BandDetail | null>(() => this.loaded.value()?.band ?? null);
  protected readonly presets = computed(() => this.loaded.value()?.presets ?? noPresets);
  private readonly trashed = computed(() => this.loaded.value()?.trashed ?? noPresets);
  protected readonly failure = this.loaded.failure;

  protected readonly recentPresets = computed(() => this.presets().items.slice(0, 5));
  protected readonly presetNames = computed(
    () => new Map([...this.presets().items, ...this.trashed().items].map((p) => [p.id, p.name])),
  );

  protected reload(): void {
    this.loaded.reload();
  }

  /** The band's presets, newest first; a failure here leaves the rest of the page standing. */
  private bandPresets(bandId: string, trash: boolean) {
    const query: PresetQuery = { q: '', sort: '-updated', page: 1, pageSize: 100, bandId, trash };
    return this.libraryApi.presets(query).pipe(catchError(() => of(noPresets)));
  }
}
