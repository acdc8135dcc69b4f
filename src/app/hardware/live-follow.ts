import { Injectable, computed, inject, signal } from '@angular/core';
import { takeUntilDestroyed, toObservable } from '@angular/core/rxjs-interop';
import type { KeyPitch } from '@shared/midi/frequency-word';
import { debounceTime } from 'rxjs';
import { DesignState } from '../design/design-state';
import { changedKeyMessages, keyPitches } from './tuning-messages';
import { TuningSender } from './tuning-sender';

/** Edits settle for this long before the changed keys go out. */
export const followDebounceMs = 150;

/**
 * Live follow: while on, each settled edit of the design sends real-time single-note changes for
 * the keys whose pitch changed, to the sender's port and target, and counts what went out.
 */
@Injectable()
export class LiveFollow {
  private readonly state = inject(DesignState);
  private readonly sender = inject(TuningSender);
  private sounding: KeyPitch[] | null = null;
  readonly on = signal(false);
  readonly messagesSent = signal(0);
  readonly bytesSent = signal(0);

  constructor() {
    const preset = computed(() => this.state.shown()?.preset ?? null);
    toObservable(preset)
      .pipe(debounceTime(followDebounceMs), takeUntilDestroyed())
      .subscribe(() => this.sendChanges());
  }

  /** Starts from the design as it is now: the instrument is taken to hold it already. */
  start(): void {
    const preset = this.state.shown()?.preset;
    this.sounding = preset ? keyPitches(preset) : null;
    this.messagesSent.set(0);
    this.bytesSent.set(0);
    this.on.set(true);
  }

  stop(): void {
    this.on.set(false);
    this.sounding = null;
  }

  private sendChanges(): void {
    const preset = this.state.shown()?.preset;
    if (!this.on() || !preset) return;
    const next = keyPitches(preset);
    if (!next) return;
    const messages = this.sounding
      ? changedKeyMessages(this.sounding, next, this.sender.target())
      : [];
    this.sounding = next;
    for (const message of messages) {
      if (!this.sender.sendNow(message)) {
        this.sender.reportPortGone();
        this.stop();
        return;
      }
      this.messagesSent.update((count) => count + 1);
      this.bytesSent.update((count) => count + message.length);
    }
  }
}
