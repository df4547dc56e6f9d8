import { describe, expect, test } from 'vitest';
import { isCrossOriginWrite, securityHeaders } from '../../../src/lib/platform/http/security';

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
});
