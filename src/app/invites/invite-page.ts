import { DatePipe } from '@angular/common';
import { ChangeDetectionStrategy, Component, computed, inject, input, signal } from '@angular/core';
import { MatButtonModule } from '@angular/material/button';
import { MatIconModule } from '@angular/material/icon';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { MatSnackBar } from '@angular/material/snack-bar';
import { Router, RouterLink } from '@angular/router';
import { apiErrorMessage } from '../api/api-error';
import { loader } from '../api/loader';
import { Session } from '../auth/session';
import { roleWithArticle } from '../bands/bands-api';
import { SignInPrompt } from '../library/sign-in-prompt';
import { InviteApi, InviteSummary } from './invite-api';

/** Where an invite e-mail leads: what the invite is, sign-in when needed, and joining the band. */
@Component({
  selector: 'app-invite-page',
  changeDetection: ChangeDetectionStrategy.OnPush,
  imports: [
    DatePipe,
    RouterLink,
    MatButtonModule,
    MatIconModule,
    MatProgressBarModule,
    SignInPrompt,
  ],
  templateUrl: './invite-page.html',
  styleUrl: './invite-page.scss',
})
export class InvitePage {
  private readonly api = inject(InviteApi);
  private readonly router = inject(Router);
  private readonly snackBar = inject(MatSnackBar);
  protected readonly session = inject(Session);
  protected readonly roleWithArticle = roleWithArticle;

  /** The invite's token, from the address. */
  readonly token = input.required<string>();

  private readonly loaded = loader(() => this.api.invite(this.token()), {
    fallback: 'The invite could not be read.',
    notFound:
      'This invite link is not known. Check that the whole link was copied from the e-mail, ' +
      "or ask the band's owner to send a new invite.",
  });
  protected readonly invite = computed<InviteSummary | null>(() => this.loaded.value() ?? null);
  protected readonly failure = this.loaded.failure;
  protected readonly joinFailure = signal<string | null>(null);
  protected readonly joining = signal(false);
  protected readonly returnPath = computed(() => `/invites/${encodeURIComponent(this.token())}`);

  protected joinBand(invite: InviteSummary): void {
    this.joining.set(true);
    this.joinFailure.set(null);
    this.api.accept(this.token()).subscribe({
      next: (accepted) => {
        const message = accepted.alreadyMember
          ? `You were already in ${invite.bandName}; nothing changed.`
          : `Welcome to ${invite.bandName}! You joined as ${roleWithArticle[accepted.role]}.`;
        this.snackBar.open(message, 'Close', { duration: 8000 });
        void this.router.navigate(['/bands', accepted.bandId]);
      },
      error: async (error: unknown) => {
        this.joining.set(false);
        const fallback = 'Joining did not work. Try again in a moment.';
        this.joinFailure.set(await apiErrorMessage(error, fallback));
      },
    });
  }
}
