/**
 * The working relationship around a brief: files sent with a message, the header's unread count,
 * a client withdrawing a submitted brief and deleting a draft, a brief link opened signed out,
 * and a declined quote's reason on the desk.
 */
import { describe, expect, inject, test } from 'vitest';
import { DEMO, Visitor } from '../../support/client';
import { until } from '../payments/helpers';
import { execSql, mailsTo, mailText, railUnderReview } from '../quotes/helpers';
import { fileRowsOf, fixture, storedFiles, upload } from './upload-helpers';

const baseUrl = inject('baseUrl');
const mailApiUrl = inject('mailApiUrl');
const databaseUrl = inject('databaseUrl');

const form = (visitor: Visitor, page: string, fields: Record<string, string>) =>
  visitor.request(page, {
    method: 'POST',
    headers: { 'content-type': 'application/x-www-form-urlencoded' },
    body: new URLSearchParams(fields).toString(),
  });

/** The header's unread count on a page, 0 when it shows none. */
async function unreadOn(visitor: Visitor, page: string): Promise<number> {
  const html = await (await visitor.request(page)).text();
  return Number(/data-unread="(\d+)"/.exec(html)?.[1] ?? 0);
}

describe('files sent with a message', () => {
  test('uploaded through the brief, listed with the message, named in the e-mail, downloaded under the file rules', async () => {
    const rail = await railUnderReview(baseUrl);
    const path = `/api/v1/briefs/${rail.briefId}/messages`;
    const uploaded = await upload(rail.client, rail.briefId, { bytes: fixture('datasheet.pdf'), name: 'bus-sag.pdf' });
    expect(uploaded.status).toBe(201);
    const file = await uploaded.json();

    const sent = await rail.client.request(path, {
      method: 'POST',
      json: { body: 'The sag we measured is attached.', attachmentIds: [file.id] },
    });
    expect(sent.status).toBe(201);
    expect((await sent.json()).attachments).toEqual([{ id: file.id, name: 'bus-sag.pdf', sizeBytes: file.sizeBytes }]);
    const listed = (await (await rail.engineer.request(path)).json()).items as { attachments: { id: string }[] }[];
    expect(listed.at(-1)?.attachments.map((a) => a.id)).toEqual([file.id]);

    // Both sides download it; another client gets 404.
    expect((await rail.engineer.request(`/api/v1/files/${file.id}`)).status).toBe(200);
    expect((await rail.client.request(`/api/v1/files/${file.id}`)).status).toBe(200);
    const other = await new Visitor(baseUrl).signIn(DEMO.otherClient);
    expect((await other.request(`/api/v1/files/${file.id}`)).status).toBe(404);

    const mail = await until(
      async () => (await mailsTo(mailApiUrl, DEMO.engineer)).filter((m) => m.subject.includes(rail.name)),
      (found) => found.length > 0,
      'the message e-mail',
    );
    expect(await mailText(mailApiUrl, mail[0]?.id)).toContain('Attached (open them on the page): bus-sag.pdf');
    // Delivered once, even after the outbox poller's turn.
    await new Promise((r) => setTimeout(r, 6_000));
    expect((await mailsTo(mailApiUrl, DEMO.engineer)).filter((m) => m.subject.includes(rail.name))).toHaveLength(1);

    // The review and the client's page show it with its download link.
    for (const [visitor, page] of [
      [rail.engineer, `/desk/briefs/${rail.briefId}`],
      [rail.client, `/briefs/${rail.briefId}`],
    ] as const) {
      const html = await (await visitor.request(page)).text();
      expect(html, page).toContain(`/api/v1/files/${file.id}`);
    }
  });

  test('a file goes with one message only, and only the writer’s own file of this brief; a refused message stores nothing', async () => {
    const rail = await railUnderReview(baseUrl);
    const path = `/api/v1/briefs/${rail.briefId}/messages`;
    const mine = await (await upload(rail.client, rail.briefId, { bytes: fixture('photo.png'), name: 'board.png' })).json();
    const engineers = await (await upload(rail.engineer, rail.briefId, { bytes: fixture('photo.png'), name: 'probe.png' })).json();
    const count = async () => (await (await rail.client.request(path)).json()).items.length as number;

    const notMine = await rail.client.request(path, { method: 'POST', json: { body: 'See this', attachmentIds: [engineers.id] } });
    expect(notMine.status).toBe(400);
    expect((await notMine.json()).issues[0].path).toBe('attachmentIds');
    expect(await count()).toBe(0);

    expect((await rail.client.request(path, { method: 'POST', json: { body: 'First', attachmentIds: [mine.id] } })).status).toBe(201);
    expect((await rail.client.request(path, { method: 'POST', json: { body: 'Again', attachmentIds: [mine.id] } })).status).toBe(400);
    const tooMany = await rail.client.request(path, {
      method: 'POST',
      json: { body: 'Many', attachmentIds: ['a', 'b', 'c', 'd', 'e', 'f'] },
    });
    expect(tooMany.status).toBe(400);
    expect(await count()).toBe(1);
  });
});

describe('the unread count in the header', () => {
  test('messages from the other side count until the reader opens the brief; their own never count', async () => {
    const rail = await railUnderReview(baseUrl);
    const path = `/api/v1/briefs/${rail.briefId}/messages`;
    expect(await unreadOn(rail.client, '/briefs')).toBe(0);

    await rail.engineer.request(path, { method: 'POST', json: { body: 'Which connector do you use?' } });
    await rail.engineer.request(path, { method: 'POST', json: { body: 'And which enclosure?' } });
    const listHtml = await (await rail.client.request('/briefs')).text();
    expect(listHtml).toContain('2 unread messages');
    expect(listHtml).toContain(`href="/briefs/${rail.briefId}#messages"`);

    const engineerBefore = await unreadOn(rail.engineer, '/desk');
    await rail.client.request(path, { method: 'POST', json: { body: 'A Phoenix block; the IP54 box.' } });
    expect(await unreadOn(rail.client, '/briefs')).toBe(2);
    expect(await unreadOn(rail.engineer, '/desk')).toBe(engineerBefore + 1);

    // Opening the brief reads it: the count is gone on that page already and after.
    expect(await unreadOn(rail.client, `/briefs/${rail.briefId}`)).toBe(0);
    expect(await unreadOn(rail.client, '/briefs')).toBe(0);
    expect(await unreadOn(rail.engineer, `/desk/briefs/${rail.briefId}`)).toBe(engineerBefore);

    // Stored per person in the database, not in the server's memory.
    const marks = await execSql(databaseUrl, 'SELECT user_id FROM brief_read WHERE brief_id = ?', [rail.briefId]);
    expect(marks).toHaveLength(2);
    await rail.engineer.request(path, { method: 'POST', json: { body: 'Thanks.' } });
    expect(await unreadOn(rail.client, '/briefs')).toBe(1);
  });
});

describe('withdrawing and deleting', () => {
  test('the client withdraws a submitted brief from its page with the tick; it is cancelled', async () => {
    const rail = await railUnderReview(baseUrl);
    const created = await rail.client.request('/api/v1/briefs', {
      method: 'POST',
      json: {
        title: 'Sensor rail to withdraw',
        spec: (await (await rail.client.request(`/api/v1/briefs/${rail.briefId}`)).json()).spec,
        submit: true,
      },
    });
    const id = (await created.json()).id as string;
    const page = `/briefs/${id}`;
    expect(await (await rail.client.request(page)).text()).toContain('Withdraw this brief');

    const unticked = await form(rail.client, page, { intent: 'withdraw' });
    expect(unticked.status).toBe(400);
    expect(await unticked.text()).toContain('Tick “Yes, withdraw” to confirm');
    const other = await new Visitor(baseUrl).signIn(DEMO.otherClient);
    expect((await form(other, page, { intent: 'withdraw', confirm: 'yes' })).status).toBe(404);
    const engineer = await form(rail.engineer, page, { intent: 'withdraw', confirm: 'yes' });
    expect(engineer.status).toBe(403);

    const withdrawn = await form(rail.client, page, { intent: 'withdraw', confirm: 'yes' });
    expect(withdrawn.status).toBe(303);
    expect(withdrawn.headers.get('location')).toBe(`${page}?done=withdrawn`);
    expect((await (await rail.client.request(`/api/v1/briefs/${id}`)).json()).state).toBe('cancelled');
    expect(await (await rail.client.request(page)).text()).not.toContain('Withdraw this brief');

    // A brief in review is the engineer's now: the page offers no withdrawal.
    expect(await (await rail.client.request(`/briefs/${rail.briefId}`)).text()).not.toContain('Withdraw this brief');
  });

  test('the owner deletes a draft for good (its files too); nothing else is deleted and nobody else deletes', async () => {
    const rail = await railUnderReview(baseUrl);
    const draft = await (await rail.client.request('/api/v1/briefs', { method: 'POST', json: { title: 'Draft to delete' } })).json();
    expect((await upload(rail.client, draft.id, { bytes: fixture('photo.png'), name: 'bench.png' })).status).toBe(201);
    const [stored] = await fileRowsOf(draft.id);
    expect(storedFiles()).toContain(stored?.storageKey);

    const other = await new Visitor(baseUrl).signIn(DEMO.otherClient);
    expect((await other.request(`/api/v1/briefs/${draft.id}`, { method: 'DELETE' })).status).toBe(404);
    expect((await rail.engineer.request(`/api/v1/briefs/${draft.id}`, { method: 'DELETE' })).status).toBe(403);
    const submitted = await rail.client.request(`/api/v1/briefs/${rail.briefId}`, { method: 'DELETE' });
    expect(submitted.status).toBe(409);
    expect((await submitted.json()).message).toContain('withdraw');

    expect((await rail.client.request(`/api/v1/briefs/${draft.id}`, { method: 'DELETE' })).status).toBe(204);
    expect((await rail.client.request(`/api/v1/briefs/${draft.id}`)).status).toBe(404);
    expect(await fileRowsOf(draft.id)).toHaveLength(0);
    expect(storedFiles()).not.toContain(stored?.storageKey);
    expect(await execSql(databaseUrl, 'SELECT id FROM state_change WHERE subject_id = ?', [draft.id])).toHaveLength(0);
    expect((await rail.client.request(`/api/v1/briefs/${draft.id}`, { method: 'DELETE' })).status).toBe(404);

    // The list's form does the same after its confirming step.
    const second = await (
      await rail.client.request('/api/v1/briefs', { method: 'POST', json: { title: 'Second draft to delete' } })
    ).json();
    expect(await (await rail.client.request('/briefs')).text()).toContain('Yes, delete the draft');
    const deleted = await form(rail.client, '/briefs', { intent: 'delete', briefId: second.id });
    expect(deleted.status).toBe(303);
    expect(deleted.headers.get('location')).toBe('/briefs?done=deleted');
    expect((await rail.client.request(`/api/v1/briefs/${second.id}`)).status).toBe(404);
  });
});

describe('links and declines', () => {
  test('a brief link opened signed out goes to sign-in and names the way back', async () => {
    const link = '/briefs/new?draft=some-brief';
    const answer = await new Visitor(baseUrl).request(link);
    expect(answer.status).toBe(303);
    expect(answer.headers.get('location')).toBe(`/sign-in?next=${encodeURIComponent(link)}`);
    // A fresh wizard is still open to anyone.
    expect((await new Visitor(baseUrl).request('/briefs/new')).status).toBe(200);
  });

  test('the engineer sees a declined quote’s reason on its desk page and on the review', async () => {
    const rail = await railUnderReview(baseUrl);
    const quote = await (await rail.engineer.request('/api/v1/quotes', { method: 'POST', json: { revisionId: rail.revisionId } })).json();
    expect((await rail.engineer.request(`/api/v1/quotes/${quote.id}/send`, { method: 'POST' })).status).toBe(200);
    const reason = 'Over our budget for this batch; a cheaper linear would do.';
    expect((await rail.client.request(`/api/v1/quotes/${quote.id}/decline`, { method: 'POST', json: { reason } })).status).toBe(200);
    for (const page of [`/desk/quotes/${quote.id}`, `/desk/briefs/${rail.briefId}`]) {
      const html = await (await rail.engineer.request(page)).text();
      expect(html, page).toContain(`“${reason}”`);
    }
  });
});
