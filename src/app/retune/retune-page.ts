import {
  ChangeDetectionStrategy,
  Component,
  DestroyRef,
  computed,
  inject,
  input,
  linkedSignal,
  resource,
  signal,
} from '@angular/core';
import { takeUntilDestroyed } from '@angular/core/rxjs-interop';
import { MatButtonModule } from '@angular/material/button';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatInputModule } from '@angular/material/input';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { MatRadioModule } from '@angular/material/radio';
import { MatSelectModule } from '@angular/material/select';
import { RouterLink } from '@angular/router';
import { tuningOfPreset } from '@shared/export/preset-tuning';
import { defaultLeadInMs, leadInFault } from '@shared/midi/lead-in';
import type { RetuneMode } from '@shared/midi/retune-report';
import { parsePresetDocument } from '@shared/preset/preset-document';
import { Subscription, map } from 'rxjs';
import { loader } from '../api/loader';
import { Session } from '../auth/session';
import { decodeDesign } from '../design/design-address';
import { LibraryApi, PresetRow } from '../library/library-api';
import { SignInPrompt } from '../library/sign-in-prompt';
import { MyInstruments, instrumentSummary } from '../instruments/my-instruments';
import { FileDrop } from './file-drop';
import { PresetFile, readPresetFile } from './preset-file';
import { RetuneApi, RetuneStep, RetuneTuning } from './retune-api';
import { readRoll, retunedRoll, writtenRoll } from './roll-notes';
import { SongPreview } from './song-preview';
import { SongReport } from './song-report';
import { SongRoll } from './song-roll';
import { fileSize, uploadFault } from './upload-limit';

type TuningSource = 'design' | 'saved' | 'file';

const modeNames: Record<RetuneMode, string> = {
  mts: 'tuning messages (MTS)',
  mpe: 'one note per channel (MPE)',
};

/** Song retuning: choose a MIDI song, a tuning and a mode, watch it go, read the report, download the result. */
@Component({
  selector: 'app-retune-page',
  changeDetection: ChangeDetectionStrategy.OnPush,
  imports: [
    RouterLink,
    MatButtonModule,
    MatFormFieldModule,
    MatIconModule,
    MatInputModule,
    MatProgressBarModule,
    MatRadioModule,
    MatSelectModule,
    FileDrop,
    SignInPrompt,
    SongPreview,
    SongReport,
    SongRoll,
  ],
  providers: [RetuneApi],
  templateUrl: './retune-page.html',
  styleUrl: './retune-page.scss',
})
export class RetunePage {
  private readonly api = inject(RetuneApi);
  private readonly library = inject(LibraryApi);
  private readonly destroyRef = inject(DestroyRef);
  private readonly session = inject(Session);
  protected readonly instruments = inject(MyInstruments);

  /** `?d=`: the design the designer sent along, in its own address encoding. */
  readonly d = input<string>();

  protected readonly song = signal<File | null>(null);
  protected readonly songFault = signal<string | null>(null);

  protected readonly design = computed(() => {
    const encoded = this.d();
    return encoded ? decodeDesign(encoded) : null;
  });
  protected readonly designFaults = computed(() => {
    const design = this.design();
    if (!design || typeof design === 'string') return [];
    const parsed = parsePresetDocument(design);
    return parsed.ok ? [] : parsed.errors.map((error) => error.message);
  });

  protected readonly signedIn = computed(() => Boolean(this.session.member()));
  protected readonly signedOut = computed(() => this.session.member() === null);
  private readonly savedPresets = loader(
    () => {
      if (!this.signedIn()) return null;
      const all = { q: '', page: 1, pageSize: 100, bandId: null, trash: false };
      return this.library.presets({ ...all, sort: 'name' }).pipe(map((page) => page.items));
    },
    { fallback: 'Your saved presets could not be loaded.' },
  );
  protected readonly presets = computed<PresetRow[]>(() => this.savedPresets.value() ?? []);
  protected readonly presetsLoading = this.savedPresets.loading;
  protected readonly presetsFailure = this.savedPresets.failure;
  protected readonly presetId = signal<string | null>(null);

  protected readonly presetFile = signal<{ file: File; reading: PresetFile } | null>(null);

  protected readonly source = linkedSignal<TuningSource>(() =>
    this.d() ? 'design' : this.signedIn() ? 'saved' : 'file',
  );
  /** "For my instrument": the instrument whose settings stand in for the preset's output block. */
  protected readonly instrumentId = signal<string | null>(null);
  protected readonly instrument = computed(
    () => this.instruments.list()?.find((each) => each.id === this.instrumentId()) ?? null,
  );
  protected readonly summary = instrumentSummary;
  /** Follows the instrument (MPE for one that takes MPE, MTS otherwise) until the player changes it. */
  protected readonly mode = linkedSignal<RetuneMode>(() =>
    this.instrument()?.receives === 'mpe' ? 'mpe' : 'mts',
  );
  /** The time the instrument gets to apply the tuning before the first note, as typed. */
  protected readonly leadInText = signal(String(defaultLeadInMs));
  protected readonly leadInFault = computed(() => {
    const text = this.leadInText().trim();
    const fault = leadInFault(text === '' ? Number.NaN : Number(text));
    return fault ? `Lead-in ${fault}.` : null;
  });

  protected readonly step = signal<RetuneStep | null>(null);
  protected readonly missing = signal<string | null>(null);
  protected readonly downloadUrl = signal<string | null>(null);
  protected readonly busy = computed(() =>
    ['sending', 'retuning'].includes(this.step()?.kind ?? ''),
  );
  protected readonly percentSent = computed(() => {
    const step = this.step();
    return step?.kind === 'sending' && step.fraction !== null
      ? Math.round(step.fraction * 100)
      : null;
  });
  /** What a screen reader hears as the retune goes: the steps, not every percent. */
  protected readonly announcement = computed(() => {
    switch (this.step()?.kind) {
      case 'sending':
        return 'Sending the song.';
      case 'retuning':
        return 'Retuning.';
      case 'done':
        return 'Retuned. The download is ready below.';
      default:
        return '';
    }
  });
  private running: Subscription | null = null;

  /** The chosen song as a piano roll, read in the browser. */
  protected readonly songRoll = resource({
    params: () => this.song() ?? undefined,
    loader: ({ params }) => readRoll(params, writtenRoll),
  });
  /** The retuned song as a piano roll, read as an instrument would sound it. */
  protected readonly retunedRoll = resource({
    params: () => {
      const step = this.step();
      return step?.kind === 'done' ? step.song.blob : undefined;
    },
    loader: ({ params }) => readRoll(params, retunedRoll),
  });
  /** The chosen saved preset, fetched once a song is there to draw against it. */
  private readonly savedToDraw = loader(
    () => {
      const id = this.source() === 'saved' && this.song() ? this.presetId() : null;
      return id === null ? null : this.library.preset(id);
    },
    { fallback: 'The saved preset could not be read.' },
  );
  private readonly savedDocument = computed((): unknown =>
    this.savedToDraw.loading() ? null : (this.savedToDraw.value()?.document ?? null),
  );
  /** The keys the chosen tuning leaves unmapped; null until a sound tuning is chosen. */
  protected readonly unmappedKeys = computed(() => {
    const document = this.tuningDocument();
    if (document === null) return null;
    const parsed = parsePresetDocument(document);
    const tuning = parsed.ok ? tuningOfPreset(parsed.value) : null;
    if (!tuning?.ok) return null;
    return tuning.value.keys.filter((entry) => entry.hz === null).map((entry) => entry.key);
  });
  private readonly tuningDocument = computed((): unknown => {
    switch (this.source()) {
      case 'design': {
        const design = this.design();
        return design && typeof design !== 'string' ? design : null;
      }
      case 'saved':
        return this.savedDocument();
      case 'file': {
        const reading = this.presetFile()?.reading;
        return reading?.ok ? reading.document : null;
      }
    }
  });

  constructor() {
    this.destroyRef.onDestroy(() => this.replaceDownload(null));
  }

  protected fileSize(bytes: number): string {
    return fileSize(bytes);
  }

  protected modeName(mode: RetuneMode): string {
    return modeNames[mode];
  }

  protected otherMode(mode: RetuneMode): RetuneMode {
    return mode === 'mts' ? 'mpe' : 'mts';
  }

  protected chooseSong(file: File): void {
    this.running?.unsubscribe();
    const fault = uploadFault(file);
    this.songFault.set(fault);
    this.song.set(fault ? null : file);
    this.missing.set(null);
    this.step.set(null);
    this.replaceDownload(null);
  }

  protected choosePreset(id: string): void {
    this.missing.set(null);
    this.presetId.set(id);
  }

  protected async choosePresetFile(file: File): Promise<void> {
    this.missing.set(null);
    this.presetFile.set({ file, reading: await readPresetFile(file) });
  }

  protected retuneSong(): void {
    if (this.busy()) return;
    const song = this.song();
    const tuning = this.chosenTuning();
    const leadInFault = this.leadInFault();
    const missing = !song
      ? 'Choose a song first.'
      : typeof tuning === 'string'
        ? tuning
        : leadInFault;
    this.missing.set(missing);
    if (!song || typeof tuning === 'string' || leadInFault) return;
    this.running?.unsubscribe();
    this.replaceDownload(null);
    this.running = this.api
      .retune(song, tuning, this.mode(), Number(this.leadInText()), this.instrumentSent())
      .pipe(takeUntilDestroyed(this.destroyRef))
      .subscribe((step) => {
        if (step.kind === 'done') this.replaceDownload(URL.createObjectURL(step.song.blob));
        this.step.set(step);
      });
  }

  protected retuneInMode(mode: RetuneMode): void {
    this.mode.set(mode);
    this.retuneSong();
  }

  /** The instrument the server knows (kept in the account) goes by its id. */
  private instrumentSent(): string | null {
    const instrument = this.instrument();
    return instrument && this.instruments.keptIn() === 'account' ? instrument.id : null;
  }

  /**
   * The tuning the musician chose, ready to send, or what is still to be chosen. A guest's
   * instrument (kept in this browser; a guest has no saved presets) is laid over the document's
   * output block here, as the server does for a member's.
   */
  private chosenTuning(): RetuneTuning | string {
    const tuning = this.ownTuning();
    const instrument = this.instrument();
    if (typeof tuning === 'string' || !instrument || this.instruments.keptIn() === 'account')
      return tuning;
    if (!('document' in tuning)) return tuning;
    const document = tuning.document as { output?: object };
    const { deviceId, program, bank, bendRange, memberChannels } = instrument;
    const output = { ...document.output, deviceId, program, bank, bendRange, memberChannels };
    return { document: { ...document, output } };
  }

  private ownTuning(): RetuneTuning | string {
    switch (this.source()) {
      case 'design': {
        const design = this.design();
        if (!design) return 'Choose a tuning first.';
        if (typeof design === 'string') return design;
        if (this.designFaults().length)
          return 'The design has faults; open it in the designer to put them right.';
        return { document: design };
      }
      case 'saved': {
        const presetId = this.presetId();
        return presetId ? { presetId } : 'Choose one of your saved presets.';
      }
      case 'file': {
        const chosen = this.presetFile();
        if (!chosen) return 'Choose a preset file.';
        return chosen.reading.ok
          ? { document: chosen.reading.document }
          : 'The preset file has faults (listed under it); choose another.';
      }
    }
  }

  private replaceDownload(url: string | null): void {
    const old = this.downloadUrl();
    if (old) URL.revokeObjectURL(old);
    this.downloadUrl.set(url);
  }
}
