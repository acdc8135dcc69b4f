/** The cookies a browser would keep for 127.0.0.1 (any port), for fetch calls that cross server processes. */
export class CookieJar {
  private readonly cookies = new Map<string, string>();

  take(response: Response): void {
    for (const line of response.headers.getSetCookie()) {
      const [pair, ...attributes] = line.split(';');
      const [name, value] = pair.split('=');
      const expired = attributes.some((a) => /^\s*expires=thu, 01 jan 1970/i.test(a));
      if (expired) this.cookies.delete(name.trim());
      else this.cookies.set(name.trim(), value);
    }
  }

  get(name: string): string | undefined {
    return this.cookies.get(name);
  }

  header(): string {
    return [...this.cookies].map(([name, value]) => `${name}=${value}`).join('; ');
  }

  /** fetch with this jar's cookies, keeping what the answer sets; redirects are not followed. */
  async fetch(url: string, init: RequestInit = {}): Promise<Response> {
    const headers = new Headers(init.headers);
    headers.set('cookie', this.header());
    const xsrf = this.get('XSRF-TOKEN');
    if (xsrf && init.method && init.method !== 'GET') headers.set('X-XSRF-TOKEN', xsrf);
    const response = await fetch(url, { ...init, headers, redirect: 'manual' });
    this.take(response);
    return response;
  }

  /** Signs in through the GitHub stand-in at `appUrl`, as a browser following the redirects would. */
  async signIn(appUrl: string, login: string): Promise<void> {
    const start = await this.fetch(`${appUrl}/auth/github?login=${login}`);
    const provider = await fetch(start.headers.get('location')!, { redirect: 'manual' });
    const back = await this.fetch(provider.headers.get('location')!);
    if (back.status !== 302) throw new Error(`sign-in failed: ${back.status}`);
    await this.fetch(`${appUrl}/api/me`);
  }
}
