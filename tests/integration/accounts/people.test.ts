import { eq, like } from 'drizzle-orm';
import { describe, expect, inject, test } from 'vitest';
import { connect } from '../../../src/lib/platform/db/connect';
import { session, user, verification } from '../../../src/lib/platform/db/schema';
import { DEMO, Visitor } from '../../support/client';

const baseUrl = inject('baseUrl');
const mailApiUrl = inject('mailApiUrl');
const databaseUrl = inject('databaseUrl');

async function withDb<T>(work: (db: ReturnType<typeof connect>['db']) => Promise<T>): Promise<T> {
  const { db, client } = connect(databaseUrl);
  try {
    return await work(db);
  } finally {
    client.close();
  }
}

async function mailTo(address: string, subject: string): Promise<{ subject: string; text: string }> {
  for (let attempt = 0; attempt < 50; attempt++) {
    const list = (await (await fetch(`${mailApiUrl}/messages?to=${encodeURIComponent(address)}`)).json()) as {
      id: string;
      subject: string;
    }[];
    const hit = list.find((m) => m.subject === subject);
    if (hit) return (await (await fetch(`${mailApiUrl}/messages/${hit.id}`)).json()) as { subject: string; text: string };
    await new Promise((r) => setTimeout(r, 100));
  }
  throw new Error(`No “${subject}” to ${address} reached the catcher`);
}

const tokenIn = (text: string) =>
  new URL(/http:\/\/\S+\/reset-password\?token=\S+/.exec(text)?.[0] ?? 'http://x/').searchParams.get('token') ?? '';

async function signUp(tag: string): Promise<{ email: string; id: string; visitor: Visitor }> {
  const email = `${tag}-${Date.now()}@example.test`;
  const visitor = new Visitor(baseUrl);
  const made = await visitor.form('/sign-up', {
    name: `Petra ${tag}`,
    company: 'Halvard Instruments',
    email,
    password: 'people-password-1',
  });
  expect(made.status).toBe(303);
  const [row] = await withDb((db) => db.select({ id: user.id }).from(user).where(eq(user.email, email)));
  return { email, id: row?.id ?? '', visitor };
}

const signInStatus = async (email: string, password: string) =>
  (await new Visitor(baseUrl).request('/api/auth/sign-in/email', { method: 'POST', json: { email, password } })).status;

describe('people (admin)', () => {
  test('search finds people by part of a name or an e-mail, a page at a time on the server', async () => {
    const tag = `zq${Date.now().toString(36)}`;
    await withDb((db) =>
      db.insert(user).values(
        Array.from({ length: 23 }, (_, i) => ({
          id: `${tag}-${i}`,
          name: `Searchable ${tag} ${String(i).padStart(2, '0')}`,
          email: `${tag}-${i}@example.test`,
          role: 'client',
          createdAt: new Date(Date.UTC(2026, 0, 1, 0, i)),
        })),
      ),
    );
    const admin = await new Visitor(baseUrl).signIn(DEMO.admin);
    const first = await (await admin.request(`/admin/users?q=${tag.toUpperCase()}`)).text();
    expect(first).toContain(`23 people matching “${tag.toUpperCase()}” · page 1 of 2`);
    expect(first).toContain(`Searchable ${tag} 22`);
    expect(first).not.toContain(`Searchable ${tag} 02`);
    expect(first).not.toContain(DEMO.engineer);
    const second = await (await admin.request(`/admin/users?q=${tag}&page=2`)).text();
    expect(second).toContain(`Searchable ${tag} 02`);
    expect(second).not.toContain(`Searchable ${tag} 03`);
    const byMail = await (await admin.request(`/admin/users?q=${encodeURIComponent('engineer@demo')}`)).text();
    expect(byMail).toContain('1 person matching');
    expect(byMail).toContain(DEMO.engineer);
    // A % typed in the box is a character to find, not a wildcard.
    expect(await (await admin.request('/admin/users?q=%25')).text()).toContain('0 people matching');
  });

  test('the invite link sets a password once, and the account signs in with the role it was given', async () => {
    const email = `invited-${Date.now()}@example.test`;
    const admin = await new Visitor(baseUrl).signIn(DEMO.admin);
    const invited = await admin.form('/admin/users', {
      intent: 'invite',
      name: 'Odile Marchetti',
      email,
      company: 'Marchetti Audio',
      role: 'engineer',
    });
    expect(invited.status).toBe(303);
    expect(await (await admin.follow(invited)).text()).toContain('Invitation sent.');
    const again = await admin.form('/admin/users', {
      intent: 'invite',
      name: 'Odile Marchetti',
      email: email.toUpperCase(),
      role: 'client',
    });
    expect(again.status).toBe(409);
    expect(await again.text()).toContain('already exists');

    const mail = await mailTo(email, 'You are invited to Railwright');
    expect(mail.text).toContain('(engineer)');
    expect(mail.text).toContain('within 3 days');
    const token = tokenIn(mail.text);
    expect(token).not.toBe('');
    expect(await signInStatus(email, 'invited-password-1')).toBe(401);
    const listed = await (await admin.request(`/admin/users?q=${encodeURIComponent(email)}`)).text();
    expect(listed).toContain('Invited, no password yet');
    expect(listed).toContain('Marchetti Audio');

    const set = await new Visitor(baseUrl).form('/reset-password', { token, password: 'invited-password-1' });
    expect(set.status).toBe(303);
    const reused = await new Visitor(baseUrl).form('/reset-password', { token, password: 'invited-password-2' });
    expect(reused.status).toBe(400);
    expect(await reused.text()).toContain('expired or was already used');

    expect(await (await admin.request(`/admin/users?q=${encodeURIComponent(email)}`)).text()).not.toContain('Invited, no password yet');
    const person = await new Visitor(baseUrl).signIn(email, 'invited-password-1');
    const me = await (await person.request('/api/auth/get-session')).json();
    expect(me.user.role).toBe('engineer');
    expect(await signInStatus(email, 'invited-password-2')).toBe(401);
  });

  test('an invite link stops working once it expires', async () => {
    const email = `late-${Date.now()}@example.test`;
    const admin = await new Visitor(baseUrl).signIn(DEMO.admin);
    expect((await admin.form('/admin/users', { intent: 'invite', name: 'Bruno Late', email, role: 'client' })).status).toBe(303);
    const token = tokenIn((await mailTo(email, 'You are invited to Railwright')).text);
    const [row] = await withDb((db) =>
      db
        .select()
        .from(verification)
        .where(eq(verification.identifier, `reset-password:${token}`)),
    );
    // Three days, give or take the time the request took.
    const lifetimeH = ((row?.expiresAt.getTime() ?? 0) - (row?.createdAt.getTime() ?? 0)) / 3_600_000;
    expect(lifetimeH).toBeCloseTo(72, 3);
    await withDb((db) =>
      db
        .update(verification)
        .set({ expiresAt: new Date(Date.now() - 1000) })
        .where(eq(verification.identifier, `reset-password:${token}`)),
    );
    const late = await new Visitor(baseUrl).form('/reset-password', { token, password: 'late-password-1' });
    expect(late.status).toBe(400);
    expect(await late.text()).toContain('expired or was already used');
  });

  test('an invitation with a bad address is refused beside the field and creates nothing', async () => {
    const admin = await new Visitor(baseUrl).signIn(DEMO.admin);
    const refused = await admin.form('/admin/users', { intent: 'invite', name: 'Nobody', email: 'not-an-address', role: 'client' });
    expect(refused.status).toBe(400);
    const page = await refused.text();
    expect(page).toMatch(/id="invite-email-error"[^>]*>[\s\S]*?Enter an e-mail address such as name@company.com/);
    expect(page).toContain('value="not-an-address"');
    expect(await withDb((db) => db.select().from(user).where(like(user.email, 'not-an-address%')))).toEqual([]);
  });

  test("a deactivated person's session stops working and they cannot sign in until reactivated", async () => {
    const { email, id, visitor } = await signUp('deactivated');
    expect((await visitor.request('/briefs')).status).toBe(200);
    const admin = await new Visitor(baseUrl).signIn(DEMO.admin);

    const off = await admin.form('/admin/users', { intent: 'deactivate', userId: id });
    expect(off.status).toBe(303);
    expect(await (await admin.follow(off)).text()).toContain('Account deactivated');
    expect(await withDb((db) => db.select().from(session).where(eq(session.userId, id)))).toEqual([]);
    const after = await visitor.request('/briefs');
    expect(after.status).toBe(303);
    expect(after.headers.get('location')).toMatch(/^\/sign-in/);
    expect((await visitor.request('/api/v1/briefs')).status).toBe(401);

    const form = await new Visitor(baseUrl).form('/sign-in', { email, password: 'people-password-1' });
    expect(form.status).toBe(403);
    expect(await form.text()).toContain('This account is deactivated');
    expect(await signInStatus(email, 'people-password-1')).toBe(403);
    // A wrong password learns nothing about the account.
    expect(await signInStatus(email, 'wrong-password-9')).toBe(401);

    const on = await admin.form('/admin/users', { intent: 'reactivate', userId: id });
    expect(on.status).toBe(303);
    expect(await signInStatus(email, 'people-password-1')).toBe(200);
  });

  test('an admin cannot deactivate themselves', async () => {
    const admin = await new Visitor(baseUrl).signIn(DEMO.admin);
    const me = await (await admin.request('/api/auth/get-session')).json();
    const refused = await admin.form('/admin/users', { intent: 'deactivate', userId: me.user.id });
    expect(refused.status).toBe(409);
    expect(await refused.text()).toContain('You cannot deactivate your own account');
    expect((await admin.request('/admin/users')).status).toBe(200);
  });

  test('an admin sends a reset link that sets a new password once and ends the old sessions', async () => {
    const { email, id, visitor } = await signUp('reset-by-admin');
    const admin = await new Visitor(baseUrl).signIn(DEMO.admin);
    const sent = await admin.form('/admin/users', { intent: 'reset', userId: id });
    expect(sent.status).toBe(303);
    expect(await (await admin.follow(sent)).text()).toContain('A reset link is on its way');
    const token = tokenIn((await mailTo(email, 'Reset your Railwright password')).text);
    expect((await new Visitor(baseUrl).form('/reset-password', { token, password: 'chosen-again-1' })).status).toBe(303);
    expect((await new Visitor(baseUrl).form('/reset-password', { token, password: 'chosen-again-2' })).status).toBe(400);
    expect((await visitor.request('/api/v1/briefs')).status).toBe(401);
    expect(await signInStatus(email, 'chosen-again-1')).toBe(200);
    // The admin's mail log shows the e-mail without its live link.
    const log = await (await admin.request('/admin/mail')).text();
    expect(log).toContain(email);
    expect(log).not.toContain(token);
  });
});
