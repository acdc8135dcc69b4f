import { Component } from '@angular/core';

/** The scale designer: kinds, degrees, analysis and key mapping. */
@Component({
  selector: 'app-design-page',
  template: `
    <h1>Design a scale</h1>
    <p>Build a scale from stacked generators, equal divisions, ratio lists or harmonics, see what it does and lay it across the keys.</p>
  `,
  styles: `h1 { font: var(--mat-sys-headline-small); margin: 8px 0 12px; } p { max-width: 60ch; }`,
})
export class DesignPage {}
