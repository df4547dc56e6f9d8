// The schematic download of a saved revision: an SVG naming every part of the chosen design, for
// staff at once and for the brief's owner only once a quote for that revision has been sent.
import { describe, expect, inject, test } from 'vitest';
import { DEMO, Visitor } from '../../support/client';
import { railUnderReview } from '../quotes/helpers';
import { saveRevision } from './helpers';

const baseUrl = inject('baseUrl');

describe('schematic download', () => {
  test('staff get the SVG with every part reference; the owner gets it once a quote for the revision is sent, nobody else', async () => {
    const rail = await railUnderReview(baseUrl);
    const saved = await saveRevision(rail.engineer, rail.briefId, { topology: 'linear', note: 'Drawn for the client' });
    const path = `/api/v1/revisions/${saved.id}/schematic.svg`;

    const response = await rail.engineer.request(path);
    expect(response.status).toBe(200);
    expect(response.headers.get('content-type')).toBe('image/svg+xml; charset=utf-8');
    expect(response.headers.get('content-disposition')).toBe(
      `attachment; filename="valve-manifold-12-v-at-2-a-from-the-24-v-bus-rev${saved.number}.svg"`,
    );
    const svg = await response.text();
    expect(svg).toMatch(/^<\?xml version="1\.0" encoding="UTF-8"\?>\n<svg xmlns="http:\/\/www\.w3\.org\/2000\/svg"/);
    const chosen = saved.result.options.find((o: { topology: string }) => o.topology === 'linear');
    expect(chosen.components.length).toBeGreaterThan(2);
    for (const c of chosen.components as { ref: string }[]) expect(svg).toContain(`data-ref="${c.ref}"`);

    const other = await new Visitor(baseUrl).signIn(DEMO.otherClient);
    expect((await rail.client.request(path)).status).toBe(404);
    expect((await other.request(path)).status).toBe(404);
    expect((await new Visitor(baseUrl).request(path)).status).toBe(401);

    // The linear option runs too hot for this rail, so quoting it takes a reason.
    const drafted = await (
      await rail.engineer.request('/api/v1/quotes', {
        method: 'POST',
        json: { revisionId: saved.id, infeasibleReason: 'Drawn for the client to compare' },
      })
    ).json();
    expect((await rail.client.request(path)).status).toBe(404);
    expect(await (await rail.client.request(`/briefs/${rail.briefId}`)).text()).not.toContain('data-testid="brief-drawing"');
    expect((await rail.engineer.request(`/api/v1/quotes/${drafted.id}/send`, { method: 'POST' })).status).toBe(200);
    const owned = await rail.client.request(path);
    expect(owned.status).toBe(200);
    expect(await owned.text()).toBe(svg);
    expect((await other.request(path)).status).toBe(404);
    // The client's brief page and quote page draw the quoted design, each part with its reference.
    for (const [page, figure] of [
      [`/briefs/${rail.briefId}`, 'brief-drawing'],
      [`/quotes/${drafted.id}`, 'design-drawing'],
    ]) {
      const html = await (await rail.client.request(page!)).text();
      expect(html).toContain(`data-testid="${figure}"`);
      for (const c of chosen.components as { ref: string }[]) expect(html).toContain(`data-ref="${c.ref}"`);
      expect(html).toMatch(/<svg [^>]*role="img"/);
    }
    // The brief's first revision has no quote of its own: still closed to the client.
    expect((await rail.client.request(`/api/v1/revisions/${rail.revisionId}/schematic.svg`)).status).toBe(404);
  });
});
