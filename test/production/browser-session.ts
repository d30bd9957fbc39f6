/**
 * A person at a browser, for the production tests: plain `fetch` against the running server
 * with a small cookie jar and the CSRF token the web app fetches from `GET /api/auth/csrf`
 * (sent as `x-csrf-token` on every change), so that the tests reach the API exactly as the
 * installed product's pages do — no supertest app, no models.
 */

/** Thrown when an answer's status is not the one a step expects; carries the body for the failure message. */
export class UnexpectedAnswer extends Error {}

export class BrowserSession {
  private readonly cookies = new Map<string, string>();
  private csrfToken: string | null = null;

  constructor(private readonly baseUrl: string) {}

  /** One request; remembers every cookie the answer sets (a cookie set to expire is dropped). */
  async request(method: string, path: string, body?: unknown): Promise<Response> {
    const headers: Record<string, string> = {};
    // The token first: fetching it may set the session cookie it belongs to.
    if (method !== 'GET') headers['x-csrf-token'] = await this.token();
    if (this.cookies.size > 0) headers['cookie'] = [...this.cookies].map(([name, value]) => `${name}=${value}`).join('; ');
    if (body !== undefined) headers['content-type'] = 'application/json';
    const answer = await fetch(`${this.baseUrl}${path}`, { method, headers, body: body === undefined ? undefined : JSON.stringify(body), redirect: 'manual' });
    for (const line of answer.headers.getSetCookie()) {
      const [pair = '', ...attributes] = line.split(';');
      const split = pair.indexOf('=');
      const name = pair.slice(0, split).trim();
      const value = pair.slice(split + 1).trim();
      const expired = attributes.some((attribute) => /^\s*max-age=0\s*$/i.test(attribute) || /^\s*expires=Thu, 01 Jan 1970/i.test(attribute));
      if (expired || value === '') this.cookies.delete(name);
      else this.cookies.set(name, value);
    }
    return answer;
  }

  /** `request`, then the JSON body — or an error naming the status and body when it is not `status`. */
  async json<T = Record<string, unknown>>(method: string, path: string, status: number, body?: unknown): Promise<T> {
    const answer = await this.request(method, path, body);
    const text = await answer.text();
    if (answer.status !== status) throw new UnexpectedAnswer(`${method} ${path}: ${answer.status} instead of ${status}: ${text.slice(0, 1000)}`);
    return JSON.parse(text) as T;
  }

  get<T = Record<string, unknown>>(path: string, status = 200): Promise<T> {
    return this.json<T>('GET', path, status);
  }

  post<T = Record<string, unknown>>(path: string, body: unknown = {}, status = 200): Promise<T> {
    return this.json<T>('POST', path, status, body);
  }

  /** Signs in as the sign-in page does; the session (and so the CSRF token) is new afterwards. */
  async signIn(email: string, password: string): Promise<void> {
    await this.post('/api/auth/login', { email, password });
    this.csrfToken = null;
  }

  private async token(): Promise<string> {
    if (this.csrfToken === null) {
      this.csrfToken = ''; // the GET below sends none
      const { token } = await this.get<{ token: string }>('/api/auth/csrf');
      this.csrfToken = token;
    }
    return this.csrfToken;
  }
}

/** The token of a mailed link (`…#token=…`), as the choose-password page reads it. */
export function linkToken(link: string): string {
  const token = new URLSearchParams(new URL(link).hash.slice(1)).get('token');
  if (!token) throw new Error(`The link ${link} carries no token.`);
  return token;
}
