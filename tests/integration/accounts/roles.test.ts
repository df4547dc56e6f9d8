import { describe, expect, inject, test } from 'vitest';
import { DEMO, Visitor } from '../../support/client';

const baseUrl = inject('baseUrl');

describe('pages by role', () => {
  test('anonymous visitors are sent to sign-in, with the page they wanted kept', async () => {
    const response = await new Visitor(baseUrl).request('/desk?state=submitted');
    expect(response.status).toBe(303);
    expect(response.headers.get('location')).toBe('/sign-in?next=%2Fdesk%3Fstate%3Dsubmitted');
  });

  test('the front page is public and ships no script', async () => {
    const response = await new Visitor(baseUrl).request('/');
    expect(response.status).toBe(200);
    const html = await response.text();
    expect(html).toContain('Railwright');
    expect(html).not.toMatch(/<script/i);
  });

  test.each([
    ['client', DEMO.client, '/briefs', 'My briefs', ['/desk', '/admin/users']],
    ['engineer', DEMO.engineer, '/desk', 'Desk', ['/briefs', '/admin/users']],
    ['admin', DEMO.admin, '/admin/users', 'People and roles', ['/briefs']],
  ] as const)(
    'a %s signs in, sees their own navigation and is refused other roles’ pages',
    async (_role, email, home, heading, refused) => {
      const visitor = await new Visitor(baseUrl).signIn(email);
      const page = await visitor.request(home);
      expect(page.status).toBe(200);
      expect(await page.text()).toContain(heading);
      for (const path of refused) {
        const denied = await visitor.request(path);
        expect(denied.status, path).toBe(403);
        expect(await denied.text()).toContain('This page is not open to your role');
      }
    },
  );

  test('a client sees only their own briefs; the engineer sees every client’s', async () => {
    const client = await new Visitor(baseUrl).signIn(DEMO.client);
    const own = await (await client.request('/briefs')).text();
    expect(own).toContain('Soil-moisture node');
    expect(own).not.toContain('Bench meter analog front-end');

    // Other tests add briefs as they run, so search rather than read the first page.
    const engineer = await new Visitor(baseUrl).signIn(DEMO.engineer);
    expect((await engineer.request('/desk')).status).toBe(200);
    const titles = async (query: string) =>
      ((await (await engineer.request(`/api/v1/briefs?${query}`)).json()) as { items: { title: string }[] }).items.map((b) => b.title);
    expect(await titles('q=Soil-moisture')).toContain('Soil-moisture node, 3.3 V from one Li-ion cell');
    expect(await titles('q=Bench%20meter')).toContain('Bench meter analog front-end, quiet 12 V');
    const submitted = await titles('state=submitted&q=Detector');
    expect(submitted).toContain('Detector bias, 150 V from a 300–350 V supply');
    expect(await titles('state=submitted&q=Soil-moisture')).toEqual([]);
  });
});

describe('accounts', () => {
  test('a new sign-up is a client with a company profile and lands on their briefs', async () => {
    const visitor = new Visitor(baseUrl);
    const email = `new-${Date.now()}@example.test`;
    const response = await visitor.form('/sign-up', {
      name: 'Nell Cartwright',
      company: 'Cartwright Optics',
      email,
      password: 'long-enough-password',
    });
    expect(response.status).toBe(303);
    expect(response.headers.get('location')).toBe('/briefs');
    const session = await (await visitor.request('/api/auth/get-session')).json();
    expect(session.user.role).toBe('client');

    const admin = await new Visitor(baseUrl).signIn(DEMO.admin);
    const people = await (await admin.request('/admin/users')).text();
    expect(people).toContain('Cartwright Optics');
  });

  test('a sign-up with a short password gets the reason beside the field and creates nothing', async () => {
    const visitor = new Visitor(baseUrl);
    const email = `short-${Date.now()}@example.test`;
    const response = await visitor.form('/sign-up', { name: 'A', company: 'B', email, password: 'short' });
    expect(response.status).toBe(400);
    expect(await response.text()).toContain('Use at least 10 characters.');
    const signIn = await visitor.request('/api/auth/sign-in/email', { method: 'POST', json: { email, password: 'short' } });
    expect(signIn.status).toBe(401);
  });

  test('an admin promotes a client to engineer, who then reaches the desk', async () => {
    const email = `promote-${Date.now()}@example.test`;
    const person = new Visitor(baseUrl);
    const signUp = await person.request('/api/v1/account', {
      method: 'POST',
      json: { name: 'Promoted Person', company: 'Promoted Labs', email, password: 'long-enough-password' },
    });
    expect(signUp.status).toBe(201);
    const user = await signUp.json();
    expect((await person.request('/desk')).status).toBe(403);

    const engineer = await new Visitor(baseUrl).signIn(DEMO.engineer);
    const refused = await engineer.form('/admin/users', { intent: 'role', userId: user.id, role: 'engineer' });
    expect(refused.status).toBe(403);

    const admin = await new Visitor(baseUrl).signIn(DEMO.admin);
    const changed = await admin.form('/admin/users', { intent: 'role', userId: user.id, role: 'engineer' });
    expect(changed.status).toBe(303);
    expect(await (await admin.follow(changed)).text()).toContain('Role changed to Engineer.');
    expect((await person.request('/desk')).status).toBe(200);
  });

  test('signing in through the form page redirects to the role’s start page, or to a safe next', async () => {
    const visitor = new Visitor(baseUrl);
    const response = await visitor.form('/sign-in?next=%2F%2Fevil.example', { email: DEMO.engineer, password: 'railwright-demo' });
    expect(response.status).toBe(303);
    expect(response.headers.get('location')).toBe('/desk');
    const wrong = await new Visitor(baseUrl).form('/sign-in', { email: DEMO.engineer, password: 'not-the-password' });
    expect(wrong.status).toBe(401);
    expect(await wrong.text()).toContain('do not match an account');
  });

  test('a signed-in visitor is never sent to another site by `next`, however it is disguised', async () => {
    const visitor = await new Visitor(baseUrl).signIn(DEMO.engineer);
    // A browser drops the TAB and lands on //evil.example/phish.html.
    const tab = await visitor.request('/sign-in?next=%2F%09%2Fevil.example%2Fphish.html');
    expect(tab.status).toBe(303);
    expect(tab.headers.get('location')).toBe('/desk');
    const lineBreak = await visitor.request('/sign-in?next=%2Fdesk%0D%0Aset-cookie%3A%20x%3D1');
    expect(lineBreak.status).toBe(303);
    // Read as the browser reads it: the line break is dropped, the rest stays one path on this site.
    expect(lineBreak.headers.get('location')).toBe('/deskset-cookie:%20x=1');
    expect(lineBreak.headers.get('set-cookie')).toBeNull();
    const kept = await visitor.request('/sign-in?next=%2Fdesk%3Fstate%3Dsubmitted');
    expect(kept.headers.get('location')).toBe('/desk?state=submitted');
    const posted = await new Visitor(baseUrl).form('/sign-in?next=%2F%0A%2Fevil.example', {
      email: DEMO.client,
      password: 'railwright-demo',
    });
    expect(posted.status).toBe(303);
    expect(posted.headers.get('location')).toBe('/briefs');
  });

  test('better-auth’s own account routes are closed: roles, sign-up and names change only through the app', async () => {
    const admin = await new Visitor(baseUrl).signIn(DEMO.admin);
    const adminId = (await (await admin.request('/api/auth/get-session')).json()).user.id as string;
    const demote = await admin.request('/api/auth/admin/set-role', { method: 'POST', json: { userId: adminId, role: 'client' } });
    expect(demote.status).toBe(404);
    expect((await demote.json()).message).toContain('/admin/users');
    expect((await admin.request('/admin/users')).status).toBe(200);

    const email = `bypass-${Date.now()}@example.test`;
    const signUp = await new Visitor(baseUrl).request('/api/auth/sign-up/email', {
      method: 'POST',
      json: { name: 'x'.repeat(10_000), email, password: 'long-enough-password' },
    });
    expect(signUp.status).toBe(404);
    expect((await signUp.json()).message).toContain('/api/v1/account');
    const signIn = await new Visitor(baseUrl).request('/api/auth/sign-in/email', {
      method: 'POST',
      json: { email, password: 'long-enough-password' },
    });
    expect(signIn.status).toBe(401);

    const client = await new Visitor(baseUrl).signIn(DEMO.client);
    const rename = await client.request('/api/auth/update-user', { method: 'POST', json: { name: 'y'.repeat(10_000) } });
    expect(rename.status).toBe(404);
    const ask = await client.request('/api/auth/request-password-reset', { method: 'POST', json: { email: DEMO.client } });
    expect(ask.status).toBe(404);
  });

  test('sign-out ends the session', async () => {
    const visitor = await new Visitor(baseUrl).signIn(DEMO.client);
    expect((await visitor.request('/briefs')).status).toBe(200);
    const out = await visitor.form('/sign-out', {});
    expect(out.status).toBe(303);
    expect((await visitor.request('/briefs')).status).toBe(303);
  });
});

describe('client home', () => {
  test('lists the client’s briefs with their state and, once sent, the quote', async () => {
    const client = await new Visitor(baseUrl).signIn(DEMO.client);
    const html = await (await client.request('/briefs')).text();
    expect(html).toMatch(/Quote RW-\d{4}-\d{4}/);
    expect(html).toContain('Deposit paid');
  });
});
