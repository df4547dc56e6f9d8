// A three-terminal linear regulator stage (class choice, divider, capacitors, protection
// diodes), shared by the plain linear option and the switcher + linear post-regulator.
import type { LinearRegulatorClass } from '../catalog.ts';
import type { Context } from '../context.ts';
import { forced } from '../context.ts';
import { chooseCapacitor } from '../capacitors.ts';
import { Refs, blocker, info, makePart, resistorPart, type DesignPart, type PartStress } from '../design.ts';
import type { SeriesName } from '../eseries.ts';
import { junctionTemperature } from '../thermal.ts';
import type { ToleranceModel } from '../tolerance.ts';
import type { Trace } from '../trace.ts';
import type { Issue, Quantity } from '../types.ts';
import { designDivider, dividerModel, type Divider } from './feedback.ts';

/** A divider current of about 100 µA keeps the feedback-pin bias error small (common practice). */
export const DIVIDER_MIN_A = 100e-6;

/** Above about 25 V out, or with large output capacitance, a diode protects the regulator when the input is shorted (common practice). */
const PROTECTION_DIODE_V = 25;

export interface StageInput {
  vTrough: number;
  vMax: number;
  rippleVpp: number;
  /** True when the ripple is at switching frequency, where rejection is much lower. */
  rippleIsHf: boolean;
}

export interface ClassCheck {
  cls: LinearRegulatorClass;
  failures: Issue[];
}

function isFixedMatch(cls: LinearRegulatorClass, vOut: number): boolean {
  return cls.kind === 'fixed' && Math.abs(cls.vRefV - vOut) <= 0.005 * vOut;
}

/** Blockers a class would meet on this rail (empty when it fits). */
export function checkClass(ctx: Context, cls: LinearRegulatorClass, input: StageInput, vOut: number, iMax: number): Issue[] {
  const out: Issue[] = [];
  if (iMax > cls.iOutMaxA) out.push(blocker('current', `${cls.label} delivers at most ${cls.iOutMaxA} A; the load needs ${iMax} A.`));
  if (input.vTrough < vOut + cls.dropoutV) {
    out.push(
      blocker(
        'headroom',
        `${cls.label} needs ${cls.dropoutV} V of headroom; the input trough ${input.vTrough.toFixed(2)} V leaves ${(input.vTrough - vOut).toFixed(2)} V above ${vOut} V.`,
      ),
    );
  }
  if (cls.vDiffMaxV !== null && input.vMax - vOut > cls.vDiffMaxV) {
    out.push(
      blocker('differential', `The input-output differential reaches ${(input.vMax - vOut).toFixed(1)} V; ${cls.label} allows ${cls.vDiffMaxV} V.`),
    );
  }
  if (cls.vInMaxV !== null && input.vMax > cls.vInMaxV) {
    out.push(blocker('input-max', `The input reaches ${input.vMax} V; ${cls.label} allows ${cls.vInMaxV} V.`));
  }
  if (cls.kind !== 'fixed' && vOut < cls.vRefV) {
    out.push(blocker('below-reference', `${cls.label} cannot regulate below its ${cls.vRefV} V reference.`));
  }
  if (cls.kind === 'fixed' && cls.vRefTolerance > ctx.spec.output.tolerance) {
    out.push(blocker('tolerance', `${cls.label} holds ±${cls.vRefTolerance * 100} %, wider than the rail's ±${ctx.spec.output.tolerance * 100} %.`));
  }
  if (!cls.heatsinkable) {
    const p = (input.vMax - vOut) * (iMax + Math.max(cls.minLoadA, DIVIDER_MIN_A));
    const tj = junctionTemperature(ctx.ambientC, p, [cls.thetaJaCW * ctx.catalog.thermal.airflowFactor[ctx.spec.thermal.airflow]]);
    if (tj > cls.tjMaxC - ctx.catalog.thermal.tjMarginK) {
      out.push(blocker('thermal', `${cls.label} cannot take a heatsink and would reach ${tj.toFixed(0)} °C.`));
    }
  }
  return out;
}

/**
 * Preference: a matching fixed class, then the adjustable classes from the smallest, then the
 * low-dropout class; the first that fits wins, otherwise the one with the fewest blockers (so a
 * rail short of headroom for the classic class moves to the low-dropout class).
 */
export function chooseRegulatorClass(ctx: Context, input: StageInput, vOut: number, iMax: number, forcedId: string | undefined): ClassCheck {
  const all = ctx.catalog.linearRegulators;
  const wanted = forcedId === undefined ? undefined : all.find((c) => c.id === forcedId);
  if (wanted) return { cls: wanted, failures: checkClass(ctx, wanted, input, vOut, iMax) };
  const rank = (c: LinearRegulatorClass) => (c.kind === 'fixed' ? 0 : c.kind === 'adjustable' ? 1 : 2);
  const ordered = all
    .filter((c) => c.kind !== 'fixed' || isFixedMatch(c, vOut))
    .map((cls, index) => ({ cls, index }))
    .sort((a, b) => rank(a.cls) - rank(b.cls) || a.cls.iOutMaxA - b.cls.iOutMaxA || (a.cls.vDiffMaxV ?? 0) - (b.cls.vDiffMaxV ?? 0) || a.index - b.index);
  let best: ClassCheck | null = null;
  for (const { cls } of ordered) {
    const failures = checkClass(ctx, cls, input, vOut, iMax);
    if (failures.length === 0) return { cls, failures };
    if (best === null || failures.length < best.failures.length) best = { cls, failures };
  }
  return best ?? { cls: all[0]!, failures: [blocker('no-class', 'The catalog has no linear regulator class.')] };
}

export interface RegulatorStage {
  cls: LinearRegulatorClass;
  regRef: string;
  parts: DesignPart[];
  issues: Issue[];
  divider: Divider | null;
  vOut: number;
  output: ToleranceModel;
  rippleOutVpp: number;
  assumptions: Record<string, Quantity>;
  /** Current the stage draws from its input at load current iOut. */
  inputCurrent(iOut: number): number;
  stress(vIn: number, iOut: number): Record<string, PartStress>;
  faultStress(vIn: number): Record<string, PartStress>;
}

export function regulatorStage(
  ctx: Context,
  refs: Refs,
  trace: Trace,
  input: StageInput,
  vTarget: number,
  iMax: number,
  forcedClassId: string | undefined,
): RegulatorStage {
  const { spec, catalog } = ctx;
  const choice = chooseRegulatorClass(ctx, input, vTarget, iMax, forcedClassId);
  const cls = choice.cls;
  const issues: Issue[] = [...choice.failures];
  if (forcedClassId !== undefined && cls.id !== forcedClassId) {
    issues.push(info('class-unknown', `The catalog has no regulator class "${forcedClassId}"; the engine chose ${cls.label}.`));
  }
  const regRef = refs.next('U');
  const series: SeriesName = spec.overrides.resistorSeries ?? 'E96';
  const rTol = series === 'E96' ? 0.01 : 0.05;
  const parts: DesignPart[] = [
    makePart({
      ref: regRef,
      role: 'regulator',
      part: cls.label,
      ratingV: cls.vDiffMaxV ?? cls.vInMaxV,
      tolerance: cls.vRefTolerance,
      costCents: cls.costCents,
      thermal: { thetaJcCW: cls.thetaJcCW, thetaJaCW: cls.thetaJaCW, tjMaxC: cls.tjMaxC, heatsinkable: cls.heatsinkable, protectedInFault: true },
    }),
  ];

  let divider: Divider | null = null;
  let r1Ref = '';
  let r2Ref = '';
  let output: ToleranceModel;
  if (cls.kind === 'fixed') {
    output = {
      params: [{ name: 'Vout', nominal: cls.vRefV, lo: cls.vRefV * (1 - cls.vRefTolerance), hi: cls.vRefV * (1 + cls.vRefTolerance) }],
      f: (x: Float64Array) => x[0]!,
      batch: (c, out) => out.set(c[0]!),
    };
  } else {
    r1Ref = refs.next('R');
    r2Ref = refs.next('R');
    const iDivMin = Math.max(cls.minLoadA, DIVIDER_MIN_A);
    divider = designDivider(vTarget, cls.vRefV, cls.iAdjTypA, iDivMin, series, spec.overrides.r1Ohm ?? forced(ctx, r1Ref), forced(ctx, r2Ref));
    trace.add(
      `${regRef}.r1`,
      'R1 so the divider alone carries the minimum load',
      'R1 ≤ Vref / Imin',
      { Vref: [cls.vRefV, 'V'], Imin: [iDivMin, 'A'] },
      divider.r1,
      'Ω',
    );
    trace.add(
      `${regRef}.r2`,
      'R2 solved for the rail, then snapped',
      'R2 = (Vout − Vref) / (Vref/R1 + Iadj)',
      { Vout: [vTarget, 'V'], Vref: [cls.vRefV, 'V'], R1: [divider.r1, 'Ω'], Iadj: [cls.iAdjTypA, 'A'] },
      divider.r2,
      'Ω',
    );
    trace.add(
      `${regRef}.vout`,
      'Output recomputed with the snapped values',
      'Vout = Vref·(1 + R2/R1) + Iadj·R2',
      { Vref: [cls.vRefV, 'V'], R1: [divider.r1, 'Ω'], R2: [divider.r2, 'Ω'], Iadj: [cls.iAdjTypA, 'A'] },
      divider.vOut,
      'V',
    );
    parts.push(resistorPart(r1Ref, 'feedback-lower', divider.r1, rTol, series), resistorPart(r2Ref, 'feedback-upper', divider.r2, rTol, series));
    output = dividerModel(cls.vRefV, cls.vRefTolerance, divider, rTol, 0, cls.iAdjMaxA, cls.iAdjTypA);
  }
  const vOut = divider?.vOut ?? cls.vRefV;

  const quiet = spec.noise.class === 'precision' || spec.noise.class === 'rf';
  const bypass = cls.kind === 'adjustable' && (input.rippleVpp > 0 || quiet);
  const psrr = input.rippleIsHf ? cls.psrrHfDb : bypass ? cls.psrrBypassDb : cls.psrrDb;
  const rippleOutVpp = trace.add(
    `${regRef}.ripple`,
    'Output ripple through the regulator’s ripple rejection',
    'ΔVout = ΔVin · 10^(−PSRR/20)',
    { ΔVin: [input.rippleVpp, 'V'], PSRR: [psrr, 'dB'] },
    input.rippleVpp * 10 ** (-psrr / 20),
    'V',
  );

  const cin = chooseCapacitor(refs.next('C'), 'input-capacitor', 0.1e-6, input.vMax, catalog);
  const cout = chooseCapacitor(refs.next('C'), 'output-capacitor', cls.kind === 'ldo' ? 4.7e-6 : 1e-6, vOut, catalog);
  parts.push(cin.part, cout.part);
  for (const c of [cin, cout]) if (c.issue) issues.push(c.issue);
  let cadjRef = '';
  if (bypass) {
    const cadj = chooseCapacitor(refs.next('C'), 'bypass-capacitor', 10e-6, Math.max(0, vOut - cls.vRefV), catalog);
    cadjRef = cadj.part.ref;
    parts.push(cadj.part);
    if (cadj.issue) issues.push(cadj.issue);
  }
  const diodes: string[] = [];
  if (vOut >= PROTECTION_DIODE_V || cout.farads >= 25e-6) {
    const d = refs.next('D');
    diodes.push(d);
    parts.push(makePart({ ref: d, role: 'protection-diode', part: 'Rectifier diode, output to input', ratingV: input.vMax, costCents: catalog.costs.protectionDiodeCents }));
    if (bypass) {
      const d2 = refs.next('D');
      diodes.push(d2);
      parts.push(makePart({ ref: d2, role: 'protection-diode', part: 'Rectifier diode, adjust to output', ratingV: vOut, costCents: catalog.costs.protectionDiodeCents }));
    }
  }

  const iDiv = divider?.iDivider ?? 0;
  const iAdj = cls.kind === 'fixed' ? 0 : cls.iAdjTypA;
  const inputCurrent = (iOut: number) => iOut + iDiv + iAdj + cls.iqA;
  const stress = (vIn: number, iOut: number): Record<string, PartStress> => {
    const s: Record<string, PartStress> = {
      // (Vin − Vout)·(Iout + Idivider) + Vin·Iq
      [regRef]: { w: Math.max(0, vIn - vOut) * (iOut + iDiv + iAdj) + vIn * cls.iqA, v: Math.max(0, vIn - vOut) },
      [cin.part.ref]: { w: 0, v: vIn },
      [cout.part.ref]: { w: 0, v: vOut },
    };
    if (divider) {
      s[r1Ref] = { w: (cls.vRefV * cls.vRefV) / divider.r1, v: cls.vRefV };
      const vr2 = vOut - cls.vRefV;
      s[r2Ref] = { w: (vr2 * vr2) / divider.r2, v: vr2 };
    }
    if (cadjRef) s[cadjRef] = { w: 0, v: vOut - cls.vRefV };
    for (const d of diodes) s[d] = { w: 0, v: vIn };
    return s;
  };
  const faultStress = (vIn: number): Record<string, PartStress> => {
    const s = stress(vIn, 0);
    // Output shorted: the regulator sits at its current limit with the whole input across it.
    s[regRef] = { w: cls.iLimitA * vIn, v: vIn };
    for (const ref of [r1Ref, r2Ref, cadjRef, cout.part.ref]) if (ref) s[ref] = { w: 0, v: 0 };
    return s;
  };

  const assumptions: Record<string, Quantity> = {
    [`${regRef}.vRef`]: { value: cls.vRefV, unit: 'V' },
    [`${regRef}.iAdj`]: { value: iAdj, unit: 'A' },
    [`${regRef}.iq`]: { value: cls.iqA, unit: 'A' },
    [`${regRef}.dropout`]: { value: cls.dropoutV, unit: 'V' },
    [`${regRef}.iLimit`]: { value: cls.iLimitA, unit: 'A' },
  };
  return { cls, regRef, parts, issues, divider, vOut, output, rippleOutVpp, assumptions, inputCurrent, stress, faultStress };
}
