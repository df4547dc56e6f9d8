/**
 * What may be uploaded: decided from the file's bytes, never from its name or
 * the type the browser claims. Documents and pictures are recognised by their
 * magic numbers; text has none, so it is accepted only as a load log or a
 * .csv/.txt file, and only when it really is UTF-8 text.
 */
import { refuse } from '../outcome';
import { fileTypeFromBuffer } from 'file-type';
import type { FILE_KINDS } from '../db/schema';

export type FileKind = (typeof FILE_KINDS)[number];

export const MAX_UPLOAD_BYTES = 10 * 1024 * 1024;
export const MAX_UPLOAD_LABEL = '10 MB';

export const uploadTooLarge = () =>
  refuse('too-large', `The file is larger than ${MAX_UPLOAD_LABEL}, the most a file may be.`, { code: 'file_too_large' });

interface Accepted {
  label: string;
  /** The first is the one a stored name gets when the uploader's does not fit. */
  extensions: readonly [string, ...string[]];
  defaultKind: FileKind;
}

const BINARY: Record<string, Accepted> = {
  'application/pdf': { label: 'PDF', extensions: ['pdf'], defaultKind: 'other' },
  'image/png': { label: 'PNG', extensions: ['png'], defaultKind: 'photo' },
  'image/jpeg': { label: 'JPEG', extensions: ['jpg', 'jpeg'], defaultKind: 'photo' },
  'image/webp': { label: 'WebP', extensions: ['webp'], defaultKind: 'photo' },
  'image/gif': { label: 'GIF', extensions: ['gif'], defaultKind: 'photo' },
};

export const ACCEPTED_TYPES_MESSAGE = 'Accepted: PDF, PNG, JPEG, WebP and GIF files, and load logs as CSV or plain text.';

export interface UploadType {
  mimeType: string;
  extensions: readonly [string, ...string[]];
  kind: FileKind;
  /** The decoded text, for files accepted as text (a load log is reduced from it). */
  text: string | null;
}

export type TypeVerdict = { ok: true; type: UploadType } | { ok: false; message: string };

const extensionOf = (name: string) => /\.([^./\\]+)$/.exec(name)?.[1]?.toLowerCase() ?? '';

function asText(bytes: Uint8Array): string | null {
  if (bytes.includes(0)) return null;
  try {
    return new TextDecoder('utf-8', { fatal: true }).decode(bytes);
  } catch {
    return null;
  }
}

/**
 * The stored type and kind of an upload, or why it is refused. `declaredKind`
 * is what the uploader chose; without one the kind follows from the type (a
 * .csv is taken as a load log).
 */
export async function decideUploadType(bytes: Uint8Array, name: string, declaredKind: FileKind | undefined): Promise<TypeVerdict> {
  const detected = await fileTypeFromBuffer(bytes);
  if (detected) {
    const accepted = BINARY[detected.mime];
    if (!accepted)
      return {
        ok: false,
        message: `The file's contents are ${detected.ext.toUpperCase()} (${detected.mime}), which is not accepted. ${ACCEPTED_TYPES_MESSAGE}`,
      };
    if (declaredKind === 'load-log')
      return { ok: false, message: `A load log must be a CSV text file; this file's contents are ${accepted.label}.` };
    return {
      ok: true,
      type: { mimeType: detected.mime, extensions: accepted.extensions, kind: declaredKind ?? accepted.defaultKind, text: null },
    };
  }

  const text = asText(bytes);
  if (text === null)
    return { ok: false, message: `The file's type could not be recognised and it is not UTF-8 text. ${ACCEPTED_TYPES_MESSAGE}` };
  // Markup (HTML, SVG, XML) is text too, and SVG and HTML can carry script.
  if (
    text
      .replace(/^\uFEFF/, '')
      .trimStart()
      .startsWith('<')
  ) {
    return { ok: false, message: `The file looks like HTML, SVG or XML markup, which is not accepted. ${ACCEPTED_TYPES_MESSAGE}` };
  }
  const extension = extensionOf(name);
  const namedAsText = extension === 'csv' || extension === 'txt';
  if (declaredKind !== 'load-log' && !namedAsText) {
    return { ok: false, message: `Text files are accepted only as load logs or with a .csv or .txt name. ${ACCEPTED_TYPES_MESSAGE}` };
  }
  const kind = declaredKind ?? (extension === 'csv' ? 'load-log' : 'other');
  const csv = kind === 'load-log' || extension === 'csv';
  return {
    ok: true,
    type: {
      mimeType: csv ? 'text/csv' : 'text/plain',
      extensions: csv ? ['csv', 'txt'] : ['txt', 'csv'],
      kind,
      text,
    },
  };
}
