import {
  ChangeDetectionStrategy,
  Component,
  ElementRef,
  computed,
  effect,
  inject,
  input,
  signal,
  untracked,
  viewChild,
} from '@angular/core';
import { MatButtonModule } from '@angular/material/button';
import { MatIconModule } from '@angular/material/icon';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { MatTabsModule } from '@angular/material/tabs';
import { RouterLink } from '@angular/router';
import { Audition } from '../audition/audition';
import { ControllerInput } from '../audition/controller-input';
import { PlayPanel } from '../audition/play-panel';
import { StripPlaying } from '../audition/strip-playing';
import { AnchorPicking } from '../keys/anchor-picking';
import { KeyTable } from '../keys/key-table';
import { Session } from '../auth/session';
import { LiveFollow } from '../hardware/live-follow';
import { MidiAccess } from '../hardware/midi-access';
import { SendPanel } from '../hardware/send-panel';
import { TuningSender } from '../hardware/tuning-sender';
import { TuningBackup } from '../hardware/tuning-backup';
import { KeyboardStrip } from '../keys/keyboard-strip';
import { LayoutEditor } from '../keys/layout-editor';
import { ReferencePitch } from '../keys/reference-pitch';
import { DownloadMenu } from '../output/download-menu';
import { OutputSettings } from '../output/output-settings';
import { DegreeTable } from '../scale/degree-table';
import { IntervalMatrix } from '../scale/interval-matrix';
import { OffsetChart } from '../scale/offset-chart';
import { PeriodRing } from '../scale/period-ring';
import { ScaleForm } from '../scale/scale-form';
import { ScaleSummary } from '../scale/scale-summary';
import { DesignAddress, encodeDesign } from './design-address';
import { DesignField } from './design-field';
import { DesignState } from './design-state';
import { SavedPreset } from './saved-preset';
import { MatDialog } from '@angular/material/dialog';
import { ShareDialog, type ShareDialogData } from '../share/share-dialog';

const tabCount = 3;

/** Whether a key press lands in a place that takes typing, where single-key shortcuts must stay quiet. */
function isTyping(target: EventTarget | null): boolean {
  return (
    target instanceof HTMLElement &&
    (target.isContentEditable || /^(INPUT|TEXTAREA|SELECT)$/.test(target.tagName))
  );
}

/**
 * The scale designer: the scale and what it does, the keys it lies on, the output settings and the
 * downloads, for a design of one's own (kept in the address) or a saved preset (`/presets/:id`).
 */
@Component({
  selector: 'app-design-page',
  changeDetection: ChangeDetectionStrategy.OnPush,
  imports: [
    RouterLink,
    MatButtonModule,
    MatIconModule,
    MatProgressBarModule,
    MatTabsModule,
    DesignField,
    DownloadMenu,
    ScaleForm,
    ScaleSummary,
    PeriodRing,
    DegreeTable,
    OffsetChart,
    IntervalMatrix,
    ReferencePitch,
    KeyboardStrip,
    LayoutEditor,
    OutputSettings,
    PlayPanel,
    StripPlaying,
    AnchorPicking,
    KeyTable,
    SendPanel,
  ],
  providers: [
    DesignState,
    DesignAddress,
    SavedPreset,
    Audition,
    MidiAccess,
    ControllerInput,
    TuningSender,
    TuningBackup,
    LiveFollow,
  ],
  templateUrl: './design-page.html',
  styleUrl: './design-page.scss',
  host: { '(document:keydown)': 'followShortcut($event)' },
})
export class DesignPage {
  /** The saved preset's id, from `/presets/:id`; absent for a design of one's own. */
  readonly id = input<string>();
  protected readonly state = inject(DesignState);
  protected readonly address = inject(DesignAddress);
  protected readonly saved = inject(SavedPreset);
  protected readonly session = inject(Session);
  protected readonly audition = inject(Audition);
  private readonly dialog = inject(MatDialog);
  protected readonly tab = signal(0);
  protected readonly ringCents = computed(
    () => this.state.shown()?.table.degrees.map((degree) => degree.cents) ?? [],
  );
  /** The tuner for what is on screen: the saved revision as it stands, else the design in the address's encoding. */
  protected readonly tunerQuery = computed(() => {
    const origin = this.state.origin();
    if (origin && !this.state.dirty()) return { preset: origin.id, revision: origin.revision };
    return { d: encodeDesign(this.state.draft()) };
  });
  /** Why the design in the address could not be opened, if it could not. */
  protected readonly addressFault = signal<string | null>(null);
  private readonly help = viewChild.required<ElementRef<HTMLElement>>('help');
  private addressUsed = false;

  constructor() {
    effect(() => {
      const id = this.id();
      untracked(() => void this.openDesign(id));
    });
  }

  /** Share links to the saved preset, made and revoked in the same dialog as in the library. */
  protected share(presetId: string, revision: number): void {
    this.dialog.open<ShareDialog, ShareDialogData>(ShareDialog, {
      data: { presetId, revision, name: this.state.draft().name },
      width: '560px',
      maxWidth: '95vw',
    });
  }

  protected followShortcut(event: KeyboardEvent): void {
    const command = event.ctrlKey || event.metaKey;
    if (command && !event.altKey && event.key.toLowerCase() === 's') {
      event.preventDefault();
      void this.saved.save();
    } else if (event.altKey && !command && /^Digit[1-9]$/.test(event.code)) {
      const tab = Number(event.code.slice(5)) - 1;
      if (tab < tabCount) {
        event.preventDefault();
        this.tab.set(tab);
      }
    } else if (event.key === '?' && !command && !event.altKey && !isTyping(event.target)) {
      event.preventDefault();
      this.help().nativeElement.togglePopover();
    }
  }

  private async openDesign(id: string | undefined): Promise<void> {
    const fromAddress = this.addressUsed ? null : this.address.initial();
    this.addressUsed = true;
    if (typeof fromAddress === 'string') this.addressFault.set(fromAddress);
    if (id) {
      if (!(await this.saved.open(id))) return;
      if (fromAddress && typeof fromAddress === 'object') this.state.restoreEdits(fromAddress);
    } else if (fromAddress && typeof fromAddress === 'object') {
      this.state.open(fromAddress, null);
    }
    this.address.follow();
  }
}
