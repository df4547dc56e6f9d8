/**
 * Generated hostile bodies against the JSON routes: wrong types, missing and
 * extra fields, huge numbers, NaN-like strings, deep nesting, long strings.
 * Every answer must be a clear 4xx (or a 2xx for a body that happens to be
 * valid) — never a 5xx, never a stack trace.
 */
import fc from 'fast-check';
import { afterAll, beforeAll, describe, expect, test } from 'vitest';
import { startAppServer, type AppServer } from '../../support/app-server';
import { DEMO, Visitor } from '../../support/client';

let server: AppServer;
let client: Visitor;
let engineer: Visitor;
let ownDraftId = '';
let reviewBriefId = '';

beforeAll(async () => {
  // Its own server with the limits off: thousands of requests from one address are the point here.
  server = await startAppServer({ RATE_LIMIT_DISABLED: '1' });
  client = await new Visitor(server.baseUrl).signIn(DEMO.client);
  engineer = await new Visitor(server.baseUrl).signIn(DEMO.engineer);
  const drafts = await (await client.request('/api/v1/briefs?state=draft')).json();
  ownDraftId = drafts.items[0].id;
  const inReview = await (await engineer.request('/api/v1/briefs?state=in-review')).json();
  reviewBriefId = inReview.items[0].id;
});
afterAll(async () => {
  await server?.stop();
});

const nastyScalar = fc.oneof(
  fc.constantFrom(
    'NaN',
    'Infinity',
    '-Infinity',
    '1e309',
    '0x10',
    '',
    ' ',
    'null',
    'undefined',
    '__proto__',
    '<script>alert(1)</script>',
    "'; DROP TABLE brief; --",
  ),
  fc.string({ maxLength: 40 }),
  fc.string({ minLength: 5_000, maxLength: 20_000 }),
  fc.double(),
  fc.constantFrom(1e308, -1e308, Number.MAX_SAFE_INTEGER, -0, 5e-324),
  fc.integer(),
  fc.boolean(),
  fc.constant(null),
);
const nastyValue = fc.letrec((tie) => ({
  value: fc.oneof(
    { depthSize: 'small', withCrossShrink: true },
    nastyScalar,
    fc.array(tie('value'), { maxLength: 4 }),
    fc.dictionary(fc.string({ maxLength: 12 }), tie('value'), { maxKeys: 5 }),
  ),
})).value;

/** Briefs that look almost right: the real field names with hostile values in some of them. */
const nearBrief = fc.record(
  {
    input: fc.record(
      {
        vMin: nastyValue,
        vNom: fc.oneof(fc.double({ min: 0, max: 2000 }), nastyValue),
        vMax: fc.double({ min: -10, max: 2e6 }),
        rippleVpp: nastyValue,
        source: fc.constantFrom('battery', 'bus', 'mains', 7),
      },
      { requiredKeys: [] },
    ),
    output: fc.record(
      {
        v: fc.oneof(fc.double({ min: -1, max: 1e5 }), nastyValue),
        tolerance: fc.double({ min: -1, max: 2 }),
        iMin: nastyValue,
        iTyp: fc.double({ min: 0, max: 10 }),
        iMax: fc.double({ min: 0, max: 1e4 }),
      },
      { requiredKeys: [] },
    ),
    noise: fc.record({ class: fc.constantFrom('digital', 'rf', 'loud'), maxRippleVpp: nastyValue }, { requiredKeys: [] }),
    thermal: fc.record(
      { ambientMaxC: fc.oneof(fc.double({ min: -300, max: 300 }), nastyValue), airflow: fc.constantFrom('enclosed', 'wind') },
      { requiredKeys: [] },
    ),
    weights: nastyValue,
    overrides: nastyValue,
  },
  { requiredKeys: [] },
);

const deep = fc.integer({ min: 200, max: 5_000 }).map((depth) => '['.repeat(depth) + ']'.repeat(depth));

async function answer(visitor: Visitor | null, method: string, path: string, body: unknown, raw = false) {
  const v = visitor ?? new Visitor(server.baseUrl);
  const response = await v.request(
    path,
    raw ? { method, headers: { 'content-type': 'application/json' }, body: body as string } : { method, json: body },
  );
  const text = await response.text();
  return { status: response.status, text };
}

function expectClear(result: { status: number; text: string }) {
  expect(result.status, result.text.slice(0, 300)).toBeLessThan(500);
  expect(result.text).not.toMatch(/\bat .+\.(m?js|ts):\d+/);
  if (result.status >= 400) expect(() => JSON.parse(result.text)).not.toThrow();
}

const ROUTES: { name: string; runs: number; send: (body: unknown) => Promise<{ status: number; text: string }> }[] = [
  { name: 'POST /api/v1/evaluate', runs: 3_000, send: (b) => answer(null, 'POST', '/api/v1/evaluate', b) },
  {
    name: 'POST /api/v1/briefs',
    runs: 2_000,
    send: (b) => answer(client, 'POST', '/api/v1/briefs', { title: 'fuzz', submit: true, spec: b }),
  },
  { name: 'POST /api/v1/briefs (whole body)', runs: 1_000, send: (b) => answer(client, 'POST', '/api/v1/briefs', b) },
  { name: 'PATCH /api/v1/briefs/:id', runs: 1_500, send: (b) => answer(client, 'PATCH', `/api/v1/briefs/${ownDraftId}`, { spec: b }) },
  {
    name: 'POST /api/v1/briefs/:id/revisions',
    runs: 1_500,
    send: (b) => answer(engineer, 'POST', `/api/v1/briefs/${reviewBriefId}/revisions`, { overrides: b }),
  },
  { name: 'POST /api/v1/account', runs: 1_000, send: (b) => answer(null, 'POST', '/api/v1/account', b) },
];

describe('hostile JSON bodies never reach a 5xx', () => {
  test.each(ROUTES)(
    '$name: $runs generated bodies',
    async ({ runs, send }) => {
      await fc.assert(
        fc.asyncProperty(fc.oneof(nearBrief, nastyValue), async (body) => {
          expectClear(await send(body));
        }),
        { numRuns: runs, seed: 20261202 },
      );
    },
    240_000,
  );

  test('malformed JSON, deep nesting and oversized bodies are refused early with a 4xx', async () => {
    for (const text of ['{', '{"a":', 'nul', '{"input":{"vMin":1,}}', '\u0000', '[1,2', '{"a":"\\u12"}']) {
      const result = await answer(null, 'POST', '/api/v1/evaluate', text, true);
      expect(result.status).toBe(400);
      expectClear(result);
    }
    await fc.assert(
      fc.asyncProperty(deep, async (text) => {
        const result = await answer(null, 'POST', '/api/v1/evaluate', text, true);
        expect([400, 413]).toContain(result.status);
      }),
      { numRuns: 20, seed: 7 },
    );
    const huge = await answer(null, 'POST', '/api/v1/evaluate', JSON.stringify({ pad: 'x'.repeat(200_000) }), true);
    expect(huge.status).toBe(413);
  }, 120_000);

  test('a brief whose spec nests 10 000 deep is refused with a 400 naming the depth, not a 500', async () => {
    const spec = '{"input":' + '['.repeat(10_000) + ']'.repeat(10_000) + '}';
    const result = await answer(client, 'POST', '/api/v1/briefs', `{"title":"deep","spec":${spec}}`, true);
    expect(result.status).toBe(400);
    expect(JSON.parse(result.text)).toMatchObject({ error: 'too_deep' });
    const strings = await answer(client, 'POST', '/api/v1/briefs', JSON.stringify({ title: '[[[[{{{{'.repeat(10), spec: {} }), true);
    expect(strings.status).toBe(201);
  });

  test('only application/json bodies are read as JSON', async () => {
    for (const type of ['text/plain', 'application/jsonp', 'text/html; application/json']) {
      const response = await new Visitor(server.baseUrl).request('/api/v1/evaluate', {
        method: 'POST',
        headers: { 'content-type': type },
        body: '{}',
      });
      expect(response.status, type).toBe(415);
    }
  });
});
