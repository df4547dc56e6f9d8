import { describe, expect, test } from 'vitest';
import { catalogSchema, defaultCatalog } from '~/lib/engine/catalog.ts';
import { extremeValues, monteCarlo, nominalValue, type ToleranceModel } from '~/lib/engine/tolerance.ts';
import { designDivider, dividerModel } from '~/lib/engine/topologies/feedback.ts';

const uniform: ToleranceModel = {
  params: [{ name: 'x', nominal: 0.5, lo: 0, hi: 1 }],
  f: (x) => x[0]!,
  batch: ({ u, lo, span }, out) => {
    for (let i = 0; i < out.length; i += 1) out[i] = lo[0]! + span[0]! * u[0]![i]!;
  },
};

describe('Monte Carlo against the uniform distribution’s known moments (mean ½, σ = 1/√12)', () => {
  test('10 000 draws land within a few standard errors of the moments', () => {
    const r = monteCarlo(uniform, 10_000, 42, { lo: 0, hi: 0.25 }, { min: 0, max: 1 });
    // Standard error of the mean: 0.2887/√10⁴ = 0.0029; of the fraction ¼: √(¼·¾/10⁴) = 0.0043.
    expect(Math.abs(r.mean - 0.5)).toBeLessThan(4 * 0.0029);
    expect(Math.abs(r.sigma - 1 / Math.sqrt(12))).toBeLessThan(0.005);
    expect(Math.abs(r.fractionInTolerance - 0.25)).toBeLessThan(4 * 0.0043);
    expect(r.histogram.counts.reduce((a, b) => a + b, 0)).toBe(10_000);
    // Each of the 20 bins expects 500 draws; σ of a bin count ≈ √(500·0.95) = 21.8.
    for (const c of r.histogram.counts) expect(Math.abs(c - 500)).toBeLessThan(5 * 21.8);
  });

  test('a run too long to keep its numbers generates the same ones the kept stream holds', () => {
    // One parameter of 2¹⁷ draws reads the kept stream; a second, ignored parameter makes the run
    // twice as long, so it generates its numbers instead: the first column must not change.
    const draws = 1 << 17;
    const kept = monteCarlo(uniform, draws, 11, { lo: 0, hi: 0.3 }, { min: 0, max: 1 });
    const firstOfTwo: ToleranceModel = { ...uniform, params: [...uniform.params, { name: 'unused', nominal: 5, lo: 4, hi: 6 }] };
    expect(monteCarlo(firstOfTwo, draws, 11, { lo: 0, hi: 0.3 }, { min: 0, max: 1 })).toEqual(kept);
  });

  test('the same seed gives the same draws; another seed different ones', () => {
    const a = monteCarlo(uniform, 1000, 7, { lo: 0, hi: 0.5 }, { min: 0, max: 1 });
    expect(monteCarlo(uniform, 1000, 7, { lo: 0, hi: 0.5 }, { min: 0, max: 1 })).toEqual(a);
    expect(monteCarlo(uniform, 1000, 8, { lo: 0, hi: 0.5 }, { min: 0, max: 1 }).mean).not.toBe(a.mean);
  });
});

describe('extreme-value analysis of the adjustable divider (hand computation)', () => {
  test('worst cases combine Vref ±4 %, 1 % resistors and the adjust current 0…100 µA', () => {
    const d = designDivider(5, 1.25, 50e-6, 10e-3, 'E96', undefined, undefined); // 124 Ω, 374 Ω
    const model = dividerModel(1.25, 0.04, d, 0.01, 0, 100e-6, 50e-6);
    const { min, max } = extremeValues(model);
    // Min: 1.2·(1 + 370.26/125.24) + 0 = 4.7477 V; max: 1.3·(1 + 377.74/122.76) + 100 µA·377.74 = 5.3402 V.
    expect(min).toBeCloseTo(1.2 * (1 + (374 * 0.99) / (124 * 1.01)), 9);
    expect(max).toBeCloseTo(1.3 * (1 + (374 * 1.01) / (124 * 0.99)) + 100e-6 * 374 * 1.01, 9);
    expect(nominalValue(model)).toBeCloseTo(d.vOut, 12);
    const mc = monteCarlo(model, 10_000, 1, { lo: 4.75, hi: 5.25 }, { min, max });
    expect(mc.mean).toBeGreaterThan(min);
    expect(mc.mean).toBeLessThan(max);
    // Draws stay inside the extreme values, so the histogram holds them all.
    expect(mc.histogram.counts.reduce((a, b) => a + b, 0)).toBe(10_000);
  });
});

describe('catalog as data', () => {
  test('the default catalog satisfies its own schema (the app seeds and edits it through this schema)', () => {
    expect(catalogSchema.safeParse(defaultCatalog).success).toBe(true);
  });

  test('the schema rejects a non-finite or negative typical value', () => {
    const broken = structuredClone(defaultCatalog);
    broken.linearRegulators[0]!.dropoutV = Number.NaN;
    expect(catalogSchema.safeParse(broken).success).toBe(false);
    const negative = structuredClone(defaultCatalog);
    negative.capacitors[0]!.cases[0]!.esrOhm = -1;
    expect(catalogSchema.safeParse(negative).success).toBe(false);
  });
});
