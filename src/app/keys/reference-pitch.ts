import { Component, computed, inject } from '@angular/core';
import { MatSlideToggleModule } from '@angular/material/slide-toggle';
import { noteName } from '@shared/tuning/twelve-edo';
import { DesignField } from '../design/design-field';
import { DesignState } from '../design/design-state';
import { typedFrom, typedText } from '../design/draft-document';

/** The root key, the pitch it plays (typed, or the equal-tempered pitch from concert A) and concert A. */
@Component({
  selector: 'app-reference-pitch',
  imports: [DesignField, MatSlideToggleModule],
  template: `
    @let mapping = state.draft().mapping;
    <fieldset [disabled]="state.readOnly()">
      <legend>Reference pitch</legend>
      <div class="fields">
        <app-design-field label="Root key" path="mapping.rootKey" inputMode="numeric" [value]="text(mapping.rootKey)"
                          (edited)="state.setMappingField('rootKey', typedFrom($event))" [hint]="rootKeyHint()" />
        @if (!fromConcertA()) {
          <app-design-field label="Root pitch" path="mapping.rootHz" inputMode="decimal" suffix="Hz"
                            [value]="text(mapping.rootHz)" (edited)="state.setMappingField('rootHz', typedFrom($event))"
                            hint="The pitch the root key plays" />
        }
        <app-design-field label="Concert A" path="mapping.concertA" inputMode="decimal" suffix="Hz"
                          [value]="text(mapping.concertA)" [placeholder]="'440'"
                          (edited)="state.setMappingField('concertA', typedFrom($event))"
                          hint="A4 (key 69) of the equal-tempered reference; empty means 440" />
      </div>
      <mat-slide-toggle [checked]="fromConcertA()" (change)="takeRootFromConcertA($event.checked)" [disabled]="state.readOnly()">
        Root pitch from concert A{{ fromConcertA() && rootHz() ? ': ' + rootHz() + ' Hz' : '' }}
      </mat-slide-toggle>
    </fieldset>
  `,
  styles: `
    fieldset { border: 0; padding: 0; margin: 0; min-width: 0; }
    legend { font: var(--mat-sys-title-small); padding: 0; margin-bottom: 8px; }
    .fields { display: grid; gap: 4px 16px; grid-template-columns: repeat(auto-fill, minmax(150px, 1fr)); margin-bottom: 8px; }
  `,
})
export class ReferencePitch {
  protected readonly state = inject(DesignState);
  protected readonly text = typedText;
  protected readonly typedFrom = typedFrom;
  protected readonly fromConcertA = computed(() => this.state.draft().mapping.rootHz === undefined);
  /** The root key's pitch as the last design that built had it, to four decimals. */
  protected readonly rootHz = computed(() => {
    const hz = this.state.shown()?.preset.mapping.rootHz;
    return hz === undefined ? null : Number(hz.toFixed(4));
  });
  protected readonly rootKeyHint = computed(() => {
    const key = this.state.draft().mapping.rootKey;
    const known = typeof key === 'number' && Number.isInteger(key) && key >= 0 && key <= 127;
    return known ? `MIDI key ${key} is ${noteName(key)}; middle C is 60` : 'A MIDI key from 0 to 127; middle C is 60';
  });

  protected takeRootFromConcertA(on: boolean): void {
    this.state.setMappingField('rootHz', on ? undefined : (this.rootHz() ?? 261.6256));
  }
}
