import { beforeAll, describe, expect, inject, test } from 'vitest';
import { DEMO, Visitor } from '../../support/client';
import { saveRevision, submittedBrief } from './helpers';

const baseUrl = inject('baseUrl');
let briefId: string;
let revisionId: string;
let secondId: string;

beforeAll(async () => {
  const engineer = await new Visitor(baseUrl).signIn(DEMO.engineer);
  briefId = await submittedBrief(baseUrl, 'controller-24v', 'Access test: the client owns this one');
  revisionId = (await saveRevision(engineer, briefId, {})).id;
  secondId = (await saveRevision(engineer, briefId, { weights: { efficiency: 1, heat: 1, partCount: 1, noise: 1, cost: 1 } })).id;
});

const apiRoutes = () =>
  [
    ['GET', `/api/v1/revisions/${revisionId}/netlist.cir`],
    ['GET', `/api/v1/revisions/${revisionId}/parts.csv`],
    ['GET', `/api/v1/revisions/compare?a=${revisionId}&b=${secondId}`],
    ['GET', `/api/v1/briefs/${briefId}/notes`],
    ['POST', `/api/v1/briefs/${briefId}/notes`],
  ] as const;
const pages = () => [
  '/desk',
  `/desk/briefs/${briefId}`,
  `/desk/briefs/${briefId}/revisions/${revisionId}`,
  `/desk/briefs/${briefId}/compare?a=${revisionId}&b=${secondId}`,
];

async function call(visitor: Visitor, method: string, path: string) {
  return visitor.request(path, method === 'POST' ? { method, json: { body: 'A note a client must not leave' } } : {});
}

describe('the engineer side is closed to clients', () => {
  test('a client, even the brief’s owner, gets 403 from every route and page; another client as well', async () => {
    for (const email of [DEMO.client, DEMO.otherClient]) {
      const client = await new Visitor(baseUrl).signIn(email);
      for (const [method, path] of apiRoutes())
        expect([method, path, (await call(client, method, path)).status]).toEqual([method, path, 403]);
      for (const path of pages()) expect([path, (await client.request(path)).status]).toEqual([path, 403]);
    }
    const engineer = await new Visitor(baseUrl).signIn(DEMO.engineer);
    const notes = (await (await engineer.request(`/api/v1/briefs/${briefId}/notes`)).json()).items;
    expect(notes).toEqual([]);
  });

  test('anonymous visitors get 401 from the routes and are sent to sign in from the pages', async () => {
    const anonymous = new Visitor(baseUrl);
    for (const [method, path] of apiRoutes()) expect([path, (await call(anonymous, method, path)).status]).toEqual([path, 401]);
    for (const path of pages()) {
      const response = await anonymous.request(path);
      expect(response.status).toBe(303);
      expect(response.headers.get('location')).toBe(`/sign-in?next=${encodeURIComponent(path)}`);
    }
  });

  test('staff reach them all; unknown briefs and revisions are 404', async () => {
    const admin = await new Visitor(baseUrl).signIn(DEMO.admin);
    for (const [method, path] of apiRoutes())
      expect([path, (await call(admin, method, path)).status]).toEqual([path, method === 'POST' ? 201 : 200]);
    for (const path of pages()) expect([path, (await admin.request(path)).status]).toEqual([path, 200]);
    expect((await admin.request('/desk/briefs/no-such-brief')).status).toBe(404);
    expect((await admin.request(`/desk/briefs/${briefId}/revisions/no-such-revision`)).status).toBe(404);
    expect((await admin.request('/api/v1/briefs/no-such-brief/notes')).status).toBe(404);
  });
});
