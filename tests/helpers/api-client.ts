/**
 * A small HTTP client with a cookie jar, signing in the way a browser does: the CSRF token from
 * /api/auth/csrf, then the credentials form to /api/auth/callback/credentials.
 */
export class ApiClient {
  private readonly cookies = new Map<string, string>();

  constructor(readonly baseUrl: string) {}

  private remember(response: Response): void {
    for (const header of response.headers.getSetCookie()) {
      const [pair] = header.split(';');
      const index = pair?.indexOf('=') ?? -1;
      if (!pair || index < 0) continue;
      const name = pair.slice(0, index).trim();
      const value = pair.slice(index + 1).trim();
      if (value === '' || /expires=thu, 01 jan 1970/i.test(header) || /max-age=0/i.test(header))
        this.cookies.delete(name);
      else this.cookies.set(name, value);
    }
  }

  cookieHeader(): string {
    return [...this.cookies].map(([name, value]) => `${name}=${value}`).join('; ');
  }

  /** The same person (the same cookies) talking to another server, e.g. a second process on one database. */
  atServer(baseUrl: string): ApiClient {
    const other = new ApiClient(baseUrl);
    for (const [name, value] of this.cookies) other.cookies.set(name, value);
    return other;
  }

  hasSessionCookie(): boolean {
    return [...this.cookies.keys()].some((name) => name.endsWith('authjs.session-token'));
  }

  /** A raw request with the jar's cookies; redirects are not followed. */
  async request(path: string, init: RequestInit = {}): Promise<Response> {
    const headers = new Headers(init.headers);
    // Browsers send Origin with every request that changes state; Astro's origin check expects it.
    const method = (init.method ?? 'GET').toUpperCase();
    if (!['GET', 'HEAD', 'OPTIONS'].includes(method) && !headers.has('origin')) headers.set('origin', this.baseUrl);
    if (this.cookies.size) headers.set('cookie', this.cookieHeader());
    const response = await fetch(`${this.baseUrl}${path}`, { ...init, headers, redirect: 'manual' });
    this.remember(response);
    return response;
  }

  async json<T = any>(
    method: string,
    path: string,
    body?: unknown,
  ): Promise<{ status: number; body: T; headers: Headers }> {
    const response = await this.request(path, {
      method,
      headers: body === undefined ? {} : { 'content-type': 'application/json' },
      body: body === undefined ? undefined : JSON.stringify(body),
    });
    const text = await response.text();
    let parsed: unknown = text;
    try {
      parsed = text ? JSON.parse(text) : null;
    } catch {
      // not JSON: keep the text
    }
    return { status: response.status, body: parsed as T, headers: response.headers };
  }

  get<T = any>(path: string) {
    return this.json<T>('GET', path);
  }
  post<T = any>(path: string, body?: unknown) {
    return this.json<T>('POST', path, body);
  }
  patch<T = any>(path: string, body?: unknown) {
    return this.json<T>('PATCH', path, body);
  }
  put<T = any>(path: string, body?: unknown) {
    return this.json<T>('PUT', path, body);
  }
  delete<T = any>(path: string) {
    return this.json<T>('DELETE', path);
  }

  /** Signs in through Auth.js; returns the callback's response (302 either way, 429 when limited). */
  async signIn(email: string, password: string): Promise<Response> {
    const csrf = await this.get<{ csrfToken: string }>('/api/auth/csrf');
    const form = new URLSearchParams({ email, password, csrfToken: csrf.body.csrfToken, callbackUrl: '/' });
    return this.request('/api/auth/callback/credentials', {
      method: 'POST',
      headers: { 'content-type': 'application/x-www-form-urlencoded' },
      body: form,
    });
  }

  async signOut(): Promise<Response> {
    const csrf = await this.get<{ csrfToken: string }>('/api/auth/csrf');
    return this.request('/api/auth/signout', {
      method: 'POST',
      headers: { 'content-type': 'application/x-www-form-urlencoded' },
      body: new URLSearchParams({ csrfToken: csrf.body.csrfToken }),
    });
  }
}

let counter = 0;
/** A unique test e-mail address. */
export function uniqueEmail(prefix = 'person'): string {
  counter += 1;
  return `${prefix}-${Date.now().toString(36)}-${counter}@example.test`;
}

export const TEST_PASSWORD = 'a long enough test passphrase';

/** Makes an account, signs it in, and optionally starts a team; returns the signed-in client. */
export async function signedInClient(baseUrl: string, options: { team?: string; email?: string; name?: string } = {}) {
  const client = new ApiClient(baseUrl);
  const email = options.email ?? uniqueEmail();
  const made = await client.post('/api/accounts', {
    email,
    password: TEST_PASSWORD,
    name: options.name ?? 'Test Person',
  });
  if (made.status !== 201) throw new Error(`sign-up failed: ${made.status} ${JSON.stringify(made.body)}`);
  const signedIn = await client.signIn(email, TEST_PASSWORD);
  if (!client.hasSessionCookie()) throw new Error(`sign-in failed: ${signedIn.status}`);
  let teamId: string | undefined;
  if (options.team) {
    const team = await client.post('/api/teams', { name: options.team });
    teamId = team.body.id;
  }
  return { client, email, userId: made.body.id as string, teamId };
}
