import { Directive, inject } from '@angular/core';
import { Audition } from './audition';

/** The key number a pointer event landed on, from the strip's `data-key` marks. */
function keyAt(event: Event): number | null {
  const target = event.target instanceof Element ? event.target.closest('[data-key]') : null;
  return target ? Number(target.getAttribute('data-key')) : null;
}

/** Makes the keyboard strip playable with the mouse, pen or touch: a key sounds while pressed. */
@Directive({
  selector: 'app-keyboard-strip[appStripPlaying]',
  host: {
    '(pointerdown)': 'pressKey($event)',
    '(pointerup)': 'releaseKey()',
    '(pointercancel)': 'releaseKey()',
    '(pointerleave)': 'releaseKey()',
    '[style.touch-action]': '"pan-x"',
  },
})
export class StripPlaying {
  private readonly audition = inject(Audition);
  private pressed: number | null = null;

  protected pressKey(event: PointerEvent): void {
    const key = keyAt(event);
    if (key === null) return;
    this.releaseKey();
    this.pressed = key;
    this.audition.pressKey(key);
  }

  protected releaseKey(): void {
    if (this.pressed === null) return;
    this.audition.releaseKey(this.pressed);
    this.pressed = null;
  }
}
