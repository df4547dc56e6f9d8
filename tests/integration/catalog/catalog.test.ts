import { describe, expect, inject, test } from 'vitest';
import { eq } from 'drizzle-orm';
import { connect } from '../../../src/lib/platform/db/connect';
import { deviceClass } from '../../../src/lib/platform/db/schema';
import { DEMO, Visitor } from '../../support/client';

const baseUrl = inject('baseUrl');
const databaseUrl = inject('databaseUrl');

const SPEC = {
  input: { vMin: 10.8, vNom: 12, vMax: 13.2, rippleVpp: 0.1, source: 'adapter' },
  output: { v: 5, tolerance: 0.05, iMin: 0.05, iTyp: 0.3, iMax: 0.6 },
  noise: { class: 'digital' },
  thermal: { ambientMaxC: 45, airflow: 'still-air' },
};

async function thermalRow() {
  const { db, client } = connect(databaseUrl);
  const [row] = await db.select().from(deviceClass).where(eq(deviceClass.id, 'thermal'));
  client.close();
  return row as { id: string; params: { thetaCsCW: number; tjMarginK: number } };
}

describe('device catalog (admin)', () => {
  test('only admins reach it', async () => {
    const engineer = await new Visitor(baseUrl).signIn(DEMO.engineer);
    expect((await engineer.request('/admin/catalog')).status).toBe(403);
    const admin = await new Visitor(baseUrl).signIn(DEMO.admin);
    const page = await (await admin.request('/admin/catalog')).text();
    expect(page).toContain('typical values — confirm them against the chosen part');
    expect(page).toContain('Thermal assumptions');
  });

  test('a bad edit is refused with the field named and changes nothing; a good one reaches the next evaluation', async () => {
    const admin = await new Visitor(baseUrl).signIn(DEMO.admin);
    const before = await thermalRow();
    const broken = await admin.form('/admin/catalog', { id: 'thermal', params: '{"thetaCsCW": 0.5,' });
    expect(broken.status).toBe(400);
    expect(await broken.text()).toContain('not valid JSON');
    const negative = await admin.form('/admin/catalog', { id: 'thermal', params: JSON.stringify({ ...before.params, tjMarginK: -5 }) });
    expect(negative.status).toBe(400);
    expect(await negative.text()).toContain('tjMarginK');
    expect((await thermalRow()).params).toEqual(before.params);

    const evaluateMargin = async () => {
      const result = await (await new Visitor(baseUrl).request('/api/v1/evaluate', { method: 'POST', json: SPEC })).json();
      const linear = result.options.find((o: { topology: string }) => o.topology === 'linear');
      return linear.heatsink.maxThetaSaCW as number | null;
    };
    const sinkBefore = await evaluateMargin();
    try {
      // A larger junction margin leaves less room for the heatsink: θSA,max = (Tj,max − margin − Ta)/P − θJC − θCS.
      const saved = await admin.form('/admin/catalog', {
        id: 'thermal',
        params: JSON.stringify({ ...before.params, tjMarginK: before.params.tjMarginK + 20 }),
      });
      expect(saved.status).toBe(303);
      expect(await (await admin.follow(saved)).text()).toContain('Saved.');
      const sinkAfter = await evaluateMargin();
      expect(sinkBefore).not.toBeNull();
      expect(sinkAfter).not.toBeNull();
      expect(sinkAfter ?? 0).toBeLessThan(sinkBefore ?? 0);
    } finally {
      await admin.form('/admin/catalog', { id: 'thermal', params: JSON.stringify(before.params) });
    }
    expect(await evaluateMargin()).toBe(sinkBefore);
  });
});
