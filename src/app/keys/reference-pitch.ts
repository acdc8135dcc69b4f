import { ChangeDetectionStrategy, Component, computed, inject } from '@angular/core';
import { MatButtonModule } from '@angular/material/button';
import { MatButtonToggleModule } from '@angular/material/button-toggle';
import { noteName } from '@shared/tuning/twelve-edo';
import { DesignField } from '../design/design-field';
import { type PitchSource, DesignState } from '../design/design-state';
import { typedFrom, typedText } from '../design/draft-document';
import { pitchWords } from './pitch-words';

/** Pitches A is tuned to in practice; each offered by its pitch alone. */
const commonAs = [415, 430, 432, 440, 442];

/**
 * Where the tuning's pitch comes from: the root key at its equal-tempered pitch from concert A, the root's pitch
 * typed, or one key (picked on the strip) that sounds exactly a pitch, the root following from it.
 */
@Component({
  selector: 'app-reference-pitch',
  changeDetection: ChangeDetectionStrategy.OnPush,
  imports: [DesignField, MatButtonModule, MatButtonToggleModule],
  template: `
    @let mapping = state.draft().mapping;
    <fieldset [disabled]="state.readOnly()">
      <legend>Reference pitch</legend>
      <mat-button-toggle-group
        class="source"
        [value]="state.pitchSource()"
        (change)="choose($event.value)"
        [disabled]="state.readOnly()"
        aria-label="How the pitch is set"
      >
        <mat-button-toggle value="anchor">Tune one key</mat-button-toggle>
        <mat-button-toggle value="concert">Root from concert A</mat-button-toggle>
        <mat-button-toggle value="root">Type the root's pitch</mat-button-toggle>
      </mat-button-toggle-group>
      <div class="fields">
        <app-design-field
          label="Root key"
          path="mapping.rootKey"
          inputMode="numeric"
          [value]="text(mapping.rootKey)"
          (edited)="state.setMappingField('rootKey', typedFrom($event))"
          [hint]="keyHint(mapping.rootKey, 'plays degree 0')"
        />
        @switch (state.pitchSource()) {
          @case ('anchor') {
            <app-design-field
              label="Key"
              path="mapping.anchor.key"
              inputMode="numeric"
              [value]="text(mapping.anchor?.key)"
              (edited)="state.setAnchor({ key: typedFrom($event) })"
              [hint]="keyHint(mapping.anchor?.key, 'is tuned')"
            />
            <app-design-field
              label="sounds"
              path="mapping.anchor.hz"
              inputMode="decimal"
              suffix="Hz"
              [value]="text(mapping.anchor?.hz)"
              (edited)="state.setAnchor({ hz: typedFrom($event) })"
              hint="Exactly this pitch, in this tuning"
            />
          }
          @case ('root') {
            <app-design-field
              label="Root pitch"
              path="mapping.rootHz"
              inputMode="decimal"
              suffix="Hz"
              [value]="text(mapping.rootHz)"
              (edited)="state.setMappingField('rootHz', typedFrom($event))"
              hint="The pitch the root key plays"
            />
          }
        }
        <app-design-field
          label="Concert A"
          path="mapping.concertA"
          inputMode="decimal"
          suffix="Hz"
          [value]="text(mapping.concertA)"
          [placeholder]="'440'"
          (edited)="state.setMappingField('concertA', typedFrom($event))"
          hint="A4 of the equal-tempered reference, for offsets; empty means 440"
        />
      </div>
      @if (state.pitchSource() === 'anchor') {
        <div class="quick" role="group" aria-label="Tune the A key to">
          @for (hz of commonAs; track hz) {
            <button
              mat-stroked-button
              type="button"
              (click)="tuneA(hz)"
              [attr.aria-pressed]="isA(hz)"
            >
              A = {{ hz }}
            </button>
          }
          <button
            mat-button
            type="button"
            (click)="state.pickingAnchorKey.set(!state.pickingAnchorKey())"
            [attr.aria-pressed]="state.pickingAnchorKey()"
          >
            {{
              state.pickingAnchorKey()
                ? 'Press a key on the strip below…'
                : 'Pick the key on the strip'
            }}
          </button>
        </div>
      }
      <p class="summary" aria-live="polite">{{ summary() }}</p>
    </fieldset>
  `,
  styles: `
    fieldset {
      border: 0;
      padding: 0;
      margin: 0;
      min-width: 0;
    }
    legend {
      font: var(--mat-sys-title-small);
      padding: 0;
      margin-bottom: 8px;
    }
    .source {
      margin-bottom: 12px;
      flex-wrap: wrap;
    }
    .fields {
      display: grid;
      gap: 4px 16px;
      grid-template-columns: repeat(auto-fill, minmax(150px, 1fr));
      margin-bottom: 8px;
    }
    .quick {
      display: flex;
      flex-wrap: wrap;
      gap: 8px;
      margin-bottom: 8px;
    }
    .quick [aria-pressed='true'] {
      background: var(--mat-sys-secondary-container);
      color: var(--mat-sys-on-secondary-container);
    }
    .summary {
      font: var(--mat-sys-body-medium);
      margin: 0;
    }
  `,
})
export class ReferencePitch {
  protected readonly state = inject(DesignState);
  protected readonly text = typedText;
  protected readonly typedFrom = typedFrom;
  protected readonly commonAs = commonAs;

  /** What the built design sounds: the root's pitch, and the anchor key's when there is one. */
  protected readonly summary = computed(() => {
    const preset = this.state.shown()?.preset;
    return preset ? pitchWords(preset.mapping) : '';
  });

  protected keyHint(key: unknown, what: string): string {
    const known = typeof key === 'number' && Number.isInteger(key) && key >= 0 && key <= 127;
    return known
      ? `MIDI key ${key} is ${noteName(key)}; this key ${what}`
      : 'A MIDI key from 0 to 127; middle C is 60';
  }

  protected choose(source: PitchSource): void {
    const rootHz = this.state.shown()?.preset.mapping.rootHz;
    this.state.setPitchSource(source, rootHz === undefined ? null : Number(rootHz.toFixed(4)));
  }

  protected tuneA(hz: number): void {
    this.state.setAnchor({ key: 69, hz });
  }

  protected isA(hz: number): boolean {
    const anchor = this.state.draft().mapping.anchor;
    return anchor?.key === 69 && anchor.hz === hz;
  }
}
