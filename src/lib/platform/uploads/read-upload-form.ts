/**
 * Reads a multipart upload without ever holding more than the cap: the
 * declared Content-Length is checked before reading, and the bytes that really
 * arrive are counted while reading (a chunked body declares nothing).
 */
import { z } from 'zod';
import { apiError, invalid, type FieldIssue } from '../http/responses';
import { FILE_KINDS } from '../db/schema';
import { MAX_UPLOAD_BYTES, MAX_UPLOAD_LABEL, type FileKind } from './file-policy';

// Room for the multipart boundaries, part headers and the small `kind` field.
const MULTIPART_OVERHEAD_BYTES = 64 * 1024;

export type UploadForm = { ok: true; file: File; kind: FileKind | undefined } | { ok: false; response: Response };

const kindSchema = z.enum(FILE_KINDS, { error: `Choose a kind: ${FILE_KINDS.join(', ')}.` }).optional();

const tooLarge = () =>
  apiError(413, 'file_too_large', { message: `The upload is larger than ${MAX_UPLOAD_LABEL}, the most a file may be.` });

/** The body's bytes, or null as soon as more than `limit` have arrived. */
async function readCapped(body: ReadableStream<Uint8Array>, limit: number): Promise<Uint8Array<ArrayBuffer> | null> {
  const reader = body.getReader();
  const chunks: Uint8Array[] = [];
  let total = 0;
  for (;;) {
    const { done, value } = await reader.read();
    if (done) break;
    total += value.byteLength;
    if (total > limit) {
      await reader.cancel();
      return null;
    }
    chunks.push(value);
  }
  const bytes = new Uint8Array(total);
  let offset = 0;
  for (const chunk of chunks) {
    bytes.set(chunk, offset);
    offset += chunk.byteLength;
  }
  return bytes;
}

export async function readUploadForm(request: Request): Promise<UploadForm> {
  const contentType = request.headers.get('content-type') ?? '';
  if (!/^multipart\/form-data\s*;/i.test(contentType)) {
    return {
      ok: false,
      response: apiError(415, 'unsupported_media_type', {
        message: 'Send the upload as multipart/form-data with the file in a field named "file".',
      }),
    };
  }
  const limit = MAX_UPLOAD_BYTES + MULTIPART_OVERHEAD_BYTES;
  if (Number(request.headers.get('content-length') ?? '0') > limit) return { ok: false, response: tooLarge() };

  const body = request.body ? await readCapped(request.body, limit) : new Uint8Array();
  if (body === null) return { ok: false, response: tooLarge() };

  let form: FormData;
  try {
    form = await new Response(body, { headers: { 'content-type': contentType } }).formData();
  } catch {
    return {
      ok: false,
      response: invalid('invalid_upload', [{ path: '', message: 'The upload could not be read as multipart/form-data.' }]),
    };
  }

  const issues: FieldIssue[] = [];
  const files = form.getAll('file');
  const file = files.length === 1 && files[0] instanceof File ? files[0] : null;
  if (!file)
    issues.push({
      path: 'file',
      message: files.length > 1 ? 'Send one file per upload.' : 'Choose a file to upload (the form field "file").',
    });
  const kindValue = form.get('kind');
  const kind = kindSchema.safeParse(kindValue === null || kindValue === '' ? undefined : kindValue);
  if (!kind.success) issues.push({ path: 'kind', message: kind.error.issues[0]?.message ?? 'Choose a valid kind.' });
  if (!file || !kind.success) return { ok: false, response: invalid('invalid_upload', issues) };
  return { ok: true, file, kind: kind.data };
}
