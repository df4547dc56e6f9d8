/** Helpers for the no-JavaScript account forms that call better-auth on the server. */

/**
 * Only a path on this site. `next` is read as the browser will read the
 * Location header (WHATWG URL parsing drops tabs and line breaks and treats
 * `\` as `/`), so `/\t/evil.example` is seen for the other site it names; what
 * passes is re-serialised, which leaves no control character in the header.
 */
export function safeNext(value: string | null | undefined, fallback: string, origin: string): string {
  if (!value) return fallback;
  const base = new URL(origin);
  let target: URL;
  try {
    target = new URL(value, base);
  } catch {
    return fallback;
  }
  if (target.origin !== base.origin) return fallback;
  return target.pathname + target.search + target.hash;
}

export function redirectWithCookies(location: string, authHeaders: Headers): Response {
  const headers = new Headers({ location });
  for (const cookie of authHeaders.getSetCookie()) headers.append('set-cookie', cookie);
  return new Response(null, { status: 303, headers });
}

export function homeFor(role: string | null | undefined): string {
  if (role === 'engineer' || role === 'admin') return '/desk';
  if (role === 'client') return '/briefs';
  return '/';
}
