import { ChangeDetectionStrategy, Component, computed, inject } from '@angular/core';
import { DesignField } from '../design/design-field';
import { DesignState } from '../design/design-state';
import { typedFrom, typedText } from '../design/draft-document';

/** Equal divisions of a period. */
@Component({
  selector: 'app-equal-form',
  changeDetection: ChangeDetectionStrategy.OnPush,
  imports: [DesignField],
  template: `
    @if (scale(); as scale) {
      <div class="fields">
        <app-design-field
          label="Divisions"
          path="scale.divisions"
          inputMode="numeric"
          [value]="text(scale.divisions)"
          (edited)="state.setScaleField('divisions', typedFrom($event))"
          hint="Equal steps in one period, such as 31"
        />
        <app-design-field
          label="Period"
          path="scale.period"
          [value]="scale.period"
          (edited)="state.setScaleField('period', $event)"
          hint="Usually the octave, 2/1; 3/1 for a tritave"
        />
      </div>
    }
  `,
  styles: `
    .fields {
      display: grid;
      gap: 4px 16px;
      grid-template-columns: repeat(auto-fill, minmax(150px, 1fr));
    }
  `,
})
export class EqualForm {
  protected readonly state = inject(DesignState);
  protected readonly text = typedText;
  protected readonly typedFrom = typedFrom;
  protected readonly scale = computed(() => {
    const scale = this.state.draft().scale;
    return scale.kind === 'equal' ? scale : null;
  });
}
