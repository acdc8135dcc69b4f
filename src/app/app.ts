import { ChangeDetectionStrategy, Component, OnInit, inject, signal } from '@angular/core';
import { MatButtonModule } from '@angular/material/button';
import { MatIconModule } from '@angular/material/icon';
import { MatMenuModule } from '@angular/material/menu';
import { MatToolbarModule } from '@angular/material/toolbar';
import { NavigationEnd, Router, RouterLink, RouterLinkActive, RouterOutlet } from '@angular/router';
import { takeUntilDestroyed, toSignal } from '@angular/core/rxjs-interop';
import { filter, map } from 'rxjs';
import { Connection } from './auth/connection';
import { Session } from './auth/session';
import { ThemeChoice } from './theme/theme-choice';

interface Destination {
  path: string;
  label: string;
  icon: string;
}

@Component({
  selector: 'app-root',
  changeDetection: ChangeDetectionStrategy.OnPush,
  imports: [
    RouterOutlet,
    RouterLink,
    RouterLinkActive,
    MatToolbarModule,
    MatButtonModule,
    MatIconModule,
    MatMenuModule,
  ],
  templateUrl: './app.html',
  styleUrl: './app.scss',
})
export class App implements OnInit {
  private readonly router = inject(Router);
  protected readonly session = inject(Session);
  /** Set when sign-in came back refused (`?signin=failed`): the shell says so until dismissed. */
  protected readonly signInFailed = signal(false);
  protected readonly connection = inject(Connection);
  /** Signing in from the shell comes back to the page the member was on. */
  protected readonly signInHref = toSignal(
    inject(Router).events.pipe(
      filter((event) => event instanceof NavigationEnd),
      map((event) => this.session.signInUrl(event.urlAfterRedirects)),
    ),
    { initialValue: this.session.signInUrl('/') },
  );
  protected readonly themes = inject(ThemeChoice);
  protected readonly destinations: Destination[] = [
    { path: '/design', label: 'Design', icon: 'tune' },
    { path: '/library', label: 'Library', icon: 'library_music' },
    { path: '/retune', label: 'Retune', icon: 'queue_music' },
    { path: '/temperaments', label: 'Generator search', icon: 'manage_search' },
    { path: '/bands', label: 'Bands', icon: 'groups' },
  ];

  ngOnInit(): void {
    void this.session.refresh();
  }

  private readonly failedSignIns = this.router.events
    .pipe(
      filter((event) => event instanceof NavigationEnd),
      takeUntilDestroyed(),
    )
    .subscribe((event) => {
      const address = this.router.parseUrl(event.urlAfterRedirects);
      if (address.queryParamMap.get('signin') !== 'failed') return;
      this.signInFailed.set(true);
      // The address keeps no trace of the failure, so a reload does not say it again.
      delete address.queryParams['signin'];
      void this.router.navigateByUrl(address, { replaceUrl: true });
    });

  protected signOut(): void {
    void this.session.signOut();
  }
}
