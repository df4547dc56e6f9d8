import { readFileSync } from 'node:fs';
import { describe, expect, test } from 'vitest';
import { decideUploadType } from '../../../../src/lib/platform/uploads/file-policy';

const fixture = (name: string) => new Uint8Array(readFileSync(new URL(`../../../fixtures/uploads/${name}`, import.meta.url)));
const text = (s: string) => new TextEncoder().encode(s);
// The first bytes of a Windows program ("MZ" DOS header).
const EXE = new Uint8Array([0x4d, 0x5a, 0x90, 0x00, 0x03, 0x00, 0x00, 0x00, 0x04, 0x00, 0x00, 0x00, 0xff, 0xff, 0x00, 0x00]);
const ZIP = new Uint8Array([0x50, 0x4b, 0x03, 0x04, 0x14, 0x00, 0x00, 0x00, 0x08, 0x00, 0x00, 0x00, 0x00, 0x00, 0x00, 0x00]);

describe('upload type policy, from the bytes', () => {
  test('a PDF is accepted whatever its name says', async () => {
    const verdict = await decideUploadType(fixture('datasheet.pdf'), 'datasheet.txt', 'datasheet');
    expect(verdict).toEqual({ ok: true, type: { mimeType: 'application/pdf', extensions: ['pdf'], kind: 'datasheet', text: null } });
  });

  test('a PNG without a kind is taken as a photo', async () => {
    const verdict = await decideUploadType(fixture('photo.png'), 'board.png', undefined);
    expect(verdict.ok && verdict.type).toMatchObject({ mimeType: 'image/png', kind: 'photo' });
  });

  test('a Windows program renamed .pdf is refused and named for what it is', async () => {
    const verdict = await decideUploadType(EXE, 'datasheet.pdf', 'datasheet');
    expect(verdict.ok).toBe(false);
    expect(!verdict.ok && verdict.message).toMatch(
      /^The file's contents are EXE \(application\/x-msdownload\), which is not accepted\. Accepted: PDF, PNG/,
    );
  });

  test('a zip archive is refused', async () => {
    const verdict = await decideUploadType(ZIP, 'schematics.pdf', undefined);
    expect(!verdict.ok && verdict.message).toContain('ZIP');
  });

  test.each([
    ['SVG', '<svg xmlns="http://www.w3.org/2000/svg"><script>alert(1)</script></svg>', 'logo.txt'],
    ['HTML', '\uFEFF  <!doctype html><html><body>hi</body></html>', 'page.csv'],
  ])('%s is refused even when named as text', async (_type, body, name) => {
    const verdict = await decideUploadType(text(body), name, 'other');
    expect(!verdict.ok && verdict.message).toContain('looks like HTML, SVG or XML markup');
  });

  test('XML is refused (its declaration is recognised from the bytes)', async () => {
    const verdict = await decideUploadType(text('<?xml version="1.0"?><svg/>'), 'drawing.csv', undefined);
    expect(verdict.ok).toBe(false);
  });

  test('text is a load log when declared so, whatever its name', async () => {
    const verdict = await decideUploadType(text('0,0.1\n1,0.2\n'), 'capture', 'load-log');
    expect(verdict).toEqual({
      ok: true,
      type: { mimeType: 'text/csv', extensions: ['csv', 'txt'], kind: 'load-log', text: '0,0.1\n1,0.2\n' },
    });
  });

  test('a .csv without a kind is taken as a load log; a .txt as other plain text', async () => {
    const csv = await decideUploadType(text('0,0.1\n1,0.2\n'), 'log.csv', undefined);
    expect(csv.ok && csv.type.kind).toBe('load-log');
    const txt = await decideUploadType(text('Bench notes'), 'notes.txt', undefined);
    expect(txt.ok && txt.type).toMatchObject({ mimeType: 'text/plain', kind: 'other' });
  });

  test('text is refused when neither its kind nor its name says it is text', async () => {
    const verdict = await decideUploadType(text('echo hello'), 'run.sh', 'schematic');
    expect(!verdict.ok && verdict.message).toContain('Text files are accepted only as load logs or with a .csv or .txt name.');
  });

  test('bytes that are neither a known type nor UTF-8 text are refused', async () => {
    const verdict = await decideUploadType(new Uint8Array([0xc3, 0x28, 0x41, 0x42]), 'log.csv', 'load-log');
    expect(!verdict.ok && verdict.message).toContain('not UTF-8 text');
    const withNul = await decideUploadType(text('0,1\u0000\n'), 'log.csv', 'load-log');
    expect(withNul.ok).toBe(false);
  });

  test('a load log must be text', async () => {
    const verdict = await decideUploadType(fixture('datasheet.pdf'), 'log.csv', 'load-log');
    expect(!verdict.ok && verdict.message).toBe("A load log must be a CSV text file; this file's contents are PDF.");
  });
});
