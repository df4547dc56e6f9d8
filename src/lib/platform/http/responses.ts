/** JSON answers in the one shape every API route uses (docs/api.md). */
import type { FieldIssue, Refusal, RefusalKind } from '../outcome';

export type { FieldIssue };

const JSON_HEADERS = { 'content-type': 'application/json; charset=utf-8', 'cache-control': 'no-store' };

export function json(body: unknown, status = 200, headers: Record<string, string> = {}): Response {
  return new Response(JSON.stringify(body), { status, headers: { ...JSON_HEADERS, ...headers } });
}

/** An answer whose JSON is already made (the engine threads serialize their own results). */
export function jsonText(text: string, status = 200): Response {
  return new Response(text, { status, headers: JSON_HEADERS });
}

export function apiError(
  status: number,
  error: string,
  extra: Record<string, unknown> = {},
  headers: Record<string, string> = {},
): Response {
  return json({ error, ...extra }, status, headers);
}

/** A 500 that says what to quote to us, and nothing of the internals. */
export const internalError = (errorId: string, message = 'Something went wrong on our side.') =>
  apiError(500, 'internal_error', { errorId, message: `${message} If it keeps happening, quote reference ${errorId}.` });

export const unauthorized = () => apiError(401, 'not_signed_in', { message: 'Sign in to continue.' });
export const forbidden = () => apiError(403, 'forbidden', { message: 'Your role does not allow this.' });
export const notFound = () => apiError(404, 'not_found', { message: 'Nothing here, or it is not yours.' });
export const invalid = (error: string, issues: FieldIssue[]) => apiError(400, error, { issues });
export const conflict = (message: string) => apiError(409, 'wrong_state', { message });
const STATUS_OF: Record<RefusalKind, number> = {
  invalid: 400,
  unauthenticated: 401,
  forbidden: 403,
  'not-found': 404,
  'wrong-state': 409,
  'too-large': 413,
  'unsupported-type': 415,
  'rate-limited': 429,
  'upstream-failed': 502,
  unavailable: 503,
};

const CODE_OF: Record<RefusalKind, string> = {
  invalid: 'invalid_body',
  unauthenticated: 'not_signed_in',
  forbidden: 'forbidden',
  'not-found': 'not_found',
  'wrong-state': 'wrong_state',
  'too-large': 'body_too_large',
  'unsupported-type': 'unsupported_media_type',
  'rate-limited': 'rate_limited',
  'upstream-failed': 'upstream_failed',
  unavailable: 'unavailable',
};

export const statusOf = (refusal: Pick<Refusal, 'kind'>): number => STATUS_OF[refusal.kind];

/** The one translation of a domain refusal into a JSON answer. */
export function refusalResponse(refusal: Refusal): Response {
  const extra: Record<string, unknown> = { message: refusal.message };
  if (refusal.issues) extra.issues = refusal.issues;
  const headers: Record<string, string> =
    refusal.retryAfterSeconds === undefined ? {} : { 'retry-after': String(refusal.retryAfterSeconds) };
  return apiError(statusOf(refusal), refusal.code ?? CODE_OF[refusal.kind], extra, headers);
}

export const tooMany = (retryAfterSeconds: number) =>
  apiError(
    429,
    'rate_limited',
    { message: `Too many attempts. Try again in ${retryAfterSeconds} s.` },
    { 'retry-after': String(retryAfterSeconds) },
  );

/** A generated PDF: shown in the browser, or saved under its name when `download` is asked for. */
export function pdfResponse(bytes: Uint8Array, filename: string, download: boolean): Response {
  return new Response(new Uint8Array(bytes), {
    headers: {
      'content-type': 'application/pdf',
      'content-disposition': `${download ? 'attachment' : 'inline'}; filename="${filename}"`,
      'cache-control': 'private, no-store',
    },
  });
}
