import { TestbedHarnessEnvironment } from '@angular/cdk/testing/testbed';
import { MatMenuHarness } from '@angular/material/menu/testing';
import { HttpClient, provideHttpClient, withInterceptors } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { TestBed } from '@angular/core/testing';
import { Router, provideRouter } from '@angular/router';
import { App } from './app';
import { routes } from './app.routes';
import { connectionInterceptor } from './auth/connection';

describe('App shell', () => {
  let http: HttpTestingController;

  beforeEach(async () => {
    await TestBed.configureTestingModule({
      imports: [App],
      providers: [
        provideRouter(routes),
        provideHttpClient(withInterceptors([connectionInterceptor])),
        provideHttpClientTesting(),
      ],
    }).compileComponents();
    http = TestBed.inject(HttpTestingController);
  });

  afterEach(() => http.verify());

  async function render(me: { user: unknown } | 'unreachable') {
    const fixture = TestBed.createComponent(App);
    fixture.detectChanges();
    const request = http.expectOne('/api/me');
    if (me === 'unreachable') request.error(new ProgressEvent('error'), { status: 0 });
    else request.flush(me);
    await fixture.whenStable();
    fixture.detectChanges();
    return { fixture, element: fixture.nativeElement as HTMLElement };
  }

  it('links to Design, Library, Retune, Generator search and Bands from the main navigation', async () => {
    const { element } = await render({ user: null });
    const links = Array.from(
      element.querySelectorAll<HTMLAnchorElement>('nav[aria-label="Main"] a'),
    );
    expect(links.map((a) => a.querySelector('.label')?.textContent?.trim())).toEqual([
      'Design',
      'Library',
      'Retune',
      'Generator search',
      'Bands',
    ]);
    expect(links.map((a) => a.getAttribute('aria-label'))).toEqual([
      'Design',
      'Library',
      'Retune',
      'Generator search',
      'Bands',
    ]);
    expect(links.map((a) => new URL(a.href).pathname)).toEqual([
      '/design',
      '/library',
      '/retune',
      '/temperaments',
      '/bands',
    ]);
  });

  it('says when sign-in came back refused, and leaves no trace of it in the address', async () => {
    const { fixture, element } = await render({ user: null });
    const router = TestBed.inject(Router);
    await router.navigateByUrl('/no/such/page?signin=failed');
    await fixture.whenStable();
    fixture.detectChanges();
    const alert = element.querySelector('.notice[role="alert"]');
    expect(alert?.textContent).toContain('Signing in did not finish');
    expect(router.url).toBe('/no/such/page');
    const dismiss = Array.from(alert!.querySelectorAll('button')).find((b) =>
      b.textContent?.includes('Dismiss'),
    )!;
    dismiss.click();
    fixture.detectChanges();
    expect(element.querySelector('.notice')).toBeNull();
  });

  it('offers sign-in with GitHub to a visitor', async () => {
    const { element } = await render({ user: null });
    const signIn = element.querySelector<HTMLAnchorElement>('a.sign-in');
    expect(signIn?.textContent).toContain('Sign in with GitHub');
    expect(signIn?.getAttribute('aria-label')).toBe('Sign in with GitHub');
    expect(new URL(signIn!.href).pathname).toBe('/auth/github');
    expect(new URL(signIn!.href).searchParams.get('next')).toMatch(/^\//);
    expect(element.querySelector('button.member')).toBeNull();
  });

  it('shows the signed-in member by name and avatar, and signs out', async () => {
    const avatar = 'data:image/svg+xml,%3Csvg xmlns=%22http://www.w3.org/2000/svg%22/%3E';
    const member = {
      id: 'u1',
      login: 'mira-vale',
      name: 'Mira Vale',
      email: null,
      avatarUrl: avatar,
      siteRole: 'member',
    };
    const { fixture, element } = await render({ user: member });
    const button = element.querySelector<HTMLButtonElement>('button.member')!;
    expect(button.textContent).toContain('Mira Vale');
    expect(button.getAttribute('aria-label')).toContain('Signed in as Mira Vale');
    expect(button.querySelector('img')?.getAttribute('src')).toBe(avatar);
    expect(element.querySelector('a.sign-in')).toBeNull();

    const menu = await TestbedHarnessEnvironment.loader(fixture).getHarness(
      MatMenuHarness.with({ selector: 'button.member' }),
    );
    await menu.open();
    await menu.clickItem({ text: /Sign out/ });
    const logout = http.expectOne('/auth/logout');
    expect(logout.request.method).toBe('POST');
    logout.flush(null, { status: 204, statusText: 'No Content' });
    await fixture.whenStable();
    fixture.detectChanges();
    expect(element.querySelector('a.sign-in')).not.toBeNull();
  });

  it('offers a switch between the light and the dark theme', async () => {
    localStorage.removeItem('keyloom.theme');
    const { fixture, element } = await render({ user: null });
    const toggle = element.querySelector<HTMLButtonElement>('button.theme')!;
    const before = toggle.getAttribute('aria-label');
    expect(before).toMatch(/^Switch to the (light|dark) theme$/);
    toggle.click();
    await fixture.whenStable();
    expect(toggle.getAttribute('aria-label')).not.toBe(before);
    expect(
      document.documentElement.classList.contains('light-theme') ||
        document.documentElement.classList.contains('dark-theme'),
    ).toBeTrue();
    localStorage.removeItem('keyloom.theme');
    document.documentElement.classList.remove('light-theme', 'dark-theme');
  });

  it('says so when the server does not answer, and stops saying so when it answers again', async () => {
    const { fixture, element } = await render('unreachable');
    expect(element.querySelector('[role="alert"]')?.textContent).toContain('not answering');
    TestBed.inject(HttpClient).get('/api/health').subscribe();
    http.expectOne('/api/health').flush({ ok: true, db: true });
    await fixture.whenStable();
    fixture.detectChanges();
    expect(element.querySelector('[role="alert"]')).toBeNull();
  });
});
