import { ChangeDetectionStrategy, Component, computed, inject, input, output } from '@angular/core';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatInputModule } from '@angular/material/input';
import { DesignState } from './design-state';
import { FieldFault } from './field-fault';

/**
 * One field of the preset document: a labelled Material input that shows the document's fault at
 * `path` under it as you type, and the hint otherwise.
 */
@Component({
  selector: 'app-design-field',
  changeDetection: ChangeDetectionStrategy.OnPush,
  imports: [MatFormFieldModule, MatInputModule, FieldFault],
  template: `
    <mat-form-field [subscriptSizing]="'dynamic'" [floatLabel]="floatLabel()">
      <mat-label>{{ label() }}</mat-label>
      <input
        matInput
        #field
        [value]="value()"
        (input)="edited.emit(field.value)"
        [appFault]="fault()"
        [attr.inputmode]="inputMode()"
        [placeholder]="placeholder()"
        [readonly]="state.readOnly()"
        [attr.maxlength]="maxLength()"
        autocomplete="off"
        spellcheck="false"
      />
      @if (suffix()) {
        <span matTextSuffix>{{ suffix() }}</span>
      }
      @if (hint()) {
        <mat-hint>{{ hint() }}</mat-hint>
      }
      <mat-error>{{ fault() }}</mat-error>
    </mat-form-field>
  `,
  styles: `
    :host {
      display: block;
    }
    mat-form-field {
      width: 100%;
    }
  `,
})
export class DesignField {
  protected readonly state = inject(DesignState);
  readonly label = input.required<string>();
  /** The field's path in the preset document, such as `scale.generator`. */
  readonly path = input.required<string>();
  readonly value = input.required<string>();
  readonly hint = input<string>('');
  readonly placeholder = input<string>('');
  readonly suffix = input<string>('');
  readonly inputMode = input<'text' | 'numeric' | 'decimal'>('text');
  /** `always` keeps the label above the field, so that a placeholder shows in an empty one. */
  readonly floatLabel = input<'auto' | 'always'>('auto');
  readonly maxLength = input<number | null>(null);
  readonly edited = output<string>();
  protected readonly fault = computed(() => this.state.faultAt(this.path()));
}
