import { Directive, inject } from '@angular/core';
import { DesignState } from '../design/design-state';

/** While the designer is picking the anchor key, the key clicked on the strip becomes it. */
@Directive({
  selector: 'app-keyboard-strip[appAnchorPicking]',
  host: { '(click)': 'pick($event)', '[class.picking]': 'state.pickingAnchorKey()' },
})
export class AnchorPicking {
  protected readonly state = inject(DesignState);

  protected pick(event: MouseEvent): void {
    const target = event.target instanceof Element ? event.target.closest('[data-key]') : null;
    if (target) this.state.pickAnchorKey(Number(target.getAttribute('data-key')));
  }
}
