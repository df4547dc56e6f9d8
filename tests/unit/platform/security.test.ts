import { describe, expect, test } from 'vitest';
import { isCrossOriginWrite, securityHeaders, staticFileHeaders } from '../../../src/lib/platform/http/security';
import { islandScriptHashes, scriptHash } from '../../../src/lib/platform/http/island-scripts';

const url = new URL('https://rails.example/api/v1/briefs');
const req = (method: string, headers: Record<string, string> = {}) => new Request(url, { method, headers });

describe('origin check on state-changing requests', () => {
  test('reads are never refused', () => {
    expect(isCrossOriginWrite(req('GET', { origin: 'https://evil.example' }), url, [])).toBe(false);
  });
  test('a write from our own origin or a configured public origin passes', () => {
    expect(isCrossOriginWrite(req('POST', { origin: 'https://rails.example' }), url, [])).toBe(false);
    expect(isCrossOriginWrite(req('PATCH', { origin: 'https://public.example' }), url, ['https://public.example'])).toBe(false);
  });
  test('a write naming another origin, or the opaque origin, is refused', () => {
    expect(isCrossOriginWrite(req('POST', { origin: 'https://evil.example' }), url, [])).toBe(true);
    expect(isCrossOriginWrite(req('DELETE', { origin: 'null' }), url, [])).toBe(true);
  });
  test('without Origin, Sec-Fetch-Site decides; a non-browser client without either passes', () => {
    expect(isCrossOriginWrite(req('POST', { 'sec-fetch-site': 'cross-site' }), url, [])).toBe(true);
    expect(isCrossOriginWrite(req('POST', { 'sec-fetch-site': 'same-origin' }), url, [])).toBe(false);
    expect(isCrossOriginWrite(req('POST'), url, [])).toBe(false);
  });
  test('the payment webhook is exempt: it is authenticated by its signature instead', () => {
    const hook = new URL('https://rails.example/api/v1/payments/webhook');
    expect(isCrossOriginWrite(new Request(hook, { method: 'POST', headers: { origin: 'https://pay.example' } }), hook, [])).toBe(false);
  });
});

describe('security headers', () => {
  test('frames are refused, types are not sniffed, HSTS only in production', () => {
    const dev = securityHeaders(false);
    const prod = securityHeaders(true);
    expect(dev['content-security-policy']).toContain("frame-ancestors 'none'");
    expect(dev['x-content-type-options']).toBe('nosniff');
    expect(dev['strict-transport-security']).toBeUndefined();
    expect(prod['strict-transport-security']).toContain('max-age=');
  });
  test('forms may only lead to our own pages and the payment provider’s hosted checkout', () => {
    expect(securityHeaders(true)['content-security-policy']).toContain("form-action 'self' https://checkout.stripe.com;");
    expect(securityHeaders(false, 'http://127.0.0.1:12111')['content-security-policy']).toContain(
      "form-action 'self' http://127.0.0.1:12111;",
    );
  });
  test('inline scripts run only when their hash is named; nothing inline is allowed wholesale', () => {
    const policy = securityHeaders(true, undefined, ['sha256-abc=', 'sha256-def='])['content-security-policy'];
    expect(policy).toContain("script-src 'self' 'sha256-abc=' 'sha256-def=';");
    expect(policy).not.toMatch(/script-src[^;]*unsafe-inline/);
  });
  test('files the server sends itself run nothing and are framed nowhere', () => {
    const headers = staticFileHeaders(true);
    expect(headers['content-security-policy']).toBe("default-src 'none'; frame-ancestors 'none'");
    expect(headers['x-content-type-options']).toBe('nosniff');
    expect(headers['cross-origin-resource-policy']).toBe('same-origin');
  });
});

describe('the island scripts Astro inlines', () => {
  test('are read from the installed Astro and hashed as the browser hashes them', async () => {
    const hashes = await islandScriptHashes();
    // The directives (idle, load, media, only, visible) and the island element itself.
    expect(hashes.length).toBeGreaterThanOrEqual(6);
    // The browser hashes the exact text between the tags (CSP Level 3, "hash-source").
    expect(scriptHash('alert(1)')).toBe('sha256-bhHHL3z2vDgxUt0W3dWQOrprscmda2Y5pLsLg4GF+pI=');
  });
});
