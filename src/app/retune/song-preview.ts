import {
  ChangeDetectionStrategy,
  Component,
  DestroyRef,
  computed,
  effect,
  inject,
  input,
  signal,
  untracked,
} from '@angular/core';
import { MatButtonModule } from '@angular/material/button';
import { MatIconModule } from '@angular/material/icon';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { MatSliderModule } from '@angular/material/slider';
import { type SongSound, songSound } from '@shared/midi/song-sounding';
import { AuditionEngine, type Timbre, startingVolumeDb } from '../audition/audition-engine';

/** How far ahead of the audio clock notes are handed to the synth, and how often the schedule is topped up. */
const lookAheadSeconds = 0.5;
const scheduleEveryMs = 50;
const timbre: Timbre = 'soft';

function clock(seconds: number): string {
  const whole = Math.max(0, Math.floor(seconds));
  return `${Math.floor(whole / 60)}:${String(whole % 60).padStart(2, '0')}`;
}

/**
 * Hearing a retuned song before downloading it: the file is read as an instrument that follows MTS and pitch bend
 * would play it (see song-sounding.ts) and played through the audition synth, quietly at first and under its limiter.
 */
@Component({
  selector: 'app-song-preview',
  changeDetection: ChangeDetectionStrategy.OnPush,
  imports: [MatButtonModule, MatIconModule, MatProgressBarModule, MatSliderModule],
  template: `
    <div class="bar">
      @if (playing()) {
        <button mat-stroked-button type="button" class="stop" (click)="stop()">
          <mat-icon aria-hidden="true">stop</mat-icon> Stop
        </button>
      } @else {
        <button mat-stroked-button type="button" class="play" (click)="play()">
          <mat-icon aria-hidden="true">play_arrow</mat-icon> Hear it first
        </button>
      }
      <label class="volume">
        <span id="song-volume-label">Volume</span>
        <mat-slider min="-60" max="0" step="1" discrete [displayWith]="volumeText">
          <input
            matSliderThumb
            aria-labelledby="song-volume-label"
            [value]="volumeDb()"
            (valueChange)="setVolumeDb($event)"
          />
        </mat-slider>
        <span>{{ volumeDb() }} dB</span>
      </label>
      @if (sound(); as sound) {
        <span class="clock" aria-label="Position in the song"
          >{{ clock(position()) }} / {{ clock(sound.seconds) }}</span
        >
      }
    </div>
    @if (sound(); as sound) {
      <mat-progress-bar mode="determinate" [value]="percent()" aria-label="Position in the song" />
      <p class="hint">
        {{ sound.notes.length }} notes, played as an instrument that follows the song's tuning
        messages and bends would play them, with a plain tone.
        @if (sound.drumNotes) {
          {{ sound.drumNotes }} drum notes (channel 10) are left out.
        }
      </p>
    }
    @if (hasSounded()) {
      <p class="caution" role="status">
        Keep the volume low, especially on headphones: it starts at {{ startingVolume }} dB and a
        limiter holds the peaks.
      </p>
    }
    @if (fault(); as fault) {
      <p class="fault" role="alert">{{ fault }}</p>
    }
  `,
  styles: `
    :host {
      display: block;
      margin: 12px 0;
    }
    .bar {
      display: flex;
      flex-wrap: wrap;
      align-items: center;
      gap: 8px 16px;
    }
    .volume {
      display: flex;
      align-items: center;
      gap: 8px;
    }
    .volume mat-slider {
      width: 160px;
    }
    .clock {
      font-variant-numeric: tabular-nums;
    }
    .hint,
    .caution {
      font: var(--mat-sys-body-small);
      color: var(--mat-sys-on-surface-variant);
      margin: 6px 0 0;
    }
    .caution {
      color: var(--mat-sys-on-surface);
    }
    .fault {
      color: var(--mat-sys-error);
    }
  `,
})
export class SongPreview {
  /** The retuned song, as downloaded. */
  readonly song = input.required<Blob>();

  protected readonly startingVolume = startingVolumeDb;
  protected readonly volumeDb = signal(startingVolumeDb);
  protected readonly sound = signal<SongSound | null>(null);
  protected readonly playing = signal(false);
  protected readonly position = signal(0);
  protected readonly hasSounded = signal(false);
  protected readonly fault = signal<string | null>(null);
  protected readonly percent = computed(() => {
    const length = this.sound()?.seconds ?? 0;
    return length > 0 ? Math.min(100, (100 * this.position()) / length) : 0;
  });

  private context: AudioContext | null = null;
  private engine: AuditionEngine | null = null;
  private timer: ReturnType<typeof setInterval> | undefined;
  private startedAt = 0;
  private next = 0;

  constructor() {
    // A new song stops the old one and is read afresh.
    effect(() => {
      this.song();
      untracked(() => {
        this.stop();
        this.sound.set(null);
        this.position.set(0);
      });
    });
    inject(DestroyRef).onDestroy(() => this.stop());
  }

  protected clock(seconds: number): string {
    return clock(seconds);
  }

  protected volumeText(db: number): string {
    return `${db} dB`;
  }

  protected setVolumeDb(db: number): void {
    this.volumeDb.set(db);
    this.engine?.setVolumeDb(db);
  }

  async play(): Promise<void> {
    this.fault.set(null);
    const sound = this.sound() ?? (await this.read());
    if (!sound) return;
    if (sound.notes.length === 0) {
      this.fault.set('The song has no notes to play outside channel 10 (drums).');
      return;
    }
    // An audio context of its own for each playing, closed on stop: that silences the notes already handed over.
    this.stop();
    this.context = new AudioContext();
    this.engine = new AuditionEngine(this.context);
    this.engine.setVolumeDb(this.volumeDb());
    void this.context.resume();
    this.startedAt = this.context.currentTime + 0.1;
    this.next = 0;
    this.playing.set(true);
    this.hasSounded.set(true);
    this.schedule();
    this.timer = setInterval(() => this.schedule(), scheduleEveryMs);
  }

  stop(): void {
    clearInterval(this.timer);
    this.timer = undefined;
    void this.context?.close();
    this.context = null;
    this.engine = null;
    this.playing.set(false);
  }

  private async read(): Promise<SongSound | null> {
    const bytes = new Uint8Array(await this.song().arrayBuffer());
    const sound = songSound(bytes);
    if (!sound.ok) {
      this.fault.set(`The retuned song cannot be played here: ${sound.errors[0].message}`);
      return null;
    }
    this.sound.set(sound.value);
    return sound.value;
  }

  /** Hands the synth every note that starts within the look-ahead, each with its own release. */
  private schedule(): void {
    const sound = this.sound();
    const engine = this.engine;
    const context = this.context;
    if (!sound || !engine || !context) return;
    const now = context.currentTime - this.startedAt;
    this.position.set(Math.max(0, Math.min(now, sound.seconds)));
    while (
      this.next < sound.notes.length &&
      sound.notes[this.next].start < now + lookAheadSeconds
    ) {
      const note = sound.notes[this.next];
      const id = `song ${this.next}`;
      engine.start(id, note.hz, timbre, this.startedAt + note.start);
      engine.stop(id, this.startedAt + Math.max(note.end, note.start + 0.02));
      this.next++;
    }
    if (now > sound.seconds + 0.5) this.stop();
  }
}
