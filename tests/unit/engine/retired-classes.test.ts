// A retired device class stays in the catalog (saved revisions name it) but no new design chooses it.
import { describe, expect, test } from 'vitest';
import { catalogSchema, defaultCatalog, evaluate, railSpecSchema, type Catalog } from '~/lib/engine/index.ts';

const spec = railSpecSchema.parse({
  input: { vMin: 10.8, vNom: 12, vMax: 13.2, rippleVpp: 0.1, source: 'adapter' },
  output: { v: 5, tolerance: 0.05, iMin: 0.05, iTyp: 0.3, iMax: 0.6 },
  noise: { class: 'digital' },
  thermal: { ambientMaxC: 45, airflow: 'still-air' },
});

const partsOf = (catalog: Catalog) => evaluate(spec, catalog).options.flatMap((o) => o.components.map((c) => c.part));

describe('retired device classes', () => {
  const chosen = defaultCatalog.linearRegulators.find((cls) => partsOf(defaultCatalog).includes(cls.label));

  test('a regulator class the engine chose is never chosen once it is retired', () => {
    expect(chosen).toBeDefined();
    const retiring: Catalog = {
      ...defaultCatalog,
      linearRegulators: defaultCatalog.linearRegulators.map((cls) => (cls.id === chosen?.id ? { ...cls, retired: true } : cls)),
    };
    expect(catalogSchema.safeParse(retiring).success).toBe(true);
    const parts = partsOf(retiring);
    expect(parts).not.toContain(chosen?.label);
    // The rail is still designed, from the classes left in use.
    expect(evaluate(spec, retiring).recommended).not.toBeNull();
  });

  test('the catalog check refuses retiring every class of a kind, naming the kind', () => {
    const none = { ...defaultCatalog, switchers: defaultCatalog.switchers.map((cls) => ({ ...cls, retired: true })) };
    const checked = catalogSchema.safeParse(none);
    expect(checked.success).toBe(false);
    expect(checked.error?.issues[0]?.path).toEqual(['switchers']);
    expect(checked.error?.issues[0]?.message).toBe('keep at least one class of this kind in use');
  });

  test('two classes of one kind cannot share an id', () => {
    const [first] = defaultCatalog.zenerSeries;
    const twice = { ...defaultCatalog, zenerSeries: [...defaultCatalog.zenerSeries, { ...first, label: 'Copy' }] };
    const checked = catalogSchema.safeParse(twice);
    expect(checked.success).toBe(false);
    expect(checked.error?.issues[0]?.path).toEqual(['zenerSeries', defaultCatalog.zenerSeries.length, 'id']);
  });
});
