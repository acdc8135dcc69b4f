import { Directive, effect, inject, input } from '@angular/core';
import { MatInput } from '@angular/material/input';

/**
 * Puts a Material field into its error state while the design has a fault at it, so that the
 * field's `<mat-error>` shows the message under it and the input is marked invalid for assistive
 * technology. The fault comes from the preset document's own checks, not from a form validator.
 */
@Directive({ selector: 'input[matInput][appFault], textarea[matInput][appFault]' })
export class FieldFault {
  readonly appFault = input<string | null>(null);
  private readonly field = inject(MatInput);

  constructor() {
    effect(() => {
      const faulty = this.appFault() !== null;
      if (this.field.errorState === faulty) return;
      this.field.errorState = faulty;
      this.field.stateChanges.next();
    });
  }
}
