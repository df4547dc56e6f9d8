/**
 * The thread on a brief between its client and the consultancy: who reads and writes it, each
 * message e-mailed once to the other side with its link, and kept apart from the internal notes.
 */
import { describe, expect, inject, test } from 'vitest';
import { DEMO, Visitor } from '../../support/client';
import { until } from '../payments/helpers';
import { execSql, mailsTo, mailText, railUnderReview } from '../quotes/helpers';

const baseUrl = inject('baseUrl');
const mailApiUrl = inject('mailApiUrl');
const databaseUrl = inject('databaseUrl');

describe('the message thread of a brief', () => {
  test('who may read and write it', async () => {
    const rail = await railUnderReview(baseUrl);
    const path = `/api/v1/briefs/${rail.briefId}/messages`;
    const anonymous = new Visitor(baseUrl);
    const other = await new Visitor(baseUrl).signIn(DEMO.otherClient);
    const admin = await new Visitor(baseUrl).signIn(DEMO.admin);
    expect((await anonymous.request(path)).status).toBe(401);
    expect((await anonymous.request(path, { method: 'POST', json: { body: 'hello' } })).status).toBe(401);
    expect((await other.request(path)).status).toBe(404);
    expect((await other.request(path, { method: 'POST', json: { body: 'hello' } })).status).toBe(404);
    for (const reader of [rail.client, rail.engineer, admin]) expect((await reader.request(path)).status).toBe(200);
    const blank = await rail.client.request(path, { method: 'POST', json: { body: '  ' } });
    expect(blank.status).toBe(400);
    expect((await blank.json()).issues[0]).toMatchObject({ path: 'body', message: 'Write your message.' });
    expect((await rail.client.request(path, { method: 'POST', json: { body: 'hi', authorId: 'x' } })).status).toBe(400);

    // A draft is not seen by the consultancy yet, so nobody writes on it.
    const draft = await rail.client.request('/api/v1/briefs', { method: 'POST', json: { title: 'Thread on a draft' } });
    const draftId = (await draft.json()).id;
    const refused = await rail.client.request(`/api/v1/briefs/${draftId}/messages`, { method: 'POST', json: { body: 'hello' } });
    expect(refused.status).toBe(409);
    expect((await refused.json()).message).toContain('submit it');
  });

  test('a question and its answer: each e-mailed once to the other side with the link, both sides read both, notes stay apart', async () => {
    const rail = await railUnderReview(baseUrl);
    const path = `/api/v1/briefs/${rail.briefId}/messages`;
    const asked = await rail.client.request(path, {
      method: 'POST',
      json: { body: 'Can the rail start at 16 V?\nOur bus sags on cranking.' },
    });
    expect(asked.status).toBe(201);
    expect(await asked.json()).toMatchObject({
      body: 'Can the rail start at 16 V?\nOur bus sags on cranking.',
      author: { side: 'client' },
    });

    // The engineer who saved the revision is told, with the review page's link.
    const questionMail = await until(
      async () => (await mailsTo(mailApiUrl, DEMO.engineer)).filter((m) => m.subject.includes(rail.name)),
      (found) => found.length > 0,
      'the question e-mail',
    );
    const questionText = await mailText(mailApiUrl, questionMail[0]?.id);
    expect(questionText).toContain('Our bus sags on cranking.');
    expect(questionText).toContain(`/desk/briefs/${rail.briefId}#messages`);

    const answered = await rail.engineer.request(path, { method: 'POST', json: { body: 'Yes: the buck runs down to 16 V with margin.' } });
    expect(answered.status).toBe(201);
    const answerMail = await until(
      async () => (await mailsTo(mailApiUrl, rail.email)).filter((m) => m.subject.startsWith('Message on')),
      (found) => found.length > 0,
      'the answer e-mail',
    );
    const answerText = await mailText(mailApiUrl, answerMail[0]?.id);
    expect(answerText).toContain('the buck runs down to 16 V');
    expect(answerText).toContain(`/briefs/${rail.briefId}#messages`);
    expect(answerText).not.toContain('/desk/');

    // Exactly once each, even after the outbox poller has had its turn.
    await new Promise((r) => setTimeout(r, 6_000));
    expect((await mailsTo(mailApiUrl, DEMO.engineer)).filter((m) => m.subject.includes(rail.name))).toHaveLength(1);
    expect((await mailsTo(mailApiUrl, rail.email)).filter((m) => m.subject.startsWith('Message on'))).toHaveLength(1);
    const outbox = await execSql(databaseUrl, "SELECT state FROM mail_outbox WHERE related_id = ? AND kind = 'brief-message'", [
      rail.briefId,
    ]);
    expect(outbox).toEqual([{ state: 'sent' }, { state: 'sent' }]);

    await rail.engineer.request(`/api/v1/briefs/${rail.briefId}/notes`, { method: 'POST', json: { body: 'Internal: margin is thin.' } });
    for (const reader of [rail.client, rail.engineer]) {
      const { items } = await (await reader.request(path)).json();
      expect(items.map((m: { author: { side: string } }) => m.author.side)).toEqual(['client', 'consultancy']);
      expect(JSON.stringify(items)).not.toContain('margin is thin');
    }
    const clientPage = await (await rail.client.request(`/briefs/${rail.briefId}`)).text();
    expect(clientPage).toContain('the buck runs down to 16 V');
    expect(clientPage).not.toContain('margin is thin');
    expect(await (await rail.engineer.request(`/desk/briefs/${rail.briefId}`)).text()).toContain('Our bus sags on cranking.');
  });
});
