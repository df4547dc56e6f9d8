// What a practitioner expects the engine to choose (common practice of supply design).
import { describe, expect, test } from 'vitest';
import { railSpecSchema, defaultCatalog, evaluate, type RailSpecInput, type Option } from '~/lib/engine/index.ts';

const run = (input: RailSpecInput) => evaluate(railSpecSchema.parse(input));
const pick = (options: Option[], id: Option['topology']) => options.find((o) => o.topology === id)!;
const codes = (o: Option) => o.issues.map((i) => i.code);

const thermal = { ambientMaxC: 40, airflow: 'still-air' } as const;

describe('high input-output differential', () => {
  const result = run({
    input: { vMin: 280, vNom: 300, vMax: 320, rippleVpp: 5, source: 'rectified' },
    output: { v: 150, tolerance: 0.1, iMin: 0.005, iTyp: 0.01, iMax: 0.02 },
    noise: { class: 'sensor' },
    thermal,
  });
  const linear = pick(result.options, 'linear');
  const predrop = pick(result.options, 'linear-predrop');

  test('a plain linear regulator is blocked: no class takes this input or differential', () => {
    expect(linear.feasible).toBe(false);
    const codes = linear.issues.filter((i) => i.severity === 'blocker').map((i) => i.code);
    expect(codes.some((c) => ['differential', 'differential-short', 'input-max'].includes(c))).toBe(true);
  });

  test('the pre-drop design carries the rail and is recommended', () => {
    expect(predrop.feasible).toBe(true);
    expect(result.recommended).toBe('linear-predrop');
  });

  test('its pass device is rated above the input with margin and heat-sunk for the shorted output', () => {
    const q = predrop.components.find((c) => c.role === 'pass-transistor')!;
    expect(q.ratingV!).toBeGreaterThanOrEqual(1.25 * 320);
    const qd = predrop.dissipation.parts.find((p) => p.ref === q.ref)!;
    expect(qd.faultW).toBeGreaterThan(qd.maxW);
    expect(predrop.heatsink.required).toBe(true);
    // The fitted heatsink meets θSA,max computed for the fault dissipation.
    const sink = predrop.components.find((c) => c.role === 'heatsink')!;
    expect(sink.value!).toBeLessThanOrEqual(predrop.heatsink.maxThetaSaCW!);
    const tj = predrop.junctions.find((j) => j.ref === q.ref)!;
    expect(tj.heatsink).toBe(true);
    expect(tj.tjC).toBeLessThanOrEqual(tj.tjMaxC - defaultCatalog.thermal.tjMarginK + 1e-9);
  });

  test('the safe-operating-area caution gives the numbers; the feedback path warns against a potentiometer', () => {
    const soa = predrop.issues.find((i) => i.code === 'soa')!;
    expect(soa.severity).toBe('caution');
    expect(soa.message).toMatch(/\d+ V at \d+ mA \(\d+(\.\d+)? W\)/);
    expect(codes(predrop)).toContain('no-potentiometer');
  });

  test('bias and Zener parts are rated for the fault, not only for normal operation', () => {
    for (const role of ['bias-resistor', 'sense-resistor'] as const) {
      const c = predrop.components.find((x) => x.role === role)!;
      const d = predrop.dissipation.parts.find((p) => p.ref === c.ref)!;
      expect(c.ratingW! * c.quantity).toBeGreaterThanOrEqual(2 * Math.max(d.maxW, d.faultW) - 1e-12);
    }
  });

  test('hazardous-voltage, stored-energy and mains-scope cautions appear (IEC 62368-1 ES1 limit of 60 V DC)', () => {
    for (const code of ['hazardous-voltage', 'stored-energy', 'mains-scope']) {
      expect(predrop.cautions.map((c) => c.code)).toContain(code);
    }
    expect(predrop.cautions.find((c) => c.code === 'hazardous-voltage')!.message).toMatch(/qualified persons/);
  });
});

describe('low headroom', () => {
  test('5 V → 3.3 V: the classic adjustable class lacks headroom, the low-dropout class is used', () => {
    const result = run({
      input: { vMin: 4.75, vNom: 5, vMax: 5.25, source: 'bus' },
      output: { v: 3.3, tolerance: 0.05, iMin: 0.01, iTyp: 0.2, iMax: 0.5 },
      noise: { class: 'digital' },
      thermal,
    });
    const linear = pick(result.options, 'linear');
    const chosen = linear.components.find((c) => c.role === 'regulator')!.part;
    expect(linear.feasible).toBe(true);
    expect(defaultCatalog.linearRegulators.find((c) => c.label === chosen)!.kind).toBe('ldo');
    // The same rail forced onto the classic class is blocked on headroom.
    const forced = evaluate(
      railSpecSchema.parse({
        input: { vMin: 4.75, vNom: 5, vMax: 5.25, source: 'bus' },
        output: { v: 3.3, tolerance: 0.05, iMin: 0.01, iTyp: 0.2, iMax: 0.5 },
        noise: { class: 'digital' },
        thermal,
        overrides: { linearClass: 'adj-1a5' },
      }),
    );
    expect(codes(pick(forced.options, 'linear'))).toContain('headroom');
  });
});

describe('input range straddling the output', () => {
  const result = run({
    input: { vMin: 3.0, vNom: 3.7, vMax: 4.2, source: 'battery' },
    output: { v: 3.3, tolerance: 0.05, iMin: 0.01, iTyp: 0.2, iMax: 0.5 },
    noise: { class: 'digital' },
    thermal,
  });

  test('neither buck nor boost alone regulates; the buck-boost is recommended and feasible', () => {
    expect(pick(result.options, 'buck').feasible).toBe(false);
    expect(pick(result.options, 'boost').feasible).toBe(false);
    expect(codes(pick(result.options, 'boost'))).toContain('step-up-only');
    expect(pick(result.options, 'buck-boost').feasible).toBe(true);
    expect(result.recommended).toBe('buck-boost');
  });
});

describe('quiet rail from a switcher', () => {
  const result = run({
    input: { vMin: 20, vNom: 24, vMax: 28, source: 'bus' },
    output: { v: 3.3, tolerance: 0.05, iMin: 0.01, iTyp: 0.2, iMax: 0.5 },
    noise: { class: 'precision' },
    thermal,
  });

  test('the buck gains an LC post-filter and meets the ripple limit', () => {
    const buck = pick(result.options, 'buck');
    expect(codes(buck)).toContain('post-filter');
    expect(buck.components.filter((c) => c.role === 'inductor')).toHaveLength(2);
    expect(buck.outputRippleVpp).toBeLessThanOrEqual(0.001);
  });

  test('the buck + linear post-regulator is feasible with its headroom and loss accounted', () => {
    const hybrid = pick(result.options, 'buck+linear');
    expect(hybrid.feasible).toBe(true);
    expect(hybrid.outputRippleVpp).toBeLessThanOrEqual(0.001);
    // The post-regulator's drop costs efficiency against the plain buck.
    expect(hybrid.efficiency.nominal).toBeLessThan(pick(result.options, 'buck').efficiency.nominal);
    const vbus = hybrid.trace.find((t) => t.id === 'hybrid.vbus')!.result.value;
    const regPart = hybrid.components.find((c) => c.role === 'regulator')!.part;
    const ldo = defaultCatalog.linearRegulators.find((c) => regPart.startsWith(c.label))!;
    // The set point covers the bus's own low extreme: (Vout,max + dropout + margin) / (1 − spread),
    // Vout,max the highest output the post-regulator's grades allow (inside the ±5 % band, at or
    // above what the design reaches), with the post-regulator's dropout at the 0.5 A load (a PMOS pass device scales its rated
    // figure with current — common practice) and spread = the loosest feedback tolerance among the
    // buck classes that take 20–28 V, + 2 % for its divider (hand arithmetic).
    const dropout = ldo.dropoutWithLoad
      ? Math.min(ldo.dropoutV, Math.max(ldo.dropoutWithLoad.floorV, (ldo.dropoutV * 0.5) / ldo.iOutMaxA))
      : ldo.dropoutV;
    const bucks = defaultCatalog.switchers.filter((s) => s.converter === 'buck' && s.vInMinV <= 20 && s.vInMaxV >= 28);
    const spread = Math.max(...bucks.map((s) => s.vFbTolerance)) + 0.02;
    const vHigh = 3.3 + hybrid.trace.find((t) => t.id === 'hybrid.vbus')!.inputs['ΔVhigh']!.value;
    expect(vHigh).toBeLessThanOrEqual(3.3 * 1.05);
    expect(vHigh).toBeGreaterThanOrEqual(hybrid.tolerance.worstCase.max - hybrid.outputRippleVpp / 2 - 1e-9);
    expect(vbus).toBeCloseTo((vHigh + dropout + 0.3) / (1 - spread), 9);
  });
});

describe('quiet rails at 1–2 A from a 24 V bus', () => {
  const quiet = (v: number, iMax: number) =>
    run({
      input: { vMin: 21.6, vNom: 24, vMax: 26.4, rippleVpp: 0.2, source: 'bus' },
      output: { v, tolerance: 0.05, iMin: iMax / 20, iTyp: iMax / 2, iMax },
      noise: { class: 'rf' },
      thermal,
    });

  test('3.3 V at 2 A: the post-regulator carries 2 A within 90 % of its rating (common practice), and the hybrid is the pick', () => {
    const result = quiet(3.3, 2);
    const hybrid = pick(result.options, 'buck+linear');
    expect(hybrid.feasible).toBe(true);
    const regPart = hybrid.components.find((c) => c.role === 'regulator')!.part;
    const cls = defaultCatalog.linearRegulators.find((c) => regPart.startsWith(c.label))!;
    expect(0.9 * cls.iOutMaxA).toBeGreaterThanOrEqual(2);
    expect(result.recommended).toBe('buck+linear');
  });

  test('the post-regulator is the class that drops least at the load: the bus sits lowest and the loss is least', () => {
    const hybrid = pick(quiet(5, 1).options, 'buck+linear');
    const regPart = hybrid.components.find((c) => c.role === 'regulator')!.part;
    const chosen = defaultCatalog.linearRegulators.find((c) => regPart.startsWith(c.label))!;
    const drop = hybrid.trace.find((t) => t.id === 'hybrid.vbus')!.inputs.Vdropout!.value;
    // Resistive dropout at 1 A, Vdo = max(floor, Vdo,rated·I/Irated) (data-sheet curves, common practice),
    // for every class able to carry 1 A at 90 % of its rating with at most ±1 % reference.
    const at1A = (c: (typeof defaultCatalog.linearRegulators)[number]) =>
      c.dropoutWithLoad ? Math.min(c.dropoutV, Math.max(c.dropoutWithLoad.floorV, (c.dropoutV * 1) / c.iOutMaxA)) : c.dropoutV;
    expect(drop).toBeCloseTo(at1A(chosen), 12);
    for (const c of defaultCatalog.linearRegulators.filter((c) => c.kind === 'ldo' && 0.9 * c.iOutMaxA >= 1 && c.vRefTolerance <= 0.01))
      expect(at1A(chosen)).toBeLessThanOrEqual(at1A(c));
  });
});

describe('a logic rail off rectified mains', () => {
  test('the hybrid bus sits where the buck’s shortest on-time reaches: Vbus ≥ 1.2·Vin,max·tOn,min·fsw,min (D = Vout/Vin, Erickson & Maksimović, 2nd ed., §2.3)', () => {
    const result = run({
      input: { vMin: 300, vNom: 325, vMax: 360, rippleVpp: 15, source: 'rectified' },
      output: { v: 3.3, tolerance: 0.05, iMin: 0.005, iTyp: 0.05, iMax: 0.1 },
      noise: { class: 'digital' },
      thermal,
    });
    const hybrid = pick(result.options, 'buck+linear');
    expect(hybrid.feasible).toBe(true);
    const bucks = defaultCatalog.switchers.filter((s) => s.converter === 'buck' && s.vInMinV <= 292.5 && s.vInMaxV >= 1.25 * 360);
    const floor = 1.2 * 360 * Math.min(...bucks.map((s) => s.tOnMinS * s.fswMinHz));
    // 360 V with a 300 ns shortest pulse at 60 kHz: 1.2 × 6.5 V = 7.8 V, far above the 3.3 V rail.
    expect(floor).toBeGreaterThan(3.3 * 2);
    expect(hybrid.trace.find((t) => t.id === 'hybrid.vbus')!.result.value).toBeGreaterThanOrEqual(floor - 1e-9);
    expect(result.recommended).toBe('buck+linear');
  });
});

describe('cautions follow the physics', () => {
  test('a 12 V → 5 V linear rail has no hazardous-voltage caution but a hot heatsink', () => {
    const result = run({
      input: { vMin: 10, vNom: 12, vMax: 14, source: 'adapter' },
      output: { v: 5, tolerance: 0.05, iMin: 0.01, iTyp: 0.1, iMax: 0.2 },
      noise: { class: 'digital' },
      thermal,
    });
    for (const o of result.options) expect(o.cautions.map((c) => c.code)).not.toContain('hazardous-voltage');
    const linear = pick(result.options, 'linear');
    expect(linear.heatsink.required).toBe(true);
    // Heatsink surface Ta + P·θSA above 60 °C is a touch hazard (common practice).
    expect(linear.cautions.map((c) => c.code)).toContain('hot-surface');
  });

  test('a 48 V bus stays under the 60 V ES1 limit of IEC 62368-1: no hazardous-voltage caution', () => {
    const result = run({
      input: { vMin: 44, vNom: 48, vMax: 52, source: 'bus' },
      output: { v: 24, tolerance: 0.05, iMin: 0.1, iTyp: 1, iMax: 1.2 },
      noise: { class: 'digital' },
      thermal,
    });
    for (const o of result.options) expect(o.cautions.map((c) => c.code)).not.toContain('hazardous-voltage');
  });
});

describe('ranking', () => {
  test('feasible options first, recommended is the first feasible, deterministic order', () => {
    const result = run({
      input: { vMin: 10, vNom: 12, vMax: 14, source: 'adapter' },
      output: { v: 5, tolerance: 0.05, iMin: 0.01, iTyp: 0.1, iMax: 0.2 },
      noise: { class: 'digital' },
      thermal,
    });
    const firstInfeasible = result.options.findIndex((o) => !o.feasible);
    expect(result.options.slice(firstInfeasible).every((o) => !o.feasible)).toBe(true);
    expect(result.recommended).toBe(result.options[0]!.topology);
    expect(result.options).toHaveLength(7);
  });

  test('weights move the ranking: heavy cost weight favours the cheaper of two feasible options', () => {
    const base = {
      input: { vMin: 10, vNom: 12, vMax: 14, source: 'adapter' },
      output: { v: 5, tolerance: 0.05, iMin: 0.01, iTyp: 0.05, iMax: 0.1 },
      noise: { class: 'digital' },
      thermal,
    } as const;
    const byCost = run({ ...base, weights: { efficiency: 0, heat: 0, partCount: 0, noise: 0, cost: 1 } });
    const feasible = byCost.options.filter((o) => o.feasible);
    const cheapest = [...feasible].sort((a, b) => a.costCents - b.costCents)[0]!;
    expect(byCost.recommended).toBe(cheapest.topology);
    const byEfficiency = run({ ...base, weights: { efficiency: 1, heat: 0, partCount: 0, noise: 0, cost: 0 } });
    const best = [...byEfficiency.options.filter((o) => o.feasible)].sort((a, b) => b.subScores.efficiency - a.subScores.efficiency)[0]!;
    expect(byEfficiency.recommended).toBe(best.topology);
  });
});
