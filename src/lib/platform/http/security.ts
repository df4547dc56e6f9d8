/** Response headers and origin rules applied to every answer (docs/quality.md, Security). */

/** `checkoutOrigin`: where the pay-deposit form may send the browser on (the provider's hosted page). */
export function securityHeaders(production: boolean, checkoutOrigin = 'https://checkout.stripe.com'): Record<string, string> {
  const csp = [
    "default-src 'self'",
    // Astro's island loader is an inline module script; hashing it per build is
    // not exposed, so scripts are limited to our own origin plus inline.
    "script-src 'self' 'unsafe-inline'",
    "style-src 'self' 'unsafe-inline'",
    "img-src 'self' data: blob:",
    "font-src 'self' data:",
    "connect-src 'self'",
    `form-action 'self' ${checkoutOrigin}`,
    "frame-ancestors 'none'",
    "base-uri 'self'",
    "object-src 'none'",
  ].join('; ');
  return {
    'content-security-policy': csp,
    'x-content-type-options': 'nosniff',
    'x-frame-options': 'DENY',
    'referrer-policy': 'strict-origin-when-cross-origin',
    'permissions-policy': 'camera=(), microphone=(), geolocation=()',
    'cross-origin-opener-policy': 'same-origin',
    ...(production ? { 'strict-transport-security': 'max-age=31536000; includeSubDomains' } : {}),
  };
}

const STATE_CHANGING = new Set(['POST', 'PUT', 'PATCH', 'DELETE']);

/** Routes called server-to-server (signed by the caller instead). */
const ORIGIN_EXEMPT = ['/api/v1/payments/webhook'];

/**
 * A browser always sends Origin (or at least Sec-Fetch-Site) on a state-changing
 * request; one that names another site is refused. Requests without either come
 * from non-browser clients, which carry no ambient cookies to abuse.
 */
export function isCrossOriginWrite(request: Request, url: URL, allowedOrigins: readonly string[]): boolean {
  if (!STATE_CHANGING.has(request.method)) return false;
  if (ORIGIN_EXEMPT.includes(url.pathname)) return false;
  const origin = request.headers.get('origin');
  if (origin) return origin !== url.origin && !allowedOrigins.includes(origin);
  return request.headers.get('sec-fetch-site') === 'cross-site';
}
