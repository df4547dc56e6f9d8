/** A tiny HTTP client with a cookie jar, for talking to the running app as one person. */
import { DEMO_PASSWORD } from '../../src/lib/demo/scenario';

export class Visitor {
  private cookies = new Map<string, string>();
  constructor(readonly baseUrl: string) {}

  get cookieHeader(): string {
    return [...this.cookies].map(([k, v]) => `${k}=${v}`).join('; ');
  }

  async request(path: string, init: RequestInit & { json?: unknown } = {}): Promise<Response> {
    const headers = new Headers(init.headers);
    if (this.cookies.size) headers.set('cookie', this.cookieHeader);
    // A browser names the page's origin on every state-changing request.
    if (init.method && init.method !== 'GET' && !headers.has('origin')) headers.set('origin', this.baseUrl);
    let body = init.body;
    if (init.json !== undefined) {
      headers.set('content-type', 'application/json');
      body = JSON.stringify(init.json);
    }
    const send = () => fetch(new URL(path, this.baseUrl), { ...init, headers, body: body ?? null, redirect: 'manual' });
    let response: Response;
    try {
      response = await send();
    } catch (error) {
      // A kept-alive connection the server closed just as it was reused: a browser retries a
      // read once on a fresh connection, and so does this client. Writes are never retried.
      const code = (error as { cause?: { code?: string } }).cause?.code;
      if (code !== 'ECONNRESET' || (init.method && init.method !== 'GET')) throw error;
      response = await send();
    }
    for (const cookie of response.headers.getSetCookie()) {
      const [pair] = cookie.split(';');
      const eq = pair?.indexOf('=') ?? -1;
      if (!pair || eq < 0) continue;
      const name = pair.slice(0, eq).trim();
      const value = pair.slice(eq + 1).trim();
      if (value === '' || /max-age=0/i.test(cookie)) this.cookies.delete(name);
      else this.cookies.set(name, value);
    }
    return response;
  }

  /** Posts a form as a browser on this site would (same Origin). */
  form(path: string, fields: Record<string, string>): Promise<Response> {
    return this.request(path, {
      method: 'POST',
      headers: { origin: this.baseUrl, 'content-type': 'application/x-www-form-urlencoded' },
      body: new URLSearchParams(fields).toString(),
    });
  }

  /** Follows a post/redirect/get answer to the page it names, as a browser does. */
  async follow(response: Response): Promise<Response> {
    const location = response.headers.get('location');
    if (response.status !== 303 || !location)
      throw new Error(`Expected a 303 with a location, got ${response.status}: ${await response.text()}`);
    return this.request(location);
  }

  async signIn(email: string, password = DEMO_PASSWORD): Promise<this> {
    const response = await this.request('/api/auth/sign-in/email', { method: 'POST', json: { email, password } });
    if (response.status !== 200) throw new Error(`Sign-in of ${email} answered ${response.status}: ${await response.text()}`);
    return this;
  }
}

export const DEMO = {
  admin: 'admin@demo.railwright.test',
  engineer: 'engineer@demo.railwright.test',
  client: 'client@demo.railwright.test',
  otherClient: 'jonas@quillon.demo.railwright.test',
} as const;
