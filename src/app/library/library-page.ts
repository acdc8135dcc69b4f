import { Component } from '@angular/core';

/** Saved presets of the member and of their bands. */
@Component({
  selector: 'app-library-page',
  template: `
    <h1>Library</h1>
    <p>Your presets and your bands' presets, with every saved revision.</p>
  `,
  styles: `h1 { font: var(--mat-sys-headline-small); margin: 8px 0 12px; } p { max-width: 60ch; }`,
})
export class LibraryPage {}
