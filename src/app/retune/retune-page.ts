import { Component } from '@angular/core';

/** Song retuning: upload a MIDI song and get it back in the tuning. */
@Component({
  selector: 'app-retune-page',
  template: `
    <h1>Retune a song</h1>
    <p>Send a MIDI song through a preset and get it back tuned, with tuning messages at its start or one note per channel with pitch bends.</p>
  `,
  styles: `h1 { font: var(--mat-sys-headline-small); margin: 8px 0 12px; } p { max-width: 60ch; }`,
})
export class RetunePage {}
