import { describe, expect, inject, test } from 'vitest';
import { scriptHash } from '../../../src/lib/platform/http/island-scripts';
import { DEMO, Visitor } from '../../support/client';

const baseUrl = inject('baseUrl');

describe('security on every answer', () => {
  test.each(['/', '/sign-in', '/api/health', '/no-such-page'])('%s carries the security headers', async (path) => {
    const response = await new Visitor(baseUrl).request(path);
    const csp = response.headers.get('content-security-policy') ?? '';
    expect(csp).toContain("frame-ancestors 'none'");
    expect(csp).toContain("default-src 'self'");
    expect(response.headers.get('x-content-type-options')).toBe('nosniff');
    expect(response.headers.get('referrer-policy')).toBe('strict-origin-when-cross-origin');
  });

  test.each(['/desk', 'the review page', '/briefs/new'])(
    '%s runs only inline scripts the policy names by hash, and nothing inline wholesale',
    async (page) => {
      const visitor = await new Visitor(baseUrl).signIn(page === '/briefs/new' ? DEMO.client : DEMO.engineer);
      let path = page;
      if (page === 'the review page') {
        const list = await (await visitor.request('/api/v1/briefs?state=submitted')).json();
        path = `/desk/briefs/${list.items[0].id}`;
      }
      const response = await visitor.request(path);
      expect(response.status).toBe(200);
      const policy = response.headers.get('content-security-policy') ?? '';
      const scriptSrc = /script-src ([^;]*)/.exec(policy)?.[1] ?? '';
      expect(scriptSrc).not.toContain('unsafe-inline');
      const html = await response.text();
      const inline = [...html.matchAll(/<script\b([^>]*)>([\s\S]*?)<\/script>/gi)].filter((m) => !/\bsrc=/.test(m[1] ?? ''));
      expect(inline.length).toBeGreaterThan(0);
      for (const [, , body] of inline) expect(scriptSrc).toContain(`'${scriptHash(body ?? '')}'`);
      expect(html).not.toMatch(/\son[a-z]+="/);
      // A page shown to someone signed in is kept by no cache.
      expect(response.headers.get('cache-control')).toBe('private, no-store');
    },
  );

  test('the files the server sends itself carry the headers too', async () => {
    const html = await (await new Visitor(baseUrl).request('/')).text();
    const asset = /(?:href|src)="(\/_astro\/[^"]+)"/.exec(html)?.[1];
    expect(asset).toBeDefined();
    for (const path of [asset ?? '', '/favicon.svg', '/print-sheet.js']) {
      const response = await fetch(new URL(path, baseUrl));
      expect(response.status, path).toBe(200);
      expect(response.headers.get('x-content-type-options'), path).toBe('nosniff');
      expect(response.headers.get('content-security-policy'), path).toBe("default-src 'none'; frame-ancestors 'none'");
      await response.body?.cancel();
    }
  });

  test('an unknown page answers 404 with our page', async () => {
    const response = await new Visitor(baseUrl).request('/no-such-page');
    expect(response.status).toBe(404);
    expect(await response.text()).toContain('Nothing here');
  });

  test('session cookies are httpOnly and SameSite=Lax, Secure in production', async () => {
    const response = await fetch(new URL('/api/auth/sign-in/email', baseUrl), {
      method: 'POST',
      headers: { 'content-type': 'application/json', origin: baseUrl },
      body: JSON.stringify({ email: DEMO.client, password: 'railwright-demo' }),
    });
    const cookie = response.headers.getSetCookie().find((c) => c.includes('session_token')) ?? '';
    expect(cookie).toMatch(/HttpOnly/i);
    expect(cookie).toMatch(/SameSite=Lax/i);
    // The built server runs as production: cookies are Secure and __Secure- prefixed.
    expect(cookie).toMatch(/Secure/);
    expect(cookie.startsWith('__Secure-')).toBe(true);
  });

  test('a state-changing request from another site is refused before anything runs', async () => {
    const visitor = await new Visitor(baseUrl).signIn(DEMO.admin);
    const response = await visitor.request('/admin/users', {
      method: 'POST',
      headers: { origin: 'https://attacker.example', 'content-type': 'application/x-www-form-urlencoded' },
      body: 'userId=x&role=admin',
    });
    expect(response.status).toBe(403);
    expect((await response.json()).error).toBe('cross_origin');
    // Sandboxed frames and some redirects send `Origin: null`; that is not our site either.
    const opaque = await visitor.request('/sign-out', { method: 'POST', headers: { origin: 'null' } });
    expect(opaque.status).toBe(403);
    expect((await visitor.request('/admin/users')).status).toBe(200);
  });

  // A chunked body declares no length: the limit must hold while the bytes arrive.
  test.each([
    ['/api/v1/payments/webhook', 'application/json'],
    ['/api/auth/sign-in/email', 'application/json'],
    ['/api/v1/evaluate', 'application/json'],
    ['/api/v1/account', 'application/json'],
    ['/sign-in', 'application/x-www-form-urlencoded'],
  ])('a 300 MB chunked body to %s is cut off at the limit with 413', async (path, type) => {
    const chunk = new Uint8Array(64 * 1024).fill(0x20);
    let sent = 0;
    const body = new ReadableStream<Uint8Array>({
      pull(controller) {
        if (sent >= 300 * 1024 * 1024) return controller.close();
        sent += chunk.byteLength;
        controller.enqueue(chunk);
      },
    });
    const response = await fetch(new URL(path, baseUrl), {
      method: 'POST',
      headers: { 'content-type': type, origin: baseUrl, 'stripe-signature': 't=1,v1=00' },
      body,
      duplex: 'half',
    } as RequestInit);
    expect(response.status).toBe(413);
    await response.body?.cancel();
    // The server stopped reading long before the end (the rest was never buffered).
    expect(sent).toBeLessThan(32 * 1024 * 1024);
  });

  test('sign-in is rate-limited per account and address', async () => {
    const visitor = new Visitor(baseUrl);
    const email = `limited-${Date.now()}@example.test`;
    const statuses: number[] = [];
    for (let i = 0; i < 10; i++) {
      const response = await visitor.request('/api/auth/sign-in/email', { method: 'POST', json: { email, password: 'wrong-password' } });
      statuses.push(response.status);
    }
    expect(statuses.slice(0, 8).every((s) => s === 401)).toBe(true);
    expect(statuses.slice(8)).toEqual([429, 429]);
    const limited = await visitor.request('/api/auth/sign-in/email', { method: 'POST', json: { email, password: 'wrong-password' } });
    expect(Number(limited.headers.get('retry-after'))).toBeGreaterThan(0);
    // The form page counts the same attempts and says so in words.
    const form = await visitor.form('/sign-in', { email, password: 'wrong-password' });
    expect(form.status).toBe(429);
    expect(await form.text()).toContain('Too many attempts');
  });
});
