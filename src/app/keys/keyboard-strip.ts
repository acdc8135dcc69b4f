import {
  ChangeDetectionStrategy,
  Component,
  DestroyRef,
  ElementRef,
  afterNextRender,
  computed,
  inject,
  input,
  viewChild,
} from '@angular/core';
import type { PreviewKey } from '@shared/tuning/preview';
import { noteName } from '@shared/tuning/twelve-edo';

const whiteWidth = 16;
const whiteHeight = 92;
const blackWidth = 10;
const blackHeight = 56;
const labelRow = 110;
const blackPitchClasses = new Set([1, 3, 6, 8, 10]);

interface DrawnKey {
  key: number;
  black: boolean;
  x: number;
  width: number;
  height: number;
  mapped: boolean;
  outside: boolean;
  root: boolean;
  anchor: boolean;
  fill: string;
  label: string;
  labelY: number;
  title: string;
}

/** A hue per degree, round the colour circle once per period, so that octaves of a degree match. */
function fillFor(degree: number, size: number, black: boolean): string {
  const hue = Math.round((degree / Math.max(size, 1)) * 330);
  return black ? `hsl(${hue} 40% 30%)` : `hsl(${hue} 65% 86%)`;
}

/** All 128 MIDI keys drawn as a keyboard, each coloured and numbered by the degree it plays. */
@Component({
  selector: 'app-keyboard-strip',
  changeDetection: ChangeDetectionStrategy.OnPush,
  template: `
    <div
      class="scroller"
      #scroller
      tabindex="0"
      role="region"
      aria-label="Keyboard, scrolls sideways"
    >
      <svg
        [attr.width]="width"
        [attr.height]="labelRow + 6"
        role="img"
        [attr.aria-label]="description()"
      >
        <defs>
          <pattern
            id="unmapped-hatch"
            width="6"
            height="6"
            patternUnits="userSpaceOnUse"
            patternTransform="rotate(45)"
          >
            <rect width="6" height="6" class="hatch-ground" />
            <line x1="0" y1="0" x2="0" y2="6" class="hatch-line" />
          </pattern>
        </defs>
        @for (key of drawn(); track key.key) {
          <g
            class="key"
            [class.black]="key.black"
            [class.unmapped]="!key.mapped"
            [class.outside]="key.outside"
            [class.root]="key.root"
            [class.anchor]="key.anchor"
            [attr.data-key]="key.key"
          >
            <title>{{ key.title }}</title>
            <rect
              [attr.x]="key.x"
              y="0"
              [attr.width]="key.width"
              [attr.height]="key.height"
              rx="2"
              [attr.fill]="key.mapped ? key.fill : 'url(#unmapped-hatch)'"
            />
            <text [attr.x]="key.x + key.width / 2" [attr.y]="key.labelY">{{ key.label }}</text>
          </g>
        }
        @for (octave of octaveLabels; track octave.key) {
          <text class="octave" [attr.x]="octave.x" [attr.y]="labelRow">{{ octave.name }}</text>
        }
      </svg>
    </div>
    <p class="legend">
      <span class="swatch unmapped-swatch" aria-hidden="true"></span> hatched keys are unmapped and
      play nothing; <span class="swatch root-swatch" aria-hidden="true"></span> the root key plays
      degree 0.
      @if (anchorKey() !== null) {
        <span class="swatch anchor-swatch" aria-hidden="true"></span> key {{ anchorKey() }} is tuned
        to the reference pitch.
      }
      @if (outsideCount() > 0) {
        <strong class="outside-note">
          {{ outsideCount() === 1 ? '1 key lies' : outsideCount() + ' keys lie' }} outside what MTS
          can express.
        </strong>
      }
    </p>
  `,
  styles: `
    :host {
      display: block;
    }
    .scroller {
      overflow-x: auto;
      max-width: 100%;
      padding-bottom: 4px;
    }
    svg {
      display: block;
      font-family: inherit;
    }
    .key rect {
      stroke: var(--mat-sys-outline);
      stroke-width: 1;
    }
    .key text {
      font-size: 9px;
      text-anchor: middle;
      fill: #1b1b1f;
      pointer-events: none;
    }
    .key.black text {
      fill: #fff;
    }
    .key.unmapped text {
      fill: var(--mat-sys-on-surface-variant);
    }
    .key.root rect {
      stroke: var(--mat-sys-tertiary);
      stroke-width: 3;
    }
    .key.anchor rect {
      stroke: var(--mat-sys-primary);
      stroke-width: 3;
      stroke-dasharray: 4 2;
    }
    .key.outside rect {
      stroke: var(--mat-sys-error);
      stroke-dasharray: 3 2;
      stroke-width: 2;
    }
    .hatch-ground {
      fill: var(--mat-sys-surface-container-high);
    }
    .key.black .hatch-ground {
      fill: var(--mat-sys-surface-container-highest);
    }
    .hatch-line {
      stroke: var(--mat-sys-outline);
      stroke-width: 2;
    }
    .octave {
      font-size: 10px;
      fill: var(--mat-sys-on-surface-variant);
    }
    .legend {
      font: var(--mat-sys-body-small);
      color: var(--mat-sys-on-surface-variant);
      margin: 6px 0 0;
    }
    .swatch {
      display: inline-block;
      width: 12px;
      height: 12px;
      vertical-align: -2px;
      border: 1px solid var(--mat-sys-outline);
    }
    .unmapped-swatch {
      background: repeating-linear-gradient(
        45deg,
        var(--mat-sys-outline) 0 2px,
        transparent 2px 5px
      );
    }
    .root-swatch {
      border: 3px solid var(--mat-sys-tertiary);
      width: 8px;
      height: 8px;
    }
    .anchor-swatch {
      border: 3px dashed var(--mat-sys-primary);
      width: 8px;
      height: 8px;
    }
    .outside-note {
      color: var(--mat-sys-error);
    }
  `,
})
export class KeyboardStrip {
  readonly keys = input.required<PreviewKey[]>();
  readonly rootKey = input.required<number>();
  /** The scale's size, which sets the colours. */
  readonly scaleSize = input.required<number>();
  /** The key tuned to the reference pitch, when the design names one. */
  readonly anchorKey = input<number | null>(null);
  private readonly scroller = viewChild.required<ElementRef<HTMLElement>>('scroller');
  private readonly destroyRef = inject(DestroyRef);
  protected readonly labelRow = labelRow;
  protected readonly width = 75 * whiteWidth;
  protected readonly octaveLabels = Array.from({ length: 11 }, (_, octave) => ({
    key: octave * 12,
    name: noteName(octave * 12),
    x: octave * 7 * whiteWidth + 1,
  }));
  protected readonly drawn = computed(() => {
    const drawn = this.keys().map((entry) => this.draw(entry));
    return [...drawn.filter((key) => !key.black), ...drawn.filter((key) => key.black)];
  });
  protected readonly outsideCount = computed(
    () => this.keys().filter((key) => key.outOfMtsRange).length,
  );
  protected readonly description = computed(() => {
    const unmapped = this.keys().filter((key) => key.degree === null).length;
    const root = this.rootKey();
    return `Keyboard of 128 keys: ${128 - unmapped} play a degree, ${unmapped} unmapped; root key ${root} (${noteName(root)})`;
  });

  constructor() {
    // The strip opens scrolled to the root key, once it has a width (a tab shows it after rendering).
    afterNextRender(() => {
      const scroller = this.scroller().nativeElement;
      const watcher = new ResizeObserver(() => {
        if (scroller.clientWidth === 0) return;
        watcher.disconnect();
        const rootX = this.whiteIndex(this.rootKey()) * whiteWidth;
        scroller.scrollLeft = Math.max(0, rootX - scroller.clientWidth / 3);
      });
      watcher.observe(scroller);
      this.destroyRef.onDestroy(() => watcher.disconnect());
    });
  }

  private whiteIndex(key: number): number {
    let whites = 0;
    for (let below = 0; below < key; below++) if (!blackPitchClasses.has(below % 12)) whites++;
    return whites;
  }

  private draw(entry: PreviewKey): DrawnKey {
    const black = blackPitchClasses.has(entry.key % 12);
    const whites = this.whiteIndex(entry.key);
    const mapped = entry.degree !== null;
    const where = `Key ${entry.key} (${noteName(entry.key)})`;
    return {
      key: entry.key,
      black,
      x: black ? whites * whiteWidth - blackWidth / 2 : whites * whiteWidth,
      width: black ? blackWidth : whiteWidth,
      height: black ? blackHeight : whiteHeight,
      mapped,
      outside: entry.outOfMtsRange,
      root: entry.key === this.rootKey(),
      anchor: entry.key === this.anchorKey(),
      fill: mapped ? fillFor(entry.degree!, this.scaleSize(), black) : '',
      label: mapped ? String(entry.degree) : '×',
      labelY: black ? blackHeight - 6 : whiteHeight - 8,
      title: mapped
        ? `${where}: degree ${entry.degree}, ${entry.hz!.toFixed(3)} Hz${entry.outOfMtsRange ? ', outside what MTS can express' : ''}`
        : `${where}: unmapped, plays nothing`,
    };
  }
}
