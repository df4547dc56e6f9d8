import { describe, expect, inject, test } from 'vitest';
import { DEMO, Visitor } from '../../support/client';
import { execSql } from '../quotes/helpers';

const baseUrl = inject('baseUrl');
const mailApiUrl = inject('mailApiUrl');
const databaseUrl = inject('databaseUrl');

const goodSpec = {
  input: { vMin: 10.8, vNom: 12, vMax: 13.2, rippleVpp: 0.1, source: 'adapter' },
  output: { v: 5, tolerance: 0.05, iMin: 0.05, iTyp: 0.3, iMax: 0.6 },
  noise: { class: 'digital' },
  thermal: { ambientMaxC: 45, airflow: 'still-air' },
};

describe('briefs API', () => {
  test('a client creates a draft, edits it, submits it; the engineers are told by e-mail', async () => {
    const client = await new Visitor(baseUrl).signIn(DEMO.client);
    const created = await client.request('/api/v1/briefs', {
      method: 'POST',
      json: { title: 'Display backlight rail', spec: { input: { vMin: 10 } }, notes: 'draft', submit: false },
    });
    expect(created.status).toBe(201);
    const draft = await created.json();
    expect(draft.state).toBe('draft');
    expect(created.headers.get('location')).toBe(`/api/v1/briefs/${draft.id}`);

    const edited = await client.request(`/api/v1/briefs/${draft.id}`, { method: 'PATCH', json: { spec: goodSpec, notes: 'now complete' } });
    expect(edited.status).toBe(200);
    expect((await edited.json()).notes).toBe('now complete');

    const submitted = await client.request(`/api/v1/briefs/${draft.id}`, { method: 'PATCH', json: { submit: true } });
    expect(submitted.status).toBe(200);
    const after = await submitted.json();
    expect(after.state).toBe('submitted');
    expect(after.submittedAt).not.toBeNull();
    expect(after.summary.feasibleCount).toBeGreaterThan(0);

    const detail = await (await client.request(`/api/v1/briefs/${draft.id}`)).json();
    expect(detail.history.map((h: { to: string }) => h.to)).toEqual(['draft', 'submitted']);

    const again = await client.request(`/api/v1/briefs/${draft.id}`, { method: 'PATCH', json: { notes: 'too late' } });
    expect(again.status).toBe(409);

    const mail = await (await fetch(`${mailApiUrl}/messages?to=engineer@demo.railwright.test`)).json();
    const list = Array.isArray(mail) ? mail : mail.messages;
    expect(list.some((m: { subject: string }) => m.subject === 'New brief: Display backlight rail')).toBe(true);
  });

  test('submitting an incomplete brief answers 400 with the field paths and leaves the draft a draft', async () => {
    const client = await new Visitor(baseUrl).signIn(DEMO.client);
    const created = await client.request('/api/v1/briefs', {
      method: 'POST',
      json: { title: 'Half a brief', spec: { input: { vMin: 5, vNom: 4, vMax: 6, source: 'bus' } }, submit: true },
    });
    expect(created.status).toBe(400);
    const body = await created.json();
    expect(body.error).toBe('invalid_brief');
    const paths = body.issues.map((i: { path: string }) => i.path);
    expect(paths).toContain('spec.output');
    const list = await (await client.request('/api/v1/briefs?q=Half%20a%20brief')).json();
    expect(list.total).toBe(0);
  });

  test('lists: a client sees only their own; staff filter by state and search; bad queries are 400', async () => {
    const client = await new Visitor(baseUrl).signIn(DEMO.otherClient);
    const own = await (await client.request('/api/v1/briefs')).json();
    expect(own.items.length).toBeGreaterThan(0);
    expect(own.items.every((b: { client: { name: string } }) => b.client.name === 'Jonas Brekke')).toBe(true);

    const engineer = await new Visitor(baseUrl).signIn(DEMO.engineer);
    const submitted = await (await engineer.request('/api/v1/briefs?state=submitted&pageSize=100')).json();
    expect(submitted.items.every((b: { state: string }) => b.state === 'submitted')).toBe(true);
    const found = await (await engineer.request('/api/v1/briefs?q=Quillon')).json();
    expect(found.items.map((b: { title: string }) => b.title)).toContain('Bench meter analog front-end, quiet 12 V');
    const paged = await (await engineer.request('/api/v1/briefs?pageSize=2&page=2&sort=title')).json();
    expect(paged.items).toHaveLength(2);
    expect(paged.page).toBe(2);
    expect((await engineer.request('/api/v1/briefs?state=lost')).status).toBe(400);
    expect((await new Visitor(baseUrl).request('/api/v1/briefs')).status).toBe(401);
  });

  test('a brief reads with its quotes (sent ones only, for the client) and, for staff, its revisions', async () => {
    const client = await new Visitor(baseUrl).signIn(DEMO.client);
    const mine = await (await client.request('/api/v1/briefs?q=Soil-moisture')).json();
    const detail = await (await client.request(`/api/v1/briefs/${mine.items[0].id}`)).json();
    expect(detail.quotes).toHaveLength(1);
    expect(detail.quotes[0]).toMatchObject({ state: 'deposit-paid', currency: 'EUR' });
    expect(detail.quotes[0].number).toMatch(/^RW-\d{4}-\d{4}$/);
    expect(detail).not.toHaveProperty('revisions');
    const engineer = await new Visitor(baseUrl).signIn(DEMO.engineer);
    const staffView = await (await engineer.request(`/api/v1/briefs/${mine.items[0].id}`)).json();
    // Other tests may add revisions; the seeded first one is there, newest listed first.
    expect(staffView.revisions.at(-1)).toMatchObject({ number: 1, topology: 'buck-boost' });
  });

  test('another client’s brief is 404 — read and write alike', async () => {
    const owner = await new Visitor(baseUrl).signIn(DEMO.otherClient);
    const theirs = (await (await owner.request('/api/v1/briefs')).json()).items[0];
    const client = await new Visitor(baseUrl).signIn(DEMO.client);
    expect((await client.request(`/api/v1/briefs/${theirs.id}`)).status).toBe(404);
    expect((await client.request(`/api/v1/briefs/${theirs.id}`, { method: 'PATCH', json: { state: 'cancelled' } })).status).toBe(404);
    expect((await client.request('/api/v1/briefs/does-not-exist')).status).toBe(404);
  });

  test('staff move a brief through its states with the history recorded; impossible moves are 409', async () => {
    const client = await new Visitor(baseUrl).signIn(DEMO.client);
    const created = await (
      await client.request('/api/v1/briefs', { method: 'POST', json: { title: 'Move me', spec: goodSpec, submit: true } })
    ).json();
    const engineer = await new Visitor(baseUrl).signIn(DEMO.engineer);
    const review = await engineer.request(`/api/v1/briefs/${created.id}`, {
      method: 'PATCH',
      json: { state: 'in-review', note: 'Taking it' },
    });
    expect(review.status).toBe(200);
    const jump = await engineer.request(`/api/v1/briefs/${created.id}`, { method: 'PATCH', json: { state: 'delivered' } });
    expect(jump.status).toBe(409);
    const detail = await (await engineer.request(`/api/v1/briefs/${created.id}`)).json();
    expect(detail.history.at(-1)).toMatchObject({ from: 'submitted', to: 'in-review', by: 'Idris Valcourt', note: 'Taking it' });
    // Staff may not rewrite the client's brief.
    expect((await engineer.request(`/api/v1/briefs/${created.id}`, { method: 'PATCH', json: { notes: 'x' } })).status).toBe(400);
    // Engineers do not create briefs.
    expect((await engineer.request('/api/v1/briefs', { method: 'POST', json: { title: 'x' } })).status).toBe(403);
  });

  test('bodies: malformed JSON, wrong content type and oversized bodies are refused early', async () => {
    const client = await new Visitor(baseUrl).signIn(DEMO.client);
    const malformed = await client.request('/api/v1/briefs', {
      method: 'POST',
      headers: { 'content-type': 'application/json' },
      body: '{"title":',
    });
    expect(malformed.status).toBe(400);
    expect((await malformed.json()).error).toBe('malformed_json');
    const text = await client.request('/api/v1/briefs', { method: 'POST', headers: { 'content-type': 'text/plain' }, body: '{}' });
    expect(text.status).toBe(415);
    const big = await client.request('/api/v1/briefs', { method: 'POST', json: { title: 'x', notes: 'n'.repeat(70_000) } });
    expect(big.status).toBe(413);
    const unknown = await client.request('/api/v1/briefs', { method: 'POST', json: { title: 'x', owner: 'someone-else' } });
    expect(unknown.status).toBe(400);
  });
});

describe('evaluate API', () => {
  test('anyone gets the ranked options with the contract fields, deterministically', async () => {
    const visitor = new Visitor(baseUrl);
    const first = await visitor.request('/api/v1/evaluate', { method: 'POST', json: goodSpec });
    expect(first.status).toBe(200);
    const text = await first.text();
    const second = await (await visitor.request('/api/v1/evaluate', { method: 'POST', json: goodSpec })).text();
    expect(second).toBe(text);
    const body = JSON.parse(text);
    expect(body.options).toHaveLength(7);
    for (const option of body.options) {
      for (const key of [
        'topology',
        'feasible',
        'score',
        'issues',
        'efficiency',
        'dissipation',
        'heatsink',
        'partCount',
        'outputRippleVpp',
        'vOutRange',
        'components',
        'trace',
      ]) {
        expect(option, key).toHaveProperty(key);
      }
    }
  });

  test('a bad brief is a 400 with field paths, never a 500', async () => {
    const response = await new Visitor(baseUrl).request('/api/v1/evaluate', {
      method: 'POST',
      json: { ...goodSpec, output: { ...goodSpec.output, v: 'five' } },
    });
    expect(response.status).toBe(400);
    const body = await response.json();
    expect(body.error).toBe('invalid_brief');
    expect(body.issues[0].path).toBe('output.v');
  });

  test('a draft with an unknown choice is refused on save; one stored before the check still opens in the wizard', async () => {
    const client = await new Visitor(baseUrl).signIn(DEMO.client);
    const refused = await client.request('/api/v1/briefs', {
      method: 'POST',
      json: { title: 'Reactor rail', spec: { input: { source: 'nuclear', vMin: 10 } } },
    });
    expect(refused.status).toBe(400);
    expect((await refused.json()).issues).toEqual([{ path: 'spec.input.source', message: expect.stringContaining('source') }]);

    const created = await (
      await client.request('/api/v1/briefs', { method: 'POST', json: { title: 'Reactor rail', spec: { input: { vMin: 10 } } } })
    ).json();
    await execSql(databaseUrl, 'UPDATE brief SET spec = ? WHERE id = ?', [
      JSON.stringify({ input: { source: 'nuclear', vMin: 10 } }),
      created.id,
    ]);
    const page = await client.request(`/briefs/new?draft=${created.id}`);
    expect(page.status).toBe(200);
    const html = await page.text();
    expect(html).toContain('Describe your rail');
    expect(html).not.toContain('nuclear');
  });
});
