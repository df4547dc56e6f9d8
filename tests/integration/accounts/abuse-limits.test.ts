/**
 * The limits on guessing, account creation and reset requests, against servers
 * of their own (the limits are used up on purpose here): one that trusts no
 * proxy, as the product ships, and one configured behind a single proxy, where
 * each test speaks from its own address by what that proxy appends.
 */
import { afterAll, beforeAll, describe, expect, test } from 'vitest';
import { startAppServer, type AppServer } from '../../support/app-server';
import { DEMO, Visitor } from '../../support/client';

let direct: AppServer;
let proxied: AppServer;

beforeAll(async () => {
  [direct, proxied] = await Promise.all([startAppServer(), startAppServer({ TRUSTED_PROXY_HOPS: '1' })]);
}, 60_000);
afterAll(async () => {
  await Promise.all([direct?.stop(), proxied?.stop()]);
});

let serial = 0;
const unique = (label: string) => `${label}-${Date.now().toString(36)}-${(serial++).toString(36)}@limits.test`;
/** A documentation address (RFC 5737) of its own for each test on the proxied server. */
let nextHost = 1;
const newAddress = () => `203.0.113.${nextHost++}`;

function post(server: AppServer, path: string, json: unknown, forwardedFor?: string): Promise<Response> {
  return new Visitor(server.baseUrl).request(path, {
    method: 'POST',
    json,
    headers: forwardedFor ? { 'x-forwarded-for': forwardedFor } : {},
  });
}

function postForm(server: AppServer, path: string, fields: Record<string, string>, forwardedFor: string): Promise<Response> {
  return new Visitor(server.baseUrl).request(path, {
    method: 'POST',
    headers: { 'content-type': 'application/x-www-form-urlencoded', 'x-forwarded-for': forwardedFor },
    body: new URLSearchParams(fields).toString(),
  });
}

const wrongGuess = (server: AppServer, email: string, forwardedFor?: string) =>
  post(server, '/api/auth/sign-in/email', { email, password: 'not-the-password' }, forwardedFor);

async function newClient(server: AppServer, forwardedFor: string, password = 'limits-password-1') {
  const email = unique('client');
  const response = await post(
    server,
    '/api/v1/account',
    { name: 'Lena Marsh', company: 'Marsh Instruments', email, password },
    forwardedFor,
  );
  expect(response.status, await response.clone().text()).toBe(201);
  return { email, password, id: ((await response.json()) as { id: string }).id };
}

describe('trusting no proxy (the default)', () => {
  test('a caller rotating X-Forwarded-For is still one address: the per-address sign-in limit holds', async () => {
    const statuses: number[] = [];
    for (let i = 0; i < 42; i++) {
      const response = await wrongGuess(direct, unique('spread'), `198.18.${i}.1`);
      statuses.push(response.status);
    }
    expect(statuses.slice(0, 40).every((s) => s === 401)).toBe(true);
    expect(statuses.slice(40)).toEqual([429, 429]);
  });

  test('reset requests from one address stop at the limit whatever X-Forwarded-For says', async () => {
    const statuses: number[] = [];
    for (let i = 0; i < 21; i++) {
      const response = await postForm(direct, '/forgot-password', { email: unique('reset-spread') }, `198.19.${i}.1`);
      statuses.push(response.status);
    }
    expect(statuses.slice(0, 20).every((s) => s === 303)).toBe(true);
    expect(statuses[20]).toBe(429);
  });
});

describe('behind one trusted proxy', () => {
  test('30 parallel wrong guesses at one account: at most 8 run, the rest are refused before they run', async () => {
    const email = unique('burst');
    const address = newAddress();
    const answers = await Promise.all(Array.from({ length: 30 }, () => wrongGuess(proxied, email, address)));
    const statuses = answers.map((r) => r.status);
    expect(statuses.filter((s) => s === 401).length).toBeLessThanOrEqual(8);
    expect(statuses.filter((s) => s === 429).length).toBeGreaterThanOrEqual(22);
    expect(statuses.every((s) => s === 401 || s === 429)).toBe(true);
  });

  test('the per-account limit holds across addresses: guesses spread over ten machines are still eight', async () => {
    const email = unique('spread-account');
    const statuses: number[] = [];
    for (let i = 0; i < 10; i++) statuses.push((await wrongGuess(proxied, email, newAddress())).status);
    expect(statuses.slice(0, 8).every((s) => s === 401)).toBe(true);
    expect(statuses.slice(8)).toEqual([429, 429]);
    // The form page counts the same account.
    const form = await postForm(proxied, '/sign-in', { email, password: 'not-the-password' }, newAddress());
    expect(form.status).toBe(429);
    expect(await form.text()).toContain('Too many attempts');
  });

  test('what the caller writes before the proxy’s entry is ignored: only the appended address counts', async () => {
    const address = newAddress();
    const statuses: number[] = [];
    for (let i = 0; i < 41; i++) statuses.push((await wrongGuess(proxied, unique('forged'), `10.9.${i}.1, ${address}`)).status);
    expect(statuses.slice(0, 40).every((s) => s === 401)).toBe(true);
    expect(statuses[40]).toBe(429);
    // Another client behind the same proxy is not affected.
    expect((await wrongGuess(proxied, unique('neighbour'), newAddress())).status).toBe(401);
  });

  test('correct sign-ins are never counted: a dozen in a row all succeed', async () => {
    const address = newAddress();
    const person = await newClient(proxied, address);
    for (let i = 0; i < 12; i++) {
      const response = await post(proxied, '/api/auth/sign-in/email', { email: person.email, password: person.password }, address);
      expect(response.status).toBe(200);
    }
  });

  test('account creation is limited per address on every sign-up path', async () => {
    const address = newAddress();
    const account = () => ({ name: 'Bulk Person', company: 'Bulk', email: unique('bulk'), password: 'bulk-password-1' });
    for (let i = 0; i < 50; i++) expect((await post(proxied, '/api/v1/account', account(), address)).status).toBe(201);
    const api = await post(proxied, '/api/v1/account', account(), address);
    expect(api.status).toBe(429);
    expect(Number(api.headers.get('retry-after'))).toBeGreaterThan(0);
    const form = await postForm(proxied, '/sign-up', account(), address);
    expect(form.status).toBe(429);
    expect(await form.text()).toContain('Too many attempts');
    // better-auth's own sign-up is not a way around it.
    const { company: _company, ...withoutCompany } = account();
    const betterAuth = await post(proxied, '/api/auth/sign-up/email', withoutCompany, address);
    expect(betterAuth.status).toBe(404);
  }, 60_000);

  test('reset e-mails are limited per account, from any address and whether or not the account exists', async () => {
    for (const email of [(await newClient(proxied, newAddress())).email, unique('nobody')]) {
      const statuses: number[] = [];
      for (let i = 0; i < 4; i++) statuses.push((await postForm(proxied, '/forgot-password', { email }, newAddress())).status);
      expect(statuses).toEqual([303, 303, 303, 429]);
    }
  });

  test('two admins demoting each other at once leave one admin: the last admin cannot be demoted', async () => {
    const admin = await new Visitor(proxied.baseUrl).signIn(DEMO.admin);
    const adminId = ((await (await admin.request('/api/auth/get-session')).json()) as { user: { id: string } }).user.id;
    const second = await newClient(proxied, newAddress());
    const promoted = await admin.form('/admin/users', { intent: 'role', userId: second.id, role: 'admin' });
    expect(promoted.status).toBe(303);
    const other = await new Visitor(proxied.baseUrl).signIn(second.email, second.password);
    const [a, b] = await Promise.all([
      admin.form('/admin/users', { intent: 'role', userId: second.id, role: 'client' }),
      other.form('/admin/users', { intent: 'role', userId: adminId, role: 'engineer' }),
    ]);
    // The loser is refused by the guard (already demoted, 403) or, when both passed it, by the count (409).
    const statuses = [a.status, b.status].sort();
    expect(statuses[0]).toBe(303);
    expect([403, 409]).toContain(statuses[1]);
    const refused = a.status === 303 ? b : a;
    if (refused.status === 409) expect(await refused.text()).toContain('This is the last admin');
    const survivor = a.status === 303 ? admin : other;
    expect((await survivor.request('/admin/users')).status).toBe(200);
  });
});
