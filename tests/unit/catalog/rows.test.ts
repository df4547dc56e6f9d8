import { describe, expect, test } from 'vitest';
import { catalogSchema, defaultCatalog } from '../../../src/lib/engine/catalog';
import { catalogToRows, draftFromRows, rowsToCatalog, upgradedRows } from '../../../src/lib/catalog/rows';

describe('device-class catalog as table rows', () => {
  test('the default catalog survives the round trip unchanged', () => {
    const rows = catalogToRows(defaultCatalog);
    expect(new Set(rows.map((r) => r.id)).size).toBe(rows.length);
    expect(rowsToCatalog(rows)).toEqual(defaultCatalog);
  });

  test('an edited row with a bad figure is refused with the field named', () => {
    const rows = catalogToRows(defaultCatalog).map((row) =>
      row.kind === 'thermal' ? { ...row, params: { ...(row.params as object), thetaCsCW: -1 } } : row,
    );
    expect(() => rowsToCatalog(rows)).toThrow(/thetaCsCW/);
  });
});

describe('a stored catalog brought up to the shipped one', () => {
  const shipped = catalogToRows(defaultCatalog);

  test('an older catalog gains the classes it lacks and the fields a class gained; stored figures stay', () => {
    const [first, second, ...rest] = shipped;
    if (!first || !second) throw new Error('the shipped catalog is empty');
    // An older version: one class missing, one class without a field it now has, and an admin's edit.
    const params = first.params as Record<string, unknown>;
    const [dropped] = Object.keys(params).filter((key) => key !== 'id' && key !== 'label');
    const older = { ...first, params: Object.fromEntries(Object.entries(params).filter(([key]) => key !== dropped)) };
    const edited = { ...second, params: { ...(second.params as Record<string, unknown>), label: 'Edited by an admin' } };
    const stored = [older, edited, ...rest.slice(1)];

    const { rows, added, filled } = upgradedRows(stored, shipped);
    expect(added).toEqual([rest[0]?.id]);
    expect(filled).toEqual([first.id]);
    expect(rows.find((r) => r.id === first.id)?.params).toEqual(first.params);
    expect((rows.find((r) => r.id === second.id)?.params as { label: string }).label).toBe('Edited by an admin');
    expect(catalogSchema.safeParse(draftFromRows(rows)).success).toBe(true);
  });

  test('the shipped catalog itself needs nothing', () => {
    expect(upgradedRows(shipped, shipped)).toMatchObject({ added: [], filled: [] });
  });
});
