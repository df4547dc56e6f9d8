/**
 * Failures a person can act on: every 500 carries a reference that is also in
 * the structured log, and nothing of the internals reaches the browser.
 */
import { rmSync, readdirSync } from 'node:fs';
import path from 'node:path';
import { afterAll, beforeAll, describe, expect, test } from 'vitest';
import { startAppServer, type AppServer } from '../../support/app-server';
import { DEMO, Visitor } from '../../support/client';
import { execSql } from '../quotes/helpers';

let server: AppServer;
beforeAll(async () => {
  server = await startAppServer();
});
afterAll(async () => {
  await server?.stop();
});

function logLineNow(errorId: string): Record<string, unknown> | undefined {
  return server
    .output()
    .split('\n')
    .filter((line) => line.startsWith('{'))
    .map((line) => JSON.parse(line) as Record<string, unknown>)
    .find((entry) => entry.errorId === errorId);
}

/** The server's output reaches this process a moment after its answer does. */
async function logLineWith(errorId: string): Promise<Record<string, unknown> | undefined> {
  for (let i = 0; i < 40; i++) {
    const entry = logLineNow(errorId);
    if (entry) return entry;
    await new Promise((resolve) => setTimeout(resolve, 50));
  }
  return undefined;
}

describe('server errors', () => {
  test('a broken record gives the API a JSON 500 with a reference, and the page our 500 page with the same kind of reference', async () => {
    const client = await new Visitor(server.baseUrl).signIn(DEMO.client);
    const created = await (await client.request('/api/v1/briefs', { method: 'POST', json: { title: 'Broken on purpose' } })).json();
    // A row the application could never write: its JSON column holds no JSON.
    await execSql(server.databaseUrl, 'UPDATE brief SET spec = ? WHERE id = ?', ['{not json', created.id]);

    const api = await client.request(`/api/v1/briefs/${created.id}`);
    expect(api.status).toBe(500);
    const body = await api.json();
    expect(body.error).toBe('internal_error');
    expect(body.errorId).toMatch(/^[0-9a-f]{8}$/);
    expect(body.message).toContain(body.errorId);
    expect(JSON.stringify(body)).not.toMatch(/SyntaxError|at .+\.m?js/);
    const logged = await logLineWith(body.errorId);
    expect(logged?.level).toBe(50);
    expect(logged?.path).toBe(`/api/v1/briefs/${created.id}`);
    expect(JSON.stringify(logged?.err)).toContain('JSON');

    const page = await client.request(`/briefs/${created.id}`);
    expect(page.status).toBe(500);
    const html = await page.text();
    expect(html).toContain('Something went wrong on our side');
    const reference = /Reference: <span[^>]*>([0-9a-f]{8})</.exec(html)?.[1];
    expect(reference).toBeDefined();
    expect(await logLineWith(reference ?? '')).toBeDefined();
    expect(html).not.toMatch(/SyntaxError|node_modules|at .+\.m?js:\d+/);
  });

  test('a file whose bytes are gone answers 500 with a reference in the log', async () => {
    const client = await new Visitor(server.baseUrl).signIn(DEMO.client);
    const created = await (await client.request('/api/v1/briefs', { method: 'POST', json: { title: 'Lost file' } })).json();
    const form = new FormData();
    form.append('file', new Blob(['time,current\n0,0.1\n1,0.2\n'], { type: 'text/csv' }), 'log.csv');
    const uploaded = await (await client.request(`/api/v1/briefs/${created.id}/files`, { method: 'POST', body: form })).json();
    const folder = path.join(server.dataDir, 'uploads');
    for (const name of readdirSync(folder, { recursive: true }) as string[])
      rmSync(path.join(folder, name), { recursive: true, force: true });
    const response = await client.request(`/api/v1/files/${uploaded.id}`);
    expect(response.status).toBe(500);
    const body = await response.json();
    expect(body.error).toBe('file_missing');
    expect(await logLineWith(body.errorId)).toMatchObject({ fileId: uploaded.id });
  });
});
