import { ChangeDetectionStrategy, Component, computed, input } from '@angular/core';

/** The needle's reach each side of the centre, in cents, and the angle it swings through there. */
const reachCents = 50;
const reachDegrees = 70;
/** A reading within this many cents of the target counts as in tune (common practice for a tuner's centre). */
export const inTuneCents = 2;

const centre = { x: 120, y: 132 };

function angleOf(cents: number): number {
  return (Math.max(-reachCents, Math.min(reachCents, cents)) / reachCents) * reachDegrees;
}

/** A point `radius` from the pivot at the needle angle of `cents`. */
function pointAt(cents: number, radius: number): { x: number; y: number } {
  const radians = (angleOf(cents) * Math.PI) / 180;
  return { x: centre.x + radius * Math.sin(radians), y: centre.y - radius * Math.cos(radians) };
}

/** An arc `radius` from the pivot between two offsets, as SVG path data. */
function arc(from: number, to: number, radius: number): string {
  const start = pointAt(from, radius);
  const end = pointAt(to, radius);
  return `M ${start.x} ${start.y} A ${radius} ${radius} 0 0 1 ${end.x} ${end.y}`;
}

/**
 * The offset on a needle: -50 to +50 cents across a dial marked every 10 cents, the in-tune band at the centre.
 * An offset beyond the dial pins the needle at its end. It repeats the reading beside it, so it is hidden from
 * assistive technology.
 */
@Component({
  selector: 'app-tuner-needle',
  changeDetection: ChangeDetectionStrategy.OnPush,
  template: `
    <svg viewBox="0 0 240 150" aria-hidden="true" focusable="false">
      <path class="dial" [attr.d]="dial" />
      <path class="in-tune" [attr.d]="inTuneBand" />
      @for (tick of ticks; track tick.cents) {
        <line
          class="tick"
          [class.major]="tick.major"
          [attr.x1]="tick.inner.x"
          [attr.y1]="tick.inner.y"
          [attr.x2]="tick.outer.x"
          [attr.y2]="tick.outer.y"
        />
      }
      @for (label of labels; track label.text) {
        <text class="label" [attr.x]="label.at.x" [attr.y]="label.at.y">{{ label.text }}</text>
      }
      <g
        class="needle"
        [class.resting]="cents() === null"
        [class.tuned]="tuned()"
        [attr.transform]="'rotate(' + angle() + ' 120 132)'"
      >
        <line x1="120" y1="132" x2="120" y2="26" />
      </g>
      <circle class="pivot" cx="120" cy="132" r="6" />
    </svg>
  `,
  styles: `
    :host {
      display: block;
    }
    svg {
      display: block;
      width: 100%;
      max-width: 420px;
      margin: 0 auto;
    }
    .dial {
      fill: none;
      stroke: var(--mat-sys-outline-variant);
      stroke-width: 2;
    }
    .in-tune {
      fill: none;
      stroke: var(--mat-sys-primary);
      stroke-width: 10;
    }
    .tick {
      stroke: var(--mat-sys-outline);
      stroke-width: 1.5;
    }
    .tick.major {
      stroke: var(--mat-sys-on-surface);
      stroke-width: 2.5;
    }
    .label {
      fill: var(--mat-sys-on-surface-variant);
      font: 11px var(--mat-sys-body-small-font, sans-serif);
      text-anchor: middle;
      dominant-baseline: middle;
    }
    .needle line {
      stroke: var(--mat-sys-on-surface);
      stroke-width: 3;
      stroke-linecap: round;
    }
    .needle.tuned line {
      stroke: var(--mat-sys-primary);
    }
    .needle.resting line {
      stroke: var(--mat-sys-outline-variant);
    }
    .pivot {
      fill: var(--mat-sys-on-surface);
    }
  `,
})
export class TunerNeedle {
  /** The offset from the target in cents; null: nothing to show. */
  readonly cents = input<number | null>(null);

  protected readonly angle = computed(() => {
    const cents = this.cents();
    return cents === null ? 0 : Math.round(angleOf(cents) * 1000) / 1000;
  });
  protected readonly tuned = computed(() => {
    const cents = this.cents();
    return cents !== null && Math.abs(cents) <= inTuneCents;
  });
  protected readonly dial = arc(-reachCents, reachCents, 112);
  protected readonly inTuneBand = arc(-inTuneCents, inTuneCents, 112);
  protected readonly ticks = Array.from({ length: 11 }, (_, n) => {
    const cents = -reachCents + 10 * n;
    const major = cents === 0 || Math.abs(cents) === reachCents;
    return { cents, major, inner: pointAt(cents, major ? 96 : 102), outer: pointAt(cents, 112) };
  });
  protected readonly labels = [-50, -25, 0, 25, 50].map((cents) => ({
    text: cents > 0 ? `+${cents}` : cents < 0 ? `−${-cents}` : '0',
    at: pointAt(cents, 84),
  }));
}
