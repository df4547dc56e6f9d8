/** Briefs of the tests' own, so the demo briefs other tests rely on stay as seeded. */
import { expect } from 'vitest';
import { DEMO_BRIEFS } from '../../../src/lib/demo/scenario';
import { DEMO, Visitor } from '../../support/client';

export function demoSpec(key: string) {
  const found = DEMO_BRIEFS.find((b) => b.key === key);
  if (!found) throw new Error(`No demo brief ${key}`);
  return found.spec;
}

/** A client submits a brief with a demo brief's figures; answers its id. */
export async function submittedBrief(baseUrl: string, key: string, title: string, email: string = DEMO.client): Promise<string> {
  const client = await new Visitor(baseUrl).signIn(email);
  const created = await client.request('/api/v1/briefs', { method: 'POST', json: { title, spec: demoSpec(key), notes: '', submit: true } });
  expect(created.status).toBe(201);
  return (await created.json()).id;
}

export async function saveRevision(engineer: Visitor, briefId: string, body: Record<string, unknown>) {
  const saved = await engineer.request(`/api/v1/briefs/${briefId}/revisions`, { method: 'POST', json: body });
  expect(saved.status).toBe(201);
  return saved.json();
}
