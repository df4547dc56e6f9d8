// The linear regulator stage's search: class sized to the load, reference and resistor grades
// escalated until the rail's tolerance holds, headroom at the highest output the tolerance allows.
// Hand calculations use Vout = Vref·(1 + R2/R1) + Iadj·R2 (the adjustable-regulator output
// equation, Horowitz & Hill, The Art of Electronics, 3rd ed., §9.3 — from memory).
import { describe, expect, test } from 'vitest';
import { assemble } from '~/lib/engine/assemble.ts';
import { defaultCatalog } from '~/lib/engine/catalog.ts';
import { makeContext } from '~/lib/engine/context.ts';
import { evaluate } from '~/lib/engine/evaluate.ts';
import { railSpecSchema, type RailSpecInput } from '~/lib/engine/rail-spec.ts';
import { designLinear } from '~/lib/engine/topologies/linear.ts';
import { dropoutAt } from '~/lib/engine/topologies/regulator-stage.ts';
import { MAINS_RIPPLE_HZ, PSRR_HF_HZ, outputNoiseRms, rippleRejectionDb } from '~/lib/engine/topologies/regulator-noise.ts';
import { parseSi } from '~/lib/engine/units.ts';

const thermal = { ambientMaxC: 40, airflow: 'still-air' } as const;
const linearOption = (input: RailSpecInput) => {
  const ctx = makeContext(railSpecSchema.parse(input), defaultCatalog);
  const design = designLinear(ctx);
  return { design, option: assemble(design, ctx, 1) };
};
const classOf = (label: string) => defaultCatalog.linearRegulators.find((c) => label.startsWith(c.label))!;

describe('5 V → 3.3 V ±3 %, 100 mA, quiet', () => {
  const { option } = linearOption({
    input: { vMin: 4.75, vNom: 5, vMax: 5.25, source: 'adapter' },
    output: { v: 3.3, tolerance: 0.03, iMin: 0.01, iTyp: 0.05, iMax: 0.1 },
    noise: { class: 'sensor' },
    thermal,
  });
  const reg = option.components.find((c) => c.role === 'regulator')!;
  const cls = classOf(reg.part);
  const r1 = option.components.find((c) => c.role === 'feedback-lower')!;
  const r2 = option.components.find((c) => c.role === 'feedback-upper')!;

  test('is feasible with a class sized to the load, not the largest', () => {
    expect(option.feasible).toBe(true);
    // 0.1 A load plus the divider within 90 % of the rating (common practice), and not a 1 A+ class.
    expect(cls.iOutMaxA * 0.9).toBeGreaterThanOrEqual(0.1);
    expect(cls.iOutMaxA).toBeLessThan(1);
  });

  test('the output with the chosen pair, by hand, lies inside ±3 % with its worst case', () => {
    const vNom = cls.vRefV * (1 + r2.value! / r1.value!) + cls.iAdjTypA * r2.value!;
    expect(Math.abs(vNom - 3.3) / 3.3).toBeLessThan(0.005);
    // Hand worst case, high side: the reference at its grade's top; drift and TCR over the larger
    // swing from 25 °C, to 0 °C (25 K) rather than to 40 °C (15 K); line and load regulation halved
    // about the set point.
    const ref = reg.tolerance!;
    const drift = cls.vRefDriftPpmK * 1e-6 * 25;
    const grade = defaultCatalog.resistorGrades.find((g) => g.tolerance === r1.tolerance)!;
    const rr = grade.tolerance + grade.tcrPpmK * 1e-6 * 25;
    const line = (cls.lineRegulationPerV * (5.25 - 4.75)) / 2;
    const load = (cls.loadRegulation * (0.1 - 0.01)) / cls.iOutMaxA / 2;
    const high =
      (cls.vRefV * (1 + ref) * (1 + drift) * (1 + (r2.value! * (1 + rr)) / (r1.value! * (1 - rr))) + cls.iAdjMaxA * r2.value! * (1 + rr)) *
      (1 + line) *
      (1 + load);
    expect(option.vOutRange.max).toBeCloseTo(high, 6);
    expect(high).toBeLessThanOrEqual(3.3 * 1.03);
  });
});

describe('battery 3.5–4.2 V → 3.3 V ±5 %, 0.9 A: headroom at the highest output', () => {
  const { design, option } = linearOption({
    input: { vMin: 3.5, vNom: 3.8, vMax: 4.2, source: 'battery' },
    output: { v: 3.3, tolerance: 0.05, iMin: 0.01, iTyp: 0.5, iMax: 0.9 },
    noise: { class: 'digital' },
    thermal,
  });
  test('no linear option is offered: the worst-case output plus dropout exceeds the 3.5 V trough', () => {
    expect(option.feasible).toBe(false);
    expect(option.issues).toContainEqual(expect.objectContaining({ code: 'headroom', severity: 'blocker' }));
  });
  test('the fix names the input it would need: highest output + dropout', () => {
    const fix = (design.fixes ?? []).find((f) => f.code === 'headroom')!;
    const reg = classOf(option.components.find((c) => c.role === 'regulator')!.part);
    const need = Number(/at least ([0-9.]+) V/.exec(fix.change)![1]);
    // The chosen class's requirement is the option's highest output plus its dropout.
    expect(need).toBeGreaterThan(3.5);
    expect(need).toBeLessThanOrEqual(option.vOutRange.max + reg.dropoutV + 0.005);
  });
});

// A PMOS/PNP pass device's dropout is resistive: data sheets plot it against load current, close to
// proportional (common practice), down to a small floor (from memory). An NPN-Darlington pass
// device's dropout is two junction drops and a saturation, the same at every load (common practice).
describe('dropout at the actual load', () => {
  const battery = (
    vin: readonly [number, number, number],
    v: number,
    tolerance: number,
    load: readonly [number, number, number],
    noise: 'digital' | 'sensor',
  ) =>
    ({
      input: { vMin: vin[0], vNom: vin[1], vMax: vin[2], source: 'battery' },
      output: { v, tolerance, iMin: load[0], iTyp: load[1], iMax: load[2] },
      noise: { class: noise },
      thermal,
    }) as const;
  const byHand = (input: RailSpecInput) => {
    const { option } = linearOption(input);
    const reg = option.components.find((c) => c.role === 'regulator')!;
    const cls = classOf(reg.part);
    const r1 = option.components.find((c) => c.role === 'feedback-lower');
    // Pass current: the load plus the divider (Vref/R1); dropout = Vdo,rated·Ipass/Irated, no lower than the floor.
    const iPass = input.output.iMax + (r1 ? cls.vRefV / r1.value! : 0);
    const floor = cls.dropoutWithLoad!.floorV;
    const dropout = Math.max(floor, (cls.dropoutV * iPass) / cls.iOutMaxA);
    const traced = option.trace.find((t) => t.id === `${reg.ref}.dropout`)!;
    return { option, cls, dropout, traced, recommended: evaluate(railSpecSchema.parse(input)).recommended };
  };

  test('4×AA 3.6–6.4 V → 3.3 V ±5 %, 0.1 A: an LDO at half its rating drops half its rated dropout, and is the recommendation', () => {
    const { option, cls, dropout, traced, recommended } = byHand(battery([3.6, 5, 6.4], 3.3, 0.05, [0.001, 0.05, 0.1], 'digital'));
    expect(option.feasible).toBe(true);
    expect(cls.kind).toBe('ldo');
    expect(traced.result.value).toBeCloseTo(dropout, 12);
    expect(dropout).toBeLessThan(cls.dropoutV);
    // Highest output plus the dropout at 0.1 A fits under the 3.6 V trough (at the rated dropout it would not).
    expect(option.vOutRange.max + dropout).toBeLessThanOrEqual(3.6);
    expect(recommended).toBe('linear');
  });

  test('Li-ion 3.2–4.2 V → 3.0 V ±3 %, 50 µA, sensor: the low-quiescent LDO at its dropout floor', () => {
    const { option, cls, dropout, traced, recommended } = byHand(
      battery([3.2, 3.7, 4.2], 3.0, 0.03, [0.000005, 0.00002, 0.00005], 'sensor'),
    );
    expect(option.feasible).toBe(true);
    expect(cls.id).toBe('ldo-lowiq-0a2');
    // 0.25 V · 50 µA / 0.2 A = 62.5 µV, below the floor: the floor holds.
    expect(dropout).toBe(cls.dropoutWithLoad!.floorV);
    expect(traced.result.value).toBeCloseTo(dropout, 12);
    expect(option.vOutRange.max + dropout).toBeLessThanOrEqual(3.2);
    expect(recommended).toBe('linear');
  });

  test('2×AA 2.0–3.2 V → 1.8 V ±5 %, 20 mA: an LDO with a tenth of its rated dropout', () => {
    const { option, cls, dropout, traced, recommended } = byHand(battery([2.0, 2.4, 3.2], 1.8, 0.05, [0.001, 0.01, 0.02], 'digital'));
    expect(option.feasible).toBe(true);
    expect(traced.result.value).toBeCloseTo(dropout, 12);
    expect(dropout).toBeLessThan(cls.dropoutV / 5);
    expect(option.vOutRange.max + dropout).toBeLessThanOrEqual(2.0);
    expect(recommended).toBe('linear');
  });

  test('an NPN-Darlington class keeps its rated dropout at a light load', () => {
    for (const cls of defaultCatalog.linearRegulators.filter((c) => c.kind === 'adjustable')) {
      expect(cls.dropoutWithLoad).toBeUndefined();
      expect(dropoutAt(cls, cls.iOutMaxA / 100)).toBe(cls.dropoutV);
    }
  });
});

describe('grade escalation: 12 V → 5 V ±1 %', () => {
  const { option } = linearOption({
    input: { vMin: 11.4, vNom: 12, vMax: 12.6, source: 'adapter' },
    output: { v: 5, tolerance: 0.01, iMin: 0.01, iTyp: 0.1, iMax: 0.2 },
    noise: { class: 'digital' },
    thermal,
  });
  test('a ±1 % rail is met by escalating to a precision reference grade and fine resistors', () => {
    expect(option.feasible).toBe(true);
    const reg = option.components.find((c) => c.role === 'regulator')!;
    const r1 = option.components.find((c) => c.role === 'feedback-lower')!;
    // A ±1 % rail cannot hold with a ±1 % reference and 1 % resistors: the reference alone uses the band.
    expect(reg.tolerance!).toBeLessThan(0.01);
    expect(r1.tolerance!).toBeLessThan(0.01);
    expect(option.vOutRange.min).toBeGreaterThanOrEqual(4.95);
    expect(option.vOutRange.max).toBeLessThanOrEqual(5.05);
  });
});

describe('5 V → 2.5 V ±0.5 %, 10 mA reference rail', () => {
  test('a precision series reference holds it', () => {
    const { option } = linearOption({
      input: { vMin: 4.75, vNom: 5, vMax: 5.25, source: 'adapter' },
      output: { v: 2.5, tolerance: 0.005, iMin: 0.001, iTyp: 0.005, iMax: 0.01 },
      noise: { class: 'precision' },
      thermal,
    });
    expect(option.feasible).toBe(true);
    expect(option.components.find((c) => c.role === 'regulator')!.part).toMatch(/reference/);
  });
});

describe('ripple rejection against frequency (single-pole roll-off, 20 dB/decade — common practice)', () => {
  const ldo = defaultCatalog.linearRegulators.find((c) => c.id === 'ldo-adj-1a')!;
  test('flat at low frequency, falling 20 dB per decade to the 1 MHz figure, flat beyond', () => {
    expect(rippleRejectionDb(ldo, 100, false)).toBe(ldo.psrrDb);
    expect(rippleRejectionDb(ldo, PSRR_HF_HZ, false)).toBe(ldo.psrrHfDb);
    expect(rippleRejectionDb(ldo, 4 * PSRR_HF_HZ, false)).toBe(ldo.psrrHfDb);
    // 60 dB at low frequency, 40 dB at 1 MHz: the roll-off starts at 100 kHz; at 300 kHz, 40 + 20·log10(1e6/3e5) = 50.46 dB.
    expect(rippleRejectionDb(ldo, 300e3, false)).toBeCloseTo(40 + 20 * Math.log10(1e6 / 3e5), 9);
  });
  test('noise: density × Vout/Vref × √(100 kHz − 10 Hz)', () => {
    expect(outputNoiseRms(ldo, 3.6, false)).toBeCloseTo(ldo.noiseDensityVrtHz * 3 * Math.sqrt(100e3 - 10), 12);
  });
});

describe('a quiet rail from a 12 V adapter with 100–120 Hz ripple: the class search weighs ripple rejection', () => {
  // Mains-derived ripple sits at twice the line frequency, 100 or 120 Hz (common practice); the
  // output ripple is ΔVin·10^(−PSRR/20) with the class's rejection at 120 Hz.
  const quiet = (maxRippleVpp: number) =>
    linearOption({
      input: { vMin: 11.4, vNom: 12, vMax: 12.6, rippleVpp: 0.15, source: 'adapter' },
      output: { v: 3.3, tolerance: 0.05, iMin: 0.005, iTyp: 0.03, iMax: 0.05 },
      noise: { class: 'precision', maxRippleVpp },
      thermal,
    });

  test('100 µV from 150 mV needs 63.5 dB: the cheaper 60 dB fixed class is passed over for one that meets it', () => {
    const { option } = quiet(100e-6);
    const need = 20 * Math.log10(0.15 / 100e-6);
    const fixed = defaultCatalog.linearRegulators.find((c) => c.id === 'fixed-3v3')!;
    expect(rippleRejectionDb(fixed, MAINS_RIPPLE_HZ.hi, false)).toBeLessThan(need);
    expect(option.feasible).toBe(true);
    expect(option.outputRippleVpp).toBeLessThanOrEqual(100e-6);
    const cls = classOf(option.components.find((c) => c.role === 'regulator')!.part);
    const bypassed = option.components.some((c) => c.role === 'bypass-capacitor');
    expect(rippleRejectionDb(cls, MAINS_RIPPLE_HZ.hi, bypassed)).toBeGreaterThanOrEqual(need);
    expect(option.outputRippleVpp).toBeCloseTo(0.15 * 10 ** (-rippleRejectionDb(cls, MAINS_RIPPLE_HZ.hi, bypassed) / 20), 12);
  });

  test('10 µV is beyond every class: the fix is an input RC filter whose attenuation at 100 Hz closes the gap', () => {
    const { design, option } = quiet(10e-6);
    expect(option.feasible).toBe(false);
    expect(option.issues).toContainEqual(expect.objectContaining({ code: 'ripple', severity: 'blocker' }));
    const fix = (design.fixes ?? []).find((f) => f.code === 'ripple')!;
    expect(fix.costCents).toBeGreaterThan(0);
    const [r, c] = /filter (\S+ \S+) \+ (\S+ \S+)/
      .exec(fix.change)!
      .slice(1)
      .map((t) => parseSi(t)!);
    // First-order low-pass |H| = 1/√(1 + (2π·f·R·C)²), at 100 Hz where it attenuates least.
    const h = 1 / Math.sqrt(1 + (2 * Math.PI * MAINS_RIPPLE_HZ.lo * r! * c!) ** 2);
    expect(option.outputRippleVpp * h).toBeLessThanOrEqual(10e-6);
    // The resistor's drop at full load leaves the regulator its headroom at the trough.
    const reg = classOf(option.components.find((c) => c.role === 'regulator')!.part);
    expect(11.4 - 0.075 - r! * (0.05 + reg.iqA)).toBeGreaterThanOrEqual(option.vOutRange.max + reg.dropoutV);
  });
});

describe('the class search prices what a class draws for itself', () => {
  test('9 V battery → 5 V at 1 mA: a µA-quiescent class, not the cheaper adjustable whose 10 mA minimum load would drain the battery', () => {
    const { option } = linearOption({
      input: { vMin: 7, vNom: 9, vMax: 9.6, source: 'battery' },
      output: { v: 5, tolerance: 0.05, iMin: 0.0001, iTyp: 0.0005, iMax: 0.001 },
      noise: { class: 'digital' },
      thermal,
    });
    expect(option.feasible).toBe(true);
    const cls = classOf(option.components.find((c) => c.role === 'regulator')!.part);
    const adjustable = defaultCatalog.linearRegulators.find((c) => c.id === 'adj-0a1')!;
    expect(adjustable.costCents).toBeLessThan(cls.costCents);
    // Battery practice: the stage's own draw (quiescent, and a divider that swamps the feedback-pin
    // current) stays within 5 % of the typical load — common practice.
    const r1 = option.components.find((c) => c.role === 'feedback-lower')!;
    const standing = cls.iqA + cls.vRefV / r1.value!;
    expect(standing).toBeLessThanOrEqual(0.05 * 0.0005);
  });

  test('24 V → 3.3 V at 0.3 mA typical: a class whose own draw stays below its load, not the cheaper fixed regulator drawing 5 mA', () => {
    const { option } = linearOption({
      input: { vMin: 20, vNom: 24, vMax: 28, source: 'bus' },
      output: { v: 3.3, tolerance: 0.05, iMin: 0.00001, iTyp: 0.0003, iMax: 0.001 },
      noise: { class: 'digital' },
      thermal,
    });
    expect(option.feasible).toBe(true);
    const cls = classOf(option.components.find((c) => c.role === 'regulator')!.part);
    const fixed = defaultCatalog.linearRegulators.find((c) => c.id === 'fixed-3v3')!;
    expect(fixed.costCents).toBeLessThan(cls.costCents);
    // Common practice: a regulator's quiescent current is small beside its load. The fixed class's
    // 5 mA would be 17× the 0.3 mA load; at 28 V that is 140 mW for a 1 mW rail.
    expect(fixed.iqA).toBeGreaterThan(0.0003);
    const r1 = option.components.find((c) => c.role === 'feedback-lower');
    const standing = cls.iqA + (r1 ? cls.vRefV / r1.value! : 0);
    expect(standing).toBeLessThanOrEqual(0.0003);
  });

  test('5 V → 2.048 V ±0.5 % at 1 mA: the 2.048 V series reference, one of the standard reference voltages (common practice)', () => {
    const { option } = linearOption({
      input: { vMin: 4.6, vNom: 5, vMax: 5.4, source: 'adapter' },
      output: { v: 2.048, tolerance: 0.005, iMin: 0, iTyp: 0.0005, iMax: 0.001 },
      noise: { class: 'precision' },
      thermal,
    });
    expect(option.feasible).toBe(true);
    expect(option.components.find((c) => c.role === 'regulator')!.part).toMatch(/series voltage reference, 2\.048 V/);
  });

  test('24 V → 10 V ±0.5 % at 5 mA: a 10 V series reference, which takes up to about 36 V in (from memory)', () => {
    const { option } = linearOption({
      input: { vMin: 21.6, vNom: 24, vMax: 26.4, source: 'bus' },
      output: { v: 10, tolerance: 0.005, iMin: 0.0005, iTyp: 0.002, iMax: 0.005 },
      noise: { class: 'precision' },
      thermal,
    });
    expect(option.feasible).toBe(true);
    expect(option.components.find((c) => c.role === 'regulator')!.part).toMatch(/series voltage reference, 10 V/);
  });
});
