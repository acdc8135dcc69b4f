import { Injectable, InjectionToken, type OnDestroy, inject, signal } from '@angular/core';
import type { StagePosition } from '@shared/api/setlists';

/** The part of the browser's EventSource the stage uses; specs hand in their own. */
export interface StageStream {
  readonly readyState: number;
  onopen: ((event: Event) => void) | null;
  onerror: ((event: Event) => void) | null;
  addEventListener(type: 'position', listener: (event: MessageEvent<string>) => void): void;
  close(): void;
}

/** Opens the live stream at an address: the browser's EventSource unless a spec provides one. */
export const STAGE_EVENT_SOURCE = new InjectionToken<(url: string) => StageStream>(
  'the stage event source',
  { providedIn: 'root', factory: () => (url: string) => new EventSource(url) },
);

/** EventSource.readyState values (WHATWG HTML, "Server-sent events"). */
const connecting = 0;
const closed = 2;

/** How long reconnecting may go on before the page says the stage is cut off. */
export const cutOffAfterMs = 15_000;

export type LinkState = 'off' | 'in-step' | 'catching-up' | 'cut-off';

/** What each state says, in words; the page colours them too. */
export const linkWords: Record<LinkState, string> = {
  off: 'Not following',
  'in-step': 'In step',
  'catching-up': 'Catching up…',
  'cut-off': 'Cut off',
};

/**
 * Following the stage: the live stream of a setlist's position, its connection state, and the
 * latest position it told. The browser reconnects a dropped stream itself and resends
 * Last-Event-ID, so nothing is missed or told twice.
 */
@Injectable()
export class StageLink implements OnDestroy {
  private readonly open = inject(STAGE_EVENT_SOURCE);
  private stream: StageStream | null = null;
  private timer: ReturnType<typeof setTimeout> | null = null;
  readonly state = signal<LinkState>('off');
  readonly latest = signal<StagePosition | null>(null);

  /** Follows the stream at `url`; `told` hears each position as it comes, before effects run. */
  start(url: string, told: (position: StagePosition) => void = () => undefined): void {
    this.stop();
    const stream = this.open(url);
    this.stream = stream;
    this.reconnecting();
    stream.onopen = () => this.inStep();
    stream.onerror = () => {
      if (stream.readyState === closed) this.cutOff();
      else if (stream.readyState === connecting) this.reconnecting();
    };
    stream.addEventListener('position', (event) => {
      try {
        const position = JSON.parse(event.data) as StagePosition;
        this.latest.set(position);
        this.inStep();
        told(position);
      } catch {
        // A malformed event is left out; the next one carries the whole position again.
      }
    });
  }

  stop(): void {
    this.stream?.close();
    this.stream = null;
    this.clearTimer();
    this.state.set('off');
  }

  ngOnDestroy(): void {
    this.stop();
  }

  private inStep(): void {
    this.clearTimer();
    this.state.set('in-step');
  }

  private reconnecting(): void {
    if (this.state() !== 'cut-off') this.state.set('catching-up');
    if (this.timer === null) this.timer = setTimeout(() => this.cutOff(), cutOffAfterMs);
  }

  private cutOff(): void {
    this.clearTimer();
    this.state.set('cut-off');
  }

  private clearTimer(): void {
    if (this.timer !== null) clearTimeout(this.timer);
    this.timer = null;
  }
}
