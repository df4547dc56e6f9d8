/** The quote lists: the client's own (sent onwards) and the consultancy's, filtered and paged on the server. */
import { describe, expect, inject, test } from 'vitest';
import { DEMO, Visitor } from '../../support/client';
import { execSql, railUnderReview } from './helpers';

const baseUrl = inject('baseUrl');
const databaseUrl = inject('databaseUrl');

interface Item {
  id: string;
  number: string;
  state: string;
  brief: { id: string; title: string };
  client: { id: string; name: string; company: string | null };
  totalMinor: number;
  depositMinor: number;
  depositPaid: boolean;
  balanceMinor: number | null;
  paidInFull: boolean;
}
interface List {
  items: Item[];
  total: number;
  page: number;
  pageSize: number;
}

async function list(visitor: Visitor, query: string): Promise<List> {
  const response = await visitor.request(`/api/v1/quotes?${query}`);
  expect(response.status, query).toBe(200);
  return response.json();
}

async function draft(engineer: Visitor, revisionId: string): Promise<{ id: string; number: string }> {
  const response = await engineer.request('/api/v1/quotes', { method: 'POST', json: { revisionId } });
  expect(response.status).toBe(201);
  return response.json();
}

async function send(engineer: Visitor, id: string) {
  expect((await engineer.request(`/api/v1/quotes/${id}/send`, { method: 'POST' })).status).toBe(200);
}

/** A fresh client with three quotes: the first sent then withdrawn by the second, the third still a draft. */
async function threeQuotes() {
  const rail = await railUnderReview(baseUrl);
  const first = await draft(rail.engineer, rail.revisionId);
  await send(rail.engineer, first.id);
  // Sending moved the brief to quoted; a new offer needs it back in review.
  expect((await rail.engineer.request(`/api/v1/briefs/${rail.briefId}`, { method: 'PATCH', json: { state: 'in-review' } })).status).toBe(
    200,
  );
  const second = await draft(rail.engineer, rail.revisionId);
  await send(rail.engineer, second.id);
  const third = await draft(rail.engineer, rail.revisionId);
  const ownerId = (await list(rail.engineer, `q=${encodeURIComponent(first.number)}`)).items[0]?.client.id ?? '';
  return { rail, first, second, third, ownerId };
}

describe('the quote lists', () => {
  test('a job paid in full owes nothing: the balance paid against its invoice counts as well as the deposit', async () => {
    const engineer = await new Visitor(baseUrl).signIn(DEMO.engineer);
    const [job] = (await list(engineer, `q=${encodeURIComponent('Field logger')}`)).items;
    expect(job).toMatchObject({ depositPaid: true, balanceMinor: 0, paidInFull: true });
    const page = await (await engineer.request('/desk/quotes?q=Field+logger')).text();
    expect(page).toContain('paid in full');
  });

  test('a client sees their sent quotes across briefs, never a draft; staff see every quote of that client', async () => {
    const { rail, first, second, third, ownerId } = await threeQuotes();
    const own = await list(rail.client, '');
    expect(own.items.map((q) => q.number)).toEqual([second.number, first.number]);
    expect(own.items.map((q) => q.state)).toEqual(['sent', 'withdrawn']);
    expect(own.total).toBe(2);
    // A client's list is their own whatever client filter they send.
    const other = await new Visitor(baseUrl).signIn(DEMO.otherClient);
    const theirs = await list(other, `client=${ownerId}&pageSize=100`);
    expect(theirs.items.some((q) => q.client.id === ownerId)).toBe(false);
    expect(theirs.items.every((q) => q.client.name === 'Jonas Brekke')).toBe(true);

    const staff = await list(rail.engineer, `client=${ownerId}`);
    expect(staff.items.map((q) => q.number)).toEqual([third.number, second.number, first.number]);
    expect(staff.items[0]).toMatchObject({ state: 'draft', depositPaid: false });
  });

  test('filters by state and by search text, and pages on the server', async () => {
    const { rail, first, second, third, ownerId } = await threeQuotes();
    const withdrawn = await list(rail.engineer, `client=${ownerId}&state=withdrawn`);
    expect(withdrawn.items.map((q) => q.number)).toEqual([first.number]);
    const byNumber = await list(rail.engineer, `q=${encodeURIComponent(second.number)}`);
    expect(byNumber.items.map((q) => q.number)).toEqual([second.number]);
    // The client's name and the brief's title are searched too.
    expect((await list(rail.engineer, `q=${encodeURIComponent(rail.name)}`)).total).toBe(3);
    expect((await list(rail.client, `q=${encodeURIComponent('Valve manifold')}`)).total).toBe(2);
    // LIKE's own wildcards are taken literally.
    expect((await list(rail.engineer, 'q=%25')).total).toBe(0);

    const page2 = await list(rail.engineer, `client=${ownerId}&pageSize=1&page=2`);
    expect(page2).toMatchObject({ total: 3, page: 2, pageSize: 1 });
    expect(page2.items.map((q) => q.number)).toEqual([second.number]);
    const past = await list(rail.engineer, `client=${ownerId}&pageSize=2&page=5`);
    expect(past).toMatchObject({ total: 3, items: [] });
    expect(third.number).not.toBe(second.number);
  });

  test('a sent quote past its validity is listed, and filtered, as expired', async () => {
    const { rail, second, ownerId } = await threeQuotes();
    await execSql(databaseUrl, 'UPDATE quote SET valid_until = ? WHERE id = ?', [Date.now() - 86_400_000, second.id]);
    const expired = await list(rail.client, 'state=expired');
    expect(expired.items.map((q) => [q.number, q.state])).toEqual([[second.number, 'expired']]);
    expect((await list(rail.engineer, `client=${ownerId}&state=sent`)).total).toBe(0);
  });

  test('deposit and balance: the total less the deposit paid once accepted; no balance on an offer not taken', async () => {
    const client = await new Visitor(baseUrl).signIn(DEMO.client);
    const paid = (await list(client, 'state=deposit-paid')).items[0];
    expect(paid).toBeDefined();
    expect(paid!.depositPaid).toBe(true);
    expect(paid!.balanceMinor).toBe(paid!.totalMinor - paid!.depositMinor);
    const { rail, second } = await threeQuotes();
    for (const q of (await list(rail.client, '')).items) expect(q).toMatchObject({ depositPaid: false, balanceMinor: null });
    expect((await rail.client.request(`/api/v1/quotes/${second.id}/accept`, { method: 'POST', json: {} })).status).toBe(200);
    const accepted = (await list(rail.client, 'state=accepted')).items;
    expect(accepted.map((q) => q.number)).toEqual([second.number]);
    expect(accepted[0]).toMatchObject({ depositPaid: false, balanceMinor: accepted[0]!.totalMinor });
  });

  test('a query that does not read is a 400 naming the field; the pages fall back to the whole list', async () => {
    const engineer = await new Visitor(baseUrl).signIn(DEMO.engineer);
    const bad = await engineer.request('/api/v1/quotes?state=paid-twice');
    expect(bad.status).toBe(400);
    expect((await bad.json()).issues[0].path).toBe('state');
    expect((await engineer.request('/api/v1/quotes?pageSize=1000')).status).toBe(400);
    expect((await engineer.request('/desk/quotes?state=paid-twice')).status).toBe(200);
  });

  test('pages: /quotes is the client’s, /desk/quotes the consultancy’s, each behind its guard and linked from the header', async () => {
    const { rail, first, third } = await threeQuotes();
    const mine = await rail.client.request('/quotes');
    expect(mine.status).toBe(200);
    const html = await mine.text();
    expect(html).toContain(first.number);
    expect(html).not.toContain(third.number);
    expect(html).toContain('href="/quotes"');
    expect((await rail.client.request('/desk/quotes')).status).toBe(403);
    expect((await rail.engineer.request('/quotes')).status).toBe(403);
    expect((await new Visitor(baseUrl).request('/quotes')).status).toBe(303);
    expect((await new Visitor(baseUrl).request('/desk/quotes')).status).toBe(303);

    const desk = await rail.engineer.request(`/desk/quotes?q=${encodeURIComponent(rail.name)}&pageSize=10`);
    expect(desk.status).toBe(200);
    const deskHtml = await desk.text();
    expect(deskHtml).toContain(third.number);
    expect(deskHtml).toContain('1–3 of 3 quotes');
    expect(deskHtml).toMatch(/aria-current="page"[^>]*>\s*Quotes/);
  });
});
