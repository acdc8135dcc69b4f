import { DecimalPipe } from '@angular/common';
import {
  ChangeDetectionStrategy,
  Component,
  DestroyRef,
  computed,
  inject,
  signal,
} from '@angular/core';
import { takeUntilDestroyed } from '@angular/core/rxjs-interop';
import { MatButtonModule } from '@angular/material/button';
import { MatIconModule } from '@angular/material/icon';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { RouterLink } from '@angular/router';
import { Subscription } from 'rxjs';
import { apiErrorMessage } from '../api/api-error';
import { encodeDesign } from '../design/design-address';
import { draftFrom } from '../design/draft-document';
import { FileDrop } from '../retune/file-drop';
import { fileSize, uploadFault } from '../retune/upload-limit';
import { readPresetDocument } from '../scale/preset-reading';
import { DegreeTable } from '../scale/degree-table';
import { ImportApi, ImportKind, ImportedTuning } from './import-api';
import { importNotes } from './import-notes';

const kindNames: Record<ImportKind, string> = {
  syx: 'MTS messages (.syx)',
  preset: 'A Keyloom preset (.json)',
  intervals: 'A list of intervals',
};

/** Import: a tuning from an .syx file, a preset file or a list of intervals, shown, then opened in the designer. */
@Component({
  selector: 'app-import-page',
  changeDetection: ChangeDetectionStrategy.OnPush,
  imports: [
    DecimalPipe,
    RouterLink,
    MatButtonModule,
    MatIconModule,
    MatProgressBarModule,
    FileDrop,
    DegreeTable,
  ],
  templateUrl: './import-page.html',
  styleUrl: './import-page.scss',
})
export class ImportPage {
  private readonly api = inject(ImportApi);
  private readonly destroyRef = inject(DestroyRef);

  protected readonly file = signal<File | null>(null);
  protected readonly importing = signal(false);
  protected readonly failure = signal<string | null>(null);
  protected readonly imported = signal<ImportedTuning | null>(null);

  private readonly reading = readPresetDocument(() => this.imported()?.document);
  protected readonly faults = this.reading.faults;
  protected readonly preset = this.reading.preset;
  protected readonly preview = this.reading.preview;
  protected readonly notes = computed(() => {
    const preset = this.preset();
    const preview = this.preview();
    return preset && preview ? importNotes(preset, preview) : [];
  });
  /** The imported tuning in the designer's address encoding: what "Open in the designer" carries. */
  protected readonly design = computed(() => {
    const imported = this.imported();
    return imported ? encodeDesign(draftFrom(imported.document)) : null;
  });
  /** What a screen reader hears: that the file is being read, and what it turned out to be. */
  protected readonly announcement = computed(() => {
    const imported = this.imported();
    if (this.importing()) return 'Reading the file.';
    return imported ? `Found ${imported.document.name}: ${kindNames[imported.kind]}.` : '';
  });
  private running: Subscription | null = null;

  protected fileSize(bytes: number): string {
    return fileSize(bytes);
  }

  protected kindName(kind: ImportKind): string {
    return kindNames[kind];
  }

  protected importFile(file: File): void {
    this.running?.unsubscribe();
    this.file.set(file);
    this.imported.set(null);
    this.failure.set(uploadFault(file));
    if (this.failure()) return;
    this.importing.set(true);
    this.running = this.api
      .importFile(file)
      .pipe(takeUntilDestroyed(this.destroyRef))
      .subscribe({
        next: (imported) => {
          this.importing.set(false);
          this.imported.set(imported);
        },
        error: async (error: unknown) => {
          const message = await apiErrorMessage(error, 'The file could not be imported.');
          if (this.file() !== file) return;
          this.failure.set(message);
          this.importing.set(false);
        },
      });
  }
}
