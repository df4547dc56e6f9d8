import { request as httpRequest } from 'node:http';
import { existsSync } from 'node:fs';
import path from 'node:path';
import { beforeAll, describe, expect, test } from 'vitest';
import { DEMO, Visitor } from '../../support/client';
import { baseUrl, briefIdTitled, EXE, fileRowsOf, fixture, MAX_BYTES, storedFiles, upload, uploadDir, uploadForm } from './upload-helpers';

const UUID = /^[0-9a-f]{8}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{12}$/;
let owner: Visitor;
let soil = '';
let gateway = '';

beforeAll(async () => {
  owner = await new Visitor(baseUrl).signIn(DEMO.client);
  soil = await briefIdTitled('Soil-moisture node');
  gateway = await briefIdTitled('Gateway logic rail');
});

describe('accepted uploads', () => {
  test('a PDF: 201 with its figures, a row, and its bytes under a random name in the upload folder', async () => {
    const pdf = fixture('datasheet.pdf');
    const response = await upload(owner, soil, { bytes: pdf, name: 'LDO datasheet.pdf', kind: 'datasheet', type: 'application/pdf' });
    expect(response.status).toBe(201);
    const body = await response.json();
    expect(body).toEqual({
      id: expect.any(String),
      name: 'LDO datasheet.pdf',
      kind: 'datasheet',
      mimeType: 'application/pdf',
      sizeBytes: pdf.length,
      loadSummary: null,
    });
    const row = (await fileRowsOf(soil)).find((r) => r.id === body.id);
    expect(row).toMatchObject({ originalName: 'LDO datasheet.pdf', mimeType: 'application/pdf', sizeBytes: pdf.length });
    expect(row!.storageKey).toMatch(UUID);
    expect(storedFiles()).toContain(row!.storageKey);
  });

  test('a CSV load log (ms, mA) is reduced; the figures are in the answer and the row', async () => {
    // Fixture: 0, 1000, 2000, 4000 ms at 100, 300, 100, 100 mA → trapezoids 0.2 + 0.2 + 0.2 A·s
    // over 4 s = 0.15 A mean; i² trapezoids 0.05 + 0.05 + 0.02 = 0.12 A²·s → RMS √0.03; peak 0.3 A.
    const response = await upload(owner, gateway, { bytes: fixture('load-log.csv'), name: 'bench-capture.csv', type: 'text/csv' });
    expect(response.status).toBe(201);
    const body = await response.json();
    expect(body).toMatchObject({ name: 'bench-capture.csv', kind: 'load-log', mimeType: 'text/csv' });
    const s = body.loadSummary;
    expect(s.samples).toBe(4);
    expect(s.durationS).toBeCloseTo(4, 9);
    expect(s.iMinA).toBeCloseTo(0.1, 9);
    expect(s.iTypA).toBeCloseTo(0.15, 9);
    expect(s.iRmsA).toBeCloseTo(Math.sqrt(0.03), 9);
    expect(s.iMaxA).toBeCloseTo(0.3, 9);
    expect(s.points).toHaveLength(4);
    const row = (await fileRowsOf(gateway)).find((r) => r.id === body.id);
    expect(row?.loadSummary).toEqual(s);
  });

  test('a path in the name is stored as a plain safe name and nothing is written outside the upload folder', async () => {
    const response = await upload(owner, soil, { bytes: fixture('datasheet.pdf'), name: '../../etc/passwd.pdf' });
    expect(response.status).toBe(201);
    const body = await response.json();
    expect(body.name).toBe('passwd.pdf');
    expect((await fileRowsOf(soil)).find((r) => r.id === body.id)?.originalName).toBe('passwd.pdf');
    expect(existsSync(path.resolve(uploadDir, '../../etc/passwd.pdf'))).toBe(false);
    expect(existsSync(path.resolve(uploadDir, '../etc/passwd.pdf'))).toBe(false);
    expect(storedFiles().every((name) => UUID.test(name))).toBe(true);
  });

  test('a Windows path and control characters in the name are dropped too', async () => {
    const response = await upload(owner, soil, { bytes: fixture('photo.png'), name: 'C:\\Users\\ana\\board\u0007 top.png' });
    expect(response.status).toBe(201);
    expect(await response.json()).toMatchObject({ name: 'board top.png', kind: 'photo', mimeType: 'image/png' });
  });

  test('an engineer may upload to any client’s brief', async () => {
    const engineer = await new Visitor(baseUrl).signIn(DEMO.engineer);
    const response = await upload(engineer, soil, { bytes: fixture('datasheet.pdf'), name: 'review-markup.pdf', kind: 'schematic' });
    expect(response.status).toBe(201);
    const row = (await fileRowsOf(soil)).find((r) => r.originalName === 'review-markup.pdf');
    expect(row?.kind).toBe('schematic');
  });

  test('eight uploads to one brief at once all succeed and all are recorded', async () => {
    const before = (await fileRowsOf(gateway)).length;
    const responses = await Promise.all(
      Array.from({ length: 8 }, (_, k) =>
        upload(owner, gateway, { bytes: fixture('datasheet.pdf'), name: `sheet-${k}.pdf`, kind: 'schematic' }),
      ),
    );
    expect(responses.map((r) => r.status)).toEqual(Array(8).fill(201));
    const ids = new Set(await Promise.all(responses.map(async (r) => (await r.json()).id)));
    expect(ids.size).toBe(8);
    const rows = await fileRowsOf(gateway);
    expect(rows).toHaveLength(before + 8);
    for (const row of rows.filter((r) => ids.has(r.id))) expect(storedFiles()).toContain(row.storageKey);
  });
});

describe('refused uploads', () => {
  /** Each refusal must leave the upload folder and the brief's rows as they were. */
  async function expectRefusal(send: () => Promise<Response>, status: number) {
    const [files, rows] = [storedFiles().length, (await fileRowsOf(soil)).length];
    const response = await send();
    expect(response.status).toBe(status);
    expect(response.headers.get('content-type')).toContain('application/json');
    const body = await response.json();
    expect(storedFiles()).toHaveLength(files);
    expect(await fileRowsOf(soil)).toHaveLength(rows);
    return body;
  }

  test('a Windows program named .pdf and declared as a PDF: 415 naming what is accepted', async () => {
    const body = await expectRefusal(
      () => upload(owner, soil, { bytes: EXE, name: 'datasheet.pdf', kind: 'datasheet', type: 'application/pdf' }),
      415,
    );
    expect(body.error).toBe('file_type_not_accepted');
    expect(body.message).toContain('EXE');
    expect(body.message).toContain('Accepted: PDF, PNG, JPEG, WebP and GIF files');
  });

  test.each([
    [
      'a zip archive named .pdf',
      new Uint8Array([0x50, 0x4b, 0x03, 0x04, 0x14, 0, 0, 0, 8, 0, 0, 0, 0, 0, 0, 0, 0, 0, 0, 0]),
      'schematics.pdf',
      'datasheet',
      'ZIP',
    ],
    [
      'an HTML page named .csv as a load log',
      new TextEncoder().encode('<!doctype html><script>alert(1)</script>'),
      'log.csv',
      'load-log',
      'markup',
    ],
    ['a PDF declared as a load log', fixture('datasheet.pdf'), 'log.csv', 'load-log', 'A load log must be a CSV text file'],
  ])('%s: 415', async (_case, bytes, name, kind, said) => {
    const body = await expectRefusal(() => upload(owner, soil, { bytes, name, kind }), 415);
    expect(body.message).toContain(said);
  });

  test('an SVG named .png: 415', async () => {
    const svg = new TextEncoder().encode('<svg xmlns="http://www.w3.org/2000/svg" onload="alert(1)"/>');
    const body = await expectRefusal(() => upload(owner, soil, { bytes: svg, name: 'logo.png', kind: 'photo', type: 'image/png' }), 415);
    expect(body.message).toContain('markup');
  });

  test('a file over 10 MB: 413 and nothing kept', async () => {
    const big = new Uint8Array(MAX_BYTES + 1);
    big.set(fixture('datasheet.pdf'));
    const body = await expectRefusal(() => upload(owner, soil, { bytes: big, name: 'huge.pdf' }), 413);
    expect(body).toEqual({ error: 'file_too_large', message: 'The file is larger than 10 MB, the most a file may be.' });
  });

  test('a body far over the cap sent without a length is cut off while it arrives: 413', async () => {
    const form = new Response(uploadForm({ bytes: new Uint8Array(MAX_BYTES * 2), name: 'stream.pdf' }));
    const type = form.headers.get('content-type')!;
    const body = await expectRefusal(
      () =>
        owner.request(`/api/v1/briefs/${soil}/files`, {
          method: 'POST',
          headers: { 'content-type': type },
          body: form.body,
          duplex: 'half',
        } as RequestInit),
      413,
    );
    expect(body.error).toBe('file_too_large');
  });

  test('a declared Content-Length over the cap is refused before the body is sent', async () => {
    const response = await new Promise<{ status: number; body: string }>((resolve, reject) => {
      const url = new URL(`/api/v1/briefs/${soil}/files`, baseUrl);
      const req = httpRequest(url, {
        method: 'POST',
        headers: {
          cookie: owner.cookieHeader,
          origin: baseUrl,
          'content-type': 'multipart/form-data; boundary=x',
          'content-length': String(50 * 1024 * 1024),
        },
      });
      req.on('response', (res) => {
        let text = '';
        res.on('data', (chunk: Buffer) => (text += chunk.toString()));
        res.on('end', () => {
          resolve({ status: res.statusCode ?? 0, body: text });
          req.destroy();
        });
      });
      req.on('error', reject);
      // Only the headers and a few bytes go out; the answer must come without the rest.
      req.write('--x\r\n');
    });
    expect(response.status).toBe(413);
    expect(JSON.parse(response.body).error).toBe('file_too_large');
  });

  test('an empty file: 400 on the file field', async () => {
    const body = await expectRefusal(() => upload(owner, soil, { bytes: new Uint8Array(), name: 'empty.pdf' }), 400);
    expect(body).toMatchObject({ error: 'invalid_upload', issues: [{ path: 'file', message: 'The file is empty.' }] });
  });

  test('no file and an unknown kind: 400 naming both fields', async () => {
    const form = new FormData();
    form.set('kind', 'invoice');
    const body = await expectRefusal(() => owner.request(`/api/v1/briefs/${soil}/files`, { method: 'POST', body: form }), 400);
    expect(body.error).toBe('invalid_upload');
    expect(body.issues).toEqual([
      { path: 'file', message: 'Choose a file to upload (the form field "file").' },
      { path: 'kind', message: 'Choose a kind: schematic, datasheet, photo, load-log, other.' },
    ]);
  });

  test('two files in one upload: 400', async () => {
    const form = uploadForm({ bytes: fixture('datasheet.pdf'), name: 'a.pdf' });
    form.append('file', new Blob([fixture('photo.png') as Uint8Array<ArrayBuffer>]), 'b.png');
    const body = await expectRefusal(() => owner.request(`/api/v1/briefs/${soil}/files`, { method: 'POST', body: form }), 400);
    expect(body.issues).toEqual([{ path: 'file', message: 'Send one file per upload.' }]);
  });

  test('a multipart body that does not parse: 400', async () => {
    const body = await expectRefusal(
      () =>
        owner.request(`/api/v1/briefs/${soil}/files`, {
          method: 'POST',
          headers: { 'content-type': 'multipart/form-data; boundary=abc' },
          body: 'not multipart at all',
        }),
      400,
    );
    expect(body).toMatchObject({
      error: 'invalid_upload',
      issues: [{ path: '', message: 'The upload could not be read as multipart/form-data.' }],
    });
  });

  test('a load log that cannot be reduced: 400 with the reducer’s message', async () => {
    const bad = new TextEncoder().encode('time (s),current (A)\n0,0.1\n2,0.2\n1,0.1\n');
    const body = await expectRefusal(() => upload(owner, soil, { bytes: bad, name: 'log.csv', kind: 'load-log' }), 400);
    expect(body.error).toBe('invalid_load_log');
    expect(body.issues).toHaveLength(1);
    expect(body.issues[0].path).toBe('file');
    expect(body.issues[0].message).toContain("Row 4: the time 1 is earlier than the previous row's");
  });

  test('a body that is not multipart: 415', async () => {
    const body = await expectRefusal(() => owner.request(`/api/v1/briefs/${soil}/files`, { method: 'POST', json: { file: 'x' } }), 415);
    expect(body.message).toContain('multipart/form-data');
  });

  test('another client’s brief: 404, as if it did not exist', async () => {
    const other = await new Visitor(baseUrl).signIn(DEMO.otherClient);
    const body = await expectRefusal(() => upload(other, soil, { bytes: fixture('datasheet.pdf'), name: 'a.pdf' }), 404);
    expect(body.error).toBe('not_found');
    const missing = await upload(other, 'no-such-brief', { bytes: fixture('datasheet.pdf'), name: 'a.pdf' });
    expect(missing.status).toBe(404);
  });

  test('anonymous: 401', async () => {
    const body = await expectRefusal(() => upload(new Visitor(baseUrl), soil, { bytes: fixture('datasheet.pdf'), name: 'a.pdf' }), 401);
    expect(body.error).toBe('not_signed_in');
  });

  test('a closed brief takes no files: 409', async () => {
    const client = new Visitor(baseUrl);
    const signedUp = await client.form('/sign-up', {
      name: 'Ola Closed',
      company: 'Closed Co',
      email: `closed-${Date.now()}@example.test`,
      password: 'long-enough-password',
    });
    expect(signedUp.status).toBe(303);
    const created = await client.request('/api/v1/briefs', { method: 'POST', json: { title: 'Changed our minds', submit: false } });
    expect(created.status).toBe(201);
    const { id } = await created.json();
    expect((await client.request(`/api/v1/briefs/${id}`, { method: 'PATCH', json: { state: 'cancelled' } })).status).toBe(200);

    const files = storedFiles().length;
    const response = await upload(client, id, { bytes: fixture('datasheet.pdf'), name: 'late.pdf' });
    expect(response.status).toBe(409);
    expect(await response.json()).toEqual({
      error: 'wrong_state',
      message: 'This brief is cancelled; files can no longer be added to it.',
    });
    expect(storedFiles()).toHaveLength(files);
    expect(await fileRowsOf(id)).toHaveLength(0);
  });
});
