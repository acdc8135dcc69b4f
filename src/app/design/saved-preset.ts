import { Injectable, inject, signal } from '@angular/core';
import { MatDialog } from '@angular/material/dialog';
import { MatSnackBar } from '@angular/material/snack-bar';
import { Router } from '@angular/router';
import { firstValueFrom } from 'rxjs';
import { apiErrorMessage } from '../api/api-error';
import { Session } from '../auth/session';
import { DesignState } from './design-state';
import { type DraftDocument, draftFrom } from './draft-document';
import { PresetApi } from './preset-api';
import { type SaveChoice, SaveDialog, type SaveDialogData } from './save-dialog';

/**
 * The designer's side of the library: opens a saved preset, saves the design as a new preset or a
 * new revision (with a note), and forks a preset the member may only read.
 */
@Injectable()
export class SavedPreset {
  private readonly api = inject(PresetApi);
  private readonly state = inject(DesignState);
  private readonly session = inject(Session);
  private readonly dialog = inject(MatDialog);
  private readonly snackBar = inject(MatSnackBar);
  private readonly router = inject(Router);

  readonly loading = signal(false);
  /** Why the preset could not be opened, in the server's words. */
  readonly loadFault = signal<string | null>(null);
  readonly busy = signal(false);

  /** Whether saving makes sense now: signed in, allowed to change the preset, no faults. */
  canSave(): boolean {
    return this.whyNotSave() === null && !this.busy();
  }

  async open(id: string): Promise<boolean> {
    this.loading.set(true);
    this.loadFault.set(null);
    try {
      const answer = await firstValueFrom(this.api.load(id));
      const origin = {
        id: answer.id,
        revision: answer.revision,
        bandId: answer.bandId,
        access: answer.access,
      };
      // Opened as a draft: the designer names whatever in a stored document it cannot read, as it does for typing.
      this.state.open(draftFrom(answer.document as DraftDocument), origin);
      return true;
    } catch (error) {
      this.loadFault.set(await apiErrorMessage(error));
      return false;
    } finally {
      this.loading.set(false);
    }
  }

  /** Why saving cannot happen now, in words for the musician; null when it can. */
  private whyNotSave(): string | null {
    if (!this.session.member())
      return "Sign in to save; until then this page's address keeps your design.";
    if (this.state.readOnly())
      return 'You can read this preset but not change it: fork it to your library first.';
    if (this.state.faults().length > 0) return 'Fix the fields marked in red before saving.';
    return null;
  }

  /** Asks for a name, library and note, then saves; a saved preset gets a new revision. */
  async save(): Promise<void> {
    if (this.busy()) return;
    const reason = this.whyNotSave();
    if (reason) {
      this.tell(reason);
      return;
    }
    const origin = this.state.origin();
    this.busy.set(true);
    try {
      const data: SaveDialogData = {
        name: this.state.draft().name,
        bands: origin ? null : await firstValueFrom(this.api.writableBands()),
        nextRevision: origin ? origin.revision + 1 : null,
      };
      const dialog = this.dialog.open<SaveDialog, SaveDialogData, SaveChoice>(SaveDialog, {
        data,
        autoFocus: 'dialog',
      });
      const choice = await firstValueFrom(dialog.afterClosed());
      if (!choice) return;
      this.state.rename(choice.name);
      if (origin) {
        const saving = this.api.saveRevision(origin.id, this.state.draft(), choice.note);
        const { revision } = await firstValueFrom(saving);
        this.state.markSaved(revision);
        this.tell(`Saved revision ${revision}.`);
      } else {
        const creating = this.api.create(this.state.draft(), choice.bandId, choice.note);
        const { id } = await firstValueFrom(creating);
        this.tell('Saved as revision 1.');
        await this.router.navigate(['/presets', id]);
      }
    } catch (error) {
      this.tell(await apiErrorMessage(error), true);
    } finally {
      this.busy.set(false);
    }
  }

  /** Copies a preset the member may only read into their own library, and opens the copy. */
  async fork(): Promise<void> {
    const origin = this.state.origin();
    if (!origin || !this.session.member() || this.busy()) return;
    this.busy.set(true);
    try {
      const { id } = await firstValueFrom(this.api.fork(origin.id));
      this.tell('Forked into your library.');
      await this.router.navigate(['/presets', id]);
    } catch (error) {
      this.tell(await apiErrorMessage(error), true);
    } finally {
      this.busy.set(false);
    }
  }

  private tell(message: string, fault = false): void {
    this.snackBar.open(message, fault ? 'Dismiss' : undefined, {
      duration: fault ? undefined : 4000,
    });
  }
}
