import { ChangeDetectionStrategy, Component, computed, inject } from '@angular/core';
import { MatCheckboxModule } from '@angular/material/checkbox';
import { DesignField } from '../design/design-field';
import { DesignState } from '../design/design-state';
import { typedFrom, typedText } from '../design/draft-document';

/** A segment of the harmonic series, or its mirror, the subharmonic series. */
@Component({
  selector: 'app-harmonic-form',
  changeDetection: ChangeDetectionStrategy.OnPush,
  imports: [DesignField, MatCheckboxModule],
  template: `
    @if (scale(); as scale) {
      <div class="fields">
        <app-design-field
          label="From harmonic"
          path="scale.from"
          inputMode="numeric"
          [value]="text(scale.from)"
          (edited)="state.setScaleField('from', typedFrom($event))"
          hint="The tonic, such as 8"
        />
        <app-design-field
          label="Up to harmonic"
          path="scale.to"
          inputMode="numeric"
          [value]="text(scale.to)"
          (edited)="state.setScaleField('to', typedFrom($event))"
          hint="The period's top, such as 16"
        />
      </div>
      <mat-checkbox
        [checked]="!!scale.sub"
        (change)="state.setScaleField('sub', $event.checked)"
        [disabled]="state.readOnly()"
      >
        Subharmonics (the segment mirrored)
      </mat-checkbox>
    }
  `,
  styles: `
    .fields {
      display: grid;
      gap: 4px 16px;
      grid-template-columns: repeat(auto-fill, minmax(150px, 1fr));
    }
    mat-checkbox {
      display: block;
      margin-left: -8px;
    }
  `,
})
export class HarmonicForm {
  protected readonly state = inject(DesignState);
  protected readonly text = typedText;
  protected readonly typedFrom = typedFrom;
  protected readonly scale = computed(() => {
    const scale = this.state.draft().scale;
    return scale.kind === 'harmonic' ? scale : null;
  });
}
