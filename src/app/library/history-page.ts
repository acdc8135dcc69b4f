import { DatePipe } from '@angular/common';
import { ChangeDetectionStrategy, Component, computed, inject, input, signal } from '@angular/core';
import { takeUntilDestroyed, toObservable } from '@angular/core/rxjs-interop';
import { MatButtonModule } from '@angular/material/button';
import { MatDialog } from '@angular/material/dialog';
import { MatIconModule } from '@angular/material/icon';
import { MatListModule } from '@angular/material/list';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { MatSnackBar } from '@angular/material/snack-bar';
import { RouterLink } from '@angular/router';
import { EMPTY, catchError, filter, forkJoin, map, of, switchMap } from 'rxjs';
import { Session } from '../auth/session';
import { apiErrorMessage, isNotFound } from './api-error';
import { ConfirmDialog, ConfirmDialogData } from './confirm-dialog';
import { LibraryApi, PresetDetail, RevisionChanges, RevisionEntry } from './library-api';
import { SignInPrompt } from './sign-in-prompt';

/** Every revision of one preset, what each changed, and a restore that saves an old one again as the newest. */
@Component({
  selector: 'app-history-page',
  changeDetection: ChangeDetectionStrategy.OnPush,
  imports: [DatePipe, RouterLink, MatButtonModule, MatIconModule, MatListModule, MatProgressBarModule, SignInPrompt],
  templateUrl: './history-page.html',
  styleUrl: './history-page.scss',
})
export class HistoryPage {
  private readonly api = inject(LibraryApi);
  private readonly dialog = inject(MatDialog);
  private readonly snackBar = inject(MatSnackBar);
  protected readonly session = inject(Session);

  /** The preset's id, from the address. */
  readonly id = input.required<string>();

  private readonly reloads = signal(0);
  protected readonly preset = signal<PresetDetail | null>(null);
  protected readonly revisions = signal<RevisionEntry[]>([]);
  protected readonly failure = signal<string | null>(null);
  protected readonly selected = signal<number | null>(null);
  protected readonly changes = signal<RevisionChanges | null>(null);
  protected readonly changesFailure = signal<string | null>(null);

  protected readonly entry = computed(() => this.revisions().find((r) => r.revision === this.selected()) ?? null);
  protected readonly latest = computed(() => this.preset()?.revision ?? 0);
  protected readonly canRestore = computed(() => this.preset()?.access !== 'read');

  constructor() {
    const request = computed(() => (this.session.member() ? { id: this.id(), reload: this.reloads() } : null));
    toObservable(request)
      .pipe(
        filter((r) => r !== null),
        switchMap(({ id }) =>
          forkJoin({ preset: this.api.preset(id), revisions: this.api.revisions(id) }).pipe(
            catchError((error: unknown) => {
              this.failure.set(
                isNotFound(error)
                  ? 'There is no such preset, or it is not shared with you.'
                  : apiErrorMessage(error, 'The history could not be loaded.'),
              );
              return EMPTY;
            }),
          ),
        ),
        takeUntilDestroyed(),
      )
      .subscribe(({ preset, revisions }) => {
        this.preset.set(preset);
        this.revisions.set(revisions);
        this.failure.set(null);
        this.selected.set(revisions[0]?.revision ?? null);
      });
    toObservable(this.selected)
      .pipe(
        switchMap((revision) => {
          this.changes.set(null);
          this.changesFailure.set(null);
          if (revision === null || revision < 2) return of(null);
          return this.api.changes(this.id(), revision).pipe(
            catchError((error: unknown) => {
              this.changesFailure.set(apiErrorMessage(error, 'The changes could not be worked out.'));
              return of(null);
            }),
          );
        }),
        takeUntilDestroyed(),
      )
      .subscribe((changes) => this.changes.set(changes));
  }

  protected authorOf(entry: RevisionEntry): string {
    return entry.authorName ?? entry.authorLogin ?? 'a former member';
  }

  protected selectRevision(revision: number): void {
    this.selected.set(revision);
  }

  protected restoreRevision(entry: RevisionEntry): void {
    const next = this.latest() + 1;
    const data: ConfirmDialogData = {
      title: `Restore revision ${entry.revision}?`,
      message:
        `Revision ${entry.revision}'s tuning is saved again as a new revision ${next}. Nothing is overwritten: ` +
        `revisions 1 to ${this.latest()} stay in the history, and you can go back to any of them.`,
      confirm: `Save as revision ${next}`,
    };
    this.dialog
      .open<ConfirmDialog, ConfirmDialogData, boolean>(ConfirmDialog, { data })
      .afterClosed()
      .pipe(
        filter((yes) => yes === true),
        switchMap(() => this.api.restore(this.id(), entry.revision)),
        map((revision) => `Revision ${entry.revision} is saved again as revision ${revision}.`),
      )
      .subscribe({
        next: (message) => {
          this.snackBar.open(message, 'Close', { duration: 6000 });
          this.reloads.update((n) => n + 1);
        },
        error: (error: unknown) =>
          this.snackBar.open(apiErrorMessage(error, 'The revision could not be restored.'), 'Close', { duration: 8000 }),
      });
  }
}
