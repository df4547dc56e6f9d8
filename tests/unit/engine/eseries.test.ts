import { describe, expect, test } from 'vitest';
import { E_SERIES, seriesRange, snap } from '~/lib/engine/eseries.ts';

describe('IEC 60063 preferred-number series', () => {
  test('series lengths are 6, 12, 24, 48 and 96 values per decade (IEC 60063)', () => {
    expect(E_SERIES.E6).toHaveLength(6);
    expect(E_SERIES.E12).toHaveLength(12);
    expect(E_SERIES.E24).toHaveLength(24);
    expect(E_SERIES.E48).toHaveLength(48);
    expect(E_SERIES.E96).toHaveLength(96);
  });

  test('E12 values (IEC 60063)', () => {
    expect(E_SERIES.E12).toEqual([1.0, 1.2, 1.5, 1.8, 2.2, 2.7, 3.3, 3.9, 4.7, 5.6, 6.8, 8.2]);
  });

  test('E24 members that differ from the rounded geometric sequence (IEC 60063)', () => {
    // 10^(k/24) rounded to two figures gives 2.6, 2.9, 3.2, 3.5, 3.8, 4.2, 4.6, 8.3; the standard keeps these instead.
    for (const v of [2.7, 3.0, 3.3, 3.6, 3.9, 4.3, 4.7, 8.2]) expect(E_SERIES.E24).toContain(v);
    for (const v of [2.6, 2.9, 3.2, 3.5, 3.8, 4.2, 4.6, 8.3]) expect(E_SERIES.E24).not.toContain(v);
    const geometric = Array.from({ length: 24 }, (_, k) => Number((10 ** (k / 24)).toFixed(1)));
    const differing = E_SERIES.E24.filter((v, k) => v !== geometric[k]);
    expect(differing).toEqual([2.7, 3.0, 3.3, 3.6, 3.9, 4.3, 4.7, 8.2]);
  });

  test('E96 spot values (IEC 60063)', () => {
    for (const v of [1.0, 1.02, 1.05, 1.5, 2.49, 4.99, 7.5, 9.76]) expect(E_SERIES.E96).toContain(v);
    expect(E_SERIES.E96).not.toContain(1.01);
    expect(E_SERIES.E96[E_SERIES.E96.length - 1]).toBe(9.76);
  });

  test('E48 is every second member of E96 (IEC 60063 builds the 1 % series on the 2 % one)', () => {
    expect(E_SERIES.E96.filter((_, k) => k % 2 === 0)).toEqual(E_SERIES.E48);
  });

  test('every series is strictly increasing inside one decade', () => {
    for (const table of Object.values(E_SERIES)) {
      for (let k = 1; k < table.length; k += 1) expect(table[k]!).toBeGreaterThan(table[k - 1]!);
      expect(table[0]).toBe(1);
      expect(table[table.length - 1]!).toBeLessThan(10);
    }
  });

  test('snapping nearest, down and up across decades', () => {
    expect(snap(4700, 'E12')).toBe(4700);
    expect(snap(4699.999999, 'E24')).toBe(4700);
    expect(snap(233.3, 'E24', 'down')).toBe(220);
    expect(snap(233.3, 'E24', 'up')).toBe(240);
    expect(snap(125, 'E96', 'down')).toBe(124);
    expect(snap(9.9, 'E12', 'up')).toBe(10);
    expect(snap(0.0000219, 'E6', 'nearest')).toBeCloseTo(22e-6, 12);
    expect(snap(370.17, 'E96', 'nearest')).toBe(374);
  });

  test('a range lists series members across decades', () => {
    expect(seriesRange('E6', 1, 100)).toEqual([1, 1.5, 2.2, 3.3, 4.7, 6.8, 10, 15, 22, 33, 47, 68, 100]);
  });
});
