/**
 * Sending a brief back for changes: who may, the request reaching the client once by e-mail and
 * in the thread, the client editing and resubmitting, and both versions of the spec kept with
 * the change shown on the review page in the wizard's words.
 */
import { describe, expect, inject, test } from 'vitest';
import { DEMO, Visitor } from '../../support/client';
import { until } from '../payments/helpers';
import { execSql, mailsTo, mailText, RAIL_SPEC, railUnderReview } from '../quotes/helpers';

const baseUrl = inject('baseUrl');
const mailApiUrl = inject('mailApiUrl');
const databaseUrl = inject('databaseUrl');

const REQUEST = 'Please confirm the highest bus voltage: does 36 V include load-dump spikes?';

describe('requesting changes to a brief', () => {
  test('only staff send a brief back, and only with what should change', async () => {
    const rail = await railUnderReview(baseUrl);
    const path = `/api/v1/briefs/${rail.briefId}`;
    const other = await new Visitor(baseUrl).signIn(DEMO.otherClient);
    // A client's body has no such move: refused as it reads (400), before any brief is looked up.
    for (const client of [other, rail.client])
      expect((await client.request(path, { method: 'PATCH', json: { state: 'changes-requested', note: REQUEST } })).status).toBe(400);
    const silent = await rail.engineer.request(path, { method: 'PATCH', json: { state: 'changes-requested', note: '  ' } });
    expect(silent.status).toBe(400);
    expect((await silent.json()).issues[0]).toMatchObject({ path: 'note', message: 'Say what the client should change.' });
    expect((await (await rail.client.request(path)).json()).state).toBe('in-review');
  });

  test('the client is told once, edits in the wizard and resubmits; both specs are kept and the review shows the change', async () => {
    const rail = await railUnderReview(baseUrl);
    const path = `/api/v1/briefs/${rail.briefId}`;
    const sent = await rail.engineer.request(path, { method: 'PATCH', json: { state: 'changes-requested', note: REQUEST } });
    expect(sent.status).toBe(200);
    expect((await sent.json()).state).toBe('changes-requested');
    // Staff cannot take it back into review behind the client's back: the next move is the client's.
    expect((await rail.engineer.request(path, { method: 'PATCH', json: { state: 'in-review' } })).status).toBe(409);

    const mail = await until(
      async () => (await mailsTo(mailApiUrl, rail.email)).filter((m) => m.subject.startsWith('Changes requested')),
      (found) => found.length > 0,
      'the change request e-mail',
    );
    const text = await mailText(mailApiUrl, mail[0]?.id);
    expect(text).toContain(REQUEST);
    expect(text).toContain(`/briefs/new?draft=${rail.briefId}`);
    const thread = (await (await rail.client.request(`${path}/messages`)).json()).items;
    expect(thread.map((m: { body: string; author: { side: string } }) => [m.author.side, m.body])).toEqual([['consultancy', REQUEST]]);

    const wizard = await (await rail.client.request(`/briefs/new?draft=${rail.briefId}`)).text();
    expect(wizard).toContain('The engineer asked for changes');
    expect(wizard).toContain('does 36 V include load-dump spikes?');

    const changed = { ...RAIL_SPEC, input: { ...RAIL_SPEC.input, vMax: 42 } };
    expect((await rail.client.request(path, { method: 'PATCH', json: { spec: changed } })).status).toBe(200);
    const resubmitted = await rail.client.request(path, { method: 'PATCH', json: { spec: changed, submit: true } });
    expect(resubmitted.status).toBe(200);
    expect((await resubmitted.json()).state).toBe('submitted');

    const versions = await execSql(databaseUrl, 'SELECT number, spec FROM brief_spec_version WHERE brief_id = ? ORDER BY number', [
      rail.briefId,
    ]);
    expect(versions.map((v) => [v.number, JSON.parse(String(v.spec)).input.vMax])).toEqual([
      [1, 36],
      [2, 42],
    ]);
    const review = await (await rail.engineer.request(`/desk/briefs/${rail.briefId}`)).text();
    expect(review).toContain('Changed since version 1');
    expect(review).toMatch(/Highest input voltage<\/th>\s*<td>\s*<del[^>]*>36 V<\/del>\s*<\/td>\s*<td>\s*<ins[^>]*>42 V<\/ins>/);
    expect(review).not.toContain('input.vMax');

    const notice = await until(
      async () =>
        (await mailsTo(mailApiUrl, DEMO.engineer)).filter(
          (m) => m.subject === `Brief resubmitted: ${'Valve manifold, 12 V at 2 A from the 24 V bus'}`,
        ),
      (found) => found.length > 0,
      'the resubmission notice',
    );
    expect(notice.length).toBeGreaterThan(0);
    await new Promise((r) => setTimeout(r, 6_000));
    expect((await mailsTo(mailApiUrl, rail.email)).filter((m) => m.subject.startsWith('Changes requested'))).toHaveLength(1);
  });

  test('a brief awaiting changes can be cancelled by its client', async () => {
    const rail = await railUnderReview(baseUrl);
    const path = `/api/v1/briefs/${rail.briefId}`;
    await rail.engineer.request(path, { method: 'PATCH', json: { state: 'changes-requested', note: REQUEST } });
    const cancelled = await rail.client.request(path, { method: 'PATCH', json: { state: 'cancelled' } });
    expect(cancelled.status).toBe(200);
    expect((await cancelled.json()).state).toBe('cancelled');
  });
});
