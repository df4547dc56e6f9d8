// Switcher design search against briefs: on-time limit, voltage derating, saturation at the
// current limit, forced parts, load step, the buck-boost's transition region, and a trace whose
// every entry recomputes from its own printed inputs.
import { describe, expect, test } from 'vitest';
import { defaultCatalog } from '~/lib/engine/catalog.ts';
import { makeContext } from '~/lib/engine/context.ts';
import type { Design } from '~/lib/engine/design.ts';
import { railSpecSchema, type RailSpecInput } from '~/lib/engine/rail-spec.ts';
import { evaluate } from '~/lib/engine/evaluate.ts';
import type { TraceEntry } from '~/lib/engine/types.ts';
import { designBoost } from '~/lib/engine/topologies/boost.ts';
import { buckBoostPoint, designBuckBoost } from '~/lib/engine/topologies/buck-boost.ts';
import { designBuck } from '~/lib/engine/topologies/buck.ts';
import { designSwitcherLinear } from '~/lib/engine/topologies/switcher-linear.ts';
import {
  boostSegments,
  buckSegments,
  classVoltageFindings,
  dutyWindow,
  fswBetween,
  fswCandidates,
  ripplePeakToPeak,
} from '~/lib/engine/topologies/switcher.ts';

const thermal = { ambientMaxC: 40, airflow: 'still-air' as const };
const ctxOf = (brief: RailSpecInput) => makeContext(railSpecSchema.parse(brief), defaultCatalog);
const brief = (vMin: number, vNom: number, vMax: number, v: number, iMax: number, extra: Partial<RailSpecInput> = {}): RailSpecInput => ({
  input: { vMin, vNom, vMax, source: 'bus' },
  output: { v, tolerance: 0.03, iMin: iMax / 10, iTyp: iMax / 2, iMax },
  noise: { class: 'digital' },
  thermal,
  ...extra,
});
const blockers = (d: Design) => d.issues.filter((i) => i.severity === 'blocker');
const part = (d: Design, role: string) => d.parts.find((p) => p.role === role)!;
const traced = (d: Design, id: string) => d.trace.entries.find((e) => e.id === id)!;

describe('minimum on-time: D·Ts ≥ tON,min (regression: 20–30 V → 0.9 V at 2.2 MHz)', () => {
  test('forced to 2.2 MHz the buck is blocked, and the fix names the highest frequency that works', () => {
    const d = designBuck(ctxOf(brief(20, 24, 30, 0.9, 1, { overrides: { fswHz: 2.2e6 } })));
    const onTime = blockers(d).find((i) => i.code === 'min-on-time');
    expect(onTime).toBeDefined();
    const ton = traced(d, 'buck.ton');
    // tON = D/fsw from the trace's own inputs, below the class's minimum.
    expect(ton.result.value).toBeCloseTo(ton.inputs.D!.value / ton.inputs.fsw!.value, 15);
    const tOnMin = d.assumptions[`${part(d, 'switch').ref}.tOnMin`]!.value;
    expect(ton.result.value).toBeLessThan(tOnMin);
    const fix = d.fixes!.find((f) => f.code === 'min-on-time')!;
    // fsw ≤ D/tON,min, rounded to kHz in the message.
    expect(fix.change).toBe(`fsw ≤ ${(ton.inputs.D!.value / tOnMin / 1e3).toFixed(0)} kHz`);
  });

  test('left free, the search lowers the frequency until the on-time fits', () => {
    const d = designBuck(ctxOf(brief(20, 24, 30, 0.9, 1)));
    expect(blockers(d)).toEqual([]);
    const ton = traced(d, 'buck.ton');
    expect(ton.result.value).toBeGreaterThanOrEqual(d.assumptions[`${part(d, 'switch').ref}.tOnMin`]!.value);
  });

  test('the off-time limit narrows the duty window: Dmax = min(Dmax, 1 − tOFF,min·fsw)', () => {
    const s = defaultCatalog.switchers.find((c) => c.id === 'buck-sync-6v-2a')!;
    // 1 − 60 ns · 3 MHz = 0.82, below the class's 100 %.
    expect(dutyWindow(s, 3e6).dMax).toBeCloseTo(0.82, 12);
    expect(dutyWindow(s, 3e6).dMin).toBeCloseTo(0.15, 12);
  });
});

describe('frequency between the coarse steps', () => {
  // 11–13 V → 48 V at 0.5 A, 50 mV ripple: the boost controller's output capacitor needs
  // C = Iout·D/(fsw·ΔV) (common practice), about 100 µF with an ESR of a few mΩ at 300 kHz, past
  // any six-part bank; at 1 MHz its MOSFET and driver run past the design limit. The window lies
  // between two of the class's steps (100 k, 300 k, 320 k, 1 MHz).
  const upTo48 = brief(11, 12, 13, 48, 0.5, { output: { v: 48, tolerance: 0.05, iMin: 0.01, iTyp: 0.3, iMax: 0.5 } });
  test('midpoints are geometric and rounded to two figures like the steps', () => {
    expect(fswBetween([100e3, 300e3, 320e3, 1e6])).toEqual([170e3, 310e3, 570e3]);
  });
  test('none of the steps holds a clean design, a midpoint does, and the search finds it', () => {
    const ctx = ctxOf(upTo48);
    const cls = defaultCatalog.switchers.find((s) => s.id === 'boost-ctrl-100v')!;
    for (const fsw of fswCandidates(ctx, cls)) {
      expect(blockers(designBoost(ctxOf({ ...upTo48, overrides: { fswHz: fsw } }))).length).toBeGreaterThan(0);
    }
    const d = designBoost(ctx);
    expect(blockers(d)).toEqual([]);
    const fsw = d.assumptions[`${part(d, 'switch').ref}.fsw`]?.value ?? traced(d, 'boost.ton').inputs.fsw!.value;
    expect(fswBetween(fswCandidates(ctx, cls))).toContain(fsw);
  });
});

describe('voltage derating of switcher ICs: at most 80 % of the rating (1.25×, as for pass transistors)', () => {
  const s36 = defaultCatalog.switchers.find((c) => c.id === 'buck-sync-36v')!;
  test('32 V on a 36 V part is blocked (28.8 V allowed); 28 V passes', () => {
    expect(classVoltageFindings(s36, 32, 30, 5, 32, 36).map((f) => f.issue.code)).toContain('input-max');
    expect(classVoltageFindings(s36, 28, 26, 5, 28, 36)).toEqual([]);
  });

  test('an 18–32 V bus to 5 V gets a class rated for it, not the 36 V part', () => {
    const d = designBuck(ctxOf(brief(18, 24, 32, 5, 1)));
    expect(blockers(d)).toEqual([]);
    const rating = part(d, 'switch').ratingV!;
    expect(32 * 1.25).toBeLessThanOrEqual(rating);
  });

  test('a 48 V boost output does not go on a 60 V switch', () => {
    const d = designBoost(ctxOf({ ...brief(10.8, 12, 13.2, 48, 0.2), input: { vMin: 10.8, vNom: 12, vMax: 13.2, source: 'adapter' } }));
    expect(part(d, 'switch').ratingV!).toBeGreaterThanOrEqual(1.25 * 48);
  });
});

describe('saturation at the current limit (regression: 0.3 A inductor on a 4 A limit)', () => {
  test('a light load still gets an inductor rated for the class’s current limit, or a caution', () => {
    const d = designBuck(ctxOf(brief(10, 12, 14, 3.3, 0.1)));
    const l = part(d, 'inductor');
    const isat = d.assumptions[`${l.ref}.isat`]!.value;
    const limit = d.assumptions[`${part(d, 'switch').ref}.iLimit`]!.value;
    const survived = d.issues.some((i) => i.code === 'fault-protected');
    expect(survived ? isat >= limit : d.issues.some((i) => i.code === 'short-saturates')).toBe(true);
  });
});

describe('classes sized to the load', () => {
  test('3.3 V → 1.2 V at 1 A: a low-voltage synchronous buck meets it', () => {
    const d = designBuck(ctxOf(brief(3.2, 3.3, 3.4, 1.2, 1)));
    expect(blockers(d)).toEqual([]);
    expect(part(d, 'switch').part).toMatch(/Low-voltage synchronous buck/);
  });

  test('100–400 V → 12 V at 50 mA: an off-line buck class, and no inductor above 2.2 mH', () => {
    const d = designBuck(ctxOf({ ...brief(100, 300, 400, 12, 0.05), input: { vMin: 100, vNom: 300, vMax: 400, source: 'rectified' } }));
    expect(blockers(d)).toEqual([]);
    expect(part(d, 'switch').part).toMatch(/Off-line buck/);
    expect(part(d, 'inductor').value!).toBeLessThanOrEqual(2.2e-3);
  });
});

describe('forced part values are used (regression: C1 = 47 µF recorded but 22 µF used)', () => {
  test('a forced output capacitor is the part listed and the capacitance in the ripple figure', () => {
    const d = designBuck(ctxOf(brief(10, 12, 14, 3.3, 1, { overrides: { parts: { C1: 47e-6, L1: 22e-6 } } })));
    const cout = part(d, 'output-capacitor');
    expect(cout.ref).toBe('C1');
    expect(cout.value).toBeCloseTo(47e-6, 15);
    expect(part(d, 'inductor').value).toBe(22e-6);
    const ripple = traced(d, 'buck.ripple');
    expect(ripple.inputs.Cout!.value).toBeCloseTo(traced(d, 'buck.cout').result.value, 15);
    expect(traced(d, 'buck.cout').inputs.C!.value).toBeCloseTo(47e-6, 15);
  });
});

describe('load step: ΔV = ΔI/(2π·fc·Cout) + ΔI·ESR with fc = fsw/10 (current mode, common practice)', () => {
  test('the output capacitance is sized so a 0.5 A step stays within 50 mV', () => {
    const d = designBuck(
      ctxOf(
        brief(10, 12, 14, 3.3, 1, {
          output: { v: 3.3, tolerance: 0.03, iMin: 0.1, iTyp: 0.5, iMax: 1, loadStep: 0.5, maxStepDeviation: 0.05 },
        }),
      ),
    );
    const step = traced(d, 'buck.step');
    const { ΔI, fc, Cout, ESR } = step.inputs as Record<string, { value: number }>;
    expect(step.result.value).toBeCloseTo(ΔI!.value / (2 * Math.PI * fc!.value * Cout!.value) + ΔI!.value * ESR!.value, 12);
    expect(step.result.value).toBeLessThanOrEqual(0.05);
    expect(blockers(d)).toEqual([]);
  });
});

describe('four-switch buck-boost: buck duty above the class’s limit switches both legs', () => {
  const s = defaultCatalog.switchers.find((c) => c.id === 'buckboost-4sw-5v5')!;
  test('3.7 V → 3.3 V wants D = 0.89 in buck mode; the part holds D1 = 0.85 and the boost leg makes up the rest', () => {
    const p = buckBoostPoint(s, 3.7, 3.3, 0.15, 1.6e6, 2.7e-6, 0.015);
    expect(p.region).toBe('transition');
    expect(p.dBuck).toBeCloseTo(dutyWindow(s, 1.6e6).dMax, 12);
    // Vout = Vin·D1/(1 − D2) up to the conduction losses: within 3 %.
    expect((3.7 * p.dBuck) / (1 - p.dBoost)).toBeGreaterThan(3.3);
    expect((3.7 * p.dBuck) / (1 - p.dBoost)).toBeLessThan(3.3 * 1.03);
  });

  test('well above and below the output the single-leg modes remain', () => {
    expect(buckBoostPoint(s, 5, 3.3, 0.15, 1.6e6, 2.7e-6, 0.015).region).toBe('buck');
    expect(buckBoostPoint(s, 2.5, 3.3, 0.15, 1.6e6, 2.7e-6, 0.015).region).toBe('boost');
  });

  test('a quiet 3.3 V rail from one Li-ion cell: the post-regulated option uses a buck-boost', () => {
    const d = designSwitcherLinear(
      ctxOf({
        input: { vMin: 3, vNom: 3.7, vMax: 4.2, source: 'battery' },
        output: { v: 3.3, tolerance: 0.03, iMin: 0.01, iTyp: 0.2, iMax: 0.5 },
        noise: { class: 'precision' },
        thermal,
      }),
    );
    expect(d.label).toMatch(/buck-boost/);
  });
});

describe('output ripple: exact peak-to-peak of vC + ESR·iC (Erickson & Maksimović, 2nd ed., ch. 2, capacitor charge balance)', () => {
  test('without ESR a zero-mean triangle gives ΔIL·Ts/(8·C) at any duty: 0.4785 A at 500 kHz on 22 µF is 5.4375 mV', () => {
    for (const d of [0.2, 0.5, 0.8])
      expect(ripplePeakToPeak(buckSegments('ccm', d, 0.4785, 1, 500e3), 22e-6, 0)).toBeCloseTo(0.4785 / (8 * 500e3 * 22e-6), 12);
  });

  test('with a huge capacitor only the ESR step is left: ΔIL·ESR', () => {
    expect(ripplePeakToPeak(buckSegments('ccm', 0.3, 0.5, 1, 500e3), 1e3, 0.01)).toBeCloseTo(0.005, 9);
  });

  test('both terms: below the textbook sum ΔIL/(8·fsw·C) + ΔIL·ESR, above either alone', () => {
    const exact = ripplePeakToPeak(buckSegments('ccm', 0.275, 0.4785, 1, 500e3), 22e-6, 0.01);
    expect(exact).toBeLessThan(5.4375e-3 + 4.785e-3);
    expect(exact).toBeGreaterThan(Math.max(5.4375e-3, 4.785e-3));
  });

  test('boost without ESR, valley above the load: the switch-on sag Iout·D/(fsw·C) = 13.258 mV (5 V → 12 V, 0.5 A, 1 MHz, 22 µF)', () => {
    const d = 1 - 5 / 12;
    expect(ripplePeakToPeak(boostSegments('ccm', d, 1.2 + 0.31, 0.62, 0.5, 1e6), 22e-6, 0)).toBeCloseTo((0.5 * d) / (1e6 * 22e-6), 12);
  });

  test('boost whose inductor valley dips below the load sags further than Iout·D/(fsw·C)', () => {
    const d = 0.1;
    expect(ripplePeakToPeak(boostSegments('ccm', d, 0.2, 0.07, 0.15, 1.6e6), 5e-6, 0)).toBeGreaterThan((0.15 * d) / (1.6e6 * 5e-6));
  });
});

describe('every switcher trace entry recomputes from its own printed inputs', () => {
  type In = Record<string, number>;
  const equations: Record<string, (x: In) => number> = {
    'd.nom': (x) => x.Vout! / (x['η']! * x.Vin!),
    dil: (x) => ((x.vInMax! - x.Vout! - x.iOutMax! * (x.Rds! + x.DCR!)) * x.D!) / (x.fsw! * x.L!),
    ipk: (x) => x.iOutMax! + x['ΔIL']! / 2,
    ton: (x) => x.D! / x.fsw!,
    ripple: (x) => ripplePeakToPeak(buckSegments('ccm', x.D!, x['ΔIL']!, x.Iout!, x.fsw!), x.Cout!, x.ESR!),
    cout: (x) => x.C! * (1 - x.tol!) * Math.max(0.2, 1 - (x.k! * x.V!) / x.Vrated!),
    'cin.rms': (x) => x.iOutMax! * Math.sqrt(x['D·(1 − D)']!),
    rds: (x) => x.Rds25! * (1 + x['α']! * (x.Tj! - 25)),
    fb: (x) => x.Vfb! * (1 + x.R2! / x.R1!),
  };
  const boostEquations: Record<string, (x: In) => number> = {
    d: (x) => 1 - (x['η']! * x.Vin!) / x.Vout!,
    ipk: (x) => x.Iout! / (1 - x.D!) + x['ΔIL']! / 2,
    'cout.rms': (x) => x.Iout! * Math.sqrt(x.D! / (1 - x.D!)),
    cout: equations.cout!,
    rds: equations.rds!,
    fb: equations.fb!,
  };
  const check = (entries: TraceEntry[], prefix: string, table: Record<string, (x: In) => number>) => {
    let checked = 0;
    for (const e of entries) {
      const key = e.id.slice(prefix.length + 1);
      const f = table[key];
      if (!e.id.startsWith(`${prefix}.`) || !f) continue;
      const x = Object.fromEntries(Object.entries(e.inputs).map(([k, q]) => [k, q.value]));
      expect(e.result.value, e.id).toBeCloseTo(f(x), 9);
      checked += 1;
    }
    return checked;
  };

  test('buck at 12 V → 3.3 V, 1 A: duty, ripple, peak, on-time, capacitances and Rds(on)', () => {
    const d = designBuck(ctxOf(brief(10, 12, 14, 3.3, 1)));
    expect(check(d.trace.entries, 'buck', equations)).toBeGreaterThanOrEqual(8);
    // One corner, one duty cycle: the ripple and the on-time use the same D at the highest input.
    expect(traced(d, 'buck.dil').inputs.D!.value).toBe(traced(d, 'buck.ton').inputs.D!.value);
  });

  test('boost at 12 V → 24 V, 0.5 A', () => {
    const d = designBoost(ctxOf(brief(11.4, 12, 12.6, 24, 0.5)));
    expect(check(d.trace.entries, 'boost', boostEquations)).toBeGreaterThanOrEqual(5);
    expect(traced(d, 'boost.ipk').inputs.D!.value).toBe(traced(d, 'boost.d').result.value);
  });

  test('buck-boost from a Li-ion cell', () => {
    const d = designBuckBoost(
      ctxOf({
        input: { vMin: 3, vNom: 3.7, vMax: 4.2, source: 'battery' },
        output: { v: 3.3, tolerance: 0.05, iMin: 0.01, iTyp: 0.2, iMax: 0.5 },
        noise: { class: 'digital' },
        thermal,
      }),
    );
    expect(check(d.trace.entries, 'buckboost', { cout: equations.cout!, rds: equations.rds!, fb: equations.fb! })).toBe(3);
  });
});

describe('input robustness cautions carry values', () => {
  test('a 24 V bus: reverse polarity, inrush, filter damping and a surge note', () => {
    const d = designBuck(ctxOf(brief(18, 24, 28, 5, 1)));
    const input = d.issues.find((i) => i.code === 'input-robustness')!;
    expect(input.message).toMatch(/reverse polarity: .* \d+\.\d+ W at \d+\.\d+ A/);
    expect(input.message).toMatch(/−Vin²\/Pin = −\d+\.\d+ Ω/);
    expect(d.issues.some((i) => i.code === 'surge' && /ISO 16750-2/.test(i.message))).toBe(true);
  });

  test('a battery input gets no surge note', () => {
    const d = designBuck(ctxOf({ ...brief(6, 7.4, 8.4, 3.3, 0.5), input: { vMin: 6, vNom: 7.4, vMax: 8.4, source: 'battery' } }));
    expect(d.issues.some((i) => i.code === 'surge')).toBe(false);
  });
});

describe('post-regulated switcher: the converter that fits the input, its ripple by the rejection at fsw', () => {
  test('quiet step-up rail (5 V → 12 V, rf, 50 mA): a boost stage ahead of the post-regulator', () => {
    const d = designSwitcherLinear(ctxOf({ ...brief(4.75, 5, 5.25, 12, 0.05), noise: { class: 'rf' } }));
    expect(d.label).toMatch(/^Boost converter with linear post-regulator/);
    expect(blockers(d)).toEqual([]);
  });

  test('Li-ion → 3.3 V, rf: the bus straddles the cell, so a four-switch buck-boost', () => {
    const d = designSwitcherLinear(
      ctxOf({ ...brief(3, 3.7, 4.2, 3.3, 0.1), input: { vMin: 3, vNom: 3.7, vMax: 4.2, source: 'battery' }, noise: { class: 'rf' } }),
    );
    expect(d.label).toMatch(/^Four-switch buck-boost converter with linear post-regulator/);
    expect(blockers(d)).toEqual([]);
  });

  test('the post-regulator is credited with its rejection at the switching frequency, not a flat figure', () => {
    const d = designSwitcherLinear(ctxOf({ ...brief(10.8, 12, 13.2, 5, 0.6), noise: { class: 'rf' } }));
    const reg = d.parts.find((p) => p.role === 'regulator')!;
    const cls = defaultCatalog.linearRegulators.find((c) => reg.part.startsWith(c.label))!;
    const fsw = d.assumptions[`${part(d, 'switch').ref}.fsw`]!.value;
    // Single-pole roll-off (common practice): PSRR(f) = PSRRhf + 20·log10(1 MHz/f), capped at the low-frequency figure.
    const psrr = Math.min(cls.kind === 'adjustable' ? cls.psrrBypassDb : cls.psrrDb, cls.psrrHfDb + 20 * Math.log10(1e6 / fsw));
    const ripple = traced(d, `${reg.ref}.ripple`);
    expect(ripple.inputs.PSRR!.value).toBeCloseTo(Math.max(cls.psrrHfDb, psrr), 9);
  });
});

describe('briefs the switcher search must make buildable', () => {
  test('9–36 V → 12 V ±5 %, 0.5 A: the 60 V four-switch controller takes a bus the 36 V part cannot (36 V > 28.8 V derated)', () => {
    const d = designBuckBoost(
      ctxOf({ ...brief(9, 24, 36, 12, 0.5), output: { v: 12, tolerance: 0.05, iMin: 0.01, iTyp: 0.25, iMax: 0.5 } }),
    );
    expect(part(d, 'switch').part).toMatch(/60 V/);
    expect(blockers(d)).toEqual([]);
  });

  test('24 V → 5 V ±2 %, 1 A, rf: the post-regulator class is one whose reference holds ±2 % at 1 A', () => {
    const d = designSwitcherLinear(
      ctxOf({ ...brief(22, 24, 26, 5, 1), output: { v: 5, tolerance: 0.02, iMin: 0.02, iTyp: 0.5, iMax: 1 }, noise: { class: 'rf' } }),
    );
    // A ±1 % reference leaves room for the divider inside ±2 %; the class carries 1 A within 90 % of its rating (common practice).
    const cls = defaultCatalog.linearRegulators.find((c) => part(d, 'regulator').part.startsWith(c.label))!;
    expect(cls.vRefTolerance).toBeLessThanOrEqual(0.01);
    expect(0.9 * cls.iOutMaxA).toBeGreaterThanOrEqual(1);
    expect(blockers(d)).toEqual([]);
  });

  test("90–110 V → 48 V ±3 %, 50 mA: a class whose ±1 % feedback holds the band, not the off-line part's ±3 %", () => {
    const d = designBuck(
      ctxOf({ ...brief(90, 100, 110, 48, 0.05), output: { v: 48, tolerance: 0.03, iMin: 0.001, iTyp: 0.025, iMax: 0.05 } }),
    );
    expect(part(d, 'switch').part).toMatch(/150 V/);
    // 110 V × 1.25 = 137.5 V of rating needed: the 100 V classes are out, the 150 V one fits.
    expect(blockers(d)).toEqual([]);
  });

  test('two AA cells (2.1–3.2 V) → 1.8 V, 50 mA: a buck class that starts from 1.8 V', () => {
    const d = designBuck(ctxOf({ ...brief(2.1, 2.6, 3.2, 1.8, 0.05), input: { vMin: 2.1, vNom: 2.6, vMax: 3.2, source: 'battery' } }));
    expect(part(d, 'switch').part).toMatch(/from 1\.8 V/);
    expect(blockers(d).map((i) => i.code)).not.toContain('input-min');
  });
});

describe('catch diode temperature in the class search: Tj = Ta + P·θJA·kair (JESD51 chain), P = Vf·Iout·(1 − D)', () => {
  // 36–60 V → 5 V, 1.5 A at 70 °C in an enclosure: the 100 V diode class's catch diode loses about
  // 0.6 V × 1.5 A × 0.9 ≈ 0.8 W, and 0.8 W × 60 K/W × 1.3 adds some 63 K: past the 125 °C design limit.
  const hot = brief(36, 48, 60, 5, 1.5, { thermal: { ambientMaxC: 70, airflow: 'enclosed' } });

  test('the search keeps a design the assembly passes, not the diode class it would then block', () => {
    const option = evaluate(railSpecSchema.parse(hot)).options.find((o) => o.topology === 'buck')!;
    expect(option.issues.filter((i) => i.severity === 'blocker')).toEqual([]);
    expect(option.feasible).toBe(true);
    const sw = option.components.find((c) => c.role === 'switch')!;
    expect(defaultCatalog.switchers.find((s) => s.label === sw.part)!.rectification).toBe('sync');
  });

  test('with only the diode class to choose, the blocker names the diode and the synchronous fix', () => {
    const diodeOnly = {
      ...defaultCatalog,
      switchers: defaultCatalog.switchers.filter((s) => s.id !== 'buck-sync-100v-3a' && s.id !== 'buck-sync-150v-1a'),
    };
    const d = designBuck(makeContext(railSpecSchema.parse(hot), diodeOnly));
    const diode = blockers(d).find((i) => i.code === 'thermal' && /diode/.test(i.message));
    expect(diode?.message).toMatch(/above the 125 °C design limit/);
    expect(d.fixes!.map((f) => f.change)).toContain('a synchronous class (no diode to heat), a lower load, or more airflow');
  });
});
