/** Turning an uploader's file name into one that is safe to store, show and send back. */

const MAX_BASE_LENGTH = 120;
// Control characters and invisible formatting (bidi overrides can make "exe.pdf" read as "fdp.exe").
// eslint-disable-next-line no-control-regex -- matching control characters is the point
const INVISIBLE = /[\u0000-\u001f\u007f-\u009f\u00ad\u200b-\u200f\u202a-\u202e\u2060-\u2069\ufeff]/g;
const RESERVED = /[<>:"/\\|?*]/g;
const WINDOWS_DEVICE = /^(con|prn|aux|nul|com\d|lpt\d)$/i;
// A trailing ".xyz" counts as an extension when it is short and has a letter; "v1.2" keeps its ".2".
const EXTENSION = /\.((?=[0-9]*[a-z])[a-z0-9]{1,5})$/i;

const trimDotsAndSpaces = (s: string) => s.replace(/^[\s.]+|[\s.]+$/g, '');

/**
 * A readable name without any path, invisible or reserved characters, with a
 * base of at most 120 characters and an extension from `extensions` (the one
 * the uploader used when it fits the detected type, else the first).
 */
export function safeFileName(original: string, extensions: readonly [string, ...string[]]): string {
  const lastSegment =
    original
      .normalize('NFC')
      .replace(/^[a-zA-Z]:/, '')
      .split(/[/\\]/)
      .pop() ?? '';
  const cleaned = trimDotsAndSpaces(lastSegment.replace(INVISIBLE, '').replace(RESERVED, '_').replace(/\s+/g, ' '));
  const match = EXTENSION.exec(cleaned);
  const given = match?.[1]?.toLowerCase();
  const extension = given && extensions.includes(given) ? given : extensions[0];
  let base = trimDotsAndSpaces(match ? cleaned.slice(0, match.index) : cleaned);
  if (WINDOWS_DEVICE.test(base.split('.')[0] ?? '')) base = `_${base}`;
  base = trimDotsAndSpaces(Array.from(base).slice(0, MAX_BASE_LENGTH).join(''));
  return `${base || 'file'}.${extension}`;
}

/** `attachment` with an ASCII fallback and the exact UTF-8 name (RFC 6266 / RFC 8187). */
export function attachmentDisposition(name: string): string {
  const ascii = name.replace(/[^\x20-\x7e]/g, '_').replace(/["\\]/g, '_');
  const encoded = encodeURIComponent(name).replace(/['()*]/g, (c) => `%${c.charCodeAt(0).toString(16).toUpperCase()}`);
  return `attachment; filename="${ascii}"; filename*=UTF-8''${encoded}`;
}
