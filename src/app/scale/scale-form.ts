import { ChangeDetectionStrategy, Component, inject } from '@angular/core';
import { MatButtonToggleModule } from '@angular/material/button-toggle';
import { DesignState } from '../design/design-state';
import type { ScaleKind } from '../design/draft-document';
import { EqualForm } from './equal-form';
import { GeneratedForm } from './generated-form';
import { HarmonicForm } from './harmonic-form';
import { ListForm } from './list-form';

interface KindChoice {
  kind: ScaleKind;
  label: string;
}

/** The kind of scale and the form for that kind. */
@Component({
  selector: 'app-scale-form',
  changeDetection: ChangeDetectionStrategy.OnPush,
  imports: [MatButtonToggleModule, GeneratedForm, EqualForm, ListForm, HarmonicForm],
  template: `
    <fieldset [disabled]="state.readOnly()">
      <legend class="visually-hidden">Scale</legend>
      <mat-button-toggle-group
        class="kinds"
        aria-label="Kind of scale"
        hideSingleSelectionIndicator
        [value]="state.draft().scale.kind"
        (change)="state.chooseKind($event.value)"
        [disabled]="state.readOnly()"
      >
        @for (choice of kinds; track choice.kind) {
          <mat-button-toggle [value]="choice.kind">{{ choice.label }}</mat-button-toggle>
        }
      </mat-button-toggle-group>
      @switch (state.draft().scale.kind) {
        @case ('generated') {
          <app-generated-form />
        }
        @case ('equal') {
          <app-equal-form />
        }
        @case ('list') {
          <app-list-form />
        }
        @case ('harmonic') {
          <app-harmonic-form />
        }
      }
    </fieldset>
  `,
  styles: `
    fieldset {
      border: 0;
      padding: 0;
      margin: 0;
      min-width: 0;
    }
    .kinds {
      margin-bottom: 16px;
      flex-wrap: wrap;
      max-width: 100%;
    }
  `,
})
export class ScaleForm {
  protected readonly state = inject(DesignState);
  protected readonly kinds: KindChoice[] = [
    { kind: 'generated', label: 'Stacked generator' },
    { kind: 'equal', label: 'Equal divisions' },
    { kind: 'list', label: 'List of intervals' },
    { kind: 'harmonic', label: 'Harmonic series' },
  ];
}
