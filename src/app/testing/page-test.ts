import { provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { HarnessLoader } from '@angular/cdk/testing';
import { TestbedHarnessEnvironment } from '@angular/cdk/testing/testbed';
import { EnvironmentProviders, Provider } from '@angular/core';
import { TestBed } from '@angular/core/testing';
import { MATERIAL_ANIMATIONS } from '@angular/material/core';
import { MatSnackBarHarness } from '@angular/material/snack-bar/testing';
import { Routes, provideRouter, withComponentInputBinding } from '@angular/router';
import { RouterTestingHarness } from '@angular/router/testing';
import { Member, Session } from '../auth/session';

/**
 * The set-up every page spec shares: the page's routes bound to inputs as in app.config.ts, HttpClient
 * against HttpTestingController, Material's animations off. Make one in `beforeEach`, `open` a page as a
 * member or a guest, and `settle` after each step; `afterEach` calls `verify()`.
 */
export class PageTest {
  readonly http: HttpTestingController;
  private opened: RouterTestingHarness | null = null;

  constructor(routes: Routes, providers: (Provider | EnvironmentProviders)[] = []) {
    TestBed.configureTestingModule({
      providers: [
        provideRouter(routes, withComponentInputBinding()),
        provideHttpClient(),
        provideHttpClientTesting(),
        { provide: MATERIAL_ANIMATIONS, useValue: { animationsDisabled: true } },
        ...providers,
      ],
    });
    this.http = TestBed.inject(HttpTestingController);
  }

  /** Opens `url` with `member` signed in (null: a guest) and lets the page settle. */
  async open(url: string, member: Member | null): Promise<void> {
    TestBed.inject(Session).member.set(member);
    this.opened = await RouterTestingHarness.create(url);
    await this.settle();
  }

  /** Waits for the page's pending work, then runs change detection. */
  async settle(): Promise<void> {
    await this.harness.fixture.whenStable();
    this.harness.detectChanges();
  }

  get harness(): RouterTestingHarness {
    if (!this.opened) throw new Error('open a page first');
    return this.opened;
  }

  /** Material's test harnesses over the whole document (menus, dialogs and snack bars live outside the page). */
  get loader(): HarnessLoader {
    return TestbedHarnessEnvironment.documentRootLoader(this.harness.fixture);
  }

  page(): HTMLElement {
    return this.harness.routeNativeElement as HTMLElement;
  }

  /** The text of the first element matching `selector`, white space collapsed ('' when there is none). */
  text(selector: string): string {
    return this.page().querySelector(selector)?.textContent?.replace(/\s+/g, ' ').trim() ?? '';
  }

  /** The message of the snack bar on show. */
  async snackBar(): Promise<string> {
    return (await this.loader.getHarness(MatSnackBarHarness)).getMessage();
  }

  verify(): void {
    this.http.verify();
  }
}
