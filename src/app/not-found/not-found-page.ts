import { ChangeDetectionStrategy, Component } from '@angular/core';
import { MatButtonModule } from '@angular/material/button';
import { RouterLink } from '@angular/router';

@Component({
  selector: 'app-not-found-page',
  changeDetection: ChangeDetectionStrategy.OnPush,
  imports: [RouterLink, MatButtonModule],
  template: `
    <h1>Nothing plays on this key</h1>
    <p>There is no page at this address. It may have moved, or the link was mistyped.</p>
    <a mat-flat-button routerLink="/design">Go to Design</a>
  `,
  styles: `
    h1 {
      font: var(--mat-sys-headline-small);
    }
  `,
})
export class NotFoundPage {}
