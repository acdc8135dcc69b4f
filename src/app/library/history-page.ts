import { DatePipe } from '@angular/common';
import {
  ChangeDetectionStrategy,
  Component,
  computed,
  inject,
  input,
  linkedSignal,
} from '@angular/core';
import { MatButtonModule } from '@angular/material/button';
import { MatDialog } from '@angular/material/dialog';
import { MatIconModule } from '@angular/material/icon';
import { MatListModule } from '@angular/material/list';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { MatSnackBar } from '@angular/material/snack-bar';
import { RouterLink } from '@angular/router';
import { filter, forkJoin, map, switchMap } from 'rxjs';
import { apiErrorMessage } from '../api/api-error';
import { loader } from '../api/loader';
import { Session } from '../auth/session';
import { ConfirmDialog, ConfirmDialogData } from './confirm-dialog';
import { LibraryApi, RevisionChanges, RevisionEntry } from './library-api';
import { SignInPrompt } from './sign-in-prompt';

/** Every revision of one preset, what each changed, and a restore that saves an old one again as the newest. */
@Component({
  selector: 'app-history-page',
  changeDetection: ChangeDetectionStrategy.OnPush,
  imports: [
    DatePipe,
    RouterLink,
    MatButtonModule,
    MatIconModule,
    MatListModule,
    MatProgressBarModule,
    SignInPrompt,
  ],
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

  private readonly history = loader(
    () => {
      const id = this.id();
      if (!this.session.member()) return null;
      return forkJoin({ preset: this.api.preset(id), revisions: this.api.revisions(id) });
    },
    {
      fallback: 'The history could not be loaded.',
      notFound: 'There is no such preset, or it is not shared with you.',
    },
  );
  protected readonly preset = computed(() => this.history.value()?.preset ?? null);
  protected readonly revisions = computed(() => this.history.value()?.revisions ?? []);
  protected readonly failure = this.history.failure;
  /** The revision shown: the newest whenever the history (re)loads, until another is picked. */
  protected readonly selected = linkedSignal<number | null>(
    () => this.revisions()[0]?.revision ?? null,
  );

  /** What the selected revision changed since the one before; revision 1 has nothing before it. */
  private readonly revisionChanges = loader(
    () => {
      const revision = this.selected();
      return revision === null || revision < 2 ? null : this.api.changes(this.id(), revision);
    },
    { fallback: 'The changes could not be worked out.' },
  );
  protected readonly changes = computed<RevisionChanges | null>(() =>
    this.revisionChanges.loading() ? null : (this.revisionChanges.value() ?? null),
  );
  protected readonly changesFailure = computed(() =>
    this.revisionChanges.loading() ? null : this.revisionChanges.failure(),
  );

  protected readonly entry = computed(
    () => this.revisions().find((r) => r.revision === this.selected()) ?? null,
  );
  protected readonly latest = computed(() => this.preset()?.revision ?? 0);
  protected readonly canRestore = computed(() => this.preset()?.access !== 'read');

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
          this.history.reload();
        },
        error: (error: unknown) => void this.tellFailure(error),
      });
  }

  private async tellFailure(error: unknown): Promise<void> {
    const message = await apiErrorMessage(error, 'The revision could not be restored.');
    this.snackBar.open(message, 'Close', { duration: 8000 });
  }
}
