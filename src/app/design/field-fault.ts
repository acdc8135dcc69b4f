import { Directive, effect, inject, input } from '@angular/core';
import { MatInput } from '@angular/material/input';
import { MatSelect } from '@angular/material/select';

/**
 * Puts a Material field into its error state while the page has a fault at it, so that the field's `<mat-error>`
 * shows the message under it and the control is marked invalid for assistive technology. The fault comes from the
 * page's own checks (the preset document's, the server's refusal), not from a form validator.
 */
@Directive({
  selector: 'input[matInput][appFault], textarea[matInput][appFault], mat-select[appFault]',
})
export class FieldFault {
  readonly appFault = input<string | null>(null);
  private readonly field: MatInput | MatSelect =
    inject(MatInput, { optional: true }) ?? inject(MatSelect);

  constructor() {
    effect(() => {
      const faulty = this.appFault() !== null;
      if (this.field.errorState === faulty) return;
      this.field.errorState = faulty;
      this.field.stateChanges.next();
    });
  }
}
