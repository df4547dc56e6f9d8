// Switcher loss terms, Rds(on) at temperature, DCM duty cycles, inductor core loss and the
// saturation rule, each against a hand calculation.
import { describe, expect, test } from 'vitest';
import { defaultCatalog, type SwitcherClass } from '~/lib/engine/catalog.ts';
import { chooseInductor, coreLossW } from '~/lib/engine/inductors.ts';
import { BODY_DIODE_V, boostDcmDuty, buckDcmDuty, cycleLosses, rdsAt } from '~/lib/engine/topologies/switcher-losses.ts';
import { buckPoint } from '~/lib/engine/topologies/buck.ts';
import { boostPoint } from '~/lib/engine/topologies/boost.ts';

const stage = (id: string) => defaultCatalog.switchers.find((s) => s.id === id)!;
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

describe('loss terms beside conduction', () => {
  const s = stage('buck-sync-36v');
  test('Coss: ½·300 pF·(12 V)²·500 kHz = 10.8 mW (common practice)', () => {
    expect(cycleLosses(s, 12, 1, 500e3, 2).coss).toBeCloseTo(0.5 * 300e-12 * 144 * 500e3, 12);
    expect(cycleLosses(s, 12, 1, 500e3, 2).coss).toBeCloseTo(10.8e-3, 9);
  });

  test('dead time: 0.7 V·1 A·2·20 ns·500 kHz = 14 mW; none for a diode stage', () => {
    expect(cycleLosses(s, 12, 1, 500e3, 2).deadTime).toBeCloseTo(BODY_DIODE_V * 1 * 2 * 20e-9 * 500e3, 12);
    expect(cycleLosses(stage('buck-diode-100v'), 12, 1, 500e3, 1).deadTime).toBe(0);
  });

  test('overlap ½·V·I·(tr + tf)·fsw and gate Qg·Vdrive·fsw per switch', () => {
    const c = cycleLosses(s, 12, 1, 500e3, 2);
    expect(c.switching).toBeCloseTo(0.5 * 12 * 1 * 20e-9 * 500e3, 12);
    expect(c.gate).toBeCloseTo(5e-9 * 5 * 500e3 * 2, 12);
  });

  test('Rds(on) rises 0.4 %/K: 80 mΩ at 25 °C is 112 mΩ at 125 °C (common practice)', () => {
    expect(rdsAt(0.08, 125)).toBeCloseTo(0.112, 12);
    expect(rdsAt(0.08, 0)).toBe(0.08);
  });
});

describe('discontinuous conduction (Erickson & Maksimović, Fundamentals of Power Electronics, 2nd ed., ch. 5)', () => {
  test('buck: 24 V → 5 V at 10 mA, 47 µH, 250 kHz: M = 0.2083, K = 0.047, D = M·√(K/(1 − M)) = 0.05076', () => {
    const m = 5 / 24;
    const k = (2 * 47e-6 * 250e3 * 0.01) / 5;
    expect(buckDcmDuty(24, 5, 0.01, 250e3, 47e-6)).toBeCloseTo(m * Math.sqrt(k / (1 - m)), 12);
    expect(buckDcmDuty(24, 5, 0.01, 250e3, 47e-6)).toBeCloseTo(0.05076, 4);
  });

  test('boost: 5 V → 12 V at 10 mA, 10 µH, 1 MHz: D = √(K·M·(M − 1)) = √(0.01667·2.4·1.4) = 0.2366', () => {
    expect(boostDcmDuty(5, 12, 0.01, 1e6, 10e-6)).toBeCloseTo(Math.sqrt(((2 * 10e-6 * 1e6 * 0.01) / 12) * 2.4 * 1.4), 12);
  });

  test('a diode buck below the boundary runs in DCM at that duty; above it in CCM at Vout/Vin', () => {
    const s = lossless(stage('buck-diode-100v'));
    const light = buckPoint(s, 24, 5, 0.01, 250e3, 47e-6, 0);
    expect(light.mode).toBe('dcm');
    expect(light.d).toBeCloseTo(buckDcmDuty(24, 5, 0.01, 250e3, 47e-6), 12);
    // Peak of the triangle: (Vin − Vout)·D/(fsw·L) = 19·0.05076/(250e3·47e-6) = 82 mA.
    expect(light.peakA).toBeCloseTo((19 * light.d) / (250e3 * 47e-6), 12);
    const heavy = buckPoint(s, 24, 5, 1, 250e3, 47e-6, 0);
    expect(heavy.mode).toBe('ccm');
    expect(heavy.d).toBeCloseTo(5 / 24, 12);
  });

  test('bursts: a synchronous burst-mode stage at light load draws its quiescent current and few switching losses', () => {
    const burst = stage('buck-sync-36v-1a');
    const pwm: SwitcherClass = { ...burst, lightLoad: 'forced-pwm' };
    const a = buckPoint(burst, 12, 3.3, 1e-3, 500e3, 22e-6, 0.05);
    const b = buckPoint(pwm, 12, 3.3, 1e-3, 500e3, 22e-6, 0.05);
    expect(a.mode).toBe('burst');
    expect(b.mode).toBe('ccm');
    expect(a.pInW).toBeLessThan(b.pInW);
    expect(a.pInW - a.pOutW).toBeGreaterThanOrEqual(burst.iqA * 12);
    // The efficiency is what a part could give: below 100 %, above the forced-PWM figure.
    expect(a.pOutW / a.pInW).toBeLessThan(1);
  });

  test('boost with a diode below the boundary: DCM duty and a peak of Vin·D/(fsw·L)', () => {
    const s = lossless(stage('boost-diode-40v-1a'));
    const p = boostPoint(s, 5, 12, 0.01, 1e6, 10e-6, 0);
    expect(p.mode).toBe('dcm');
    expect(p.peakA).toBeCloseTo((5 * p.d) / (1e6 * 10e-6), 12);
  });
});

describe('inductor', () => {
  const catalog = defaultCatalog;
  test('Isat reaches the converter’s current limit when the ladder allows (a short does not saturate it)', () => {
    const { chosen } = chooseInductor('L1', catalog, 10e-6, 0.3, 4, undefined);
    expect(chosen.isatA).toBe(4);
    expect(chosen.survivesLimit).toBe(true);
  });

  test('beyond the ladder the peak still sets Isat and the short is flagged as not survived', () => {
    const { chosen, issue } = chooseInductor('L1', catalog, 10e-6, 2, 40, undefined);
    expect(chosen.isatA).toBe(3); // 1.3 × 2 A = 2.6 A → the 3 A step
    expect(chosen.survivesLimit).toBe(false);
    expect(issue).toBeNull();
  });

  test('core loss, Steinmetz Pv = k·f^α·B^β over Ve: 10 µH, 3 A, ΔIL 0.6 A at 500 kHz', () => {
    // B = 0.3 T·0.3 A/3 A = 0.03 T; Ve = 1.3e-3 m³/J · ½·10 µH·9 A² = 5.85e-8 m³;
    // Pv = 9.5·(5e5)^1.4·0.03^2.5 W/m³; P = Pv·Ve ≈ 8 mW (from memory of shielded-part data).
    const pv = 9.5 * 5e5 ** 1.4 * 0.03 ** 2.5;
    expect(coreLossW(catalog, 10e-6, 3, 0.6, 500e3)).toBeCloseTo(pv * 5.85e-8, 12);
    expect(coreLossW(catalog, 10e-6, 3, 0.6, 500e3)).toBeGreaterThan(0.005);
    expect(coreLossW(catalog, 10e-6, 3, 0.6, 500e3)).toBeLessThan(0.015);
  });

  test('no inductor above the family’s 2.2 mH ceiling is ever chosen', () => {
    const { chosen } = chooseInductor('L1', catalog, 4.7e-3, 0.05, 0.35, undefined);
    expect(chosen.henries).toBeLessThanOrEqual(2.2e-3);
  });
});
