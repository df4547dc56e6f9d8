/** Response headers and origin rules applied to every answer (docs/quality.md, Security). */

/**
 * Every answer's headers. `checkoutOrigin`: where the pay-deposit form may send the
 * browser on (the provider's hosted page). `scriptHashes`: the inline scripts a page may run.
 */
export function securityHeaders(
  production: boolean,
  checkoutOrigin = 'https://checkout.stripe.com',
  scriptHashes: readonly string[] = [],
): Record<string, string> {
  const csp = [
    "default-src 'self'",
    ['script-src', "'self'", ...scriptHashes.map((hash) => `'${hash}'`)].join(' '),
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

/**
 * What the server sends with the files it serves itself (scripts, styles, fonts
 * under /_astro and public/), which never pass the middleware: nothing may run
 * or frame them, and their types are not guessed.
 */
export function staticFileHeaders(production: boolean): Record<string, string> {
  const { 'content-security-policy': _pagePolicy, ...rest } = securityHeaders(production);
  return {
    ...rest,
    'content-security-policy': "default-src 'none'; frame-ancestors 'none'",
    'cross-origin-resource-policy': 'same-origin',
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
