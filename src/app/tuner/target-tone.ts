import { DestroyRef, Injectable, inject, signal } from '@angular/core';
import { AuditionEngine, startingVolumeDb } from '../audition/audition-engine';

const voice = 'target';

/**
 * The target pitch, sounded through the audition synth (quiet at first, under its limiter) for tuning by ear.
 * Its audio context starts on the first sound and closes with the page.
 */
@Injectable()
export class TargetTone {
  readonly volumeDb = signal(startingVolumeDb);
  /** The pitch sounding, in Hz; null: silent. */
  readonly sounding = signal<number | null>(null);
  /** True once sound has played: the page then reminds the player to keep the volume low. */
  readonly hasSounded = signal(false);
  private context: AudioContext | null = null;
  private engine: AuditionEngine | null = null;

  constructor() {
    inject(DestroyRef).onDestroy(() => {
      void this.context?.close();
      this.context = null;
      this.engine = null;
    });
  }

  /** Sounds `hz`, or moves the sounding tone to it. */
  play(hz: number): void {
    if (this.sounding() === hz) return;
    this.started().start(voice, hz, 'soft');
    this.sounding.set(hz);
    this.hasSounded.set(true);
  }

  stop(): void {
    this.engine?.stop(voice);
    this.sounding.set(null);
  }

  setVolumeDb(db: number): void {
    this.volumeDb.set(db);
    this.engine?.setVolumeDb(db);
  }

  private started(): AuditionEngine {
    if (!this.engine) {
      this.context = new AudioContext();
      void this.context.resume();
      this.engine = new AuditionEngine(this.context);
      this.engine.setVolumeDb(this.volumeDb());
    }
    return this.engine;
  }
}
