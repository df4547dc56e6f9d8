/** The one mutation path: guard, limited body, schema, domain outcome → answer. */
import type { APIContext } from 'astro';
import { describe, expect, test } from 'vitest';
import { z } from 'zod';
import { isJsonType, jsonDepth, readJsonBody, readLimitedBytes } from '../../../../src/lib/platform/http/body';
import { apiMutation } from '../../../../src/lib/platform/http/mutation';
import { json, refusalResponse } from '../../../../src/lib/platform/http/responses';
import { refuse, succeed, type RefusalKind } from '../../../../src/lib/platform/outcome';

const engineer = { id: 'u1', name: 'Eng', email: 'e@x.test', role: 'engineer' as const };

function streamOf(chunks: number, size: number, counter: { pulled: number }) {
  return new ReadableStream<Uint8Array>({
    pull(controller) {
      if (counter.pulled >= chunks) return controller.close();
      counter.pulled += 1;
      controller.enqueue(new Uint8Array(size).fill(0x41));
    },
  });
}

function context(user: typeof engineer | null, request: Request): APIContext {
  return { locals: { user, session: null }, request, params: {} } as unknown as APIContext;
}

describe('reading a body', () => {
  test('a chunked body past the limit is refused after the limit, not after the end', async () => {
    const counter = { pulled: 0 };
    const request = new Request('http://x/', { method: 'POST', body: streamOf(1_000, 1024, counter), duplex: 'half' } as RequestInit);
    const read = await readLimitedBytes(request, 8 * 1024);
    expect(read).toMatchObject({ ok: false, kind: 'too-large' });
    expect(counter.pulled).toBeLessThan(20);
  });

  test('a declared length over the limit is refused before reading', async () => {
    const request = new Request('http://x/', { method: 'POST', body: 'x'.repeat(10), headers: { 'content-length': '999999' } });
    expect(await readLimitedBytes(request, 100)).toMatchObject({ ok: false, kind: 'too-large' });
  });

  test('JSON bodies: wrong type 415, malformed 400, good parsed', async () => {
    const post = (body: string, type = 'application/json') =>
      new Request('http://x/', { method: 'POST', body, headers: { 'content-type': type } });
    expect(await readJsonBody(post('{}', 'text/plain'))).toMatchObject({ kind: 'unsupported-type' });
    expect(await readJsonBody(post('{'))).toMatchObject({ kind: 'invalid', code: 'malformed_json' });
    expect(await readJsonBody(post('{"a":1}'))).toEqual({ ok: true, value: { a: 1 } });
  });
});

describe('refusals become answers', () => {
  test.each([
    ['invalid', 400],
    ['unauthenticated', 401],
    ['forbidden', 403],
    ['not-found', 404],
    ['wrong-state', 409],
    ['too-large', 413],
    ['unsupported-type', 415],
    ['rate-limited', 429],
    ['upstream-failed', 502],
    ['unavailable', 503],
  ] as [RefusalKind, number][])('%s → %i with the message a person can act on', async (kind, status) => {
    const response = refusalResponse(refuse(kind, 'Say why.'));
    expect(response.status).toBe(status);
    expect(await response.json()).toMatchObject({ message: 'Say why.' });
  });

  test('a rate-limit refusal says when to try again', () => {
    expect(refusalResponse(refuse('rate-limited', 'Wait.', { retryAfterSeconds: 30 })).headers.get('retry-after')).toBe('30');
  });
});

describe('an API mutation', () => {
  const calls: unknown[] = [];
  const route = apiMutation({
    access: ['engineer'],
    body: z.object({ n: z.number() }),
    run: async ({ body }) => {
      calls.push(body);
      return body.n > 0 ? succeed(body.n * 2) : refuse('wrong-state', 'Only positive numbers.');
    },
    answer: (value) => json({ value }, 201),
  });
  const post = (body: string) => new Request('http://x/', { method: 'POST', body, headers: { 'content-type': 'application/json' } });

  test('an anonymous caller is refused before the body is read', async () => {
    const request = post('{"n":1}');
    const response = await route(context(null, request));
    expect(response.status).toBe(401);
    expect(request.bodyUsed).toBe(false);
  });

  test('a body that fails the schema never reaches the domain', async () => {
    const before = calls.length;
    const response = await route(context(engineer, post('{"n":"two"}')));
    expect(response.status).toBe(400);
    expect((await response.json()).issues[0].path).toBe('n');
    expect(calls).toHaveLength(before);
  });

  test('the domain outcome is the answer: value or refusal', async () => {
    expect(await (await route(context(engineer, post('{"n":2}')))).json()).toEqual({ value: 4 });
    const refused = await route(context(engineer, post('{"n":-1}')));
    expect(refused.status).toBe(409);
    expect(await refused.json()).toEqual({ error: 'wrong_state', message: 'Only positive numbers.' });
  });
});

describe('JSON depth and type', () => {
  test('depth counts brackets outside strings and stops past the limit', () => {
    expect(jsonDepth('{"a":[1,{"b":2}]}')).toBe(3);
    expect(jsonDepth('{"a":"[[[[[[\\"{{{{"}')).toBe(1);
    expect(jsonDepth('['.repeat(100_000), 32)).toBe(33);
  });

  test.each([
    ['application/json', true],
    ['application/json; charset=utf-8', true],
    ['Application/JSON;charset="UTF-8"', true],
    ['application/jsonp', false],
    ['text/plain; application/json', false],
    ['application/json; charset=latin1', false],
    [null, false],
  ])('%s is JSON: %s', (type, expected) => {
    expect(isJsonType(type)).toBe(expected);
  });
});
