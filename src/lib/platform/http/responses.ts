/** JSON answers in the one shape every API route uses (docs/api.md). */

export interface FieldIssue {
  path: string;
  message: string;
}

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
export const tooMany = (retryAfterSeconds: number) =>
  apiError(
    429,
    'rate_limited',
    { message: `Too many attempts. Try again in ${retryAfterSeconds} s.` },
    { 'retry-after': String(retryAfterSeconds) },
  );

/** Reads a JSON body with a size cap; answers 400/413 itself so routes never see a half-read body. */
export async function readJson(
  request: Request,
  maxBytes = 64 * 1024,
): Promise<{ ok: true; value: unknown } | { ok: false; response: Response }> {
  const declared = Number(request.headers.get('content-length') ?? '0');
  if (declared > maxBytes)
    return { ok: false, response: apiError(413, 'body_too_large', { message: `The body may be at most ${maxBytes} bytes.` }) };
  const type = request.headers.get('content-type') ?? '';
  if (!type.toLowerCase().includes('application/json')) {
    return { ok: false, response: apiError(415, 'unsupported_media_type', { message: 'Send the body as application/json.' }) };
  }
  const text = await request.text();
  if (Buffer.byteLength(text) > maxBytes)
    return { ok: false, response: apiError(413, 'body_too_large', { message: `The body may be at most ${maxBytes} bytes.` }) };
  try {
    return { ok: true, value: JSON.parse(text) };
  } catch {
    return { ok: false, response: invalid('malformed_json', [{ path: '', message: 'The body is not valid JSON.' }]) };
  }
}
