/** Helpers for the no-JavaScript account forms that call better-auth on the server. */

/** Only same-site paths: `next=//evil.example` or absolute URLs fall back to the role's home. */
export function safeNext(value: string | null | undefined, fallback: string): string {
  if (!value || !value.startsWith('/') || value.startsWith('//') || value.startsWith('/\\')) return fallback;
  return value;
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
