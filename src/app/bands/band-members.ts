import { DatePipe, TitleCasePipe } from '@angular/common';
import {
  ChangeDetectionStrategy,
  Component,
  computed,
  inject,
  input,
  output,
  signal,
} from '@angular/core';
import { MatButtonModule } from '@angular/material/button';
import { MatDialog } from '@angular/material/dialog';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatSelectModule } from '@angular/material/select';
import { MatSnackBar } from '@angular/material/snack-bar';
import { Router } from '@angular/router';
import { filter, switchMap } from 'rxjs';
import { apiErrorMessage } from '../api/api-error';
import { ConfirmDialog, ConfirmDialogData } from '../library/confirm-dialog';
import {
  BandDetail,
  BandMember,
  BandRole,
  BandsApi,
  bandRoles,
  roleWithArticle,
} from './bands-api';

/** The band's members with their roles: owners change roles and remove members; anyone may leave. */
@Component({
  selector: 'app-band-members',
  changeDetection: ChangeDetectionStrategy.OnPush,
  imports: [
    DatePipe,
    TitleCasePipe,
    MatButtonModule,
    MatFormFieldModule,
    MatIconModule,
    MatSelectModule,
  ],
  templateUrl: './band-members.html',
  styleUrl: './band-members.scss',
})
export class BandMembers {
  private readonly api = inject(BandsApi);
  private readonly dialog = inject(MatDialog);
  private readonly snackBar = inject(MatSnackBar);
  private readonly router = inject(Router);

  readonly band = input.required<BandDetail>();
  /** The signed-in member's id. */
  readonly me = input.required<string>();
  /** Asks the page to load the band again after a change. */
  readonly changed = output<void>();

  protected readonly roles = bandRoles;
  protected readonly failure = signal<string | null>(null);
  protected readonly members = computed(() => this.band().members);

  protected nameOf(member: BandMember): string {
    return member.name ?? member.login;
  }

  protected changeRole(member: BandMember, role: BandRole): void {
    this.failure.set(null);
    this.api.changeRole(this.band().id, member.userId, role).subscribe({
      next: () => {
        this.snackBar.open(`${this.nameOf(member)} is now ${roleWithArticle[role]}.`, 'Close', {
          duration: 6000,
        });
        this.changed.emit();
      },
      error: async (error: unknown) => {
        this.failure.set(await apiErrorMessage(error, 'The role could not be changed.'));
        this.changed.emit();
      },
    });
  }

  protected removeMember(member: BandMember): void {
    const band = this.band();
    this.confirm(
      {
        title: `Remove ${this.nameOf(member)}?`,
        message:
          `${this.nameOf(member)} will no longer see ${band.name}'s presets. Presets saved into the band stay in its ` +
          'library. You can invite them again later.',
        confirm: 'Remove from band',
      },
      () => {
        this.snackBar.open(`${this.nameOf(member)} is no longer in ${band.name}.`, 'Close', {
          duration: 6000,
        });
        this.changed.emit();
      },
      member.userId,
    );
  }

  protected leaveBand(): void {
    const band = this.band();
    this.confirm(
      {
        title: `Leave ${band.name}?`,
        message:
          `You will no longer see ${band.name}'s presets. Presets you saved into the band stay there for your ` +
          'bandmates. To come back, an owner has to invite you again.',
        confirm: 'Leave band',
      },
      () => {
        this.snackBar.open(`You left ${band.name}.`, 'Close', { duration: 6000 });
        void this.router.navigate(['/bands']);
      },
      this.me(),
    );
  }

  private confirm(data: ConfirmDialogData, done: () => void, userId: string): void {
    this.failure.set(null);
    this.dialog
      .open<ConfirmDialog, ConfirmDialogData, boolean>(ConfirmDialog, { data })
      .afterClosed()
      .pipe(
        filter((yes) => yes === true),
        switchMap(() => this.api.removeMember(this.band().id, userId)),
      )
      .subscribe({
        next: done,
        error: async (error: unknown) =>
          this.failure.set(await apiErrorMessage(error, 'That did not work.')),
      });
  }
}
