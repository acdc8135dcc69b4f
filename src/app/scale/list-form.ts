import { ChangeDetectionStrategy, Component, computed, inject, linkedSignal } from '@angular/core';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatInputModule } from '@angular/material/input';
import { readDegreeList } from '@shared/tuning/degree-list';
import { DesignField } from '../design/design-field';
import { DesignState } from '../design/design-state';
import { FieldFault } from '../design/field-fault';

function sameDegrees(a: string[], b: string[]): boolean {
  return a.length === b.length && a.every((degree, index) => degree === b[index]);
}

/** A list of degrees above the tonic, as ratios or cents, and the period they repeat at. */
@Component({
  selector: 'app-list-form',
  changeDetection: ChangeDetectionStrategy.OnPush,
  imports: [DesignField, MatFormFieldModule, MatInputModule, FieldFault],
  template: `
    @if (degrees(); as degrees) {
      <mat-form-field subscriptSizing="dynamic">
        <mat-label>Degrees above the tonic</mat-label>
        <textarea
          matInput
          #field
          [value]="text()"
          (input)="editDegrees(field.value)"
          [appFault]="fault()"
          [readonly]="state.readOnly()"
          rows="7"
          spellcheck="false"
        ></textarea>
        <mat-hint
          >One per line or separated by commas, between the tonic and the period: 9/8, 386.3c,
          4\\12</mat-hint
        >
        <mat-error>{{ fault() }}</mat-error>
      </mat-form-field>
      @if (reading().notices.length > 0) {
        <ul class="notices" aria-live="polite">
          @for (notice of reading().notices; track notice) {
            <li>{{ notice }}</li>
          }
        </ul>
      }
      <app-design-field
        label="Period"
        path="scale.period"
        [value]="period()"
        (edited)="state.setScaleField('period', $event)"
        hint="Usually the octave, 2/1"
      />
    }
  `,
  styles: `
    :host {
      display: grid;
      gap: 4px 16px;
      grid-template-columns: repeat(auto-fill, minmax(220px, 1fr));
      align-items: start;
    }
    mat-form-field {
      width: 100%;
    }
    .notices {
      grid-column: 1 / -1;
      margin: 0;
      padding-left: 20px;
      font: var(--mat-sys-body-small);
      color: var(--mat-sys-on-surface-variant);
    }
  `,
})
export class ListForm {
  protected readonly state = inject(DesignState);
  private readonly scale = computed(() => {
    const scale = this.state.draft().scale;
    return scale.kind === 'list' ? scale : null;
  });
  protected readonly degrees = computed(() => this.scale()?.degrees ?? null, {
    equal: (a, b) => a === b,
  });
  protected readonly period = computed(() => this.scale()?.period ?? '');
  /** The text as typed, kept while it still means the degrees the design holds (a blank line, a pasted 1/1). */
  protected readonly text = linkedSignal<string[] | null, string>({
    source: this.degrees,
    computation: (degrees, previous) =>
      previous && degrees && sameDegrees(this.read(previous.value).degrees, degrees)
        ? previous.value
        : (degrees ?? []).join('\n'),
  });
  /** What the text was read as: the degrees, and what was done besides splitting it. */
  protected readonly reading = computed(() => this.read(this.text()));
  /** The first fault among the degrees, saying which degree it is. */
  protected readonly fault = computed(() => {
    const fault = this.state
      .faults()
      .find((candidate) => candidate.path.startsWith('scale.degrees'));
    if (!fault) return null;
    const index = /^scale\.degrees\[(\d+)]/.exec(fault.path);
    const words = this.state.faultAt(fault.path);
    return index ? `Degree ${Number(index[1]) + 1}: ${words}` : words;
  });

  protected editDegrees(text: string): void {
    this.text.set(text);
    this.state.setScaleField('degrees', this.read(text).degrees);
  }

  private read(text: string) {
    return readDegreeList(text, this.period().trim() || '2/1');
  }
}
