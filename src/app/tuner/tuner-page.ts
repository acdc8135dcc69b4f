import { DecimalPipe } from '@angular/common';
import {
  ChangeDetectionStrategy,
  Component,
  computed,
  effect,
  inject,
  input,
  linkedSignal,
  signal,
} from '@angular/core';
import { MatButtonModule } from '@angular/material/button';
import { MatExpansionModule } from '@angular/material/expansion';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatInputModule } from '@angular/material/input';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { MatSelectModule } from '@angular/material/select';
import { MatSliderModule } from '@angular/material/slider';
import { RouterLink } from '@angular/router';
import {
  type TunerLock,
  type TunerMatch,
  centsFrom,
  nearestTarget,
  tunerTargets,
} from '@shared/tuner/nearest-target';
import { highestHz, lowestHz, quietestDb } from '@shared/tuner/pitch-detector';
import {
  agreeingFrames,
  agreementCents,
  averagedFrames,
  heldFrames,
} from '@shared/tuner/pitch-track';
import { readingParts, signedCents } from '@shared/tuner/tuner-reading';
import { noteName } from '@shared/tuning/twelve-edo';
import { map } from 'rxjs';
import { loader } from '../api/loader';
import { startingVolumeDb } from '../audition/audition-engine';
import { Session } from '../auth/session';
import { decodeDesign } from '../design/design-address';
import { pitchWords } from '../keys/pitch-words';
import { LibraryApi } from '../library/library-api';
import { SignInPrompt } from '../library/sign-in-prompt';
import { readPresetDocument } from '../scale/preset-reading';
import { ShareApi } from '../share/share-api';
import { type ListeningState, PitchListener } from './pitch-listener';
import { TargetTone } from './target-tone';
import { TunerNeedle, inTuneCents } from './tuner-needle';

/** The tuning to tune to, wherever it came from, and where to go back to it. */
interface TunerTuning {
  name: string;
  about: string;
  document: unknown;
  back: { path: string; query: Record<string, string> };
}

/** Concert A as the preset document allows it, in Hz. */
const concertRange = { low: 220, high: 880 };

/** What each listening state means for the player, in plain words. */
const stateWords: Record<ListeningState, string> = {
  idle: 'Press Start, then play one note at a time.',
  asking: 'Waiting for the browser: allow the microphone so that the tuner can listen.',
  listening: 'Listening.',
  refused:
    'The tuner may not use the microphone: it was refused. Allow the microphone for this site ' +
    '(in the site settings by the address bar) and press Start again.',
  'no-input': 'No microphone was found. Connect one, or switch it on, and press Start again.',
  busy:
    'The microphone could not be opened: another program may be using it. Close that program and ' +
    'press Start again.',
  ended: 'The microphone stopped (unplugged or switched off). Press Start to listen again.',
  unsupported:
    'This browser cannot listen to a microphone on this page: it needs a secure (https) address ' +
    'and a current browser.',
};

/** The name of the preset a document holds, or a stand-in when it has none. */
function documentName(document: unknown): string {
  const name = (document as { name?: unknown } | null)?.name;
  return typeof name === 'string' && name.trim() ? name : 'Untitled preset';
}

/**
 * The tuner (`/tuner`): for a saved preset (`?preset=ID`, `&revision=N`), a share link (`?share=TOKEN`, no
 * account needed) or a design from the designer's address (`?d=`), it listens to the microphone once asked,
 * and shows the nearest mapped key and degree, the target's pitch and the offset on a needle and in words. It
 * can be locked to one degree or key, tune to a concert A of the session's own, and sound the target.
 */
@Component({
  selector: 'app-tuner-page',
  changeDetection: ChangeDetectionStrategy.OnPush,
  imports: [
    DecimalPipe,
    RouterLink,
    MatButtonModule,
    MatExpansionModule,
    MatFormFieldModule,
    MatIconModule,
    MatInputModule,
    MatProgressBarModule,
    MatSelectModule,
    MatSliderModule,
    SignInPrompt,
    TunerNeedle,
  ],
  providers: [PitchListener, TargetTone],
  templateUrl: './tuner-page.html',
  styleUrl: './tuner-page.scss',
})
export class TunerPage {
  private readonly shareApi = inject(ShareApi);
  private readonly library = inject(LibraryApi);
  protected readonly session = inject(Session);
  protected readonly listener = inject(PitchListener);
  protected readonly tone = inject(TargetTone);

  /** `?preset=`: a saved preset's id; `?revision=`: one of its revisions (else the latest). */
  readonly preset = input<string>();
  readonly revision = input<string>();
  /** `?share=`: a share link's token. */
  readonly share = input<string>();
  /** `?d=`: a design in the designer's own address encoding. */
  readonly d = input<string>();

  private readonly design = computed(() => {
    const encoded = this.share() || this.preset() ? undefined : this.d();
    return encoded ? decodeDesign(encoded) : null;
  });
  /** Why the design in the address cannot be read, when it cannot. */
  protected readonly designFault = computed(() => {
    const design = this.design();
    return typeof design === 'string' ? design : null;
  });
  /** A saved preset opens for a member only; a guest is asked to sign in. */
  protected readonly needsSignIn = computed(
    () => !this.share() && Boolean(this.preset()) && this.session.member() === null,
  );
  protected readonly noTuning = computed(() => !this.share() && !this.preset() && !this.d());

  private readonly loaded = loader(
    () => {
      const token = this.share();
      if (token) {
        return this.shareApi.shared(token).pipe(
          map((shared): TunerTuning => ({
            name: shared.name,
            about: `shared preset, revision ${shared.revision}`,
            document: shared.document,
            back: { path: `/s/${token}`, query: {} },
          })),
        );
      }
      const id = this.preset();
      if (!id || !this.session.member()) return null;
      const back = { path: `/presets/${id}`, query: {} };
      const revision = Number(this.revision());
      if (Number.isInteger(revision) && revision >= 1) {
        return this.library.revision(id, revision).pipe(
          map((saved): TunerTuning => ({
            name: documentName(saved.document),
            about: `saved preset, revision ${saved.revision}`,
            document: saved.document,
            back,
          })),
        );
      }
      return this.library.preset(id).pipe(
        map((saved): TunerTuning => ({
          name: saved.name,
          about: `saved preset, revision ${saved.revision}`,
          document: saved.document,
          back,
        })),
      );
    },
    {
      fallback: 'The tuning could not be loaded.',
      notFound:
        'There is no such preset or share link: it was deleted or revoked, it is not yours to open, ' +
        'or the address is not complete.',
    },
  );
  /** Loading, or waiting to know who is signed in before a saved preset can be asked for. */
  protected readonly loading = computed(
    () =>
      this.loaded.loading() ||
      (!this.share() && Boolean(this.preset()) && this.session.member() === undefined),
  );
  protected readonly loadFailure = this.loaded.failure;

  protected readonly tuning = computed<TunerTuning | null>(() => {
    const design = this.design();
    if (design && typeof design === 'object') {
      return {
        name: documentName(design),
        about: 'the design from the designer',
        document: design,
        back: { path: '/design', query: { d: this.d()! } },
      };
    }
    return this.loaded.value() ?? null;
  });
  private readonly reading = readPresetDocument(() => this.tuning()?.document);
  protected readonly faults = this.reading.faults;
  protected readonly resolved = this.reading.preset;
  protected readonly preview = this.reading.preview;
  protected readonly pitchWords = computed(() => {
    const preset = this.resolved();
    return preset ? pitchWords(preset.mapping) : '';
  });

  /** The preset's concert A, and the session's own (the preset keeps its own). */
  protected readonly presetConcertA = computed(() => this.resolved()?.mapping.concertA ?? 440);
  protected readonly concertA = linkedSignal(() => this.presetConcertA());
  protected readonly concertAText = linkedSignal(() => String(this.presetConcertA()));
  protected readonly concertAFault = signal<string | null>(null);
  /** How far the session's concert A moves every target, in cents. */
  protected readonly referenceShift = computed(() =>
    centsFrom(this.concertA(), this.presetConcertA()),
  );
  protected readonly referenceWords = computed(() => {
    const preset = this.presetConcertA();
    const moved =
      this.concertA() === preset ? '' : ` (${signedCents(this.referenceShift())} cents now)`;
    return (
      `The preset's concert A is ${preset} Hz. Another holds for this session only and moves every ` +
      `target by the same interval${moved}.`
    );
  });

  /** Every mapped key as a target, at the session's concert A. */
  private readonly targets = computed(() => {
    const preview = this.preview();
    if (!preview) return [];
    return tunerTargets(preview.keys, this.concertA() / this.presetConcertA());
  });
  /** The keys one can lock to: those whose pitch the tuner reads. */
  protected readonly lockableKeys = computed(() =>
    this.targets()
      .filter((target) => target.hz >= lowestHz && target.hz <= highestHz)
      .map((target) => ({ ...target, name: noteName(target.key) })),
  );
  protected readonly degreeNames = computed(() =>
    (this.preview()?.degrees ?? []).map((degree) => ({
      degree: degree.degree,
      name: degree.name,
    })),
  );

  /** What the reading is taken against; a new tuning starts unlocked. */
  protected readonly lock = linkedSignal<TunerLock>(() => {
    this.preview();
    return null;
  });
  protected readonly lockChoice = computed(() => {
    const lock = this.lock();
    return lock === null
      ? 'nearest'
      : lock.kind === 'key'
        ? `key:${lock.key}`
        : `degree:${lock.degree}`;
  });
  protected readonly lockWords = computed(() => {
    const lock = this.lock();
    if (lock === null) return null;
    if (lock.kind === 'key') return `Locked to ${noteName(lock.key)} (key ${lock.key})`;
    const name = this.degreeNames()[lock.degree]?.name;
    return `Locked to degree ${lock.degree}${name ? ` (${name})` : ''}, in any octave`;
  });

  protected readonly listening = computed(() => this.listener.state() === 'listening');
  protected readonly stateWords = computed(() => stateWords[this.listener.state()]);
  protected readonly trouble = computed(() =>
    ['refused', 'no-input', 'busy', 'ended', 'unsupported'].includes(this.listener.state()),
  );
  protected readonly match = computed<TunerMatch | null>(() => {
    const hz = this.listener.hz();
    return hz === null || !this.listening() ? null : nearestTarget(hz, this.targets(), this.lock());
  });
  protected readonly parts = computed(() => {
    const match = this.match();
    return match ? readingParts(match) : null;
  });
  protected readonly inTune = computed(() => {
    const match = this.match();
    return match !== null && Math.abs(match.cents) <= inTuneCents;
  });
  /** The reading's words when there is no reading. */
  protected readonly emptyReading = computed(() =>
    this.listening() ? 'No clear pitch' : 'Not listening',
  );
  protected readonly hint = computed(() => {
    if (!this.listening() || this.match()) return null;
    switch (this.listener.lastFrame()) {
      case 'quiet':
        return 'Too quiet to read: play louder, or nearer the microphone.';
      case 'unclear':
        return 'Play one note at a time: noise, chords and knocks have no clear pitch.';
      default:
        return null;
    }
  });
  /** Said to assistive technology when it changes: the key and degree, and when the note is in tune. */
  protected readonly announcement = computed(() => {
    const parts = this.parts();
    if (!parts) return this.listening() ? 'No clear pitch' : '';
    return `${parts[0]}, ${parts[1]}${this.inTune() ? ', in tune' : ''}`;
  });

  /** The last pitch heard, kept through silences, for the target tone. */
  private readonly lastHz = linkedSignal<number | null, number | null>({
    source: this.listener.hz,
    computation: (hz, previous) => hz ?? previous?.value ?? null,
  });
  /**
   * What the tone sounds: the locked key; else the target of the last note heard; else, locked to a degree, its
   * key nearest the root.
   */
  protected readonly toneTarget = computed(
    () => {
      const targets = this.targets();
      const lock = this.lock();
      const heard = this.lastHz();
      const root = this.resolved()?.mapping.rootHz;
      if (heard !== null) return nearestTarget(heard, targets, lock);
      if (lock?.kind === 'key') return targets.find((target) => target.key === lock.key) ?? null;
      if (lock?.kind === 'degree' && root) {
        return nearestTarget((root * this.concertA()) / this.presetConcertA(), targets, lock);
      }
      return null;
    },
    { equal: (a, b) => a?.key === b?.key && a?.hz === b?.hz },
  );
  protected readonly toneOn = signal(false);
  protected readonly startingVolume = startingVolumeDb;
  protected readonly volumeText = (db: number) => `${db} dB`;

  /** The smoothing and the limits, in the help's words, from the numbers the tuner uses. */
  protected readonly listeningFacts = {
    averagedFrames,
    agreeingFrames,
    agreementCents,
    heldFrames,
    heldMs: Math.round((heldFrames * 1000) / 60),
    quietestDb,
    lowestHz,
    highestHz,
    inTuneCents,
  };

  constructor() {
    effect(() => {
      const target = this.toneTarget();
      if (this.toneOn() && target) this.tone.play(target.hz);
      else this.tone.stop();
    });
  }

  protected start(): void {
    void this.listener.start();
  }

  protected chooseLock(choice: string): void {
    const [kind, value] = choice.split(':');
    if (kind === 'key') this.lock.set({ kind: 'key', key: Number(value) });
    else if (kind === 'degree') this.lock.set({ kind: 'degree', degree: Number(value) });
    else this.lock.set(null);
  }

  protected lockToKey(key: number): void {
    this.lock.set({ kind: 'key', key });
  }

  protected setConcertA(text: string): void {
    this.concertAText.set(text);
    const hz = Number(text.trim().replace(',', '.'));
    if (
      text.trim() === '' ||
      !Number.isFinite(hz) ||
      hz < concertRange.low ||
      hz > concertRange.high
    ) {
      this.concertAFault.set(
        `Concert A must be a pitch from ${concertRange.low} to ${concertRange.high} Hz.`,
      );
      return;
    }
    this.concertAFault.set(null);
    this.concertA.set(hz);
  }

  protected resetConcertA(): void {
    this.setConcertA(String(this.presetConcertA()));
  }

  protected toggleTone(): void {
    this.toneOn.update((on) => !on);
  }

  protected keyName(key: number): string {
    return noteName(key);
  }
}
