import { DatePipe, TitleCasePipe } from '@angular/common';
import { ChangeDetectionStrategy, Component, computed, inject, input, signal } from '@angular/core';
import { FormControl, FormGroup, FormGroupDirective, ReactiveFormsModule } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatInputModule } from '@angular/material/input';
import { MatSelectModule } from '@angular/material/select';
import { MatSnackBar } from '@angular/material/snack-bar';
import { inviteRequest } from '@shared/api/requests';
import { apiErrorMessage } from '../api/api-error';
import { loader } from '../api/loader';
import { BandRole, BandsApi, PendingInvite, bandRoles, roleWithArticle } from './bands-api';
import { requestFieldValidator } from './request-validator';

/** Invite by e-mail with a role, and the invites still waiting for an answer (send again, revoke). */
@Component({
  selector: 'app-band-invites',
  changeDetection: ChangeDetectionStrategy.OnPush,
  imports: [
    DatePipe,
    TitleCasePipe,
    ReactiveFormsModule,
    MatButtonModule,
    MatFormFieldModule,
    MatIconModule,
    MatInputModule,
    MatSelectModule,
  ],
  templateUrl: './band-invites.html',
  styleUrl: './band-invites.scss',
})
export class BandInvites {
  private readonly api = inject(BandsApi);
  private readonly snackBar = inject(MatSnackBar);

  readonly bandId = input.required<string>();

  protected readonly roles = bandRoles;
  protected readonly roleWithArticle = roleWithArticle;
  protected readonly form = new FormGroup({
    email: new FormControl('', {
      nonNullable: true,
      validators: requestFieldValidator(inviteRequest, 'email', 'This'),
    }),
    role: new FormControl<BandRole>('editor', { nonNullable: true }),
  });
  private readonly invites = loader(() => this.api.invites(this.bandId()), {
    fallback: 'The pending invites could not be loaded.',
  });
  protected readonly pending = computed<PendingInvite[] | null>(() => this.invites.value() ?? null);
  protected readonly busy = signal(false);
  /** Why the last invite, resend or revoke did not work. */
  private readonly actionFailure = signal<string | null>(null);
  protected readonly failure = computed(() => this.actionFailure() ?? this.invites.failure());

  protected sendInvite(formDirective: FormGroupDirective): void {
    if (this.form.invalid) return;
    const { email, role } = this.form.getRawValue();
    this.busy.set(true);
    this.actionFailure.set(null);
    this.api.invite(this.bandId(), email.trim(), role).subscribe({
      next: () => {
        this.busy.set(false);
        formDirective.resetForm({ email: '', role });
        this.snackBar.open(`Invite sent to ${email.trim()}.`, 'Close', { duration: 6000 });
        this.reload();
      },
      error: (error: unknown) => {
        this.busy.set(false);
        void this.tellFailure(error, 'The invite could not be sent.');
      },
    });
  }

  protected resendInvite(invite: PendingInvite): void {
    this.actionFailure.set(null);
    this.api.resendInvite(this.bandId(), invite.id).subscribe({
      next: () => {
        this.snackBar.open(
          `Sent again to ${invite.email}; the earlier link no longer works.`,
          'Close',
          { duration: 6000 },
        );
        this.reload();
      },
      error: (error: unknown) =>
        void this.tellFailure(error, 'The invite could not be sent again.'),
    });
  }

  protected revokeInvite(invite: PendingInvite): void {
    this.actionFailure.set(null);
    this.api.revokeInvite(this.bandId(), invite.id).subscribe({
      next: () => {
        this.snackBar.open(`The invite to ${invite.email} is revoked.`, 'Close', {
          duration: 6000,
        });
        this.reload();
      },
      error: (error: unknown) => void this.tellFailure(error, 'The invite could not be revoked.'),
    });
  }

  private reload(): void {
    this.invites.reload();
  }

  private async tellFailure(error: unknown, fallback: string): Promise<void> {
    this.actionFailure.set(await apiErrorMessage(error, fallback));
  }
}
