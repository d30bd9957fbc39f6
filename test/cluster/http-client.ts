/**
 * A small HTTP client for the cluster test: one browser-like session (its cookies and CSRF token)
 * that can send each request to any base URL — the load balancer or one instance directly — as a
 * device whose requests a load balancer spreads over several instances.
 */
export interface Answer {
  status: number;
  body: unknown;
  /** The instance nginx chose (X-Speedwright-Upstream), when the request went through it. */
  upstream: string | null;
}

export class ClusterClient {
  private readonly cookies = new Map<string, string>();
  private token = '';

  constructor(private readonly defaultBase: string) {}

  /** Sends one request; a network failure answers status 0 (as a browser's fetch would reject). */
  async send(method: string, path: string, body?: unknown, base = this.defaultBase, timeoutMs = 30_000): Promise<Answer> {
    const headers: Record<string, string> = { accept: 'application/json' };
    if (this.cookies.size) headers['cookie'] = [...this.cookies].map(([name, value]) => `${name}=${value}`).join('; ');
    if (this.token) headers['x-csrf-token'] = this.token;
    if (body !== undefined) headers['content-type'] = 'application/json';
    let response: Response;
    try {
      response = await fetch(`${base}${path}`, { method, headers, body: body === undefined ? undefined : JSON.stringify(body), signal: AbortSignal.timeout(timeoutMs) });
    } catch {
      return { status: 0, body: null, upstream: null };
    }
    for (const line of response.headers.getSetCookie()) {
      const [pair] = line.split(';');
      const at = pair!.indexOf('=');
      if (at > 0) this.cookies.set(pair!.slice(0, at).trim(), pair!.slice(at + 1).trim());
    }
    const text = await response.text();
    let parsed: unknown = text;
    try {
      parsed = text ? JSON.parse(text) : null;
    } catch {
      // not JSON (an nginx error page)
    }
    return { status: response.status, body: parsed, upstream: response.headers.get('x-speedwright-upstream') };
  }

  /** A fresh CSRF token for the session (after sign-in the session is regenerated). */
  async refreshToken(base = this.defaultBase): Promise<void> {
    const answer = await this.send('GET', '/api/auth/csrf', undefined, base);
    if (answer.status !== 200) throw new Error(`GET /api/auth/csrf answered ${answer.status}`);
    this.token = (answer.body as { token: string }).token;
  }

  /** Signs in, trying again (at most five times) while the answer says the server or its database is away, as a person would. */
  async signIn(email: string, password: string, base = this.defaultBase): Promise<void> {
    let answer: Answer = { status: 0, body: null, upstream: null };
    for (let attempt = 1; attempt <= 5; attempt++) {
      await this.refreshToken(base).catch(() => undefined);
      answer = await this.send('POST', '/api/auth/login', { email, password }, base);
      if (![0, 502, 503, 504].includes(answer.status)) break;
      await new Promise((done) => setTimeout(done, 300 * attempt));
    }
    if (answer.status !== 200) throw new Error(`Sign-in of ${email} answered ${answer.status}: ${JSON.stringify(answer.body)}`);
    await this.refreshToken(base);
  }
}
