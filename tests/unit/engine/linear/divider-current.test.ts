// The feedback divider's current: at low voltage it carries the regulator's whole minimum load
// (the classic adjustable regulator's application circuit, 240 Ω across 1.25 V — common practice);
// at high voltage its power rules that out, and it is sized by the adjust-pin error instead.
// Hand calculations use Vout = Vref·(1 + R2/R1) + Iadj·R2 (the adjustable-regulator output
// equation, Horowitz & Hill, The Art of Electronics, 3rd ed., §9.3 — from memory).
import { describe, expect, test } from 'vitest';
import { defaultCatalog } from '~/lib/engine/catalog.ts';
import { makeContext } from '~/lib/engine/context.ts';
import { evaluate } from '~/lib/engine/evaluate.ts';
import { railSpecSchema, type RailSpecInput } from '~/lib/engine/rail-spec.ts';
import { ADJUST_ERROR_SHARE, DIVIDER_POWER_W, dividerCurrent } from '~/lib/engine/topologies/regulator-stage.ts';

const adjustable = defaultCatalog.linearRegulators.find((c) => c.id === 'adj-1a5')!;
const rail = (v: number, tolerance: number, load: [number, number, number], vin: [number, number, number]): RailSpecInput => ({
  input: { vMin: vin[0], vNom: vin[1], vMax: vin[2], rippleVpp: 10, source: 'rectified' },
  output: { v, tolerance, iMin: load[0], iTyp: load[1], iMax: load[2] },
  noise: { class: 'sensor' },
  thermal: { ambientMaxC: 40, airflow: 'still-air' },
});
const ctxOf = (input: RailSpecInput) => makeContext(railSpecSchema.parse(input), defaultCatalog);

describe('divider current of the classic adjustable regulator (50 µA typical, 100 µA most adjust current, 10 mA minimum load)', () => {
  test('12 V out: 10 mA carries the minimum load and dissipates 0.12 W, within a quarter-watt', () => {
    expect(12 * adjustable.minLoadA).toBeLessThanOrEqual(DIVIDER_POWER_W);
    expect(dividerCurrent(ctxOf(rail(12, 0.05, [0, 0.5, 1], [15, 18, 20])), adjustable, 12, 1)).toBe(10e-3);
  });

  test('400 V ±5 % with a 10 mA load: 4 mA, the adjust-pin spread taking a quarter of the band', () => {
    // Carrying 10 mA would put 400 V × 10 mA = 4 W in the divider; the load itself draws the minimum.
    // R2 ≈ 400 V / 4 mA = 100 kΩ; Iadj spans 0–100 µA about its 50 µA typical, so Iadj·R2 swings
    // ±50 µA × 100 kΩ = ±5 V = ±1.25 % of 400 V, a quarter of ±5 %.
    const i = dividerCurrent(ctxOf(rail(400, 0.05, [0.01, 0.01, 0.01], [480, 500, 520])), adjustable, 400, 0.01);
    expect(i).toBeCloseTo(4e-3, 12);
    const r2 = 400 / i;
    expect(((adjustable.iAdjMaxA / 2) * r2) / 400).toBeCloseTo(ADJUST_ERROR_SHARE * 0.05, 12);
  });

  test('400 V with a 1 mA lightest load: the divider makes up the other 9 mA of the minimum load', () => {
    const i = dividerCurrent(ctxOf(rail(400, 0.05, [0.001, 0.005, 0.01], [480, 500, 520])), adjustable, 400, 0.01);
    expect(i).toBeCloseTo(9e-3, 12);
  });

  test('a floating pre-drop stage keeps the whole 10 mA in its divider: its standoff Zener feeds the output too', () => {
    const i = dividerCurrent(ctxOf(rail(400, 0.05, [0.01, 0.01, 0.01], [480, 500, 520])), adjustable, 400, 0.01, true);
    expect(i).toBe(10e-3);
  });

  test('60–70 V → 48 V ±5 %, 20–200 mA, linear: the divider runs at 4–6 mA, about 0.25 W, not the 10–15 mA and half a watt of the whole minimum load', () => {
    // The classic adjustable class, forced: the search would pick a low-dropout class with a far smaller adjust current.
    const input = { ...rail(48, 0.05, [0.02, 0.1, 0.2], [60, 65, 70]), overrides: { linearClass: adjustable.id } };
    const result = evaluate(railSpecSchema.parse(input));
    const option = result.options.find((o) => o.topology === 'linear')!;
    const lower = option.components.find((c) => c.role === 'feedback-lower')!;
    const upper = option.components.find((c) => c.role === 'feedback-upper')!;
    // 48 V × 10 mA = 0.48 W is past a quarter-watt; the 20 mA load holds the minimum, and the
    // adjust pin needs 100 µA / (2 × 0.25 × 0.05) = 4 mA; the pair is searched between 4 and 6 mA.
    const iDivider = adjustable.vRefV / lower.value!;
    expect(iDivider).toBeGreaterThanOrEqual(4e-3);
    expect(iDivider).toBeLessThanOrEqual(6e-3);
    const upperW = option.dissipation.parts.find((p) => p.ref === upper.ref)!.maxW;
    expect(upperW).toBeLessThan(48 * 6e-3);
    // The adjust-pin spread, ±50 µA through R2, stays within a quarter of the band.
    expect((adjustable.iAdjMaxA / 2) * upper.value!).toBeLessThanOrEqual(ADJUST_ERROR_SHARE * 0.05 * 48);
  });
});
