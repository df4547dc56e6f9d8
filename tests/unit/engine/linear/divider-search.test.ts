// Divider pair and grade search, checked against hand calculations of Vout = Vref·(1 + R2/R1)
// (the adjustable-regulator output equation, e.g. Horowitz & Hill, The Art of Electronics,
// 3rd ed., §9.3 — from memory) and IEC 60063's E192 table.
import { describe, expect, test } from 'vitest';
import { defaultCatalog } from '~/lib/engine/catalog.ts';
import { E_SERIES } from '~/lib/engine/eseries.ts';
import { analyseTolerance, extremeValues, toleranceVerdict, type ToleranceModel } from '~/lib/engine/tolerance.ts';
import { bestPair, designDivider, dividerOutputModel, searchDivider, type DividerSearchInput } from '~/lib/engine/topologies/feedback.ts';

describe('E192 (IEC 60063)', () => {
  test('192 members; every other one is the E96 member; 9.20 is the irregular value', () => {
    expect(E_SERIES.E192).toHaveLength(192);
    E_SERIES.E96.forEach((v, i) => expect(E_SERIES.E192[2 * i]).toBe(v));
    // The rounded geometric sequence gives 10^(185/192) = 9.19; the standard lists 9.20.
    expect(E_SERIES.E192[185]).toBe(9.2);
    expect(Math.round(100 * 10 ** (185 / 192)) / 100).toBe(9.19);
  });
});

describe('divider pair', () => {
  test('5 V → 3.3 V from 1.25 V: searching both resistors beats snapping R2 alone', () => {
    // R2 alone: R1 = 12.4 k (E96 below 1.25 V/100 µA), R2 = 20.5 k → 1.25·(1 + 20.5/12.4) = 3.3165 V.
    const single = designDivider(3.3, 1.25, 0, 100e-6, 'E96', undefined, undefined);
    expect(single.vOut).toBeCloseTo(1.25 * (1 + 20.5 / 12.4), 9);
    // Pair search over E96 with 100–300 µA in the divider: 6.98 k / 11.5 k → 1.25·(1 + 11.5/6.98) = 3.30946 V.
    const pair = bestPair(3.3, 1.25, 0, 100e-6, 300e-6, 'E96');
    expect([pair.r1, pair.r2]).toEqual([6980, 11500]);
    expect(pair.vOut).toBeCloseTo(1.25 * (1 + 11500 / 6980), 9);
    expect(Math.abs(pair.vOut - 3.3)).toBeLessThan(Math.abs(single.vOut - 3.3));
    // E192 holds 1.00 and 1.64: 1.25·(1 + 1.64) = 3.3 V exactly at 10 k (125 µA), but 11.4 k / 18.7 k
    // gives 1.25·(1 + 18.7/11.4) = 3.30044 V (0.013 %, finer than any grade) at 110 µA: the smaller current wins.
    const fine = bestPair(3.3, 1.25, 0, 100e-6, 300e-6, 'E192');
    expect(fine).toMatchObject({ r1: 11400, r2: 18700 });
    expect(fine.vOut).toBeCloseTo(1.25 * (1 + 18.7 / 11.4), 12);
  });

  test('forced values are kept', () => {
    const d = bestPair(3.3, 1.25, 0, 100e-6, 300e-6, 'E96', 10000, 16200);
    expect([d.r1, d.r2]).toEqual([10000, 16200]);
  });
});

const base: DividerSearchInput = {
  vTarget: 3.3,
  vRef: 1.2,
  refGrades: [
    { tolerance: 0.02, extraCents: 0 },
    { tolerance: 0.01, extraCents: 15 },
    { tolerance: 0.005, extraCents: 40 },
  ],
  vRefDriftPpmK: 0,
  iAdjTyp: 0,
  iAdjMin: 0,
  iAdjMax: 0,
  iDividerMin: 100e-6,
  iDividerMax: 300e-6,
  band: { lo: 3.3 * 0.985, hi: 3.3 * 1.015 },
  rule: 'worst-case',
  tempSwingK: 0,
  grades: defaultCatalog.resistorGrades,
};

describe('grade escalation', () => {
  test('±1.5 % at 3.3 V from a ±2 % 1.2 V reference needs 0.1 % resistors and the ±1 % reference', () => {
    const { pick } = searchDivider(base);
    expect(pick.grade.tolerance).toBe(0.001);
    expect(pick.refTolerance).toBe(0.01);
    // E192 1.20 and 2.10: 1.2·(1 + 21/12) = 3.3 V exactly.
    expect([pick.r1, pick.r2]).toEqual([12000, 21000]);
    // Hand worst case: 1.2·1.01·(1 + 21·1.001/(12·0.999)) = 3.33725 V; low side 1.2·0.99·(1 + 21·0.999/(12·1.001)) = 3.26285 V.
    expect(pick.summary.worstCase.max).toBeCloseTo(1.2 * 1.01 * (1 + (21 * 1.001) / (12 * 0.999)), 9);
    expect(pick.summary.worstCase.min).toBeCloseTo(1.2 * 0.99 * (1 + (21 * 0.999) / (12 * 1.001)), 9);
    // Cost: two 0.1 % resistors (2 × 9 ¢) and the ±1 % reference (15 ¢).
    expect(pick.extraCents).toBe(2 * 9 + 15);
    // The cheaper pairings fail by hand: 1 % resistors with the ±0.5 % reference give a ratio term of
    // (1.75·1.01/0.99)/2.75 → +1.27 % plus 0.5 % = +1.8 %, beyond 1.5 %.
    expect(pick.verdict).toBe('worst-case');
  });

  test('a loose rail keeps the standard parts', () => {
    const { pick } = searchDivider({ ...base, band: { lo: 3.3 * 0.95, hi: 3.3 * 1.05 } });
    expect(pick.extraCents).toBe(0);
    expect(pick.refTolerance).toBe(0.02);
  });
});

describe('root-sum-square sigma (uniform parts: σ = a/√3)', () => {
  const sum: ToleranceModel = {
    params: [
      { name: 'a', nominal: 0, lo: -1, hi: 1 },
      { name: 'b', nominal: 0, lo: -1, hi: 1 },
    ],
    f: (x) => x[0]! + x[1]!,
    batch: ({ u, lo, span }, out) => {
      for (let i = 0; i < out.length; i += 1) out[i] = lo[0]! + span[0]! * u[0]![i]! + lo[1]! + span[1]! * u[1]![i]!;
    },
  };
  test('two ±1 uniform terms: σ = √(2/3), worst case ±2, 3σ clipped to the worst case', () => {
    const s = analyseTolerance(sum);
    expect(s.sigma).toBeCloseTo(Math.sqrt(2 / 3), 12);
    expect(s.worstCase).toEqual({ min: -2, max: 2 });
    expect(s.statistical).toEqual({ min: -2, max: 2 });
    // A ±2.2 band holds the worst case; in ±1.5 the 3σ of 2.449 (clipped to 2) fails as well.
    expect(toleranceVerdict(s, { lo: -2.2, hi: 2.2 }, 'statistical')).toBe('worst-case');
    expect(toleranceVerdict(s, { lo: -1.5, hi: 1.5 }, 'statistical')).toBe('fails');
  });
  test('eight ±1 terms: σ = √(8/3) = 1.633, 3σ = 4.90 inside a ±5 band the ±8 worst case leaves', () => {
    const n = 8;
    const many: ToleranceModel = {
      params: Array.from({ length: n }, (_, k) => ({ name: `p${k}`, nominal: 0, lo: -1, hi: 1 })),
      f: (x) => x.reduce((a, b) => a + b, 0),
      batch: () => undefined,
    };
    const s = analyseTolerance(many);
    expect(s.sigma).toBeCloseTo(Math.sqrt(n / 3), 12);
    expect(toleranceVerdict(s, { lo: -5, hi: 5 }, 'statistical')).toBe('statistical');
    expect(toleranceVerdict(s, { lo: -5, hi: 5 }, 'worst-case')).toBe('fails');
  });
});

describe('monotone extremes', () => {
  test('the divider model’s two-vertex extremes equal the full 2ⁿ enumeration', () => {
    const model = dividerOutputModel(
      1.25,
      { r1: 240, r2: 720, vOut: 5, iDivider: 1.25 / 240 },
      {
        vRefTolerance: 0.04,
        vRefDrift: 0.002,
        resistor: 0.012,
        iAdjMin: 0,
        iAdjMax: 100e-6,
        iAdjTyp: 50e-6,
        extra: [{ name: 'Line', nominal: 1, lo: 0.999, hi: 1.001 }],
      },
    );
    const full = extremeValues({ params: model.params, f: model.f, batch: model.batch });
    const fast = extremeValues(model);
    expect(fast.min).toBeCloseTo(full.min, 12);
    expect(fast.max).toBeCloseTo(full.max, 12);
  });
});
