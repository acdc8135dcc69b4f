import { DatePipe } from '@angular/common';
import { ChangeDetectionStrategy, Component, computed, inject, input, signal } from '@angular/core';
import { takeUntilDestroyed, toObservable } from '@angular/core/rxjs-interop';
import { MatButtonModule } from '@angular/material/button';
import { MatButtonToggleModule } from '@angular/material/button-toggle';
import { MatDialog } from '@angular/material/dialog';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatInputModule } from '@angular/material/input';
import { MatMenuModule } from '@angular/material/menu';
import { MatPaginatorModule, PageEvent } from '@angular/material/paginator';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { MatSelectModule } from '@angular/material/select';
import { MatSnackBar } from '@angular/material/snack-bar';
import { MatSortModule, Sort } from '@angular/material/sort';
import { MatTableModule } from '@angular/material/table';
import { Router, RouterLink } from '@angular/router';
import { debounceTime, distinctUntilChanged, filter, map, switchMap } from 'rxjs';
import { apiErrorMessage } from '../api/api-error';
import { loader } from '../api/loader';
import { Session } from '../auth/session';
import { BandSummary, BandsApi } from '../bands/bands-api';
import {
  type MyInstrument,
  MyInstruments,
  exportOfInstrument,
} from '../instruments/my-instruments';
import { DownloadNotice } from '../output/download-notice';
import { ShareDialog, ShareDialogData } from '../share/share-dialog';
import { ForkDialog, ForkDialogData, ForkTarget } from './fork-dialog';
import { LibraryApi, PresetPage, PresetRow, PresetSort } from './library-api';
import { SignInPrompt } from './sign-in-prompt';

const searchDelayMs = 300;

/** My presets and my bands': search, filter by band, sort, page, and the trash. */
@Component({
  selector: 'app-library-page',
  changeDetection: ChangeDetectionStrategy.OnPush,
  imports: [
    DatePipe,
    RouterLink,
    MatTableModule,
    MatSortModule,
    MatPaginatorModule,
    MatFormFieldModule,
    MatInputModule,
    MatSelectModule,
    MatButtonModule,
    MatButtonToggleModule,
    MatIconModule,
    MatMenuModule,
    MatProgressBarModule,
    SignInPrompt,
  ],
  templateUrl: './library-page.html',
  styleUrl: './library-page.scss',
})
export class LibraryPage {
  private readonly api = inject(LibraryApi);
  private readonly bandsApi = inject(BandsApi);
  private readonly router = inject(Router);
  private readonly dialog = inject(MatDialog);
  private readonly snackBar = inject(MatSnackBar);
  protected readonly session = inject(Session);
  protected readonly instruments = inject(MyInstruments);
  private readonly notice = inject(DownloadNotice);
  protected readonly exportOf = exportOfInstrument;

  /** `?band=<id>`: only that band's presets. */
  readonly band = input<string>();
  /** `?view=trash`: what waits in the trash. */
  readonly view = input<string>();

  protected readonly searchText = signal('');
  private readonly q = signal('');
  protected readonly sort = signal<PresetSort>('-updated');
  protected readonly pageIndex = signal(0);
  protected readonly pageSize = signal(20);

  protected readonly trash = computed(() => this.view() === 'trash');
  protected readonly bandId = computed(() => this.band() ?? null);
  private readonly signedIn = computed(() => Boolean(this.session.member()));
  private readonly presets = loader(
    () =>
      this.signedIn()
        ? this.api.presets({
            q: this.q(),
            sort: this.sort(),
            page: this.pageIndex() + 1,
            pageSize: this.pageSize(),
            bandId: this.bandId(),
            trash: this.trash(),
          })
        : null,
    { fallback: 'The library could not be loaded.' },
  );
  /** The bands I am in; without them the library still lists, so their failure is not shown. */
  private readonly myBands = loader(() => (this.signedIn() ? this.bandsApi.bands() : null), {
    fallback: 'Your bands could not be loaded.',
  });
  protected readonly bands = computed<BandSummary[]>(() => this.myBands.value() ?? []);
  protected readonly page = computed<PresetPage | null>(() => this.presets.value() ?? null);
  protected readonly loading = this.presets.loading;
  protected readonly failure = this.presets.failure;

  protected readonly columns = computed(() =>
    this.trash()
      ? ['name', 'library', 'owner', 'revision', 'deleted', 'actions']
      : ['name', 'library', 'owner', 'revision', 'updated', 'actions'],
  );
  protected readonly filteredBandName = computed(
    () => this.bands().find((b) => b.id === this.bandId())?.name ?? null,
  );

  constructor() {
    toObservable(this.searchText)
      .pipe(
        debounceTime(searchDelayMs),
        map((text) => text.trim()),
        distinctUntilChanged(),
        takeUntilDestroyed(),
      )
      .subscribe((q) => {
        this.pageIndex.set(0);
        this.q.set(q);
      });
  }

  protected sortBy(sort: Sort): void {
    const by = sort.active === 'name' ? 'name' : 'updated';
    this.sort.set(sort.direction === '' ? '-updated' : sort.direction === 'asc' ? by : `-${by}`);
    this.pageIndex.set(0);
  }

  protected turnPage(event: PageEvent): void {
    this.pageIndex.set(event.pageIndex);
    this.pageSize.set(event.pageSize);
  }

  protected filterByBand(bandId: string | null): void {
    this.showWith({ band: bandId });
  }

  protected switchView(view: 'presets' | 'trash'): void {
    this.showWith({ view: view === 'trash' ? 'trash' : null });
  }

  protected clearSearch(): void {
    this.searchText.set('');
  }

  protected libraryOf(row: PresetRow): string {
    return row.bandName ?? 'My library';
  }

  protected ownerOf(row: PresetRow): string {
    return row.ownerId === this.session.member()?.id ? 'you' : row.ownerLogin;
  }

  /** Whether I may change this preset, as the server says on its row. */
  protected canChange(row: PresetRow): boolean {
    return row.access !== 'read';
  }

  protected openPreset(row: PresetRow): void {
    void this.router.navigate(['/presets', row.id]);
  }

  protected openHistory(row: PresetRow): void {
    void this.router.navigate(['/library', row.id, 'history']);
  }

  protected forkPreset(row: PresetRow): void {
    const targets: ForkTarget[] = [
      { bandId: null, label: 'My library' },
      ...this.bands()
        .filter((band) => band.role !== 'viewer')
        .map((band) => ({ bandId: band.id, label: `${band.name} (band)` })),
    ];
    this.dialog
      .open<ForkDialog, ForkDialogData, { bandId: string | null }>(ForkDialog, {
        data: { name: row.name, targets },
      })
      .afterClosed()
      .pipe(
        filter((choice) => choice !== undefined),
        switchMap((choice) =>
          this.api.fork(row.id, choice.bandId).pipe(map((id) => ({ id, choice }))),
        ),
      )
      .subscribe({
        next: ({ id, choice }) => {
          this.reload();
          const where =
            targets.find((target) => target.bandId === choice.bandId)?.label ?? 'My library';
          this.snackBar
            .open(`Forked “${row.name}” into ${where}.`, 'Open the fork', { duration: 10000 })
            .onAction()
            .subscribe(() => void this.router.navigate(['/presets', id]));
        },
        error: (error: unknown) => void this.tellFailure(error, 'The fork could not be made.'),
      });
  }

  /** The preset's latest revision in the instrument's own form, with its settings in place of the output block. */
  protected downloadFor(row: PresetRow, instrument: MyInstrument): Promise<void> {
    return this.notice.forInstrument(instrument, { presetId: row.id });
  }

  protected sharePreset(row: PresetRow): void {
    this.dialog.open<ShareDialog, ShareDialogData>(ShareDialog, {
      data: { presetId: row.id, revision: row.revision, name: row.name },
      width: '560px',
      maxWidth: '95vw',
    });
  }

  protected moveToTrash(row: PresetRow): void {
    this.api.moveToTrash(row.id).subscribe({
      next: () => {
        this.reload();
        this.snackBar
          .open(`“${row.name}” is in the trash for 30 days.`, 'Undo', { duration: 10000 })
          .onAction()
          .subscribe(() => this.restoreFromTrash(row));
      },
      error: (error: unknown) =>
        void this.tellFailure(error, 'The preset could not be moved to the trash.'),
    });
  }

  protected restoreFromTrash(row: PresetRow): void {
    this.api.restoreFromTrash(row.id).subscribe({
      next: () => {
        this.reload();
        this.tell(`“${row.name}” is back in the library.`);
      },
      error: (error: unknown) =>
        void this.tellFailure(error, 'The preset could not be brought back.'),
    });
  }

  private showWith(params: { band?: string | null; view?: string | null }): void {
    this.pageIndex.set(0);
    void this.router.navigate([], { queryParams: params, queryParamsHandling: 'merge' });
  }

  private reload(): void {
    this.presets.reload();
  }

  private tell(message: string): void {
    this.snackBar.open(message, 'Close', { duration: 8000 });
  }

  private async tellFailure(error: unknown, fallback: string): Promise<void> {
    this.tell(await apiErrorMessage(error, fallback));
  }
}
