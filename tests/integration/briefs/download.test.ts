import { rmSync } from 'node:fs';
import path from 'node:path';
import { beforeAll, describe, expect, test } from 'vitest';
import { DEMO, Visitor } from '../../support/client';
import { baseUrl, briefIdTitled, fileRowsOf, fixture, upload, uploadDir } from './upload-helpers';

let owner: Visitor;
let soil = '';
let pdfId = '';
let logId = '';
const pdf = fixture('datasheet.pdf');
const log = fixture('load-log.csv');

beforeAll(async () => {
  owner = await new Visitor(baseUrl).signIn(DEMO.client);
  soil = await briefIdTitled('Soil-moisture node');
  const sent = await upload(owner, soil, { bytes: pdf, name: 'Lüfter "main" datasheet.pdf', kind: 'datasheet' });
  pdfId = (await sent.json()).id;
  const logged = await upload(owner, soil, { bytes: log, name: 'capture.csv', kind: 'load-log' });
  logId = (await logged.json()).id;
});

const bytesOf = async (response: Response) => new Uint8Array(await response.arrayBuffer());

describe('downloads', () => {
  test('the owner gets the same bytes as an attachment that is never sniffed or cached', async () => {
    const response = await owner.request(`/api/v1/files/${pdfId}`);
    expect(response.status).toBe(200);
    expect(await bytesOf(response)).toEqual(pdf);
    expect(response.headers.get('content-type')).toBe('application/pdf');
    expect(response.headers.get('content-disposition')).toBe(
      `attachment; filename="L_fter _main_ datasheet.pdf"; filename*=UTF-8''L%C3%BCfter%20_main_%20datasheet.pdf`,
    );
    expect(response.headers.get('x-content-type-options')).toBe('nosniff');
    expect(response.headers.get('cache-control')).toBe('private, no-store');
    expect(response.headers.get('content-security-policy')).toBe("default-src 'none'; sandbox");
  });

  test('a load log comes back byte for byte, and its brief lists it with the same figures', async () => {
    const response = await owner.request(`/api/v1/files/${logId}`);
    expect(response.status).toBe(200);
    expect(response.headers.get('content-type')).toBe('text/csv');
    expect(await bytesOf(response)).toEqual(log);
    const row = (await fileRowsOf(soil)).find((r) => r.id === logId);
    expect(row?.loadSummary).toMatchObject({ samples: 4, iMaxA: expect.closeTo(0.3, 9), iTypA: expect.closeTo(0.15, 9) });
  });

  test.each([
    ['engineer', DEMO.engineer],
    ['admin', DEMO.admin],
  ])('the %s may download any client’s file', async (_role, email) => {
    const staff = await new Visitor(baseUrl).signIn(email);
    const response = await staff.request(`/api/v1/files/${pdfId}`);
    expect(response.status).toBe(200);
    expect(await bytesOf(response)).toEqual(pdf);
  });

  test('another client gets 404, the same as for a file that does not exist', async () => {
    const other = await new Visitor(baseUrl).signIn(DEMO.otherClient);
    const theirs = await other.request(`/api/v1/files/${pdfId}`);
    expect(theirs.status).toBe(404);
    expect(await theirs.json()).toEqual({ error: 'not_found', message: 'Nothing here, or it is not yours.' });
    const missing = await other.request('/api/v1/files/no-such-file');
    expect(missing.status).toBe(404);
  });

  test('anonymous: 401', async () => {
    const response = await new Visitor(baseUrl).request(`/api/v1/files/${pdfId}`);
    expect(response.status).toBe(401);
    expect((await response.json()).error).toBe('not_signed_in');
  });

  test('a row whose bytes are gone answers a JSON error, not a stack trace', async () => {
    const sent = await upload(owner, soil, { bytes: pdf, name: 'lost.pdf' });
    const { id } = await sent.json();
    const row = (await fileRowsOf(soil)).find((r) => r.id === id)!;
    rmSync(path.join(uploadDir, row.storageKey));
    const response = await owner.request(`/api/v1/files/${id}`);
    expect(response.status).toBe(500);
    const body = await response.json();
    expect(body).toEqual({
      error: 'file_missing',
      errorId: expect.stringMatching(/^[0-9a-f]{8}$/),
      message: expect.stringContaining('missing from storage'),
    });
    expect(body.message).toContain(body.errorId);
  });
});
