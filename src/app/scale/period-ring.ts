import { ChangeDetectionStrategy, Component, computed, input } from '@angular/core';

const size = 240;
const centre = size / 2;
const ringRadius = 84;
const labelRadius = 104;
const semitoneCents = 100;
/** Above this many degrees, only every few degrees get a number, so that the numbers stay apart. */
const mostLabels = 24;

interface Point {
  x: number;
  y: number;
}

/** A point on a circle of `radius` at `fraction` of a turn clockwise from the top. */
function pointAt(fraction: number, radius: number): Point {
  const angle = fraction * 2 * Math.PI - Math.PI / 2;
  return { x: centre + radius * Math.cos(angle), y: centre + radius * Math.sin(angle) };
}

/**
 * The degrees as points around a circle that is one period: the tonic at the top, each degree as
 * far round as it lies in the period, with the equal-tempered semitones as ticks for reference.
 */
@Component({
  selector: 'app-period-ring',
  changeDetection: ChangeDetectionStrategy.OnPush,
  template: `
    <svg [attr.viewBox]="'0 0 ' + size + ' ' + size" role="img" [attr.aria-label]="description()">
      <circle class="ring" [attr.cx]="centre" [attr.cy]="centre" [attr.r]="ringRadius" />
      @for (tick of ticks(); track $index) {
        <line
          class="tick"
          [attr.x1]="tick.inner.x"
          [attr.y1]="tick.inner.y"
          [attr.x2]="tick.outer.x"
          [attr.y2]="tick.outer.y"
        />
      }
      <polygon class="shape" [attr.points]="outline()" />
      @for (point of points(); track $index) {
        <circle
          class="degree"
          [class.tonic]="$index === 0"
          [attr.cx]="point.at.x"
          [attr.cy]="point.at.y"
          r="4.5"
        />
        @if (point.label !== null) {
          <text [attr.x]="point.labelAt.x" [attr.y]="point.labelAt.y + 4">{{ point.label }}</text>
        }
      }
    </svg>
  `,
  styles: `
    :host {
      display: block;
      max-width: 300px;
    }
    svg {
      display: block;
      width: 100%;
      height: auto;
    }
    .ring {
      fill: none;
      stroke: var(--mat-sys-outline-variant);
      stroke-width: 1.5;
    }
    .tick {
      stroke: var(--mat-sys-outline);
      stroke-width: 1;
    }
    .shape {
      fill: color-mix(in srgb, var(--mat-sys-primary) 12%, transparent);
      stroke: var(--mat-sys-primary);
      stroke-width: 1;
    }
    .degree {
      fill: var(--mat-sys-primary);
    }
    .degree.tonic {
      fill: var(--mat-sys-tertiary);
    }
    text {
      fill: var(--mat-sys-on-surface);
      font-size: 10px;
      text-anchor: middle;
    }
  `,
})
export class PeriodRing {
  /** Each degree's cents above the tonic, degree 0 first. */
  readonly degreeCents = input.required<number[]>();
  readonly periodCents = input.required<number>();
  protected readonly size = size;
  protected readonly centre = centre;
  protected readonly ringRadius = ringRadius;
  protected readonly points = computed(() => {
    const cents = this.degreeCents();
    const every = Math.ceil(cents.length / mostLabels);
    return cents.map((degreeCents, degree) => {
      const fraction = degreeCents / this.periodCents();
      return {
        at: pointAt(fraction, ringRadius),
        labelAt: pointAt(fraction, labelRadius),
        label: degree % every === 0 ? degree : null,
      };
    });
  });
  protected readonly outline = computed(() =>
    this.points()
      .map(({ at }) => `${at.x.toFixed(1)},${at.y.toFixed(1)}`)
      .join(' '),
  );
  protected readonly ticks = computed(() => {
    const count = Math.round(this.periodCents() / semitoneCents);
    return Array.from({ length: count }, (_, index) => ({
      inner: pointAt((index * semitoneCents) / this.periodCents(), ringRadius - 6),
      outer: pointAt((index * semitoneCents) / this.periodCents(), ringRadius + 6),
    }));
  });
  protected readonly description = computed(
    () =>
      `Ring of the ${this.degreeCents().length} degrees inside the period of ${this.periodCents().toFixed(1)} cents, ` +
      'with ticks at each equal-tempered semitone',
  );
}
