import { ClipboardModule } from '@angular/cdk/clipboard';
import { DatePipe } from '@angular/common';
import { ChangeDetectionStrategy, Component, computed, inject, signal } from '@angular/core';
import { FormsModule } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MAT_DIALOG_DATA, MatDialogModule } from '@angular/material/dialog';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatInputModule } from '@angular/material/input';
import { MatRadioModule } from '@angular/material/radio';
import { MatSnackBar } from '@angular/material/snack-bar';
import { apiErrorMessage } from '../api/api-error';
import { loader } from '../api/loader';
import { NewShareLink, ShareApi, ShareLink } from './share-api';

export interface ShareDialogData {
  presetId: string;
  /** The revision on screen, offered for a pinned link. */
  revision: number;
  name: string;
}

/** Makes, copies and revokes read-only links to a preset. Open it with `MatDialog.open(ShareDialog, { data })`. */
@Component({
  selector: 'app-share-dialog',
  changeDetection: ChangeDetectionStrategy.OnPush,
  imports: [
    DatePipe,
    FormsModule,
    ClipboardModule,
    MatDialogModule,
    MatButtonModule,
    MatFormFieldModule,
    MatIconModule,
    MatInputModule,
    MatRadioModule,
  ],
  templateUrl: './share-dialog.html',
  styleUrl: './share-dialog.scss',
})
export class ShareDialog {
  private readonly api = inject(ShareApi);
  private readonly snackBar = inject(MatSnackBar);
  protected readonly data = inject<ShareDialogData>(MAT_DIALOG_DATA);

  protected readonly pinned = signal(false);
  protected readonly created = signal<NewShareLink | null>(null);
  private readonly existing = loader(() => this.api.links(this.data.presetId), {
    fallback: 'The links could not be loaded.',
  });
  protected readonly links = computed<ShareLink[] | null>(() => this.existing.value() ?? null);
  protected readonly busy = signal(false);
  /** Why the last link could not be made or revoked. */
  private readonly actionFailure = signal<string | null>(null);
  protected readonly failure = computed(() => this.actionFailure() ?? this.existing.failure());

  protected createLink(): void {
    this.busy.set(true);
    this.actionFailure.set(null);
    this.api.createLink(this.data.presetId, this.pinned() ? this.data.revision : null).subscribe({
      next: (link) => {
        this.busy.set(false);
        this.created.set(link);
        this.existing.reload();
      },
      error: (error: unknown) => {
        this.busy.set(false);
        void this.tellFailure(error, 'The link could not be made.');
      },
    });
  }

  protected revokeLink(link: ShareLink): void {
    this.actionFailure.set(null);
    this.api.revokeLink(link.id).subscribe({
      next: () => {
        if (this.created()?.id === link.id) this.created.set(null);
        this.snackBar.open('Link revoked: it no longer opens the preset.', 'Close', {
          duration: 6000,
        });
        this.existing.reload();
      },
      error: (error: unknown) => void this.tellFailure(error, 'The link could not be revoked.'),
    });
  }

  protected reportCopy(copied: boolean): void {
    const message = copied
      ? 'Link copied.'
      : 'The link could not be copied: select it and copy it by hand.';
    this.snackBar.open(message, 'Close', { duration: 4000 });
  }

  protected describe(link: ShareLink): string {
    return link.revision === null ? 'Latest revision' : `Revision ${link.revision}`;
  }

  private async tellFailure(error: unknown, fallback: string): Promise<void> {
    this.actionFailure.set(await apiErrorMessage(error, fallback));
  }
}
