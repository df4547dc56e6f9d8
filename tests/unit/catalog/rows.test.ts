import { describe, expect, test } from 'vitest';
import { defaultCatalog } from '../../../src/lib/engine/catalog';
import { catalogToRows, rowsToCatalog } from '../../../src/lib/catalog/rows';

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
