import { ChangeDetectionStrategy, Component, computed, inject, signal } from '@angular/core';
import { FormControl, FormGroup, ReactiveFormsModule } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatInputModule } from '@angular/material/input';
import { MatListModule } from '@angular/material/list';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { Router, RouterLink } from '@angular/router';
import { bandNameRequest } from '@shared/api/requests';
import { Session } from '../auth/session';
import { apiErrorMessage } from '../api/api-error';
import { loader } from '../api/loader';
import { SignInPrompt } from '../library/sign-in-prompt';
import { BandSummary, BandsApi, roleWithArticle } from './bands-api';
import { requestFieldValidator } from './request-validator';

/** My bands with my role in each, and a form to start a new one. */
@Component({
  selector: 'app-bands-page',
  changeDetection: ChangeDetectionStrategy.OnPush,
  imports: [
    RouterLink,
    ReactiveFormsModule,
    MatButtonModule,
    MatFormFieldModule,
    MatIconModule,
    MatInputModule,
    MatListModule,
    MatProgressBarModule,
    SignInPrompt,
  ],
  template: `
    <h1>Bands</h1>
    <p class="about">
      A band keeps one library of presets. Owners invite bandmates by e-mail and give each a role:
      owners manage the band, editors save presets into it, viewers open and fork them.
    </p>
    @switch (session.member()) {
      @case (undefined) {
        <mat-progress-bar mode="indeterminate" aria-label="Checking sign-in" />
      }
      @case (null) {
        <app-sign-in-prompt label="Sign in to see your bands" />
      }
      @default {
        @if (failure(); as message) {
          <p class="failure" role="alert">{{ message }}</p>
        }
        @if (bands(); as bands) {
          @if (bands.length) {
            <mat-nav-list class="bands" aria-label="Your bands">
              @for (band of bands; track band.id) {
                <a mat-list-item [routerLink]="['/bands', band.id]">
                  <mat-icon matListItemIcon aria-hidden="true">groups</mat-icon>
                  <span matListItemTitle>{{ band.name }}</span>
                  <span matListItemLine>You are {{ roleWithArticle[band.role] }}</span>
                </a>
              }
            </mat-nav-list>
          } @else {
            <p class="empty">
              You are in no band yet. Start one below, or follow an invite a bandmate sent you.
            </p>
          }
        } @else {
          <mat-progress-bar mode="indeterminate" aria-label="Loading your bands" />
        }

        <form class="create" [formGroup]="form" (ngSubmit)="createBand()">
          <h2>Start a band</h2>
          <mat-form-field appearance="outline">
            <mat-label>Band name</mat-label>
            <input matInput formControlName="name" autocomplete="off" />
            <mat-error>{{ form.controls.name.errors?.['request'] }}</mat-error>
          </mat-form-field>
          <button mat-flat-button type="submit" [disabled]="busy()">Create band</button>
          @if (createFailure(); as message) {
            <p class="failure" role="alert">{{ message }}</p>
          }
        </form>
      }
    }
  `,
  styles: `
    h1 {
      font: var(--mat-sys-headline-small);
      margin: 8px 0 8px;
    }
    h2 {
      font: var(--mat-sys-title-medium);
      margin: 0 0 8px;
    }
    .about {
      max-width: 64ch;
      color: var(--mat-sys-on-surface-variant);
    }
    .failure {
      color: var(--mat-sys-error);
    }
    .bands {
      max-width: 560px;
      border: 1px solid var(--mat-sys-outline-variant);
      border-radius: var(--mat-sys-corner-medium);
    }
    .create {
      margin-top: 32px;
      display: flex;
      flex-wrap: wrap;
      align-items: baseline;
      gap: 0 12px;
      max-width: 560px;
    }
    .create h2 {
      flex-basis: 100%;
    }
    .create mat-form-field {
      flex: 1 1 240px;
    }
  `,
})
export class BandsPage {
  private readonly api = inject(BandsApi);
  private readonly router = inject(Router);
  protected readonly session = inject(Session);
  protected readonly roleWithArticle = roleWithArticle;

  private readonly signedIn = computed(() => Boolean(this.session.member()));
  private readonly myBands = loader(() => (this.signedIn() ? this.api.bands() : null), {
    fallback: 'Your bands could not be loaded.',
  });
  protected readonly bands = computed<BandSummary[] | null>(() => this.myBands.value() ?? null);
  protected readonly failure = this.myBands.failure;
  protected readonly form = new FormGroup({
    name: new FormControl('', {
      nonNullable: true,
      validators: requestFieldValidator(bandNameRequest, 'name', 'The band name'),
    }),
  });
  protected readonly createFailure = signal<string | null>(null);
  protected readonly busy = signal(false);

  protected createBand(): void {
    if (this.form.invalid) return;
    this.busy.set(true);
    this.createFailure.set(null);
    this.api.createBand(this.form.controls.name.value.trim()).subscribe({
      next: (band) => void this.router.navigate(['/bands', band.id]),
      error: async (error: unknown) => {
        this.busy.set(false);
        this.createFailure.set(await apiErrorMessage(error, 'The band could not be made.'));
      },
    });
  }
}
