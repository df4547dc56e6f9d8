/**
 * Request bodies read with a byte limit enforced while streaming: a chunked
 * body without Content-Length is cut off at the limit instead of being
 * buffered whole, so no caller can make the server hold more than the limit.
 */
import { invalidInput, refuse, succeed, type Outcome } from '../outcome';

export const JSON_BODY_LIMIT = 64 * 1024;
export const FORM_BODY_LIMIT = 64 * 1024;

const tooLarge = (maxBytes: number) => refuse('too-large', `The body may be at most ${maxBytes} bytes.`);

export async function readLimitedBytes(request: Request, maxBytes: number): Promise<Outcome<Uint8Array<ArrayBuffer>>> {
  const declared = Number(request.headers.get('content-length') ?? '0');
  if (declared > maxBytes) return tooLarge(maxBytes);
  if (!request.body) return succeed(new Uint8Array());
  const reader = request.body.getReader();
  const chunks: Uint8Array[] = [];
  let total = 0;
  for (;;) {
    const { done, value } = await reader.read();
    if (done) break;
    total += value.byteLength;
    if (total > maxBytes) {
      await reader.cancel().catch(() => undefined);
      return tooLarge(maxBytes);
    }
    chunks.push(value);
  }
  const bytes = new Uint8Array(total);
  let at = 0;
  for (const chunk of chunks) {
    bytes.set(chunk, at);
    at += chunk.byteLength;
  }
  return succeed(bytes);
}

export async function readLimitedText(request: Request, maxBytes: number): Promise<Outcome<string>> {
  const bytes = await readLimitedBytes(request, maxBytes);
  return bytes.ok ? succeed(new TextDecoder().decode(bytes.value)) : bytes;
}

/** A JSON body: 415 unless sent as JSON, 413 past the limit, 400 when it does not parse. */
export async function readJsonBody(request: Request, maxBytes = JSON_BODY_LIMIT): Promise<Outcome<unknown>> {
  const type = request.headers.get('content-type') ?? '';
  if (!type.toLowerCase().includes('application/json'))
    return refuse('unsupported-type', 'Send the body as application/json.', { code: 'unsupported_media_type' });
  const text = await readLimitedText(request, maxBytes);
  if (!text.ok) return text;
  try {
    return succeed(JSON.parse(text.value));
  } catch {
    return invalidInput('malformed_json', [{ path: '', message: 'The body is not valid JSON.' }]);
  }
}

/** A page form's fields (URL-encoded or multipart text fields), with the same streaming limit. */
export async function readFormFields(request: Request, maxBytes = FORM_BODY_LIMIT): Promise<Outcome<Record<string, string>>> {
  const bytes = await readLimitedBytes(request, maxBytes);
  if (!bytes.ok) return bytes;
  const type = request.headers.get('content-type') ?? 'application/x-www-form-urlencoded';
  let form: FormData;
  try {
    form = await new Response(bytes.value, { headers: { 'content-type': type } }).formData();
  } catch {
    return invalidInput('malformed_form', [{ path: '', message: 'The form could not be read; reload the page and try again.' }]);
  }
  const fields: Record<string, string> = {};
  for (const [key, value] of form) if (typeof value === 'string') fields[key] = value;
  return succeed(fields);
}
