import { ChangeDetectionStrategy, Component, computed, inject } from '@angular/core';
import { MatButtonToggleModule } from '@angular/material/button-toggle';
import { DesignField } from '../design/design-field';
import { DesignState } from '../design/design-state';
import { type DraftScale, type DraftTemper, typedFrom, typedText } from '../design/draft-document';
import { ChainEditor } from './chain-editor';

/** Pure generators, one fraction of a comma for all of them, or a fraction (or none) for each link of the chain. */
type Tempering = 'pure' | 'every' | 'links';

type GeneratedScale = Extract<DraftScale, { kind: 'generated' }>;

/**
 * A stack of generators: how many above and below the tonic, and how they are tempered: not at all, all alike by a
 * fraction of a comma, or link by link (well temperaments).
 */
@Component({
  selector: 'app-generated-form',
  changeDetection: ChangeDetectionStrategy.OnPush,
  imports: [DesignField, MatButtonToggleModule, ChainEditor],
  template: `
    @if (scale(); as scale) {
      <div class="fields">
        <app-design-field
          label="Generator"
          path="scale.generator"
          [value]="scale.generator"
          (edited)="state.setScaleField('generator', $event)"
          hint="A ratio (3/2), cents (701.955c) or equal steps (7\\12)"
        />
        <app-design-field
          label="Period"
          path="scale.period"
          [value]="scale.period"
          (edited)="state.setScaleField('period', $event)"
          hint="Usually the octave, 2/1"
        />
        <app-design-field
          label="Generators up"
          path="scale.up"
          inputMode="numeric"
          [value]="text(scale.up)"
          (edited)="state.setScaleField('up', typedFrom($event))"
          hint="Stacked above the tonic"
        />
        <app-design-field
          label="Generators down"
          path="scale.down"
          inputMode="numeric"
          [value]="text(scale.down)"
          (edited)="state.setScaleField('down', typedFrom($event))"
          hint="Stacked below the tonic"
        />
      </div>
      <mat-button-toggle-group
        class="tempering"
        [value]="tempering()"
        (change)="temper($event.value)"
        [disabled]="state.readOnly()"
        aria-label="Tempering"
      >
        <mat-button-toggle value="pure">Pure generators</mat-button-toggle>
        <mat-button-toggle value="every">Temper every generator alike</mat-button-toggle>
        <mat-button-toggle value="links">Temper link by link</mat-button-toggle>
      </mat-button-toggle-group>
      @if (tempering() === 'links') {
        <app-chain-editor />
      } @else if (uniformTemper(); as temper) {
        <div class="fields">
          <app-design-field
            label="Comma"
            path="scale.temper.comma"
            [value]="temper.comma"
            (edited)="state.setTemper({ comma: $event, fraction: temper.fraction })"
            hint="The comma to spread, such as 81/80"
          />
          <app-design-field
            label="Fraction of the comma"
            path="scale.temper.fraction"
            [value]="temper.fraction"
            (edited)="state.setTemper({ comma: temper.comma, fraction: $event })"
            [hint]="temperedHint()"
          />
        </div>
      }
    }
  `,
  styles: `
    :host {
      display: block;
    }
    .fields {
      display: grid;
      gap: 4px 16px;
      grid-template-columns: repeat(auto-fill, minmax(150px, 1fr));
      margin-bottom: 8px;
    }
    .tempering {
      margin: 0 0 12px;
      flex-wrap: wrap;
    }
  `,
})
export class GeneratedForm {
  protected readonly state = inject(DesignState);
  protected readonly text = typedText;
  protected readonly typedFrom = typedFrom;
  protected readonly scale = computed(() => {
    const scale = this.state.draft().scale;
    return scale.kind === 'generated' ? (scale as GeneratedScale) : null;
  });
  protected readonly temperedHint = computed(() => {
    const generator = this.state.shown()?.table.analysis.stack?.generator;
    const narrowed =
      generator && !this.state.stale()
        ? `: the generator becomes ${generator.cents.toFixed(3)}c`
        : '';
    return `How much of it each generator gives up, such as 1/4${narrowed}`;
  });

  protected readonly tempering = computed<Tempering>(() => {
    const temper = this.scale()?.temper;
    return Array.isArray(temper) ? 'links' : temper ? 'every' : 'pure';
  });
  protected readonly uniformTemper = computed(() => {
    const temper = this.scale()?.temper;
    return temper && !Array.isArray(temper) ? temper : null;
  });

  /**
   * Switches the tempering. Every generator alike starts at a quarter of 81/80 (quarter-comma meantone); link by
   * link starts from what there was: each link tempered as every generator was, or every link pure.
   */
  protected temper(tempering: Tempering): void {
    const scale = this.scale();
    if (!scale) return;
    if (tempering === 'pure') return this.state.setTemper(undefined);
    if (tempering === 'every') return this.state.setTemper({ comma: '81/80', fraction: '1/4' });
    const uniform = this.uniformTemper();
    const linkCount = Number(scale.up ?? 0) + Number(scale.down ?? 0);
    const links: (DraftTemper | null)[] = Array.from(
      { length: Number.isInteger(linkCount) ? linkCount : 0 },
      () => uniform && { ...uniform },
    );
    this.state.setTemper(links);
  }
}
