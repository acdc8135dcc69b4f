import { ChangeDetectionStrategy, Component, computed, inject } from '@angular/core';
import { MatButtonModule } from '@angular/material/button';
import { fifthsPerStep } from '@shared/tuning/chain-names';
import { DesignField } from '../design/design-field';
import { DesignState } from '../design/design-state';
import type { DraftScale, DraftTemper } from '../design/draft-document';
import { centsText, signedCentsText } from './cents-text';

type GeneratedScale = Extract<DraftScale, { kind: 'generated' }>;

const pythagoreanComma = '531441/524288';
const quarter = { comma: pythagoreanComma, fraction: '1/4' };
const sixth = { comma: pythagoreanComma, fraction: '1/6' };

/** Well temperaments by their published names: the chain (from its lowest note) and its links. */
const wellTemperaments: {
  name: string;
  up: number;
  down: number;
  links: (DraftTemper | null)[];
}[] = [
  // From E-flat: C-G, G-D, D-A and B-F# narrowed by a quarter of the Pythagorean comma, the rest pure.
  {
    name: 'Werckmeister III',
    up: 8,
    down: 3,
    links: [null, null, null, quarter, quarter, quarter, null, null, quarter, null, null],
  },
  // From F: F-C-G-D-A-E-B narrowed by a sixth of the Pythagorean comma, the rest pure.
  {
    name: 'Vallotti',
    up: 10,
    down: 1,
    links: [sixth, sixth, sixth, sixth, sixth, sixth, null, null, null, null, null],
  },
];

interface LinkRow {
  index: number;
  name: string;
  fraction: string;
  sizeText: string;
  deviationText: string;
  deviation: number | null;
}

const circleRadius = 110;
const centre = 140;

/**
 * A chain of generators tempered link by link (the way well temperaments are made): one comma, a fraction of it for
 * each link (empty: pure; negative: widened), each link's size and its distance from pure, and the chain drawn as a
 * circle with the step that closes it.
 */
@Component({
  selector: 'app-chain-editor',
  changeDetection: ChangeDetectionStrategy.OnPush,
  imports: [DesignField, MatButtonModule],
  template: `
    @if (scale(); as scale) {
      <div class="quick" role="group" aria-label="Well temperaments">
        @for (well of wellTemperaments; track well.name) {
          <button
            mat-stroked-button
            type="button"
            (click)="useWell(well)"
            [disabled]="state.readOnly()"
          >
            {{ well.name }}
          </button>
        }
        <button mat-button type="button" (click)="allPure()" [disabled]="state.readOnly()">
          Every link pure
        </button>
      </div>
      <app-design-field
        class="comma"
        label="Comma"
        path="scale.temper"
        [value]="comma()"
        (edited)="setComma($event)"
        hint="The comma each tempered link gives up part of"
      />
      <table class="links">
        <caption class="visually-hidden">
          The links of the chain, from its lowest note up
        </caption>
        <thead>
          <tr>
            <th scope="col">Link</th>
            <th scope="col">Fraction of the comma</th>
            <th scope="col">Size</th>
            <th scope="col">From pure</th>
          </tr>
        </thead>
        <tbody>
          @for (row of rows(); track row.index) {
            <tr>
              <th scope="row">{{ row.name }}</th>
              <td>
                <app-design-field
                  [label]="'Link ' + row.name"
                  [path]="'scale.temper[' + row.index + ']'"
                  [value]="row.fraction"
                  (edited)="setLink(row.index, $event)"
                  placeholder="pure"
                  floatLabel="always"
                />
              </td>
              <td class="number">{{ row.sizeText }}</td>
              <td
                class="number"
                [class.narrow]="(row.deviation ?? 0) < -0.0005"
                [class.wide]="(row.deviation ?? 0) > 0.0005"
              >
                {{ row.deviationText }}
              </td>
            </tr>
          }
        </tbody>
      </table>
      @if (circle(); as circle) {
        <svg
          class="circle"
          viewBox="0 0 280 280"
          width="280"
          height="280"
          role="img"
          [attr.aria-label]="circle.description"
        >
          <circle [attr.cx]="centre" [attr.cy]="centre" [attr.r]="radius" class="ring" />
          @for (link of circle.links; track $index) {
            <line
              [attr.x1]="link.x1"
              [attr.y1]="link.y1"
              [attr.x2]="link.x2"
              [attr.y2]="link.y2"
              [class.narrow]="link.deviation < -0.0005"
              [class.wide]="link.deviation > 0.0005"
              [class.gap]="link.gap"
            />
            <text [attr.x]="link.labelX" [attr.y]="link.labelY" class="deviation">
              {{ link.label }}
            </text>
          }
          @for (note of circle.notes; track $index) {
            <circle [attr.cx]="note.x" [attr.cy]="note.y" r="13" class="note" />
            <text [attr.x]="note.x" [attr.y]="note.y + 4" class="note-name">{{ note.name }}</text>
          }
        </svg>
        <p class="closing">{{ circle.closing }}</p>
      }
    }
  `,
  styles: `
    :host {
      display: block;
    }
    .quick {
      display: flex;
      flex-wrap: wrap;
      gap: 8px;
      margin-bottom: 8px;
    }
    .comma {
      max-width: 260px;
    }
    .links {
      border-collapse: collapse;
      font-variant-numeric: tabular-nums;
      margin: 8px 0;
    }
    .links th,
    .links td {
      padding: 0 12px 0 0;
      text-align: left;
      vertical-align: middle;
    }
    .links th[scope='row'] {
      font: var(--mat-sys-body-medium);
      white-space: nowrap;
    }
    .links td app-design-field {
      width: 120px;
    }
    .number {
      text-align: right;
      white-space: nowrap;
    }
    .narrow {
      color: var(--mat-sys-primary);
    }
    .wide {
      color: var(--mat-sys-error);
    }
    .circle {
      display: block;
      max-width: 100%;
      height: auto;
    }
    .ring {
      fill: none;
      stroke: var(--mat-sys-outline-variant);
    }
    line {
      stroke: var(--mat-sys-outline);
      stroke-width: 2;
    }
    line.narrow {
      stroke: var(--mat-sys-primary);
      stroke-width: 3;
    }
    line.wide {
      stroke: var(--mat-sys-error);
      stroke-width: 3;
    }
    line.gap {
      stroke-dasharray: 5 4;
    }
    .note {
      fill: var(--mat-sys-surface-container-high);
      stroke: var(--mat-sys-outline);
    }
    .note-name {
      font-size: 10px;
      text-anchor: middle;
      fill: var(--mat-sys-on-surface);
    }
    .deviation {
      font-size: 9px;
      text-anchor: middle;
      fill: var(--mat-sys-on-surface-variant);
    }
    .closing {
      font: var(--mat-sys-body-medium);
      margin: 4px 0 0;
    }
  `,
})
export class ChainEditor {
  protected readonly state = inject(DesignState);
  protected readonly wellTemperaments = wellTemperaments;
  protected readonly centre = centre;
  protected readonly radius = circleRadius;
  protected readonly scale = computed(() => {
    const scale = this.state.draft().scale;
    return scale.kind === 'generated' && Array.isArray(scale.temper)
      ? (scale as GeneratedScale)
      : null;
  });
  private readonly links = computed(
    () => (this.scale()?.temper as (DraftTemper | null)[] | undefined) ?? [],
  );
  /** The comma the tempered links share (the first one's; new links take it too). */
  protected readonly comma = computed(
    () => this.links().find((link) => link !== null)?.comma ?? pythagoreanComma,
  );
  private readonly stack = computed(() =>
    this.state.stale() ? null : (this.state.shown()?.table.analysis.stack ?? null),
  );
  /**
   * The names of the chain's notes by stack position: for a chain of fifths the degrees' own names (as the degree
   * table gives them), else the position.
   */
  private readonly nameOf = computed(() => {
    const table = this.state.shown()?.table;
    const stack = this.stack();
    const fifths =
      stack && table && fifthsPerStep(stack.reducedGenerator.cents, table.analysis.period.cents);
    const byPosition = new Map(
      fifths ? table.degrees.map((degree) => [degree.stackPosition, degree.name]) : [],
    );
    return (position: number) =>
      byPosition.get(position) ??
      (position === 0 ? 'tonic' : `${position > 0 ? '+' : ''}${position}`);
  });
  protected readonly rows = computed<LinkRow[]>(() => {
    const down = Number(this.scale()?.down ?? 0);
    const chain = this.stack()?.chain ?? [];
    const name = this.nameOf();
    return this.links().map((link, index) => {
      const from = index - down;
      const built = chain[index];
      return {
        index,
        name: `${name(from)} → ${name(from + 1)}`,
        fraction: link?.fraction ?? '',
        sizeText: built ? centsText(built.cents) : '',
        deviationText: built
          ? Math.abs(built.deviationCents) < 0.0005
            ? 'pure'
            : signedCentsText(built.deviationCents, 3)
          : '',
        deviation: built ? built.deviationCents : null,
      };
    });
  });
  /** The chain round a circle: its notes in chain order, each link a chord, the step that closes it dashed. */
  protected readonly circle = computed(() => {
    const stack = this.stack();
    const chain = stack?.chain ?? [];
    if (!stack || chain.length < 2 || chain.length > 40) return null;
    const name = this.nameOf();
    const count = chain.length + 1;
    const point = (index: number, radius = circleRadius) => {
      const angle = -Math.PI / 2 + (2 * Math.PI * index) / count;
      return { x: centre + radius * Math.cos(angle), y: centre + radius * Math.sin(angle) };
    };
    const notes = Array.from({ length: count }, (_, index) => ({
      ...point(index),
      name: name(chain[0].from + index),
    }));
    const chord = (from: number, to: number, deviation: number, gap: boolean) => {
      const [a, b] = [point(from), point(to)];
      const label = point(from + (to === 0 ? count - from : to - from) / 2, circleRadius - 26);
      // Pure links go unlabelled: the numbers are where the tempering is.
      const text = Math.abs(deviation) < 0.0005 ? '' : deviation.toFixed(1).replace('-', '−');
      return {
        x1: a.x,
        y1: a.y,
        x2: b.x,
        y2: b.y,
        deviation,
        gap,
        label: text,
        labelX: label.x,
        labelY: label.y + 3,
      };
    };
    const links = chain.map((link, index) => chord(index, index + 1, link.deviationCents, false));
    const wolf = stack.wolf;
    links.push(chord(count - 1, 0, wolf ? wolf.deviationCents : 0, true));
    const ends = `${name(chain[chain.length - 1].to)}–${name(chain[0].from)}`;
    const closing = wolf
      ? `The step that closes the circle, ${ends}, is ${centsText(wolf.cents)}: ${signedCentsText(wolf.deviationCents, 3)} from the generator as written.`
      : `The circle closes: the step ${ends} is the generator as written.`;
    const narrowed = chain.filter((link) => link.deviationCents < -0.0005).length;
    const widened = chain.filter((link) => link.deviationCents > 0.0005).length;
    const description = `Circle of the chain's ${count} notes: ${narrowed} links narrowed, ${widened} widened, the rest pure. ${closing}`;
    return { notes, links, closing, description };
  });

  protected useWell(well: (typeof wellTemperaments)[number]): void {
    this.state.setScaleField('generator', '3/2');
    this.state.setScaleField('period', '2/1');
    this.state.setScaleField('up', well.up);
    this.state.setScaleField('down', well.down);
    this.state.setTemper(well.links.map((link) => link && { ...link }));
  }

  protected allPure(): void {
    this.state.setTemper(this.links().map(() => null));
  }

  protected setComma(comma: string): void {
    this.state.setTemper(this.links().map((link) => link && { ...link, comma }));
  }

  protected setLink(index: number, fraction: string): void {
    const links = [...this.links()];
    links[index] = fraction.trim() === '' ? null : { comma: this.comma(), fraction };
    this.state.setTemper(links);
  }
}
