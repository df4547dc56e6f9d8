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
    const broken = await admin.form('/admin/catalog', { intent: 'json', id: 'thermal', params: '{"thetaCsCW": 0.5,' });
    expect(broken.status).toBe(400);
    expect(await broken.text()).toContain('not valid JSON');
    const negative = await admin.form('/admin/catalog', {
      intent: 'json',
      id: 'thermal',
      params: JSON.stringify({ ...before.params, tjMarginK: -5 }),
    });
    expect(negative.status).toBe(400);
    expect(await negative.text()).toContain('Not saved: Thermal assumptions — Margin kept below the junction limit: must not be negative.');
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
        intent: 'json',
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
      await admin.form('/admin/catalog', { intent: 'json', id: 'thermal', params: JSON.stringify(before.params) });
    }
    expect(await evaluateMargin()).toBe(sinkBefore);
  });
});

async function classRow(id: string) {
  const { db, client } = connect(databaseUrl);
  const [row] = await db.select().from(deviceClass).where(eq(deviceClass.id, id));
  client.close();
  return row as { id: string; name: string; params: Record<string, unknown> } | undefined;
}

/** Every figure of a class as its edit form posts it (a ticked box as `on`). */
async function formOf(admin: Visitor, id: string): Promise<Record<string, string>> {
  const page = await (await admin.request(`/admin/catalog?class=${encodeURIComponent(id)}`)).text();
  const fields: Record<string, string> = { intent: 'edit', id };
  for (const [, name, value] of page.matchAll(/<input[^>]*?name="(f\.[^"]+)"[^>]*?value="([^"]*)"/g)) fields[name ?? ''] = value ?? '';
  for (const [, name] of page.matchAll(/<input type="checkbox"[^>]*?name="(f\.[^"]+)"[^>]*?checked/g)) fields[name ?? ''] = 'on';
  for (const [, name, body] of page.matchAll(/<select[^>]*?name="(f\.[^"]+)"[^>]*>([\s\S]*?)<\/select>/g))
    fields[name ?? ''] = /<option value="([^"]*)" selected/.exec(body ?? '')?.[1] ?? '';
  return fields;
}

const partsOf = async () => {
  const result = await (await new Visitor(baseUrl).request('/api/v1/evaluate', { method: 'POST', json: SPEC })).json();
  return (result.options as { components: { part: string }[] }[]).flatMap((o) => o.components.map((c) => c.part));
};

describe('device catalog as forms', () => {
  test('the list groups the classes by kind and links each to its form', async () => {
    const admin = await new Visitor(baseUrl).signIn(DEMO.admin);
    const page = await (await admin.request('/admin/catalog')).text();
    expect(page).toMatch(/<h2 id="kind-linearRegulators"[^>]*>\s*Linear regulators/);
    expect(page).toContain('href="/admin/catalog?class=thermal"');
    const form = await (await admin.request('/admin/catalog?class=thermal')).text();
    expect(form).toContain('Margin kept below the junction limit');
    expect(form).toContain('θCS, case to sink (interface)');
    expect(form).toContain('Advanced: the figures as JSON');
    expect((await admin.request('/admin/catalog?class=nothing')).status).toBe(404);
  });

  test('a bad figure is refused beside its field, keeps what was typed and names the class; a good one is saved', async () => {
    const admin = await new Visitor(baseUrl).signIn(DEMO.admin);
    const before = await thermalRow();
    const fields = await formOf(admin, 'thermal');
    expect(fields['f.tjMarginK']).toBe(String(before.params.tjMarginK));
    const refused = await admin.form('/admin/catalog?class=thermal', { ...fields, 'f.tjMarginK': '-5' });
    expect(refused.status).toBe(400);
    const page = await refused.text();
    expect(page).toMatch(/id="field-f-tjMarginK-error"[^>]*>[\s\S]*?Must not be negative\./);
    expect(page).toMatch(/name="f\.tjMarginK"[^>]*value="-5"/);
    expect(page).toContain('Not saved: Thermal assumptions — Margin kept below the junction limit: must not be negative.');
    const words = await admin.form('/admin/catalog?class=thermal', { ...fields, 'f.thetaCsCW': 'half' });
    expect(words.status).toBe(400);
    expect(await words.text()).toContain('“half” is not a number');
    expect((await thermalRow()).params).toEqual(before.params);

    try {
      const saved = await admin.form('/admin/catalog?class=thermal', { ...fields, 'f.tjMarginK': '12,5' });
      expect(saved.status).toBe(303);
      expect(saved.headers.get('location')).toBe('/admin/catalog?class=thermal&done=saved');
      expect((await thermalRow()).params).toEqual({ ...before.params, tjMarginK: 12.5 });
    } finally {
      await admin.form('/admin/catalog', { intent: 'json', id: 'thermal', params: JSON.stringify(before.params) });
    }
  });

  test('a copy, an added class and retiring: the engine stops choosing a retired class; the last of a kind stays in use', async () => {
    const admin = await new Visitor(baseUrl).signIn(DEMO.admin);
    const { db, client } = connect(databaseUrl);
    const regulators = await db.select().from(deviceClass).where(eq(deviceClass.kind, 'linearRegulators'));
    const switchers = await db.select().from(deviceClass).where(eq(deviceClass.kind, 'switchers'));
    client.close();
    const parts = await partsOf();
    const chosen = regulators.find((row) => parts.includes(row.name));
    expect(chosen).toBeDefined();
    const chosenId = chosen?.id ?? '';

    const copied = await admin.form(`/admin/catalog?class=${chosenId}`, {
      intent: 'copy',
      id: chosenId,
      label: 'Bench regulator, second source',
    });
    expect(copied.status).toBe(303);
    expect(copied.headers.get('location')).toBe('/admin/catalog?class=linearRegulators%3Abench-regulator-second-source&done=copied');
    const copy = await classRow('linearRegulators:bench-regulator-second-source');
    expect(copy?.params).toMatchObject({
      ...(chosen?.params as object),
      id: 'bench-regulator-second-source',
      label: 'Bench regulator, second source',
    });

    const added = await admin.form('/admin/catalog', { intent: 'add', kind: 'zenerSeries', label: 'Glass Zener, 0.4 W' });
    expect(added.status).toBe(303);
    expect((await classRow('zenerSeries:glass-zener-0-4-w'))?.name).toBe('Glass Zener, 0.4 W');

    try {
      const retired = await admin.form(`/admin/catalog?class=${chosenId}`, { intent: 'retire', id: chosenId });
      expect(retired.status).toBe(303);
      expect(await (await admin.follow(retired)).text()).toContain('⊘ Retired');
      // The copy carries the same figures under its own name, so the engine may choose it instead.
      const after = await partsOf();
      expect(after).not.toContain(chosen?.name);
      expect((await classRow(chosenId))?.params.retired).toBe(true);
    } finally {
      expect((await admin.form(`/admin/catalog?class=${chosenId}`, { intent: 'restore', id: chosenId })).status).toBe(303);
    }
    expect((await classRow(chosenId))?.params).toEqual(chosen?.params);

    // Retiring every switcher stage but one works; the last one is refused with the kind named.
    const retiredHere: string[] = [];
    try {
      for (const row of switchers.slice(1)) {
        expect((await admin.form('/admin/catalog', { intent: 'retire', id: row.id })).status).toBe(303);
        retiredHere.push(row.id);
      }
      const last = await admin.form('/admin/catalog', { intent: 'retire', id: switchers[0]?.id ?? '' });
      expect(last.status).toBe(400);
      expect(await last.text()).toContain('Not saved: Switcher stages — keep at least one class of this kind in use.');
    } finally {
      for (const id of retiredHere) await admin.form('/admin/catalog', { intent: 'restore', id });
    }
    for (const id of ['linearRegulators:bench-regulator-second-source', 'zenerSeries:glass-zener-0-4-w']) {
      expect((await admin.form('/admin/catalog', { intent: 'retire', id })).status).toBe(303);
    }
  });
});
