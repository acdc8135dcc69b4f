import {
  ChangeDetectionStrategy,
  Component,
  type OnDestroy,
  computed,
  effect,
  inject,
  input,
  signal,
  untracked,
} from '@angular/core';
import { FormsModule } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatInputModule } from '@angular/material/input';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { MatSelectModule } from '@angular/material/select';
import { MatSlideToggleModule } from '@angular/material/slide-toggle';
import { RouterLink } from '@angular/router';
import { firstValueFrom } from 'rxjs';
import type { Listener } from 'webmidi';
import { apiErrorMessage } from '../api/api-error';
import { loader } from '../api/loader';
import { Session } from '../auth/session';
import { MidiAccess, midiAccessFaults } from '../hardware/midi-access';
import { SignInPrompt } from '../library/sign-in-prompt';
import { type Setlist, type SetlistEntry, StageApi, type StagePosition } from './stage-api';
import { stageFacts } from './stage-facts';
import { type StageControls, keepStageControls, keptStageControls } from './stage-controls';
import { StageLink, linkWords } from './stage-link';
import { StageSender } from './stage-sender';
import { TuningBackup } from '../hardware/tuning-backup';

/** Keys that move the stage: the arrows, and the page keys foot pedals send. */
const backKeys = new Set(['ArrowLeft', 'PageUp']);
const onKeys = new Set(['ArrowRight', 'PageDown']);

/**
 * The stage (`/stage/:setlistId`): the current and next tuning of a setlist in large type, moves
 * for editors (buttons, keys, a MIDI input), and Follow, which keeps the page on the band's live
 * position and sends each tuning to the member's instruments.
 */
@Component({
  selector: 'app-stage-page',
  changeDetection: ChangeDetectionStrategy.OnPush,
  imports: [
    FormsModule,
    RouterLink,
    MatButtonModule,
    MatFormFieldModule,
    MatIconModule,
    MatInputModule,
    MatProgressBarModule,
    MatSelectModule,
    MatSlideToggleModule,
    SignInPrompt,
  ],
  providers: [MidiAccess, StageLink, StageSender, TuningBackup],
  templateUrl: './stage-page.html',
  styleUrl: './stage-page.scss',
  host: { '(document:keydown)': 'onKey($event)' },
})
export class StagePage implements OnDestroy {
  private readonly api = inject(StageApi);
  protected readonly session = inject(Session);
  protected readonly midi = inject(MidiAccess);
  protected readonly link = inject(StageLink);
  protected readonly sender = inject(StageSender);
  protected readonly linkWords = linkWords;
  protected readonly midiFaults = midiAccessFaults;

  /** The setlist's id, from the address. */
  readonly setlistId = input.required<string>();

  private readonly loaded = loader(
    () => (this.session.member() ? this.api.setlist(this.setlistId()) : null),
    {
      fallback: 'The setlist could not be loaded.',
      notFound: 'There is no such setlist, or you are not in its band.',
    },
  );
  private readonly instrumentsLoaded = loader(
    () => (this.session.member() ? this.api.instruments() : null),
    { fallback: 'Your instruments could not be loaded.' },
  );
  protected readonly setlist = signal<Setlist | null>(null);
  protected readonly failure = computed(() => this.loaded.failure());
  protected readonly instrumentsFailure = this.instrumentsLoaded.failure;
  protected readonly moveFailure = signal<string | null>(null);
  protected readonly position = signal(0);
  protected readonly following = signal(false);
  protected readonly editor = computed(() => this.setlist()?.access === 'edit');

  protected readonly entries = computed(() => this.setlist()?.entries ?? []);
  protected readonly current = computed<SetlistEntry | null>(
    () => this.entries()[this.position()] ?? null,
  );
  protected readonly next = computed<SetlistEntry | null>(
    () => this.entries()[this.position() + 1] ?? null,
  );

  /** The document of the current entry: from the live stream when it told it, else loaded. */
  private readonly tellsNow = computed(() => {
    const latest = this.link.latest();
    const current = this.current();
    const fits = this.following() && latest?.position === this.position();
    return fits && latest.presetId === current?.presetId ? latest : null;
  });
  /** Which revision's document to load; the same one twice is loaded once. */
  private readonly wanted = computed(
    () => {
      const entry = this.current();
      if (!entry || this.tellsNow()) return null;
      return { presetId: entry.presetId, revision: entry.revision ?? entry.latestRevision };
    },
    { equal: (a, b) => a?.presetId === b?.presetId && a?.revision === b?.revision },
  );
  private readonly documentLoaded = loader(
    () => {
      const wanted = this.wanted();
      return wanted && this.api.revision(wanted.presetId, wanted.revision);
    },
    { fallback: 'The tuning of this entry could not be loaded.' },
  );
  /** The tuner for the current entry, at the revision on stage. */
  protected readonly tunerQuery = computed(() => {
    const told = this.tellsNow();
    if (told) return { preset: told.presetId, revision: told.revision };
    const wanted = this.wanted();
    return wanted && { preset: wanted.presetId, revision: wanted.revision };
  });
  protected readonly facts = computed(() => {
    const document = this.tellsNow()?.document ?? this.documentLoaded.value();
    return document === undefined ? null : stageFacts(document);
  });

  /**
   * The MIDI input that may move the stage, and the footswitch controller that means Next; both are kept in this
   * browser, and the kept input is listened to again as soon as a port of that name is connected.
   */
  private readonly kept = signal(keptStageControls());
  protected readonly inputId = signal<string | null>(null);
  protected readonly footswitch = computed(() => this.kept().footswitch);
  private inputListeners: Listener[] = [];

  constructor() {
    effect(() => {
      const setlist = this.loaded.value();
      if (!setlist) return;
      untracked(() => {
        this.setlist.set(setlist);
        this.position.set(setlist.position);
      });
    });
    effect(() => {
      const name = this.kept().inputName;
      const port = this.editor() && name && this.midi.inputs().find((input) => input.name === name);
      if (port && untracked(this.inputId) !== port.id) untracked(() => this.listenTo(port.id));
    });
    effect(() => {
      const instruments = this.instrumentsLoaded.value();
      if (instruments) untracked(() => this.sender.instruments.set(instruments));
    });
  }

  /** Each position the live stream tells moves the page, and its tuning goes to the instruments. */
  private told(latest: StagePosition): void {
    if (!this.following()) return;
    const entry = this.entries()[latest.position];
    if (entry?.presetId !== latest.presetId) this.loaded.reload();
    this.position.set(latest.position);
    const facts = stageFacts(latest.document);
    if (facts) void this.sender.offer(facts.preset);
  }

  ngOnDestroy(): void {
    this.listenTo(null);
  }

  protected setFollowing(on: boolean): void {
    this.following.set(on);
    if (on) this.link.start(this.api.livePath(this.setlistId()), (latest) => this.told(latest));
    else this.link.stop();
  }

  protected retry(): void {
    this.setFollowing(true);
  }

  protected async connectMidi(): Promise<void> {
    if (!(await this.midi.open())) return;
    const facts = this.following() && this.tellsNow() ? this.facts() : null;
    if (facts) void this.sender.offer(facts.preset);
  }

  protected previous(): void {
    this.moveTo(this.position() - 1);
  }

  protected forward(): void {
    this.moveTo(this.position() + 1);
  }

  protected onKey(event: KeyboardEvent): void {
    if (!this.editor() || event.altKey || event.ctrlKey || event.metaKey) return;
    const target = event.target;
    const fields = 'input, textarea, select, [role="combobox"], [role="listbox"]';
    if (target instanceof Element && target.closest(fields)) return;
    if (backKeys.has(event.key)) this.previous();
    else if (onKeys.has(event.key)) this.forward();
    else return;
    event.preventDefault();
  }

  protected async moveTo(position: number): Promise<void> {
    const setlist = this.setlist();
    if (!setlist || !this.editor() || position < 0 || position >= setlist.entries.length) return;
    if (position === this.position()) return;
    const before = this.position();
    this.position.set(position);
    this.moveFailure.set(null);
    try {
      const moved = await firstValueFrom(this.api.move(setlist.id, position));
      this.setlist.set(moved);
    } catch (error) {
      if (this.position() === position) this.position.set(before);
      this.moveFailure.set(await apiErrorMessage(error, 'The stage could not be moved.'));
    }
  }

  /** The player's choice of input: listened to, and kept for the next visit. */
  protected chooseInput(id: string | null): void {
    const name = id ? (this.midi.inputs().find((port) => port.id === id)?.name ?? null) : null;
    this.keep({ ...this.kept(), inputName: name });
    this.listenTo(id);
  }

  protected chooseFootswitch(controller: number | null): void {
    if (controller === null || !Number.isInteger(controller) || controller < 0 || controller > 127)
      return;
    this.keep({ ...this.kept(), footswitch: controller });
  }

  private keep(controls: StageControls): void {
    this.kept.set(controls);
    keepStageControls(controls);
  }

  /**
   * Listens to MIDI input `id` (null: to none): a program change selects the entry whose trigger
   * it is; the footswitch controller at 64 or above means Next.
   */
  private listenTo(id: string | null): void {
    for (const listener of this.inputListeners) listener.remove();
    this.inputListeners = [];
    this.inputId.set(id);
    const port = id ? this.midi.input(id) : null;
    if (!port) return;
    this.inputListeners = [
      // MIDI 1.0 Detailed Specification: program change Cn pp, pp the program from 0 to 127.
      port.addListener('programchange', (event) => {
        const program = event.rawValue ?? event.value;
        const index = this.entries().findIndex((entry) => entry.trigger === program);
        if (index >= 0) this.moveTo(index);
      }),
      // Common practice: a footswitch sends a controller at 64 or above when pressed.
      port.addListener('controlchange', (event) => {
        const pressed = (event.rawValue ?? 0) >= 64;
        if (event.controller.number === this.footswitch() && pressed) this.forward();
      }),
    ].flat();
  }
}
