import { Component, computed, inject, input, signal } from '@angular/core';
import { takeUntilDestroyed, toObservable } from '@angular/core/rxjs-interop';
import { MatButtonModule } from '@angular/material/button';
import { MatIconModule } from '@angular/material/icon';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { RouterLink } from '@angular/router';
import { EMPTY, catchError, filter, forkJoin, of, switchMap } from 'rxjs';
import { Session } from '../auth/session';
import { apiErrorMessage, isNotFound } from '../library/api-error';
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
  imports: [
    RouterLink, MatButtonModule, MatIconModule, MatProgressBarModule, SignInPrompt, BandMembers,
    BandInvites, BandAudit, BandSetlists,
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

  private readonly reloads = signal(0);
  protected readonly band = signal<BandDetail | null>(null);
  protected readonly presets = signal<PresetPage>(noPresets);
  private readonly trashed = signal<PresetPage>(noPresets);
  protected readonly failure = signal<string | null>(null);

  protected readonly recentPresets = computed(() => this.presets().items.slice(0, 5));
  protected readonly presetNames = computed(
    () => new Map([...this.presets().items, ...this.trashed().items].map((p) => [p.id, p.name])),
  );

  constructor() {
    const request = computed(() => (this.session.member() ? { id: this.id(), reload: this.reloads() } : null));
    toObservable(request)
      .pipe(
        filter((r) => r !== null),
        switchMap(({ id }) =>
          forkJoin({
            band: this.bandsApi.band(id),
            presets: this.bandPresets(id, false),
            trashed: this.bandPresets(id, true),
          }).pipe(
            catchError((error: unknown) => {
              this.failure.set(
                isNotFound(error)
                  ? 'There is no such band, or you are not in it.'
                  : apiErrorMessage(error, 'The band could not be loaded.'),
              );
              return EMPTY;
            }),
          ),
        ),
        takeUntilDestroyed(),
      )
      .subscribe(({ band, presets, trashed }) => {
        this.failure.set(null);
        this.band.set(band);
        this.presets.set(presets);
        this.trashed.set(trashed);
      });
  }

  protected reload(): void {
    this.reloads.update((n) => n + 1);
  }

  /** The band's presets, newest first; a failure here leaves the rest of the page standing. */
  private bandPresets(bandId: string, trash: boolean) {
    const query: PresetQuery = { q: '', sort: '-updated', page: 1, pageSize: 100, bandId, trash };
    return this.libraryApi.presets(query).pipe(catchError(() => of(noPresets)));
  }
}
