import { beforeAll, describe, expect, inject, test } from 'vitest';
import { DEMO, Visitor } from '../../support/client';
import { saveRevision, submittedBrief } from './helpers';

const baseUrl = inject('baseUrl');
const mailApiUrl = inject('mailApiUrl');
// Few briefs of our own: every test brief lengthens the desk other tests read.
let plcId: string;
let movingId: string;
beforeAll(async () => {
  plcId = await submittedBrief(baseUrl, 'controller-24v', 'Review test: 5 V from 24 V');
  movingId = await submittedBrief(baseUrl, 'detector-hv', 'Review test: detector bias on the move');
});

describe('revisions compared side by side', () => {
  test('the comparison lists the changed inputs and the key figures of both chosen options', async () => {
    const engineer = await new Visitor(baseUrl).signIn(DEMO.engineer);
    const briefId = plcId;
    const one = await saveRevision(engineer, briefId, { note: 'As briefed' });
    const two = await saveRevision(engineer, briefId, {
      topology: 'buck-boost',
      weights: { efficiency: 3, heat: 2, partCount: 1, noise: 2, cost: 9 },
      overrides: { fswHz: 1_000_000 },
      note: 'Cheaper, faster',
    });

    const response = await engineer.request(`/api/v1/revisions/compare?a=${one.id}&b=${two.id}`);
    expect(response.status).toBe(200);
    const compared = await response.json();
    expect(compared.a).toMatchObject({ number: one.number, note: 'As briefed' });
    expect(compared.b).toMatchObject({ number: two.number, topology: 'buck-boost' });
    expect(compared.inputs).toEqual(
      expect.arrayContaining([
        { path: 'chosen topology', label: 'Chosen option', a: 'Buck (step-down) switcher', b: 'Buck-boost switcher' },
        // Each field by its label, each value with its unit and SI prefix.
        { path: 'overrides.fswHz', label: 'Switching frequency', a: '—', b: '1 MHz' },
        { path: 'weights.cost', label: 'Parts cost weight', a: '2', b: '9' },
      ]),
    );
    // The brief itself did not change between the two.
    expect(compared.inputs.some((c: { path: string }) => c.path.startsWith('output.'))).toBe(false);
    const score = compared.figures.find((f: { key: string }) => f.key === 'score');
    const buck = one.result.options.find((o: { topology: string }) => o.topology === 'buck');
    const buckBoost = two.result.options.find((o: { topology: string }) => o.topology === 'buck-boost');
    // An infeasible option carries no score and says so.
    const scoreText = (value: number | null) => (value === null ? 'not ranked (infeasible)' : value.toFixed(1));
    expect(score).toEqual({ key: 'score', label: 'Score', a: scoreText(buck.score), b: scoreText(buckBoost.score), changed: true });
    expect(compared.figures.find((f: { key: string }) => f.key === 'partCount')).toMatchObject({
      a: String(buck.partCount),
      b: String(buckBoost.partCount),
    });

    const page = await engineer.request(`/desk/briefs/${briefId}/compare?a=${one.id}&b=${two.id}`);
    expect(page.status).toBe(200);
    const html = await page.text();
    expect(html).toContain('overrides.fswHz');
    expect(html).toContain('Cheaper, faster');
  });

  test('revisions of two briefs, unknown ones and missing parameters are refused with a reason', async () => {
    const engineer = await new Visitor(baseUrl).signIn(DEMO.engineer);
    const a = await saveRevision(engineer, plcId, {});
    const b = await saveRevision(engineer, movingId, {});
    const mixed = await engineer.request(`/api/v1/revisions/compare?a=${a.id}&b=${b.id}`);
    expect(mixed.status).toBe(400);
    expect((await mixed.json()).issues[0].message).toBe('Compare two revisions of the same brief.');
    expect((await engineer.request(`/api/v1/revisions/compare?a=${a.id}&b=nope`)).status).toBe(404);
    const missing = await engineer.request(`/api/v1/revisions/compare?a=${a.id}`);
    expect(missing.status).toBe(400);
    expect((await missing.json()).issues[0].path).toBe('b');
  });
});

describe('state moves and internal notes on the review page', () => {
  test('an engineer moves a brief with a reason through the page form; the history records who and why', async () => {
    const engineer = await new Visitor(baseUrl).signIn(DEMO.engineer);
    const briefId = movingId;
    const moved = await engineer.form(`/desk/briefs/${briefId}`, { intent: 'move', state: 'in-review', note: 'Taking this one' });
    expect(moved.status).toBe(303);
    expect(moved.headers.get('location')).toBe(`/desk/briefs/${briefId}?done=moved`);
    const detail = await (await engineer.request(`/api/v1/briefs/${briefId}`)).json();
    expect(detail.state).toBe('in-review');
    expect(detail.history.at(-1)).toMatchObject({ from: 'submitted', to: 'in-review', by: 'Idris Valcourt', note: 'Taking this one' });

    // Only moves open from the current state are offered, and others are refused.
    const html = await (await engineer.request(`/desk/briefs/${briefId}`)).text();
    expect(html).toContain('<option value="declined">');
    // Nothing is chosen for the engineer: the first option asks, and no state is preselected.
    expect(html).toMatch(/<select id="move-state"[^>]*>\s*<option value="" disabled selected>/);
    expect(html).not.toMatch(/<option value="[a-z-]+" selected/);
    expect(html).not.toContain('<option value="in-review">');
    const wrong = await engineer.form(`/desk/briefs/${briefId}`, { intent: 'move', state: 'delivered', note: '' });
    expect(wrong.status).toBe(409);
    expect(await wrong.text()).toContain('cannot move to delivered');
  });

  test('declining through the page takes the confirming tick; without it nothing changes', async () => {
    const engineer = await new Visitor(baseUrl).signIn(DEMO.engineer);
    const briefId = movingId;
    const html = await (await engineer.request(`/desk/briefs/${briefId}`)).text();
    expect(html).toContain('Yes, decline this brief.');
    const unconfirmed = await engineer.form(`/desk/briefs/${briefId}`, { intent: 'move', state: 'declined', note: 'Out of scope' });
    expect(unconfirmed.status).toBe(400);
    expect(await unconfirmed.text()).toContain('tick “Yes, decline this brief” to confirm');
    expect((await (await engineer.request(`/api/v1/briefs/${briefId}`)).json()).state).toBe('in-review');
    const confirmed = await engineer.form(`/desk/briefs/${briefId}`, {
      intent: 'move',
      state: 'declined',
      note: 'Out of scope',
      confirm: 'yes',
    });
    expect(confirmed.status).toBe(303);
    expect((await (await engineer.request(`/api/v1/briefs/${briefId}`)).json()).state).toBe('declined');
  });

  test('notes are kept for staff through the API and the page, and never reach the client', async () => {
    const engineer = await new Visitor(baseUrl).signIn(DEMO.engineer);
    const briefId = plcId;
    const secret = 'Margin is thin; ask about the cabinet fan before quoting.';
    const posted = await engineer.request(`/api/v1/briefs/${briefId}/notes`, { method: 'POST', json: { body: secret } });
    expect(posted.status).toBe(201);
    expect(await posted.json()).toMatchObject({ body: secret, author: 'Idris Valcourt' });
    const viaPage = await engineer.form(`/desk/briefs/${briefId}`, { intent: 'note', body: 'Second thought from the page.' });
    expect(viaPage.status).toBe(303);
    const notes = (await (await engineer.request(`/api/v1/briefs/${briefId}/notes`)).json()).items.map((n: { body: string }) => n.body);
    expect(notes).toEqual(['Second thought from the page.', secret]);

    const empty = await engineer.request(`/api/v1/briefs/${briefId}/notes`, { method: 'POST', json: { body: '   ' } });
    expect(empty.status).toBe(400);
    expect((await empty.json()).issues[0]).toEqual({ path: 'body', message: 'Write something in the note.' });

    const owner = await new Visitor(baseUrl).signIn(DEMO.client);
    expect(JSON.stringify(await (await owner.request(`/api/v1/briefs/${briefId}`)).json())).not.toContain('cabinet fan');
    expect(await (await owner.request(`/briefs/${briefId}`)).text()).not.toContain('cabinet fan');
    expect((await owner.request(`/api/v1/briefs/${briefId}/notes`)).status).toBe(403);
  });
});

describe('the arrival e-mail', () => {
  test('tells the engineers about a submitted brief with a link to its review page', async () => {
    const briefId = plcId;
    const list = await (await fetch(`${mailApiUrl}/messages?to=${DEMO.engineer}`)).json();
    const summary = (Array.isArray(list) ? list : list.messages).find(
      (m: { subject: string }) => m.subject === 'New brief: Review test: 5 V from 24 V',
    );
    const message = await (await fetch(`${mailApiUrl}/messages/${summary.id}`)).json();
    expect(message.text).toContain(`${baseUrl}/desk/briefs/${briefId}`);
    const engineer = await new Visitor(baseUrl).signIn(DEMO.engineer);
    expect((await engineer.request(`/desk/briefs/${briefId}`)).status).toBe(200);
  });
});
