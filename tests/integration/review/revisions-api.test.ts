import { describe, expect, inject, test } from 'vitest';
import { DEMO, Visitor } from '../../support/client';

const baseUrl = inject('baseUrl');

async function briefIdByTitle(visitor: Visitor, title: string): Promise<string> {
  const list = await (await visitor.request(`/api/v1/briefs?q=${encodeURIComponent(title)}`)).json();
  const hit = list.items.find((b: { title: string }) => b.title === title);
  if (!hit) throw new Error(`No brief titled ${title}`);
  return hit.id;
}

describe('design revisions', () => {
  test('an engineer saves numbered revisions with choices; each stores its inputs and the full result', async () => {
    const engineer = await new Visitor(baseUrl).signIn(DEMO.engineer);
    const id = await briefIdByTitle(engineer, 'PLC I/O card, 5 V at 1.5 A from the 24 V bus');
    const first = await engineer.request(`/api/v1/briefs/${id}/revisions`, { method: 'POST', json: { note: 'As briefed' } });
    expect(first.status).toBe(201);
    const one = await first.json();
    const second = await engineer.request(`/api/v1/briefs/${id}/revisions`, {
      method: 'POST',
      json: {
        topology: 'buck',
        weights: { efficiency: 5, heat: 1, partCount: 1, noise: 1, cost: 1 },
        overrides: { fswHz: 1_000_000 },
        note: 'Faster switching',
      },
    });
    expect(second.status).toBe(201);
    const two = await second.json();
    expect(two.number).toBe(one.number + 1);
    expect(two.topology).toBe('buck');
    expect(two.input.overrides.fswHz).toBe(1_000_000);
    expect(two.result.options).toHaveLength(7);

    const list = await (await engineer.request(`/api/v1/briefs/${id}/revisions`)).json();
    expect(list.items[0]).toMatchObject({ number: two.number, note: 'Faster switching', author: 'Idris Valcourt' });
  });

  test('bad choices are a 400 with paths; clients cannot save or list revisions', async () => {
    const engineer = await new Visitor(baseUrl).signIn(DEMO.engineer);
    const id = await briefIdByTitle(engineer, 'PLC I/O card, 5 V at 1.5 A from the 24 V bus');
    const bad = await engineer.request(`/api/v1/briefs/${id}/revisions`, { method: 'POST', json: { overrides: { fswHz: -5 } } });
    expect(bad.status).toBe(400);
    expect((await bad.json()).issues[0].path).toBe('overrides.fswHz');
    const badTopology = await engineer.request(`/api/v1/briefs/${id}/revisions`, { method: 'POST', json: { topology: 'flyback' } });
    expect(badTopology.status).toBe(400);

    const owner = await new Visitor(baseUrl).signIn('lucia@harrowgate.demo.railwright.test');
    expect((await owner.request(`/api/v1/briefs/${id}/revisions`, { method: 'POST', json: {} })).status).toBe(403);
    expect((await owner.request(`/api/v1/briefs/${id}/revisions`)).status).toBe(403);
  });

  test('a draft takes no revision', async () => {
    const engineer = await new Visitor(baseUrl).signIn(DEMO.engineer);
    const list = await (await engineer.request('/api/v1/briefs?state=draft')).json();
    const draft = list.items[0];
    expect((await engineer.request(`/api/v1/briefs/${draft.id}/revisions`, { method: 'POST', json: {} })).status).toBe(409);
  });
});
