import { describe, expect, inject, test } from 'vitest';
import { pdfText, railUnderReview } from './helpers';

const baseUrl = inject('baseUrl');

describe('a requirement relaxed with the client’s agreement', () => {
  test('the revision records what it was designed to, and the quote and its PDF state it beside the brief', async () => {
    const rail = await railUnderReview(baseUrl);
    const saved = await rail.engineer.request(`/api/v1/briefs/${rail.briefId}/revisions`, {
      method: 'POST',
      json: { requirement: { tolerance: 0.05, maxRippleVpp: 0.2 }, note: 'Client agreed to ±5 % and 200 mV on the phone' },
    });
    expect(saved.status).toBe(201);
    const revision = await saved.json();
    expect(revision.input.output.tolerance).toBe(0.05);
    expect(revision.input.noise.maxRippleVpp).toBe(0.2);

    const list = await (await rail.engineer.request(`/api/v1/briefs/${rail.briefId}/revisions`)).json();
    const listed = list.items.find((r: { id: string }) => r.id === revision.id);
    expect(listed.requirement).toEqual({ tolerance: 0.05, maxRippleVpp: 0.2 });
    // The revision saved as briefed departs from nothing.
    expect(list.items.find((r: { id: string }) => r.id === rail.revisionId).requirement).toEqual({});

    const drafted = await rail.engineer.request('/api/v1/quotes', { method: 'POST', json: { revisionId: revision.id } });
    expect(drafted.status).toBe(201);
    const quote = await drafted.json();
    const pdf = await rail.engineer.request(`/api/v1/quotes/${quote.id}/pdf`);
    expect(pdf.status).toBe(200);
    const text = pdfText(new Uint8Array(await pdf.arrayBuffer())).replace(/\s+/g, ' ');
    expect(text).toContain('12 V ± 5 % — agreed with the client (brief: 12 V ± 3 %)');
    expect(text).toContain('agreed with the client (brief: 50 mVpp)');
  });

  test('a relaxed figure the spec cannot take is refused with its field and nothing is saved', async () => {
    const rail = await railUnderReview(baseUrl);
    const refused = await rail.engineer.request(`/api/v1/briefs/${rail.briefId}/revisions`, {
      method: 'POST',
      json: { requirement: { tolerance: 0.9 } },
    });
    expect(refused.status).toBe(400);
    const body = await refused.json();
    expect(body.issues).toEqual(expect.arrayContaining([expect.objectContaining({ path: 'output.tolerance' })]));
    const list = await (await rail.engineer.request(`/api/v1/briefs/${rail.briefId}/revisions`)).json();
    expect(list.items).toHaveLength(1);
  });
});
