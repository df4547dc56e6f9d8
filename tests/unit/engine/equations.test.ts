import { describe, expect, test } from 'vitest';
import { defaultCatalog, type Catalog, type SwitcherClass } from '~/lib/engine/catalog.ts';
import { railSpecSchema, evaluate } from '~/lib/engine/index.ts';
import { CAPACITOR_V, RESISTOR_POWER_W, rateResistor, ratingFor } from '~/lib/engine/ratings.ts';
import { assessThermal, junctionTemperature, maxSinkTheta } from '~/lib/engine/thermal.ts';
import { designDivider, dividerVout } from '~/lib/engine/topologies/feedback.ts';
import { buckPoint, buckRipple } from '~/lib/engine/topologies/buck.ts';
import { boostPoint, boostRipple } from '~/lib/engine/topologies/boost.ts';
import { solveShunt } from '~/lib/engine/topologies/shunt.ts';

const adjustable = defaultCatalog.linearRegulators.find((c) => c.id === 'adj-1a5')!;

describe('adjustable regulator: Vout = Vref·(1 + R2/R1) + Iadj·R2', () => {
  test('worked example R1 = 240 Ω, R2 = 720 Ω (Horowitz & Hill, The Art of Electronics, adjustable three-terminal regulators — from memory)', () => {
    // 1.25·(1 + 720/240) = 5.000 V, plus 50 µA · 720 Ω = 36 mV → 5.036 V.
    expect(dividerVout(1.25, 240, 720, 50e-6)).toBeCloseTo(5.036, 6);
    // Without the adjust-pin term the text's round 5.0 V.
    expect(dividerVout(1.25, 240, 720, 0)).toBeCloseTo(5.0, 9);
  });

  test('R1 ≤ Vref/Imin snapped down to E96, R2 solved and snapped, Vout recomputed (hand computation)', () => {
    // R1 ≤ 1.25 V / 10 mA = 125 Ω → 124 Ω (E96 below 125).
    // R2 = (5 − 1.25)/(1.25/124 + 50 µA) = 3.75/0.0101306 = 370.2 Ω → 374 Ω (E96 nearest: 374/370.2 < 370.2/365).
    // Vout = 1.25·(1 + 374/124) + 50 µA·374 = 5.0202 + 0.0187 = 5.0389 V.
    const d = designDivider(5, 1.25, 50e-6, 10e-3, 'E96', undefined, undefined);
    expect(d.r1).toBe(124);
    expect(d.r2).toBe(374);
    expect(d.vOut).toBeCloseTo(5.0389, 4);
    expect(1.25 / d.r1).toBeGreaterThanOrEqual(10e-3);
  });

  test('the engine’s linear option on a 12 V → 5 V rail searches the pair (trace entries match the hand figures)', () => {
    const brief = railSpecSchema.parse({
      input: { vMin: 9, vNom: 12, vMax: 15, source: 'adapter' },
      output: { v: 5, tolerance: 0.08, iMin: 0.01, iTyp: 0.1, iMax: 0.3 },
      noise: { class: 'digital' },
      thermal: { ambientMaxC: 40, airflow: 'still-air' },
      overrides: { linearClass: 'adj-1a5' },
    });
    const linear = evaluate(brief).options.find((o) => o.topology === 'linear')!;
    const r1 = linear.components.find((c) => c.role === 'feedback-lower')!;
    const r2 = linear.components.find((c) => c.role === 'feedback-upper')!;
    // R1 between 1.25 V/15 mA and 1.25 V/10 mA, both from E96: 93.1 Ω / 280 Ω gives
    // 1.25·(1 + 280/93.1) + 50 µA·280 = 5.0234 V, nearer 5 V than R2 snapped alone (124 Ω / 374 Ω, 5.0389 V).
    expect(r1.value).toBe(93.1);
    expect(r2.value).toBe(280);
    expect(linear.trace.find((t) => t.id === 'U1.vout')!.result.value).toBeCloseTo(5.0234, 4);
    // Dissipation (vInMax − Vout)·(iOutMax + Idivider + Iadj) = (15 − 5.0234)·(0.3 + 0.013426 + 0.00005) = 3.1274 W.
    expect(linear.dissipation.parts.find((p) => p.ref === 'U1')!.maxW).toBeCloseTo(3.1274, 3);
  });
});

describe('thermal chain Tj = Ta + P·Σθ (JEDEC JESD51 definitions of θJA, θJC, θCS, θSA)', () => {
  test('hand example: 2 W through θJC 5 + θCS 0.5 + θSA 10 K/W at 40 °C', () => {
    // 40 + 2·(5 + 0.5 + 10) = 71 °C.
    expect(junctionTemperature(40, 2, [5, 0.5, 10])).toBe(71);
    // θJA alone: θJA = (Tj − Ta)/P → Tj = 40 + 2·50 = 140 °C.
    expect(junctionTemperature(40, 2, [50])).toBe(140);
  });

  test('largest heatsink θSA,max = ((Tj,design − Ta)/P − θJC − θCS)/k, with Tj,design = Tj,max − 25 K (common practice)', () => {
    // (100 − 40)/2 − 5 − 0.5 = 24.5 K/W in still air; enclosed (k = 1.3) the sink must be 24.5/1.3 = 18.85 K/W.
    expect(maxSinkTheta(100, 40, 2, 5, 0.5, 1)).toBe(24.5);
    expect(maxSinkTheta(100, 40, 2, 5, 0.5, 1.3)).toBeCloseTo(18.846, 3);
    // The budget is spent before the sink: (100 − 40)/20 − 5 − 0.5 < 0, no heatsink exists.
    expect(maxSinkTheta(100, 40, 20, 5, 0.5, 1)).toBeNull();
    const part = { thetaJcCW: 5, thetaJaCW: 50, tjMaxC: 125, heatsinkable: true };
    const r = assessThermal(part, 2, 40, 1, defaultCatalog, undefined);
    expect(r.maxThetaSaCW).toBeCloseTo(24.5, 9);
    // The cheapest catalog heatsink at or below 24.5 K/W is the 15 K/W one: Tj = 40 + 2·(5 + 0.5 + 15) = 81 °C.
    expect(r.sinkThetaCW).toBe(15);
    expect(r.tjC).toBeCloseTo(81, 9);
    expect(r.problem).toBe('none');
  });

  test('a θSA below 1 K/W is flagged impractical; a negative one cannot be met', () => {
    const part = { thetaJcCW: 1.5, thetaJaCW: 60, tjMaxC: 150, heatsinkable: true };
    // (125 − 40)/40 − 1.5 − 0.5 = 0.125 K/W.
    expect(assessThermal(part, 40, 40, 1, defaultCatalog, undefined).problem).toBe('no-sink-fits');
    // (125 − 40)/30 − 2 = 0.833 K/W: the 0.6 K/W heatsink fits but is impractical.
    const r = assessThermal(part, 30, 40, 1, defaultCatalog, undefined);
    expect(r.maxThetaSaCW).toBeCloseTo(0.8333, 3);
    expect(r.problem).toBe('impractical');
  });
});

const lossless = (base: SwitcherClass): SwitcherClass => ({
  ...base,
  rdsOnOhm: 0,
  diodeVfV: 0,
  riseS: 0,
  fallS: 0,
  qgC: 0,
  iqA: 0,
  cossF: 0,
  deadTimeS: 0,
});

describe('switching converters (Erickson & Maksimović, Fundamentals of Power Electronics, ch. 2 — from memory; their Δi and Δv are half the peak-to-peak values)', () => {
  const buckStage = lossless(defaultCatalog.switchers.find((s) => s.converter === 'buck')!);
  const boostStage = lossless(defaultCatalog.switchers.find((s) => s.converter === 'boost')!);

  test('buck: D = V/Vg, ΔIpp = (Vg − V)·D·Ts/L, Δvpp = ΔIpp·Ts/(8C) — hand example 12 V → 3.3 V, 500 kHz, 10 µH, 22 µF', () => {
    // D = 3.3/12 = 0.275; ΔIpp = 8.7·0.275/(5e5·10e-6) = 0.4785 A; Δvpp = 0.4785/(8·5e5·22e-6) = 5.4375 mV.
    const p = buckPoint(buckStage, 12, 3.3, 1, 500e3, 10e-6, 0);
    expect(p.d).toBeCloseTo(0.275, 12);
    expect(p.rippleA).toBeCloseTo(0.4785, 9);
    expect(buckRipple(p.rippleA, 500e3, 22e-6, 0)).toBeCloseTo(5.4375e-3, 9);
    // ESR term ΔIpp·ESR adds 0.4785 · 0.01 = 4.785 mV (common practice).
    expect(buckRipple(p.rippleA, 500e3, 22e-6, 0.01) - buckRipple(p.rippleA, 500e3, 22e-6, 0)).toBeCloseTo(4.785e-3, 9);
    expect(p.pInW).toBeCloseTo(p.pOutW, 12);
  });

  test('boost: M = 1/(1 − D), IL = I/(1 − D), ΔIpp = Vg·D·Ts/L, Δvpp = I·D·Ts/C — hand example 5 V → 12 V at 0.5 A, 1 MHz, 4.7 µH, 22 µF', () => {
    // D = 1 − 5/12 = 0.58333; IL = 0.5/0.41667 = 1.2 A; ΔIpp = 5·0.58333/(1e6·4.7e-6) = 0.62057 A; Δvpp = 0.5·0.58333/(1e6·22e-6) = 13.258 mV.
    const p = boostPoint(boostStage, 5, 12, 0.5, 1e6, 4.7e-6, 0);
    expect(p.d).toBeCloseTo(0.583333, 5);
    expect(p.inductorA).toBeCloseTo(1.2, 9);
    expect(p.rippleA).toBeCloseTo(0.620567, 5);
    expect(boostRipple(0.5, p.d, 0, 1e6, 22e-6, 0)).toBeCloseTo(13.258e-3, 6);
  });

  test('with losses the duty rises and the input power is the output plus every loss (energy balance)', () => {
    const real = defaultCatalog.switchers.find((s) => s.id === 'buck-diode-100v')!;
    const p = buckPoint(real, 24, 5, 1, 250e3, 33e-6, 0.05);
    expect(p.d).toBeGreaterThan(5 / 24);
    // Catch-diode loss Vf·Iout·(1 − D) (common practice).
    expect(p.diodeW).toBeCloseTo(real.diodeVfV * 1 * (1 - p.d), 9);
    expect(p.pInW).toBeCloseTo(p.pOutW + p.switchW + p.diodeW + p.dcrW, 9);
    // Switching loss ½·Vin·Iout·(tr + tf)·fsw is part of the switch loss: 0.5·24·1·40 ns·250 kHz = 0.12 W.
    const noTransitions = buckPoint({ ...real, riseS: 0, fallS: 0 }, 24, 5, 1, 250e3, 33e-6, 0.05);
    expect(p.switchW - noTransitions.switchW).toBeCloseTo(0.12, 9);
  });
});

describe('Zener shunt regulator (Horowitz & Hill, The Art of Electronics, ch. 1 Zener regulator; textbook form with rz = 0)', () => {
  // A catalog whose Zeners have rz = 0 and a 1 mA knee, so the engine must reproduce the textbook figures.
  const ideal: Catalog = {
    ...defaultCatalog,
    zenerSeries: defaultCatalog.zenerSeries.map((s) => ({ ...s, kneeCurrentA: 1e-3, rzPoints: [{ v: 1, ohm: 0 }] })),
  };
  const brief = railSpecSchema.parse({
    input: { vMin: 10, vNom: 12, vMax: 14, source: 'adapter' },
    output: { v: 5.1, tolerance: 0.1, iMin: 0.005, iTyp: 0.01, iMax: 0.02 },
    noise: { class: 'digital' },
    thermal: { ambientMaxC: 40, airflow: 'still-air' },
  });
  const shunt = evaluate(brief, ideal).options.find((o) => o.topology === 'shunt')!;

  test('Rs = (vInMin − Vz)/(iOutMax + IzKnee) snapped DOWN to E24', () => {
    // (10 − 5.1)/(0.020 + 0.001) = 233.3 Ω → 220 Ω.
    expect(shunt.components.find((c) => c.role === 'series-resistor')!.value).toBe(220);
  });

  test('Zener worst current and power at vInMax, iOutMin; fault power of the resistor', () => {
    // Iz = (14 − 5.1)/220 − 0.005 = 35.455 mA; Pz = 5.1·Iz = 0.18082 W.
    const dz = shunt.dissipation.parts.find((p) => p.role === 'zener')!;
    expect(dz.maxW).toBeCloseTo(0.18082, 4);
    // Resistor normal (14 − 5.1)²/220 = 0.36005 W; fault 14²/220 = 0.89091 W.
    const rs = shunt.dissipation.parts.find((p) => p.role === 'series-resistor')!;
    expect(rs.maxW).toBeCloseTo(0.36005, 4);
    expect(rs.faultW).toBeCloseTo(0.89091, 4);
    // Ratings: twice the worst (common practice): resistor ≥ 1.78 W → 2 W; Zener ≥ 0.36 W → 0.5 W series.
    expect(shunt.components.find((c) => c.role === 'series-resistor')!.ratingW).toBe(2);
    expect(shunt.components.find((c) => c.role === 'zener')!.ratingW).toBe(0.5);
  });

  test('efficiency Vout·Iout / (Vin·(Vin − Vz)/Rs) at the nominal corner', () => {
    // 5.1·0.010 / (12·(12 − 5.1)/220) = 0.051/0.37636 = 0.13551.
    expect(shunt.efficiency.nominal).toBeCloseTo(0.13551, 4);
  });

  test('with rz the output rises with current: Vz(I) = Vk + rz·I, and line regulation is rz/(Rs + rz)', () => {
    const lo = solveShunt(10, 0, 220, 5, 10);
    const hi = solveShunt(14, 0, 220, 5, 10);
    expect((hi.vOut - lo.vOut) / 4).toBeCloseTo(10 / 230, 9);
  });
});

describe('ratings: at least twice the worst stress (common practice)', () => {
  test('resistor power and capacitor voltage ladders', () => {
    expect(ratingFor(RESISTOR_POWER_W, 0.3)).toBe(1);
    expect(ratingFor(RESISTOR_POWER_W, 0.125)).toBe(0.25);
    expect(ratingFor(CAPACITOR_V, 12)).toBe(25);
    expect(ratingFor(CAPACITOR_V, 150)).toBe(400);
  });

  test('a resistor over its limiting voltage becomes a series string', () => {
    // 0.1 W at 400 V: one 1 W resistor (500 V) is below 2·400 V; two 1 W resistors see 200 V each, under 500/2.
    expect(rateResistor(0.1, 400)).toEqual({ count: 2, ratingW: 1, ratingV: 500 });
    expect(rateResistor(0.1, 10)).toEqual({ count: 1, ratingW: 0.25, ratingV: 250 });
  });
});

describe('trade facts of the classic adjustable class in the catalog (common practice)', () => {
  test('1.25 V reference, ~50 µA adjust current, 3.5–10 mA minimum load (10 mA worst), ~1.75 V dropout', () => {
    for (const cls of defaultCatalog.linearRegulators.filter((c) => c.kind === 'adjustable')) {
      expect(cls.vRefV).toBe(1.25);
      expect(cls.iAdjTypA).toBeCloseTo(50e-6, 12);
      expect(cls.minLoadA).toBeGreaterThanOrEqual(3.5e-3);
      expect(cls.minLoadA).toBeLessThanOrEqual(10e-3);
      expect(cls.dropoutV).toBeCloseTo(1.75, 9);
    }
    expect(adjustable.psrrBypassDb).toBeGreaterThan(adjustable.psrrDb);
  });
});
