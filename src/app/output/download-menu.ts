import { ChangeDetectionStrategy, Component, computed, inject, signal } from '@angular/core';
import { MatButtonModule } from '@angular/material/button';
import { MatIconModule } from '@angular/material/icon';
import { MatMenuModule } from '@angular/material/menu';
import { MatTooltipModule } from '@angular/material/tooltip';
import { MatDialog } from '@angular/material/dialog';
import { firstValueFrom } from 'rxjs';
import { InstrumentDialog } from '../instruments/instrument-dialog';
import {
  type MyInstrument,
  MyInstruments,
  exportOfInstrument,
} from '../instruments/my-instruments';
import { DesignState } from '../design/design-state';
import { DownloadNotice } from './download-notice';
import type { ExportSource } from './downloads';
import { type ExportFormat, exportFormats } from './export-formats';
import { exportRefusals } from './export-refusals';

/** The download button and its menu of every export format, each with a line on what it is for. */
@Component({
  selector: 'app-download-menu',
  changeDetection: ChangeDetectionStrategy.OnPush,
  imports: [MatButtonModule, MatIconModule, MatMenuModule, MatTooltipModule],
  template: `
    <span [matTooltip]="blocked() ?? ''" [matTooltipDisabled]="!blocked()">
      <button
        mat-stroked-button
        class="download"
        [matMenuTriggerFor]="formatMenu"
        [disabled]="blocked() !== null || busy()"
        (menuOpened)="menuOpen.set(true)"
        [attr.aria-label]="blocked() ? 'Download (' + blocked() + ')' : 'Download'"
      >
        <mat-icon aria-hidden="true">download</mat-icon>
        <span class="label">{{ busy() ? 'Downloading…' : 'Download' }}</span>
      </button>
    </span>
    <mat-menu
      #formatMenu="matMenu"
      class="download-formats"
      xPosition="before"
      (closed)="menuOpen.set(false)"
    >
      @for (format of formats; track format.id) {
        @let refused = refusals().get(format.id);
        <button
          mat-menu-item
          class="format"
          (click)="downloadFormat(format)"
          [disabled]="!!refused"
          [attr.aria-label]="
            format.label +
            ' (.' +
            format.extension +
            '): ' +
            (refused ? 'not for this design: ' + refused : format.use)
          "
        >
          <span class="format-name"
            >{{ format.label }} <span class="extension">.{{ format.extension }}</span></span
          >
          @if (refused) {
            <span class="format-use refused">Not for this design: {{ refused }}</span>
          } @else {
            <span class="format-use">{{ format.use }}</span>
          }
        </button>
      }
    </mat-menu>
    <button
      mat-stroked-button
      class="for-instrument"
      type="button"
      [matMenuTriggerFor]="instrumentMenu"
      [disabled]="blocked() !== null || busy()"
      (menuOpened)="openInstruments()"
      [attr.aria-label]="instrumentLabel()"
    >
      <mat-icon aria-hidden="true">piano</mat-icon>
      <span class="label">For my instrument</span>
    </button>
    <mat-menu
      #instrumentMenu="matMenu"
      class="instrument-downloads"
      xPosition="before"
      (closed)="menuOpen.set(false)"
    >
      @if (instruments.list() === null) {
        <span mat-menu-item disabled>Loading your instruments…</span>
      }
      @for (instrument of instruments.list() ?? []; track instrument.id) {
        @let format = exportOf(instrument);
        @let refused = refusals().get(format.id);
        <button
          mat-menu-item
          class="format"
          (click)="downloadFor(instrument)"
          [disabled]="!!refused"
        >
          <span class="format-name">For {{ instrument.name }}</span>
          @if (refused) {
            <span class="format-use refused">Not for this design: {{ refused }}</span>
          } @else {
            <span class="format-use">
              {{ format.label }} .{{ format.extension }}, with its own settings
            </span>
          }
        </button>
      }
      <button mat-menu-item class="set-up" (click)="setUpInstrument()">
        <mat-icon aria-hidden="true">add</mat-icon>
        Set up an instrument…
      </button>
    </mat-menu>
  `,
  styles: `
    :host {
      display: inline-flex;
      flex-wrap: wrap;
      gap: 8px;
    }
    .format {
      padding-block: 6px;
      line-height: 1.35;
    }
    .format-name {
      display: block;
      font: var(--mat-sys-label-large);
    }
    .extension {
      color: var(--mat-sys-on-surface-variant);
    }
    .format-use {
      display: block;
      white-space: normal;
      font: var(--mat-sys-body-small);
      color: var(--mat-sys-on-surface-variant);
    }
    .format-use.refused {
      font-style: italic;
    }
    @media (max-width: 720px) {
      .download .label,
      .for-instrument .label {
        display: none;
      }
      .download mat-icon,
      .for-instrument mat-icon {
        margin: 0;
      }
    }
  `,
})
export class DownloadMenu {
  private readonly state = inject(DesignState);
  private readonly notice = inject(DownloadNotice);
  private readonly dialog = inject(MatDialog);
  protected readonly instruments = inject(MyInstruments);
  protected readonly exportOf = exportOfInstrument;
  protected readonly formats = exportFormats;
  protected readonly busy = signal(false);
  protected readonly menuOpen = signal(false);
  /** Formats this design cannot be written in, with the reason: worked out while the menu is open. */
  protected readonly refusals = computed(() => {
    const preset = this.menuOpen() ? this.state.shown()?.preset : undefined;
    return preset ? exportRefusals(preset) : new Map<string, string>();
  });
  /** Why nothing can be downloaded now, or null. */
  protected readonly blocked = computed(() =>
    this.state.faults().length > 0 ? 'fix the faults in the design first' : null,
  );
  /** A saved preset downloads as saved; a changed or unsaved design goes to the server as it stands. */
  private readonly source = computed<ExportSource>(() => {
    const origin = this.state.origin();
    return origin && !this.state.dirty()
      ? { presetId: origin.id }
      : { document: this.state.draft() };
  });

  protected readonly instrumentLabel = computed(() => {
    const blocked = this.blocked();
    return `Download for my instrument${blocked ? ` (${blocked})` : ''}`;
  });

  protected openInstruments(): void {
    this.instruments.load();
    this.menuOpen.set(true);
  }

  /** The instrument's own export, made with its settings in place of the design's output ones. */
  protected async downloadFor(instrument: MyInstrument): Promise<void> {
    this.busy.set(true);
    try {
      await this.notice.forInstrument(instrument, this.source());
    } finally {
      this.busy.set(false);
    }
  }

  protected async setUpInstrument(): Promise<void> {
    const dialog = this.dialog.open<InstrumentDialog, void, MyInstrument>(InstrumentDialog, {
      maxWidth: '560px',
    });
    const instrument = await firstValueFrom(dialog.afterClosed());
    if (instrument) await this.downloadFor(instrument);
  }

  protected async downloadFormat(format: ExportFormat): Promise<void> {
    this.busy.set(true);
    try {
      await this.notice.download(format, this.source());
    } finally {
      this.busy.set(false);
    }
  }
}
