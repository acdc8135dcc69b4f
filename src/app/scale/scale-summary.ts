import { ChangeDetectionStrategy, Component, computed, input } from '@angular/core';
import type { PreviewTable, SizeJson } from '@shared/tuning/preview';
import { centsText } from './cents-text';

function sizeText(size: SizeJson): string {
  return size.ratio ? `${size.ratio} (${centsText(size.cents)})` : centsText(size.cents);
}

/** What the scale does as a whole: size, period, step pattern, MOS sizes, the comma and the wolf. */
@Component({
  selector: 'app-scale-summary',
  changeDetection: ChangeDetectionStrategy.OnPush,
  template: `
    @let analysis = table().analysis;
    <dl>
      <div>
        <dt>Degrees</dt>
        <dd>{{ analysis.size }} in a period of {{ period() }}</dd>
      </div>
      <div>
        <dt>Step pattern</dt>
        <dd>
          <span class="pattern">{{ analysis.stepPattern.pattern }}</span>
          @if (analysis.stepPattern.isMos) {
            <span class="badge">MOS</span>
          }
          <ul class="steps">
            @for (size of analysis.stepPattern.sizes; track size.letter) {
              <li>
                <b>{{ size.letter }}</b> = {{ sizeOf(size) }} × {{ size.count }}
              </li>
            }
          </ul>
        </dd>
      </div>
      @if (analysis.stack; as stack) {
        <div>
          <dt>Generator in the period</dt>
          <dd>{{ sizeOf(stack.reducedGenerator) }}</dd>
        </div>
        <div>
          <dt>Comma</dt>
          <dd>{{ sizeOf(stack.comma) }}</dd>
        </div>
        <div>
          <dt>Wolf</dt>
          <dd>
            @if (stack.wolf; as wolf) {
              @if (wolf.name) {
                the {{ wolf.name }} (degree {{ wolf.from }} to degree {{ wolf.to }}) is
                {{ sizeOf(wolf) }}, {{ wideOrNarrow(wolf.deviationCents) }} of the fifth
              } @else {
                degree {{ wolf.from }} to degree {{ wolf.to }}: {{ sizeOf(wolf) }},
                {{ wideOrNarrow(wolf.deviationCents) }} of the generator
              }
            } @else {
              none: the stack closes
            }
          </dd>
        </div>
        <div>
          <dt>MOS sizes</dt>
          <dd>{{ stack.mosSizes.length ? stack.mosSizes.join(', ') : 'none up to 60' }}</dd>
        </div>
      }
    </dl>
  `,
  styles: `
    dl {
      margin: 0;
      display: grid;
      gap: 8px;
    }
    dl > div {
      display: grid;
      grid-template-columns: minmax(9em, auto) 1fr;
      gap: 12px;
    }
    dt {
      color: var(--mat-sys-on-surface-variant);
    }
    dd {
      margin: 0;
      font-variant-numeric: tabular-nums;
    }
    .pattern {
      font: var(--mat-sys-title-medium);
      letter-spacing: 0.08em;
      word-break: break-all;
    }
    .badge {
      margin-left: 8px;
      padding: 2px 8px;
      border-radius: 8px;
      font: var(--mat-sys-label-small);
      background: var(--mat-sys-secondary-container);
      color: var(--mat-sys-on-secondary-container);
    }
    .steps {
      list-style: none;
      padding: 0;
      margin: 4px 0 0;
    }
    @media (max-width: 480px) {
      dl > div {
        grid-template-columns: 1fr;
        gap: 0;
      }
    }
  `,
})
export class ScaleSummary {
  readonly table = input.required<PreviewTable>();
  protected readonly period = computed(() => sizeText(this.table().analysis.period));
  protected readonly sizeOf = sizeText;
  /** A deviation in words: `41.059¢ wide`, `23.460¢ narrow`. */
  protected wideOrNarrow(cents: number): string {
    return `${centsText(Math.abs(cents))} ${cents >= 0 ? 'wide' : 'narrow'}`;
  }
}
