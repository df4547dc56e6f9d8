import { describe, expect, inject, test } from 'vitest';
import { DEMO, Visitor } from '../../support/client';
import { railUnderReview } from '../quotes/helpers';

const baseUrl = inject('baseUrl');

interface Item {
  id: string;
  title: string;
  state: string;
  client: { id: string; name: string; company: string | null };
  submittedAt: string | null;
  updatedAt: string;
  summary: { topology: string; feasible: boolean; feasibleCount: number; reason?: string | null } | null;
  highestV: number | null;
  design?: { revision: number; quoted: boolean } | null;
}

async function list(visitor: Visitor, query: string): Promise<{ items: Item[]; total: number; page: number; pageSize: number }> {
  const response = await visitor.request(`/api/v1/briefs?${query}`);
  expect(response.status).toBe(200);
  return response.json();
}

describe('the desk list', () => {
  test('filters by state, by client and by text', async () => {
    const engineer = await new Visitor(baseUrl).signIn(DEMO.engineer);
    const submitted = await list(engineer, 'state=submitted&pageSize=100');
    expect(submitted.items.length).toBeGreaterThan(0);
    expect(submitted.items.every((b) => b.state === 'submitted')).toBe(true);
    expect(submitted.items.map((b) => b.title)).toContain('Detector bias, 150 V from a 300–350 V supply');
    expect(submitted.items.map((b) => b.title)).not.toContain('PLC I/O card, 5 V at 1.5 A from the 24 V bus');
    // The 350 V input is flagged on the desk before anyone opens the brief (ES1 limit of IEC 62368-1: 60 V DC).
    expect(submitted.items.find((b) => b.title.startsWith('Detector bias'))!.highestV).toBe(350);

    const harrow = (await list(engineer, 'q=Harrowgate')).items.find((b) => b.title === 'PLC I/O card, 5 V at 1.5 A from the 24 V bus')!;
    expect(harrow.client.company).toBe('Harrowgate Controls');
    const byClient = await list(engineer, `client=${harrow.client.id}&pageSize=100`);
    expect(byClient.items.length).toBeGreaterThan(0);
    expect(byClient.items.every((b) => b.client.id === harrow.client.id)).toBe(true);

    const none = await list(engineer, 'q=no-such-rail-anywhere');
    expect(none).toMatchObject({ items: [], total: 0 });
  });

  test('sorts by title and by submission date both ways', async () => {
    const engineer = await new Visitor(baseUrl).signIn(DEMO.engineer);
    const up = (await list(engineer, 'sort=title&pageSize=100')).items.map((b) => b.title);
    const down = (await list(engineer, 'sort=-title&pageSize=100')).items.map((b) => b.title);
    expect(up.length).toBeGreaterThan(3);
    // SQLite compares text by its bytes; so does this.
    expect([...up].sort((a, b) => (Buffer.from(a) < Buffer.from(b) ? -1 : 1))).toEqual(up);
    expect(down).toEqual([...up].reverse());

    const newest = (await list(engineer, 'state=submitted&sort=-submitted&pageSize=100')).items.map((b) => Date.parse(b.submittedAt!));
    expect(newest).toEqual([...newest].sort((a, b) => b - a));
    const oldest = (await list(engineer, 'sort=submitted&pageSize=100')).items
      .filter((b) => b.submittedAt)
      .map((b) => Date.parse(b.submittedAt!));
    expect(oldest).toEqual([...oldest].sort((a, b) => a - b));
  });

  test('pages are disjoint slices of one order, with the total of the whole list', async () => {
    const engineer = await new Visitor(baseUrl).signIn(DEMO.engineer);
    const whole = await list(engineer, 'sort=title&pageSize=4');
    const first = await list(engineer, 'sort=title&pageSize=2&page=1');
    const second = await list(engineer, 'sort=title&pageSize=2&page=2');
    expect(first.total).toBe(whole.total);
    expect(second).toMatchObject({ page: 2, pageSize: 2 });
    expect([...first.items, ...second.items].map((b) => b.id)).toEqual(whole.items.map((b) => b.id));
    const beyond = await list(engineer, `sort=title&pageSize=2&page=${Math.ceil(whole.total / 2) + 1}`);
    expect(beyond.items).toEqual([]);
    expect((await engineer.request('/api/v1/briefs?sort=cheapest')).status).toBe(400);
  });

  test('the desk page renders the first page server-side and links each row to its review', async () => {
    const engineer = await new Visitor(baseUrl).signIn(DEMO.engineer);
    const { items } = await list(engineer, 'q=Detector');
    const page = await engineer.request('/desk?q=Detector');
    expect(page.status).toBe(200);
    const html = await page.text();
    expect(html).toContain(`href="/desk/briefs/${items[0]!.id}"`);
    expect(html).not.toContain('PLC I/O card');
  });

  test('staff see the figures of the quoted revision, else the newest; a client sees those of the submission', async () => {
    const rail = await railUnderReview(baseUrl);
    const drafted = await rail.engineer.request('/api/v1/quotes', { method: 'POST', json: { revisionId: rail.revisionId } });
    const quote = (await drafted.json()) as { id: string };
    expect((await rail.engineer.request(`/api/v1/quotes/${quote.id}/send`, { method: 'POST' })).status).toBe(200);
    // A newer revision no design can meet: the quoted one stays the current design.
    const blocked = await rail.engineer.request(`/api/v1/briefs/${rail.briefId}/revisions`, {
      method: 'POST',
      json: { topology: 'linear', requirement: { maxRippleVpp: 1e-9 }, note: 'Quieter' },
    });
    expect(blocked.status).toBe(201);
    const quoted = (await list(rail.engineer, `q=${encodeURIComponent(rail.name)}`)).items.find((b) => b.id === rail.briefId)!;
    expect(quoted.design).toEqual({ revision: 1, quoted: true });
    expect(quoted.summary).toMatchObject({ feasible: true, reason: null });

    // Without a quote, the newest revision is the current design, and it says why it cannot be built.
    const unquoted = await railUnderReview(baseUrl);
    await unquoted.engineer.request(`/api/v1/briefs/${unquoted.briefId}/revisions`, {
      method: 'POST',
      json: { requirement: { maxRippleVpp: 1e-9 }, note: 'Quieter' },
    });
    const stuck = (await list(unquoted.engineer, `q=${encodeURIComponent(unquoted.name)}`)).items.find((b) => b.id === unquoted.briefId)!;
    expect(stuck.design).toEqual({ revision: 2, quoted: false });
    expect(stuck.summary).toMatchObject({ feasible: false, feasibleCount: 0 });
    expect(stuck.summary!.reason).toMatch(/\S/);

    const client = await list(rail.client, '');
    expect(client.items.find((b) => b.id === rail.briefId)!.design).toBeUndefined();
  });
});
