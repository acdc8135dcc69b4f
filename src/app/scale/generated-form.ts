import { Component, computed, inject } from '@angular/core';
import { MatCheckboxModule } from '@angular/material/checkbox';
import { DesignField } from '../design/design-field';
import { DesignState } from '../design/design-state';
import { type DraftScale, typedFrom, typedText } from '../design/draft-document';

type GeneratedScale = Extract<DraftScale, { kind: 'generated' }>;

/** A stack of generators: how many above and below the tonic, and an optional tempering by a comma. */
@Component({
  selector: 'app-generated-form',
  imports: [DesignField, MatCheckboxModule],
  template: `
    @if (scale(); as scale) {
      <div class="fields">
        <app-design-field label="Generator" path="scale.generator" [value]="scale.generator"
                          (edited)="state.setScaleField('generator', $event)"
                          hint="A ratio (3/2), cents (701.955c) or equal steps (7\\12)" />
        <app-design-field label="Period" path="scale.period" [value]="scale.period"
                          (edited)="state.setScaleField('period', $event)" hint="Usually the octave, 2/1" />
        <app-design-field label="Generators up" path="scale.up" inputMode="numeric" [value]="text(scale.up)"
                          (edited)="state.setScaleField('up', typedFrom($event))" hint="Stacked above the tonic" />
        <app-design-field label="Generators down" path="scale.down" inputMode="numeric" [value]="text(scale.down)"
                          (edited)="state.setScaleField('down', typedFrom($event))" hint="Stacked below the tonic" />
      </div>
      <mat-checkbox [checked]="!!scale.temper" (change)="temper($event.checked)" [disabled]="state.readOnly()">
        Temper the generator by part of a comma
      </mat-checkbox>
      @if (scale.temper; as temper) {
        <div class="fields">
          <app-design-field label="Comma" path="scale.temper.comma" [value]="temper.comma"
                            (edited)="state.setTemper({ comma: $event, fraction: temper.fraction })"
                            hint="The comma to spread, such as 81/80" />
          <app-design-field label="Fraction of the comma" path="scale.temper.fraction" [value]="temper.fraction"
                            (edited)="state.setTemper({ comma: temper.comma, fraction: $event })"
                            [hint]="temperedHint()" />
        </div>
      }
    }
  `,
  styles: `
    :host { display: block; }
    .fields { display: grid; gap: 4px 16px; grid-template-columns: repeat(auto-fill, minmax(150px, 1fr)); margin-bottom: 8px; }
    mat-checkbox { display: block; margin: 0 0 12px -8px; }
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
    const narrowed = generator && !this.state.stale() ? `: the generator becomes ${generator.cents.toFixed(3)}c` : '';
    return `How much of it each generator gives up, such as 1/4${narrowed}`;
  });

  protected temper(on: boolean): void {
    this.state.setTemper(on ? { comma: '81/80', fraction: '1/4' } : undefined);
  }
}
