import { ChangeDetectionStrategy, Component, computed, input } from '@angular/core';
import type { PreviewDegree } from '@shared/tuning/preview';
import { signedCentsText } from './cents-text';

const slotWidth = 30;
const axisWidth = 44;
const plotHeight = 140;
const labelHeight = 36;
/** The furthest a degree can sit from its nearest equal-tempered note. */
const rangeCents = 50;

interface Bar {
  x: number;
  y: number;
  height: number;
  raised: boolean;
  note: string;
  degree: number;
  title: string;
}

/** A bar per degree: how many cents it sits above or below its nearest twelve-tone equal-tempered note. */
@Component({
  selector: 'app-offset-chart',
  changeDetection: ChangeDetectionStrategy.OnPush,
  template: `
    <div class="scroller">
      <svg
        [attr.viewBox]="'0 0 ' + width() + ' ' + height"
        [style.max-width.px]="width()"
        [style.min-width.px]="narrowest()"
        preserveAspectRatio="xMinYMin meet"
        role="img"
        aria-label="Chart of each degree's offset from the nearest equal-tempered note; the degree table lists the same figures"
      >
        @for (line of gridLines; track line.cents) {
          <line
            class="grid"
            [class.zero]="line.cents === 0"
            [attr.x1]="axisWidth"
            [attr.x2]="width()"
            [attr.y1]="line.y"
            [attr.y2]="line.y"
          />
          <text class="axis" [attr.x]="axisWidth - 6" [attr.y]="line.y + 4">{{ line.label }}</text>
        }
        @for (bar of bars(); track bar.degree) {
          <g>
            <title>{{ bar.title }}</title>
            <rect
              [class.raised]="bar.raised"
              [attr.x]="bar.x + 5"
              [attr.y]="bar.y"
              [attr.width]="slotWidth - 10"
              [attr.height]="bar.height"
              rx="2"
            />
            <text class="note" [attr.x]="bar.x + slotWidth / 2" [attr.y]="plotHeight + 16">
              {{ bar.note }}
            </text>
            <text class="degree" [attr.x]="bar.x + slotWidth / 2" [attr.y]="plotHeight + 30">
              {{ bar.degree }}
            </text>
          </g>
        }
      </svg>
    </div>
  `,
  styles: `
    .scroller {
      overflow-x: auto;
      max-width: 100%;
    }
    /* Shrinks to fit a phone's width, down to a readable size; past that the chart scrolls. */
    svg {
      display: block;
      width: 100%;
      height: auto;
      font: var(--mat-sys-body-small);
    }
    .grid {
      stroke: var(--mat-sys-outline-variant);
      stroke-dasharray: 3 3;
    }
    .grid.zero {
      stroke: var(--mat-sys-outline);
      stroke-dasharray: none;
    }
    .axis {
      fill: var(--mat-sys-on-surface-variant);
      text-anchor: end;
      font-size: 11px;
    }
    rect {
      fill: var(--mat-sys-primary);
    }
    rect.raised {
      fill: var(--mat-sys-tertiary);
    }
    .note {
      fill: var(--mat-sys-on-surface);
      text-anchor: middle;
      font-size: 11px;
    }
    .degree {
      fill: var(--mat-sys-on-surface-variant);
      text-anchor: middle;
      font-size: 10px;
    }
  `,
})
export class OffsetChart {
  readonly degrees = input.required<PreviewDegree[]>();
  protected readonly slotWidth = slotWidth;
  protected readonly axisWidth = axisWidth;
  protected readonly plotHeight = plotHeight;
  protected readonly height = plotHeight + labelHeight;
  protected readonly gridLines = [50, 25, 0, -25, -50].map((cents) => ({
    cents,
    y: this.yOf(cents),
    label: cents === 0 ? '0¢' : signedCentsText(cents, 0),
  }));
  /** The least width the chart shrinks to: about 18 px a bar, below which labels stop being readable. */
  protected readonly narrowest = computed(() =>
    Math.min(this.width(), axisWidth + this.degrees().length * 18),
  );
  protected readonly width = computed(
    () => axisWidth + Math.max(this.degrees().length, 8) * slotWidth,
  );
  protected readonly bars = computed(() =>
    this.degrees().map((degree, index): Bar => {
      const offset = Math.max(-rangeCents, Math.min(rangeCents, degree.nearestNote.offsetCents));
      const [top, bottom] = [this.yOf(Math.max(offset, 0)), this.yOf(Math.min(offset, 0))];
      const note = degree.nearestNote.name.replace(/-?\d+$/, '');
      return {
        x: axisWidth + index * slotWidth,
        y: top,
        height: Math.max(bottom - top, 1),
        raised: offset > 0,
        note,
        degree: degree.degree,
        title: `Degree ${degree.degree}: ${signedCentsText(degree.nearestNote.offsetCents)} from ${degree.nearestNote.name}`,
      };
    }),
  );

  private yOf(cents: number): number {
    const margin = 8;
    return margin + ((rangeCents - cents) / (2 * rangeCents)) * (plotHeight - 2 * margin);
  }
}
