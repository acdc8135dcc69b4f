import { Injectable, computed, inject, signal } from '@angular/core';
import { DesignState } from '../design/design-state';
import { AuditionEngine, type Timbre, startingVolumeDb } from './audition-engine';

const droneVoice = 'drone';
/** How long a chosen interval sounds, long enough to hear it beat. */
const intervalSeconds = 2.5;

/** The equal-tempered pitch of `key` with A4 (key 69) at `concertA`. */
function equalTemperedHz(key: number, concertA: number): number {
  return concertA * 2 ** ((key - 69) / 12);
}

/**
 * Hearing the design: plays keys at exactly the frequencies the key table maps them to (or, with the
 * compare switch, in 12-tone equal temperament), holds them with sustain, drones on the tonic, and
 * plays an interval's two notes together. The audio context starts on the first sound.
 */
@Injectable()
export class Audition {
  private readonly state = inject(DesignState);
  private engine: AuditionEngine | null = null;
  private readonly held = new Set<number>();
  private readonly sustained = new Set<number>();
  private intervalTimer: ReturnType<typeof setTimeout> | undefined;

  readonly volumeDb = signal(startingVolumeDb);
  readonly timbre = signal<Timbre>('soft');
  readonly sustain = signal(false);
  readonly drone = signal(false);
  readonly compare = signal(false);
  /** True once sound has played: the page then reminds the listener to keep the volume low. */
  readonly hasSounded = signal(false);
  readonly playing = signal<readonly number[]>([]);
  private readonly keys = computed(() => this.state.shown()?.table.keys ?? []);

  /** The frequency key `key` sounds at now: the mapped pitch, or equal temperament when comparing; null if unmapped. */
  hzOfKey(key: number): number | null {
    const shown = this.state.shown();
    const entry = this.keys()[key];
    if (!shown || !entry || entry.hz === null) return null;
    return this.compare() ? equalTemperedHz(key, shown.preset.mapping.concertA) : entry.hz;
  }

  pressKey(key: number): void {
    const hz = this.hzOfKey(key);
    if (hz === null) return;
    this.sustained.delete(key);
    this.held.add(key);
    this.sound(`key ${key}`, hz);
    this.showPlaying();
  }

  releaseKey(key: number): void {
    if (!this.held.delete(key)) return;
    if (this.sustain()) this.sustained.add(key);
    else this.engine?.stop(`key ${key}`);
    this.showPlaying();
  }

  setSustain(on: boolean): void {
    this.sustain.set(on);
    if (on) return;
    for (const key of this.sustained) this.engine?.stop(`key ${key}`);
    this.sustained.clear();
    this.showPlaying();
  }

  setDrone(on: boolean): void {
    this.drone.set(on);
    const shown = this.state.shown();
    if (!on || !shown) {
      this.engine?.stop(droneVoice);
      return;
    }
    const { rootKey, rootHz, concertA } = shown.preset.mapping;
    this.sound(droneVoice, this.compare() ? equalTemperedHz(rootKey, concertA) : rootHz);
  }

  setCompare(on: boolean): void {
    this.compare.set(on);
    if (this.drone()) this.setDrone(true);
  }

  setVolumeDb(db: number): void {
    this.volumeDb.set(db);
    this.engine?.setVolumeDb(db);
  }

  /**
   * Plays degree `from` and the degree `steps` above it together; comparing, both fall on the
   * nearest equal-tempered pitches instead.
   */
  playInterval(from: number, steps: number): void {
    const shown = this.state.shown();
    if (!shown) return;
    const { degrees, analysis } = shown.table;
    const lowerCents = degrees[from]?.cents;
    const widthCents = analysis.intervalMatrix[from]?.[steps];
    if (lowerCents === undefined || widthCents === undefined) return;
    const rootHz = shown.preset.mapping.rootHz;
    const snap = (cents: number) => (this.compare() ? Math.round(cents / 100) * 100 : cents);
    const lower = snap(lowerCents);
    const upper = lower + snap(widthCents);
    this.sound('interval low', rootHz * 2 ** (lower / 1200));
    this.sound('interval high', rootHz * 2 ** (upper / 1200));
    clearTimeout(this.intervalTimer);
    this.intervalTimer = setTimeout(() => {
      this.engine?.stop('interval low');
      this.engine?.stop('interval high');
    }, intervalSeconds * 1000);
  }

  /** Silences everything: keys held or sustained, the drone and any interval. */
  stopAll(): void {
    for (const id of this.engine?.sounding() ?? []) this.engine?.stop(id);
    this.held.clear();
    this.sustained.clear();
    this.drone.set(false);
    this.showPlaying();
  }

  private sound(id: string, hz: number): void {
    this.engineStarted().start(id, hz, this.timbre());
    this.hasSounded.set(true);
  }

  private engineStarted(): AuditionEngine {
    if (!this.engine) {
      const context = new AudioContext();
      void context.resume();
      this.engine = new AuditionEngine(context);
      this.engine.setVolumeDb(this.volumeDb());
    }
    return this.engine;
  }

  private showPlaying(): void {
    this.playing.set([...new Set([...this.held, ...this.sustained])].sort((a, b) => a - b));
  }
}
