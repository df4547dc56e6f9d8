/**
 * Reads a multipart upload without ever holding more than the cap: the
 * declared Content-Length is checked before reading, and the bytes that really
 * arrive are counted while reading (a chunked body declares nothing).
 */
import { z } from 'zod';
import { FILE_KINDS } from '../db/schema';
import { readLimitedBytes } from '../http/body';
import { invalidInput, refuse, succeed, type FieldIssue, type Outcome } from '../outcome';
import { MAX_UPLOAD_BYTES, uploadTooLarge, type FileKind } from './file-policy';

// Room for the multipart boundaries, part headers and the small `kind` field.
const MULTIPART_OVERHEAD_BYTES = 64 * 1024;

export interface UploadForm {
  file: File;
  kind: FileKind | undefined;
}

const kindSchema = z.enum(FILE_KINDS, { error: `Choose a kind: ${FILE_KINDS.join(', ')}.` }).optional();

export async function readUploadForm(request: Request): Promise<Outcome<UploadForm>> {
  const contentType = request.headers.get('content-type') ?? '';
  if (!/^multipart\/form-data\s*;/i.test(contentType)) {
    return refuse('unsupported-type', 'Send the upload as multipart/form-data with the file in a field named "file".');
  }
  const body = await readLimitedBytes(request, MAX_UPLOAD_BYTES + MULTIPART_OVERHEAD_BYTES);
  if (!body.ok) return body.kind === 'too-large' ? uploadTooLarge() : body;

  let form: FormData;
  try {
    form = await new Response(body.value, { headers: { 'content-type': contentType } }).formData();
  } catch {
    return invalidInput('invalid_upload', [{ path: '', message: 'The upload could not be read as multipart/form-data.' }]);
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
  if (!file || !kind.success) return invalidInput('invalid_upload', issues);
  return succeed({ file, kind: kind.data });
}
