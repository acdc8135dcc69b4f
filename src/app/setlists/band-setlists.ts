import {
  ChangeDetectionStrategy,
  Component,
  computed,
  inject,
  input,
  linkedSignal,
  signal,
} from '@angular/core';
import { FormControl, FormGroup, ReactiveFormsModule } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatInputModule } from '@angular/material/input';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { setlistRequest } from '@shared/api/setlists';
import { firstValueFrom } from 'rxjs';
import type { BandDetail } from '../bands/bands-api';
import { requestFieldValidator } from '../bands/request-validator';
import { apiErrorMessage } from '../api/api-error';
import { loader } from '../api/loader';
import type { PresetRow } from '../library/library-api';
import { SetlistCard } from './setlist-card';
import { type Setlist, SetlistsApi } from './setlists-api';

/** The band's setlists: every member reads them; editors and owners start, change and delete them. */
@Component({
  selector: 'app-band-setlists',
  changeDetection: ChangeDetectionStrategy.OnPush,
  imports: [
    ReactiveFormsModule,
    MatButtonModule,
    MatFormFieldModule,
    MatInputModule,
    MatProgressBarModule,
    SetlistCard,
  ],
  template: `
    @if (failure(); as message) {
      <p class="fault" role="alert">{{ message }}</p>
    }
    @if (setlists(); as setlists) {
      @for (setlist of setlists; track setlist.id) {
        <app-setlist-card
          class="setlist"
          [setlist]="setlist"
          [presets]="presets()"
          (saved)="replace($event)"
          (deleted)="drop($event)"
        />
      } @empty {
        <p class="empty">
          No setlists yet.
          @if (canEdit()) {
            Start one for the next gig below.
          }
        </p>
      }
    } @else {
      <mat-progress-bar mode="indeterminate" aria-label="Loading the setlists" />
    }
    @if (canEdit()) {
      <form class="create" [formGroup]="form" (ngSubmit)="create()">
        <mat-form-field>
          <mat-label>New setlist name</mat-label>
          <input matInput formControlName="name" autocomplete="off" />
          <mat-error>{{ name.errors?.['request'] }}</mat-error>
        </mat-form-field>
        <button mat-flat-button type="submit" [disabled]="busy()">Start setlist</button>
      </form>
    }
  `,
  styles: `
    :host {
      display: block;
    }
    .fault {
      color: var(--mat-sys-error);
    }
    .empty {
      color: var(--mat-sys-on-surface-variant);
    }
    .setlist {
      padding: 12px 0;
      border-bottom: 1px solid var(--mat-sys-outline-variant);
    }
    .create {
      display: flex;
      flex-wrap: wrap;
      align-items: baseline;
      gap: 0 12px;
      margin-top: 12px;
    }
    .create mat-form-field {
      flex: 1 1 200px;
    }
  `,
})
export class BandSetlists {
  private readonly api = inject(SetlistsApi);

  readonly band = input.required<BandDetail>();
  /** The band's presets, offered for the lists. */
  readonly presets = input<PresetRow[]>([]);

  /** The band's id alone: a reloaded band (a changed role, say) does not read its setlists again. */
  private readonly bandId = computed(() => this.band().id);
  private readonly loaded = loader(() => this.api.setlists(this.bandId()), {
    fallback: 'The setlists could not be loaded.',
  });
  /** The list as loaded, then as this page's own starts, changes and deletions leave it. */
  protected readonly setlists = linkedSignal<Setlist[] | null>(() => this.loaded.value() ?? null);
  private readonly actionFailure = signal<string | null>(null);
  protected readonly failure = computed(() => this.actionFailure() ?? this.loaded.failure());
  protected readonly busy = signal(false);
  protected readonly canEdit = computed(
    () => this.band().role === 'owner' || this.band().role === 'editor',
  );
  protected readonly name = new FormControl('', {
    nonNullable: true,
    validators: requestFieldValidator(setlistRequest, 'name', 'The setlist name'),
  });
  protected readonly form = new FormGroup({ name: this.name });

  protected async create(): Promise<void> {
    this.name.markAsTouched();
    if (this.name.invalid) return;
    this.busy.set(true);
    this.actionFailure.set(null);
    try {
      const created = await firstValueFrom(
        this.api.create(this.band().id, { name: this.name.value.trim(), entries: [] }),
      );
      this.setlists.update((setlists) => [...(setlists ?? []), created]);
      this.name.reset();
    } catch (error) {
      this.actionFailure.set(await apiErrorMessage(error, 'The setlist could not be started.'));
    } finally {
      this.busy.set(false);
    }
  }

  protected replace(setlist: Setlist): void {
    this.setlists.update((setlists) =>
      (setlists ?? []).map((candidate) => (candidate.id === setlist.id ? setlist : candidate)),
    );
  }

  protected drop(id: string): void {
    this.setlists.update((setlists) => (setlists ?? []).filter((setlist) => setlist.id !== id));
  }
}
