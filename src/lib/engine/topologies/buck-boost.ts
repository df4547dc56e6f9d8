// Four-switch buck-boost: steps down when the input is well above the output, up when below, and
// switches both legs in between, so it regulates an input range that straddles the output.
import type { SwitcherClass } from '../catalog.ts';
import type { Context } from '../context.ts';
import type { ChosenCapacitor } from '../capacitors.ts';
import { Refs, info, operatingPoint, type Design, type PartStress } from '../design.ts';
import { coreLossW, type ChosenInductor } from '../inductors.ts';
import { cycleLosses, sumCycle } from './switcher-losses.ts';
import { Trace } from '../trace.ts';
import { boostPoint, boostRipple } from './boost.ts';
import { buckPoint, buckRipple } from './buck.ts';
import { inputCautions } from './switcher-input.ts';
import * as shared from './switcher-stress.ts';
import {
  RIPPLE_BUDGET,
  RIPPLE_RATIO,
  capacitorFindings,
  classVoltageFindings,
  dutyWindow,
  finding,
  inputBank,
  onTimeFinding,
  outputBank,
  boostSegments,
  buckSegments,
  ripplePeakToPeak,
  rippleReference,
  stepCapacitance,
  converterDesign,
  railRequest,
  voltageFits,
  type ConverterStage,
  type Finding,
  type StageRequest,
  type SizingBase,
  type StageRefs,
} from './switcher.ts';
import { classPhrase } from '../units.ts';

export type BuckBoostRegion = 'buck' | 'transition' | 'boost';

export interface BuckBoostPoint {
  region: BuckBoostRegion;
  /** Duty of the leg that switches (the boost leg in the transition region). */
  d: number;
  dBuck: number;
  dBoost: number;
  /** Average inductor current. */
  il: number;
  rippleA: number;
  peakA: number;
  switchW: number;
  dcrW: number;
  coreW: number;
  pInW: number;
  pOutW: number;
  /** True when the boost leg switches (transition or boost region). */
  boost: boolean;
}

/** One leg switching as a plain buck or boost, the other's top switch held on. */
function onlyLeg(
  region: 'buck' | 'boost',
  p: Pick<BuckBoostPoint, 'd' | 'rippleA' | 'peakA' | 'switchW' | 'dcrW' | 'coreW' | 'pInW' | 'pOutW'>,
  dBuck: number,
  dBoost: number,
  il: number,
): BuckBoostPoint {
  const { d, rippleA, peakA, switchW, dcrW, coreW, pInW, pOutW } = p;
  return { region, d, dBuck, dBoost, il, rippleA, peakA, switchW, dcrW, coreW, pInW, pOutW, boost: region === 'boost' };
}

/**
 * Above the output the buck leg switches while the boost leg's top switch stays on; below it the
 * boost leg switches while the buck leg's top switch stays on: two switches always carry the
 * inductor current. Where the buck duty would pass the class's limit, or the boost duty fall
 * below its minimum on-time, both legs switch (transition region): the buck leg at its limit D1,
 * the boost leg at D2 = 1 − η·Vin·D1/Vout, so Vout = Vin·D1/(1 − D2); the inductor sees
 * Vin − drop for D2·Ts, then Vin − Vout − drop until D1·Ts, then −Vout − drop.
 */
export function buckBoostPoint(
  stage: SwitcherClass,
  vIn: number,
  vOut: number,
  iOut: number,
  fsw: number,
  henries: number,
  dcrOhm: number,
  coreLoss?: (rippleA: number) => number,
): BuckBoostPoint {
  const window = dutyWindow(stage, fsw);
  if (vIn > vOut) {
    const p = buckPoint({ ...stage, rdsOnOhm: 2 * stage.rdsOnOhm }, vIn, vOut, iOut, fsw, henries, dcrOhm, coreLoss);
    if (p.d <= window.dMax) {
      return onlyLeg('buck', p, p.d, 0, iOut);
    }
  } else {
    const p = boostPoint(stage, vIn, vOut, iOut, fsw, henries, dcrOhm, 2, coreLoss);
    if (p.d >= window.dMin || p.mode !== 'ccm') {
      return onlyLeg('boost', p, 1, p.d, p.inductorA);
    }
  }
  const pOut = vOut * iOut;
  const d1 = Math.min(window.dMax, vOut / vIn);
  let eta = 1;
  let d2 = 0;
  let il = iOut;
  let peak = iOut;
  let ripple = 0;
  let conduction = 0;
  let dcr = 0;
  for (let k = 0; k < 8; k += 1) {
    d2 = Math.min(0.99, Math.max(0, 1 - (eta * vIn * d1) / vOut));
    // Inductor voltage over the three intervals, less the drop of the two conducting switches and
    // the winding: u1, u2 are the current's rise after the first and second interval.
    const drop = il * (2 * stage.rdsOnOhm + dcrOhm);
    const u1 = ((vIn - drop) * d2) / (fsw * henries);
    const u2 = u1 + ((vIn - vOut - drop) * (d1 - d2)) / (fsw * henries);
    // The output takes the inductor current only after D2: its average there is Iout (charge
    // balance), which fixes the starting current i0; the period average follows.
    const i0 = (iOut - ((u1 + u2) * (d1 - d2) + u2 * (1 - d1)) / 2) / (1 - d2);
    // A sourcing stage's inductor never averages below zero (the model's charge balance can dip
    // under it at light load, or run away where the drops exceed the input): it stops there.
    il = Math.max(0, i0 + (u1 * d2 + (u1 + u2) * (d1 - d2) + u2 * (1 - d1)) / 2);
    peak = Math.max(0, i0 + Math.max(0, u1, u2));
    ripple = Math.max(0, u1, u2) - Math.min(0, u1, u2);
    const irms2 = il * il + (ripple * ripple) / 12;
    conduction = irms2 * 2 * stage.rdsOnOhm;
    dcr = irms2 * dcrOhm;
    eta = pOut > 0 ? pOut / (pOut + il * il * (2 * stage.rdsOnOhm + dcrOhm)) : 1;
  }
  const cycles = sumCycle(cycleLosses(stage, vIn, il, fsw, 2)) + sumCycle(cycleLosses(stage, vOut, il, fsw, 2));
  const coreW = coreLoss?.(ripple) ?? 0;
  const switchW = conduction + cycles + stage.iqA * vIn;
  return {
    region: 'transition',
    d: d2,
    dBuck: d1,
    dBoost: d2,
    il,
    rippleA: ripple,
    peakA: peak,
    switchW,
    dcrW: dcr,
    coreW,
    pInW: pOut + switchW + dcr + coreW,
    pOutW: pOut,
    boost: true,
  };
}

/** Output ripple: pulsed output current in the boost and transition regions, triangular in the buck region. */
export function buckBoostRipple(p: BuckBoostPoint, iOut: number, fsw: number, capF: number, esrOhm: number): number {
  return p.boost ? boostRipple(iOut, p.dBoost, p.peakA, fsw, capF, esrOhm) : buckRipple(p.rippleA, fsw, capF, esrOhm);
}

interface Load {
  iMin: number;
  iTyp: number;
  iMax: number;
}

interface BuckBoostSizing extends SizingBase {
  low: BuckBoostPoint;
  high: BuckBoostPoint;
  point(vIn: number, iOut: number): BuckBoostPoint;
}

/** The switch nodes swing to the higher of the input and the output (with 5 % for overshoot). */
const switchNodeV = (vMax: number, vOut: number) => Math.max(vMax, vOut * 1.05);

/** The class's ratings and ranges against the rail: the same at every frequency. */
function buckBoostClassFindings(stage: SwitcherClass, input: { vTrough: number; vMax: number }, vOut: number): Finding[] {
  return classVoltageFindings(stage, input.vMax, input.vTrough, vOut, switchNodeV(input.vMax, vOut), stage.vOutMaxV);
}

function sizeBuckBoost(
  ctx: Context,
  r: StageRefs,
  base: SwitcherClass,
  fsw: number,
  input: { vTrough: number; vMax: number },
  vOut: number,
  load: Load,
  rippleLimit: number,
): BuckBoostSizing {
  const { catalog } = ctx;
  const { vMax, vTrough: vLow } = input;
  const iMax = load.iMax;
  const dBuck = Math.min(1, vOut / vMax);
  const lBuck = (Math.max(0, vMax - vOut) * dBuck) / (fsw * RIPPLE_RATIO * rippleReference(base, iMax));
  const dBoost = Math.min(0.99, Math.max(0, 1 - vLow / vOut));
  const ilBoost = iMax / (1 - dBoost);
  const lBoost = (vLow * dBoost) / (fsw * RIPPLE_RATIO * rippleReference(base, ilBoost));
  const lWanted = Math.max(lBuck, lBoost, 1e-9);
  const { stage, tjC, inductor, issue, core } = shared.sizeInductor(ctx, r, base, fsw, lWanted, (henries, dcrOhm) =>
    [vLow, vMax].map((vIn) => buckBoostPoint(base, vIn, vOut, iMax, fsw, henries, dcrOhm)),
  );
  const point = (vIn: number, iOut: number) => buckBoostPoint(stage, vIn, vOut, iOut, fsw, inductor.henries, inductor.dcrOhm, core);
  const low = point(vLow, iMax);
  const high = point(vMax, iMax);

  const findings = [
    ...buckBoostClassFindings(stage, input, vOut),
    ...shared.commonFindings(
      ctx,
      base,
      stage,
      Math.max(low.peakA, high.peakA),
      // Four-switch stages: no diode to heat.
      { switchW: Math.max(high.switchW, low.switchW), rectifierW: 0 },
      issue,
    ),
  ];
  const window = dutyWindow(stage, fsw);
  if (low.boost && low.dBoost > window.dMax) {
    findings.push(
      finding(
        'duty',
        `At the input trough ${vLow.toFixed(2)} V the boost duty cycle would be ${(low.dBoost * 100).toFixed(0)} %; ${classPhrase(stage.label)} reaches ${(window.dMax * 100).toFixed(0)} %.`,
        `input ≥ ${((vOut * (1 - window.dMax) * low.pInW) / Math.max(low.pOutW, 1e-9)).toFixed(2)} V`,
      ),
    );
  }
  if (high.region === 'buck') {
    const onTime = onTimeFinding(stage, fsw, high.dBuck, `At ${vMax} V in`);
    if (onTime) findings.push(onTime);
  }
  const budget = RIPPLE_BUDGET * rippleLimit;
  const cNeed = Math.max(
    low.boost ? (iMax * low.dBoost) / (fsw * (budget / 2)) : 0,
    high.rippleA / (8 * fsw * (budget / 2)),
    stepCapacitance(ctx, fsw),
  );
  const coutRms = low.boost ? iMax * Math.sqrt(low.dBoost / Math.max(1e-3, 1 - low.dBoost)) : high.rippleA / Math.sqrt(12);
  const cout = outputBank(ctx, r.cout, cNeed, vOut, coutRms, budget / (2 * Math.max(low.peakA, high.peakA, 1e-9)));
  const dHigh = high.dBuck;
  const cinRms = Math.max(iMax * Math.sqrt(dHigh * (1 - dHigh)), low.rippleA / Math.sqrt(12));
  const cin = inputBank(ctx, r.cin, vMax, vLow, iMax * dHigh * (1 - dHigh), cinRms, fsw);
  findings.push(...capacitorFindings(cout, cin));
  const costCents = shared.stageCostCents(catalog, stage, [inductor.part, cout.part, cin.part], false);
  const nominal = point(Math.min(Math.max(ctx.spec.input.vNom, vLow), vMax), load.iTyp);
  return {
    stage,
    rds25: base.rdsOnOhm,
    tjC,
    fsw,
    lWanted,
    inductor,
    cout,
    cin,
    low,
    high,
    findings,
    costCents,
    nominalLossW: nominal.pInW - nominal.pOutW,
    point,
  };
}

export interface BuckBoostStage extends ConverterStage {
  inductor: ChosenInductor;
  cout: ChosenCapacitor;
  switchRef: string;
  point(vIn: number, iOut: number): BuckBoostPoint;
  stress(vIn: number, iOut: number, at?: BuckBoostPoint): Record<string, PartStress>;
}

export function buckBoostStage(ctx: Context, refs: Refs, trace: Trace, req: StageRequest): BuckBoostStage {
  const { spec, catalog } = ctx;
  const { input, vTarget, load, idPrefix } = req;
  const { r, s, fb, vOut, filtered, issues, fixes } = shared.setupStage(
    ctx,
    refs,
    trace,
    req,
    'buck-boost',
    (r, stage, fsw, limit) => sizeBuckBoost(ctx, r, stage, fsw, input, vTarget, load, limit),
    {
      fits: (stage) => voltageFits(stage, input.vMax, switchNodeV(input.vMax, vTarget)),
      fixedFindings: (stage) => buckBoostClassFindings(stage, input, vTarget).length,
    },
    (sized) =>
      Math.max(
        buckBoostRipple(sized.low, load.iMax, sized.fsw, sized.cout.effectiveF, sized.cout.esrOhm),
        buckBoostRipple(sized.high, load.iMax, sized.fsw, sized.cout.effectiveF, sized.cout.esrOhm),
      ),
  );
  const { stage, fsw, inductor, cout, cin } = s;
  trace.select(
    `${idPrefix}.l`,
    'Inductance for the ripple ratio at the worse end of the input range',
    'L = max((vInMax − Vout)·D/(fsw·r·Iref), Vin,min·D/(fsw·r·IL,ref))',
    {
      vInMax: [input.vMax, 'V'],
      'Vin,min': [input.vTrough, 'V'],
      Vout: [vTarget, 'V'],
      fsw: [fsw, 'Hz'],
      r: [RIPPLE_RATIO, ''],
    },
    s.lWanted,
    'H',
  );
  const point = (vIn: number, iOut: number) =>
    buckBoostPoint(stage, vIn, vOut, iOut, fsw, inductor.henries, inductor.dcrOhm, (ripple) =>
      coreLossW(catalog, inductor.henries, inductor.isatA, ripple, fsw),
    );
  const lowP = point(input.vTrough, load.iMax);
  const highP = point(input.vMax, load.iMax);
  const peak = Math.max(lowP.peakA, highP.peakA);
  trace.select(
    `${idPrefix}.ipk`,
    'Peak inductor current (worse end of the input range)',
    'Ipk = max(IL + ΔIL/2) at Vin,min and vInMax',
    {
      'IL(Vin,min)': [lowP.il, 'A'],
      'ΔIL(Vin,min)': [lowP.rippleA, 'A'],
      'IL(vInMax)': [highP.il, 'A'],
      'ΔIL(vInMax)': [highP.rippleA, 'A'],
    },
    peak,
    'A',
  );
  shared.traceEffectiveCout(trace, `${idPrefix}.cout`, cout);
  const rippleOf = (p: BuckBoostPoint) =>
    ripplePeakToPeak(
      p.boost
        ? boostSegments('ccm', p.dBoost, p.peakA, p.rippleA, load.iMax, fsw)
        : buckSegments('ccm', p.dBuck, p.rippleA, load.iMax, fsw),
      cout.effectiveF,
      cout.esrOhm,
    );
  const rippleStage = trace.select(
    `${idPrefix}.ripple`,
    'Converter output ripple (worse end of the input range)',
    'ΔV = the larger of max − min over one period of vC + ESR·iC at the two ends',
    {
      Cout: [cout.effectiveF, 'F'],
      ESR: [cout.esrOhm, 'Ω'],
      fsw: [fsw, 'Hz'],
    },
    Math.max(rippleOf(lowP), rippleOf(highP)),
    'V',
  );
  const post = shared.stepAndFilter(ctx, refs, trace, { fsw, vOut, iMax: load.iMax, cout, filtered, idPrefix }, issues, fixes);
  issues.push(...inputCautions(ctx, { vMax: input.vMax, vTrough: input.vTrough, cin, pInW: lowP.pInW, ratingV: stage.vInMaxV }));
  const window = dutyWindow(stage, fsw);
  if (spec.input.vNom > vOut) {
    const nominal = point(spec.input.vNom, load.iTyp);
    if (nominal.region === 'transition') {
      issues.push(
        info(
          'transition',
          `At ${spec.input.vNom} V in the buck duty would pass ${(window.dMax * 100).toFixed(0)} %, so both legs switch (buck leg at ${(nominal.dBuck * 100).toFixed(0)} %, boost leg at ${(nominal.dBoost * 100).toFixed(0)} %).`,
        ),
      );
    }
  }

  const parts = [shared.switchPart(r.u, stage, stage.vInMaxV), inductor.part, cin.part, cout.part, ...fb.parts, ...(post?.parts ?? [])];
  const stressParts = { u: r.u, inductor, cin, cout, fb, stage };
  const stress = (vIn: number, iOut: number, at?: BuckBoostPoint): Record<string, PartStress> => {
    const p = at ?? point(vIn, iOut);
    const st = shared.coreStress(stressParts, p, vIn, vOut, Math.max(vIn, vOut));
    shared.postFilterStress(st, post, iOut, vOut);
    return st;
  };
  const lim = stage.iSwitchMaxA;
  const faultStress = (vIn: number): Record<string, PartStress> => {
    const st = stress(vIn, 0);
    st[r.u] = { w: lim * lim * 2 * stage.rdsOnOhm, v: vIn };
    st[inductor.part.ref] = { w: lim * lim * inductor.dcrOhm, v: vIn };
    st[cout.part.ref] = { w: 0, v: 0 };
    if (post) st[post.capRef] = { w: 0, v: 0 };
    return st;
  };
  return {
    stage,
    fsw,
    vOut,
    inductor,
    cout,
    post,
    parts,
    issues,
    fixes,
    switchRef: r.u,
    rippleVpp: rippleStage * (post?.attenuation ?? 1),
    output: fb.output,
    assumptions: shared.stageAssumptions(r.u, stage, fsw, inductor, cout, false),
    point,
    operate: (vIn, iOut) => {
      const p = point(vIn, iOut);
      return operatingPoint(p.boost ? p.dBoost <= window.dMax : p.dBuck <= window.dMax, p.pInW, p.pOutW, () => stress(vIn, iOut, p));
    },
    stress,
    faultStress,
  };
}

export function designBuckBoost(ctx: Context): Design {
  const { spec } = ctx;
  const trace = new Trace();
  const refs = new Refs();
  const b = buckBoostStage(ctx, refs, trace, railRequest(ctx, 'buckboost'));
  const lim = b.stage.iSwitchMaxA;
  return converterDesign('buck-boost', 'Four-switch buck-boost converter', b, trace, {
    regulates: false,
    pInW: lim * lim * (2 * b.stage.rdsOnOhm + b.inductor.dcrOhm),
    pOutW: 0,
    stress: b.faultStress(spec.input.vMax),
  });
}
