import { Component } from '@angular/core';

/** Bands, their members and roles, and invitations. */
@Component({
  selector: 'app-bands-page',
  template: `
    <h1>Bands</h1>
    <p>Keep one library with your bandmates: owners invite by e-mail and give each member a role.</p>
  `,
  styles: `h1 { font: var(--mat-sys-headline-small); margin: 8px 0 12px; } p { max-width: 60ch; }`,
})
export class BandsPage {}
