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

/** No request of the product nests deeper than this; deeper bodies are refused before parsing. */
export const JSON_MAX_DEPTH = 32;

/** How deep the brackets of a JSON text nest, outside strings; stops counting past `limit`. */
export function jsonDepth(text: string, limit = JSON_MAX_DEPTH): number {
  let depth = 0;
  let deepest = 0;
  let inString = false;
  for (let i = 0; i < text.length; i++) {
    const c = text.charCodeAt(i);
    if (inString) {
      if (c === 0x5c)
        i++; // backslash: skip the escaped character
      else if (c === 0x22) inString = false;
    } else if (c === 0x22) inString = true;
    else if (c === 0x7b || c === 0x5b) {
      depth++;
      if (depth > deepest) deepest = depth;
      if (deepest > limit) return deepest;
    } else if (c === 0x7d || c === 0x5d) depth--;
  }
  return deepest;
}

/** `application/json`, optionally with a charset parameter: nothing that merely contains the words. */
export function isJsonType(header: string | null): boolean {
  const [type, ...params] = (header ?? '').split(';').map((part) => part.trim().toLowerCase());
  return type === 'application/json' && params.every((p) => p === '' || /^charset="?utf-8"?$/.test(p));
}

/** A JSON body: 415 unless sent as JSON, 413 past the limit, 400 when it does not parse or nests too deep. */
export async function readJsonBody(request: Request, maxBytes = JSON_BODY_LIMIT): Promise<Outcome<unknown>> {
  if (!isJsonType(request.headers.get('content-type')))
    return refuse('unsupported-type', 'Send the body as application/json (UTF-8).', { code: 'unsupported_media_type' });
  const text = await readLimitedText(request, maxBytes);
  if (!text.ok) return text;
  if (jsonDepth(text.value) > JSON_MAX_DEPTH)
    return invalidInput('too_deep', [{ path: '', message: `The body nests deeper than ${JSON_MAX_DEPTH} levels.` }]);
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
