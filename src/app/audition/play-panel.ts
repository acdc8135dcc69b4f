import {
  ChangeDetectionStrategy,
  Component,
  computed,
  inject,
  input,
  linkedSignal,
} from '@angular/core';
import { MatButtonModule } from '@angular/material/button';
import { MatButtonToggleModule } from '@angular/material/button-toggle';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatSelectModule } from '@angular/material/select';
import { MatSliderModule } from '@angular/material/slider';
import { MatSlideToggleModule } from '@angular/material/slide-toggle';
import { DesignState } from '../design/design-state';
import { MidiAccess, midiAccessFaults } from '../hardware/midi-access';
import { Audition } from './audition';
import type { Timbre } from './audition-engine';
import {
  keyOffsetOfCode,
  playingKeyCount,
  shiftDownCode,
  shiftUpCode,
  sustainCode,
} from './computer-keys';
import { ControllerInput } from './controller-input';

/** Whether a key press lands in a place that takes typing or pressing, where playing must stay quiet. */
function isTyping(target: EventTarget | null): boolean {
  return (
    target instanceof HTMLElement &&
    (target.isContentEditable || /^(INPUT|TEXTAREA|SELECT|BUTTON)$/.test(target.tagName))
  );
}

/** The Play panel: volume, timbre, sustain, drone, compare and a MIDI controller, and the computer keyboard. */
@Component({
  selector: 'app-play-panel',
  changeDetection: ChangeDetectionStrategy.OnPush,
  imports: [
    MatButtonModule,
    MatButtonToggleModule,
    MatFormFieldModule,
    MatSelectModule,
    MatSliderModule,
    MatSlideToggleModule,
  ],
  templateUrl: './play-panel.html',
  styleUrl: './play-panel.scss',
  host: {
    '(document:keydown)': 'playComputerKey($event, true)',
    '(document:keyup)': 'playComputerKey($event, false)',
  },
})
export class PlayPanel {
  /** Whether the 128 keys are shown right under the panel (the shared page) rather than on the Keys tab. */
  readonly keysBelow = input(false);
  protected readonly audition = inject(Audition);
  protected readonly midi = inject(MidiAccess);
  protected readonly controller = inject(ControllerInput);
  private readonly state = inject(DesignState);
  protected readonly timbres: { id: Timbre; label: string }[] = [
    { id: 'soft', label: 'Soft' },
    { id: 'bright', label: 'Bright' },
    { id: 'pluck', label: 'Plucked' },
  ];
  /** The lowest key the computer keyboard plays: the root key until shifted. */
  protected readonly lowestKey = linkedSignal(
    () => this.state.shown()?.preset.mapping.rootKey ?? 60,
  );
  protected readonly highestKey = computed(() =>
    Math.min(127, this.lowestKey() + playingKeyCount - 1),
  );
  protected readonly accessFault = computed(() => midiAccessFaults[this.midi.state()] ?? null);
  private readonly down = new Map<string, number>();
  protected readonly volumeText = (db: number) => `${db} dB`;

  protected playComputerKey(event: KeyboardEvent, pressed: boolean): void {
    if (event.ctrlKey || event.metaKey || event.altKey || isTyping(event.target)) return;
    if (event.code === sustainCode) {
      event.preventDefault();
      if (!event.repeat) this.audition.setSustain(pressed);
      return;
    }
    if (pressed && (event.code === shiftDownCode || event.code === shiftUpCode)) {
      const period = Math.max(1, this.state.keysPerPeriod());
      const step = event.code === shiftUpCode ? period : -period;
      this.lowestKey.update((key) => Math.min(127, Math.max(0, key + step)));
      return;
    }
    const offset = keyOffsetOfCode(event.code);
    if (offset === null) return;
    event.preventDefault();
    if (!pressed) {
      const key = this.down.get(event.code);
      this.down.delete(event.code);
      if (key !== undefined) this.audition.releaseKey(key);
      return;
    }
    const key = this.lowestKey() + offset;
    if (event.repeat || key > 127 || this.down.has(event.code)) return;
    this.down.set(event.code, key);
    this.audition.pressKey(key);
  }

  protected async connectController(): Promise<void> {
    if (!(await this.midi.open())) return;
    const first = this.midi.inputs()[0];
    if (first && !this.controller.inputId()) this.controller.choose(first.id);
  }
}
