import { ChangeDetectionStrategy, Component, computed, inject, input } from '@angular/core';
import { MatButtonModule } from '@angular/material/button';
import { MatIconModule } from '@angular/material/icon';
import { Router } from '@angular/router';

/** A link through GitHub sign-in that comes back to `next` (the current page when not given). */
@Component({
  selector: 'app-sign-in-prompt',
  changeDetection: ChangeDetectionStrategy.OnPush,
  imports: [MatButtonModule, MatIconModule],
  template: `
    <a mat-flat-button class="sign-in-link" [href]="href()">
      <mat-icon aria-hidden="true">login</mat-icon>
      {{ label() }}
    </a>
  `,
})
export class SignInPrompt {
  private readonly router = inject(Router);
  readonly label = input('Sign in with GitHub');
  readonly next = input<string>();
  protected readonly href = computed(
    () => `/auth/github?next=${encodeURIComponent(this.next() ?? this.router.url)}`,
  );
}
