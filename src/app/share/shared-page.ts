import { DatePipe, DecimalPipe } from '@angular/common';
import { HttpParams } from '@angular/common/http';
import {
  ChangeDetectionStrategy,
  Component,
  computed,
  inject,
  input,
  linkedSignal,
  signal,
} from '@angular/core';
import { MatButtonModule } from '@angular/material/button';
import { MatIconModule } from '@angular/material/icon';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { MatSnackBar } from '@angular/material/snack-bar';
import { Router, RouterLink } from '@angular/router';
import { tap } from 'rxjs';
import { apiErrorMessage } from '../api/api-error';
import { loader } from '../api/loader';
import { MatDialog } from '@angular/material/dialog';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatSelectModule } from '@angular/material/select';
import { firstValueFrom } from 'rxjs';
import { InstrumentDialog } from '../instruments/instrument-dialog';
import {
  type MyInstrument,
  MyInstruments,
  exportOfInstrument,
} from '../instruments/my-instruments';
import { Session } from '../auth/session';
import { LibraryApi } from '../library/library-api';
import { SignInPrompt } from '../library/sign-in-prompt';
import { DegreeTable } from '../scale/degree-table';
import { exportFormats } from '../output/export-formats';
import { readPresetDocument } from '../scale/preset-reading';
import { ShareApi, SharedPreset } from './share-api';
import { pitchWords } from '../keys/pitch-words';
import { exportRefusals } from '../output/export-refusals';
import type { PresetDocument } from '@shared/preset/preset-document';
import { Audition } from '../audition/audition';
import { ControllerInput } from '../audition/controller-input';
import { PlayPanel } from '../audition/play-panel';
import { StripPlaying } from '../audition/strip-playing';
import { DesignState } from '../design/design-state';
import { draftFrom } from '../design/draft-document';
import { MidiAccess } from '../hardware/midi-access';
import { KeyboardStrip } from '../keys/keyboard-strip';

/** What a share link opens, for anyone: the preset read-only, its degrees, downloads, and a fork. */
@Component({
  selector: 'app-shared-page',
  changeDetection: ChangeDetectionStrategy.OnPush,
  imports: [
    DatePipe,
    DecimalPipe,
    RouterLink,
    MatButtonModule,
    MatIconModule,
    MatProgressBarModule,
    SignInPrompt,
    DegreeTable,
    PlayPanel,
    KeyboardStrip,
    StripPlaying,
    MatFormFieldModule,
    MatSelectModule,
  ],
  providers: [DesignState, Audition, MidiAccess, ControllerInput],
  templateUrl: './shared-page.html',
  styleUrl: './shared-page.scss',
})
export class SharedPage {
  private readonly shareApi = inject(ShareApi);
  private readonly libraryApi = inject(LibraryApi);
  private readonly router = inject(Router);
  private readonly snackBar = inject(MatSnackBar);
  private readonly design = inject(DesignState);
  private readonly dialog = inject(MatDialog);
  protected readonly session = inject(Session);

  /** The link's token, from the address. */
  readonly token = input.required<string>();

  private readonly link = loader(
    () => this.shareApi.shared(this.token()).pipe(tap((shared) => this.openReadOnly(shared))),
    {
      fallback: 'The shared preset could not be loaded.',
      notFound:
        'This link does not open anything: it was revoked, its preset was deleted, ' +
        'or the address is not complete.',
    },
  );
  protected readonly shared = computed<SharedPreset | null>(() => this.link.value() ?? null);
  protected readonly failure = this.link.failure;
  protected readonly forking = signal(false);
  protected readonly returnPath = computed(() => `/s/${encodeURIComponent(this.token())}`);

  /** The document read through the shared tuning code, or the faults that keep it from being shown. */
  private readonly reading = readPresetDocument(() => this.shared()?.document);
  protected readonly faults = this.reading.faults;
  protected readonly preset = this.reading.preset;
  protected readonly preview = this.reading.preview;
  /** Where the tuning's pitch sits: the key tuned to a pitch when there is one, and the root key's pitch. */
  protected readonly pitch = computed(() => {
    const mapping = this.preset()?.mapping;
    return mapping ? pitchWords(mapping) : null;
  });
  /** Every file of the preset; those it cannot be written in are named with the reason instead of a link. */
  protected readonly downloads = computed(() => {
    const preset = this.preset();
    const refusals = preset ? exportRefusals(preset) : new Map<string, string>();
    return exportFormats
      .filter((format) => format.id !== 'bundle')
      .map((format) => ({
        ...format,
        href: this.shareApi.exportUrl(this.token(), format.id),
        refused: refusals.get(format.id) ?? null,
      }));
  });
  protected readonly bundleHref = computed(() => this.shareApi.bundleUrl(this.token()));
  /** The player's instruments (a guest's are kept in this browser) and the one the file is for. */
  protected readonly instruments = inject(MyInstruments);
  protected readonly chosenId = linkedSignal<MyInstrument[] | null, string | null>({
    source: this.instruments.list,
    computation: (list, previous) =>
      list?.find((instrument) => instrument.id === previous?.value)?.id ?? list?.[0]?.id ?? null,
  });
  /** The chosen instrument's own export, with its id (or a guest's settings) in the address. */
  protected readonly instrumentDownload = computed(() => {
    const id = this.chosenId();
    const instrument = this.instruments.list()?.find((candidate) => candidate.id === id);
    if (!instrument) return null;
    const format = exportOfInstrument(instrument);
    const query = new HttpParams({ fromObject: this.instruments.downloadQuery(instrument) });
    const preset = this.preset();
    return {
      ...format,
      instrument: instrument.name,
      href: `${this.shareApi.exportUrl(this.token(), format.id)}?${query.toString()}`,
      refused: (preset && exportRefusals(preset).get(format.id)) ?? null,
    };
  });

  /** The tuning is heard through the designer's audition engine, read-only: nothing changes it. */
  private openReadOnly(shared: SharedPreset): void {
    const { revision, document } = shared;
    const origin = { id: 'shared', revision, bandId: null, access: 'read' as const };
    this.design.open(draftFrom(document as PresetDocument), origin);
  }

  constructor() {
    this.instruments.load();
  }

  protected async setUpInstrument(): Promise<void> {
    const dialog = this.dialog.open<InstrumentDialog, void, MyInstrument>(InstrumentDialog, {
      maxWidth: '560px',
    });
    const instrument = await firstValueFrom(dialog.afterClosed());
    if (instrument) this.chosenId.set(instrument.id);
  }

  /**
   * The link does not reveal which preset it belongs to, so the fork is a new preset in my library made
   * from the shared document.
   */
  protected forkToMyLibrary(shared: SharedPreset): void {
    this.forking.set(true);
    this.libraryApi.saveCopy(shared.document, 'Copied from a share link').subscribe({
      next: (id) => {
        this.forking.set(false);
        this.snackBar
          .open(`“${shared.name}” is now in your library.`, 'Open it', { duration: 10000 })
          .onAction()
          .subscribe(() => void this.router.navigate(['/presets', id]));
      },
      error: async (error: unknown) => {
        this.forking.set(false);
        const message = await apiErrorMessage(error, 'The copy could not be saved.');
        this.snackBar.open(message, 'Close', { duration: 8000 });
      },
    });
  }
}
