// Step-up converter (synchronous or with an output diode). The class and switching frequency are
// searched; inductor and capacitors are sized for each.
import type { SwitcherClass } from '../catalog.ts';
import type { Context } from '../context.ts';
import { Refs, caution, operatingPoint, type Design, type DesignPart, type PartStress } from '../design.ts';
import { coreLossW, type ChosenInductor } from '../inductors.ts';
import { SEMICONDUCTOR_VOLTAGE_FACTOR, TRANSISTOR_V, pickFromLadder } from '../ratings.ts';
import { boostDcmDuty, burstShare, conductionMode, cycleLosses, sumCycle, type ConductionMode } from './switcher-losses.ts';
import { Trace } from '../trace.ts';
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

export interface BoostPoint {
  mode: ConductionMode;
  d: number;
  etaPath: number;
  /** Average inductor (input) current. */
  inductorA: number;
  /** ΔIL in continuous conduction; the peak (valley at zero) in DCM and bursts. */
  rippleA: number;
  peakA: number;
  switchW: number;
  rectifierW: number;
  dcrW: number;
  coreW: number;
  pInW: number;
  pOutW: number;
}

/**
 * Continuous conduction: D = 1 − η·Vin/Vout with η the power-path efficiency of the DC current (by energy balance),
 * IL = Iout/(1 − D). While the low-side switch conducts the inductor sees the input less the drop
 * across the n = pathSwitches switches in its path and its winding: ΔIL = (Vin − IL·(n·Rds + DCR))·D/(fsw·L).
 * Below the boundary (IL < ΔIL/2) DCM for a diode stage, bursts or forced PWM as in the buck.
 */
export function boostPoint(
  stage: SwitcherClass,
  vIn: number,
  vOut: number,
  iOut: number,
  fsw: number,
  henries: number,
  dcrOhm: number,
  pathSwitches = 1,
  coreLoss?: (rippleA: number) => number,
): BoostPoint {
  const sync = stage.rectification === 'sync';
  const pOut = vOut * iOut;
  let eta = 1;
  let etaUsed = 1;
  let d = 0;
  let il = iOut;
  let ripple = 0;
  let sw = 0;
  let rect = 0;
  let dcr = 0;
  for (let k = 0; k < 8; k += 1) {
    etaUsed = eta;
    d = Math.min(0.99, Math.max(0, 1 - (eta * vIn) / vOut));
    il = iOut / (1 - d);
    ripple = (Math.max(0, vIn - il * (pathSwitches * stage.rdsOnOhm + dcrOhm)) * d) / (fsw * henries);
    const irms2 = il * il + (ripple * ripple) / 12;
    sw = irms2 * stage.rdsOnOhm * (d + (pathSwitches - 1));
    rect = sync ? irms2 * stage.rdsOnOhm * (1 - d) : stage.diodeVfV * iOut;
    dcr = irms2 * dcrOhm;
    // Only the DC current's drop costs volt-seconds; the ripple's RMS heats without shifting D.
    const dcDrop = il * il * (stage.rdsOnOhm * (d + (pathSwitches - 1) + (sync ? 1 - d : 0)) + dcrOhm) + (sync ? 0 : stage.diodeVfV * iOut);
    eta = pOut > 0 ? pOut / (pOut + dcDrop) : 1;
  }
  const mode = vOut > vIn ? conductionMode(stage, il, ripple / 2) : 'ccm';
  const share = burstShare(stage, il, ripple / 2);
  let peak = il + ripple / 2;
  if (mode === 'dcm') {
    d = boostDcmDuty(vIn, vOut, iOut, fsw, henries);
    peak = (vIn * d) / (fsw * henries);
    const d2 = Math.min(1 - d, (peak * henries * fsw) / (vOut - vIn));
    const i2 = (peak * peak) / 3;
    il = (peak * (d + d2)) / 2;
    sw = i2 * stage.rdsOnOhm * (d + (pathSwitches - 1) * (d + d2));
    rect = stage.diodeVfV * iOut;
    dcr = i2 * (d + d2) * dcrOhm;
    ripple = peak;
  } else if (mode === 'burst') {
    // Packets of ordinary cycles: the circulating ripple current flows only while switching.
    const irms2 = il * il + (share * ripple * ripple) / 12;
    sw = irms2 * stage.rdsOnOhm * (d + (pathSwitches - 1));
    rect = sync ? irms2 * stage.rdsOnOhm * (1 - d) : rect;
    dcr = irms2 * dcrOhm;
  }
  const cycle = cycleLosses(stage, vOut, mode === 'dcm' ? peak / 2 : il, fsw, sync ? 2 : 1);
  const coreW = (coreLoss?.(ripple) ?? 0) * share;
  const switchW = sw + (sync ? rect : 0) + share * sumCycle(cycle) + stage.iqA * vIn;
  const rectifierW = sync ? 0 : rect;
  return {
    mode,
    d,
    etaPath: etaUsed,
    inductorA: il,
    rippleA: ripple,
    peakA: peak,
    switchW,
    rectifierW,
    dcrW: dcr,
    coreW,
    pInW: pOut + switchW + rectifierW + dcr + coreW,
    pOutW: pOut,
  };
}

/** Boost output ripple: Iout·D/(fsw·Cout) + Ipk·ESR (Cout the capacitance left at the working bias). */
export function boostRipple(iOut: number, d: number, peakA: number, fsw: number, capF: number, esrOhm: number): number {
  return (iOut * d) / (fsw * capF) + peakA * esrOhm;
}

interface Load {
  iMin: number;
  iTyp: number;
  iMax: number;
}

interface BoostSizing extends SizingBase {
  low: BoostPoint;
  point(vIn: number, iOut: number): BoostPoint;
}

/** The class's ratings and ranges against the rail, and whether it can step up at all: the same at every frequency. */
function boostClassFindings(stage: SwitcherClass, input: { vTrough: number; vMax: number }, vOut: number): Finding[] {
  // The switch node sits at the regulated output plus the rectifier's drop.
  const findings = classVoltageFindings(stage, input.vMax, input.vTrough, vOut, vOut + stage.diodeVfV, stage.vOutMaxV);
  if (input.vMax >= vOut)
    findings.push(
      finding(
        'step-up-only',
        `A boost stage cannot regulate when the input (up to ${input.vMax} V) reaches the output ${vOut.toFixed(2)} V.`,
        'a buck-boost stage, or an input that stays below the output',
      ),
    );
  return findings;
}

function sizeBoost(
  ctx: Context,
  r: StageRefs,
  base: SwitcherClass,
  fsw: number,
  input: { vTrough: number; vMax: number },
  vOut: number,
  load: Load,
  rippleLimit: number,
): BoostSizing {
  const { catalog, spec } = ctx;
  const { vMax, vTrough: vLow } = input;
  const { iMax } = load;
  const dLow = Math.min(0.99, Math.max(0, 1 - vLow / vOut));
  const ilMax = iMax / (1 - dLow);
  const lWanted = (vLow * dLow) / (fsw * RIPPLE_RATIO * rippleReference(base, ilMax));
  const { stage, tjC, inductor, issue, core } = shared.sizeInductor(ctx, r, base, fsw, lWanted, (henries, dcrOhm) => [
    boostPoint(base, vLow, vOut, iMax, fsw, henries, dcrOhm),
  ]);
  const point = (vIn: number, iOut: number) => boostPoint(stage, vIn, vOut, iOut, fsw, inductor.henries, inductor.dcrOhm, 1, core);
  const low = point(vLow, iMax);
  const high = point(vMax, iMax);

  const findings = boostClassFindings(stage, input, vOut);
  findings.push(
    ...shared.commonFindings(
      ctx,
      base,
      stage,
      low.peakA,
      { switchW: Math.max(high.switchW, low.switchW), rectifierW: Math.max(high.rectifierW, low.rectifierW) },
      issue,
    ),
  );
  const window = dutyWindow(stage, fsw);
  if (low.d > window.dMax) {
    const need = (vOut * (1 - window.dMax)) / low.etaPath;
    findings.push(
      finding(
        'duty',
        `The duty cycle at the lowest input would be ${(low.d * 100).toFixed(0)} %; ${classPhrase(stage.label)} reaches ${(window.dMax * 100).toFixed(0)} % at ${(fsw / 1e3).toFixed(0)} kHz.`,
        `input ≥ ${need.toFixed(2)} V`,
      ),
    );
  }
  if (vMax < vOut && (high.mode === 'ccm' || stage.lightLoad === 'forced-pwm')) {
    const onTime = onTimeFinding(stage, fsw, high.d, `At ${vMax} V in`);
    if (onTime) findings.push(onTime);
  }
  const budget = RIPPLE_BUDGET * rippleLimit;
  const cNeed = Math.max((iMax * low.d) / (fsw * (budget / 2)), stepCapacitance(ctx, fsw));
  // Output capacitor RMS: Iout·√(D/(1 − D)) (common practice for the boost's pulsed output current).
  const cout = outputBank(
    ctx,
    r.cout,
    cNeed,
    vOut,
    iMax * Math.sqrt(low.d / Math.max(1e-3, 1 - low.d)),
    budget / (2 * Math.max(low.peakA, 1e-9)),
  );
  // The boost draws a continuous input current: the input capacitor carries only ΔIL (RMS ΔIL/√12).
  const cin = inputBank(ctx, r.cin, vMax, vLow, low.rippleA / 8, low.rippleA / Math.sqrt(12), fsw);
  findings.push(...capacitorFindings(cout, cin));
  const costCents = shared.stageCostCents(catalog, stage, [inductor.part, cout.part, cin.part], true);
  const nominal = point(Math.min(Math.max(spec.input.vNom, vLow), vMax, vOut), load.iTyp);
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
    findings,
    costCents,
    nominalLossW: nominal.pInW - nominal.pOutW,
    point,
  };
}

export interface BoostStage extends ConverterStage {
  inductor: ChosenInductor;
  /** Current a shorted output draws, limited only by the fuse the caution asks for (about Isat). */
  faultA: number;
}

export function boostStage(ctx: Context, refs: Refs, trace: Trace, req: StageRequest): BoostStage {
  const { catalog } = ctx;
  const { input, vTarget, load, idPrefix } = req;
  const { vMax, vTrough: vLow } = input;
  const { iMax } = load;
  const { r, s, fb, vOut, filtered, issues, fixes } = shared.setupStage(
    ctx,
    refs,
    trace,
    req,
    'boost',
    (r, stage, fsw, limit) => sizeBoost(ctx, r, stage, fsw, input, vTarget, load, limit),
    {
      fits: (stage) => voltageFits(stage, vMax, vTarget + stage.diodeVfV),
      fixedFindings: (stage) => boostClassFindings(stage, input, vTarget).length,
    },
    (sized) => boostRipple(iMax, sized.low.d, sized.low.peakA, sized.fsw, sized.cout.effectiveF, sized.cout.esrOhm),
  );
  const { stage, fsw, inductor, cout, cin, low } = s;
  const sync = stage.rectification === 'sync';

  const dIdeal = Math.min(0.99, Math.max(0, 1 - vLow / vTarget));
  trace.add(
    `${idPrefix}.l`,
    'Inductance for the ripple ratio at the lowest input',
    'L = Vin·D/(fsw·r·Iref)',
    {
      Vin: [vLow, 'V'],
      D: [dIdeal, ''],
      fsw: [fsw, 'Hz'],
      r: [RIPPLE_RATIO, ''],
      Iref: [rippleReference(stage, iMax / (1 - dIdeal)), 'A'],
    },
    s.lWanted,
    'H',
  );
  const point = (vIn: number, iOut: number) =>
    boostPoint(stage, vIn, vOut, iOut, fsw, inductor.henries, inductor.dcrOhm, 1, (ripple) =>
      coreLossW(catalog, inductor.henries, inductor.isatA, ripple, fsw),
    );
  const worst = point(vLow, iMax);
  if (worst.mode !== 'dcm') {
    trace.add(
      `${idPrefix}.d`,
      'Duty cycle at the lowest input',
      'D = min(0.99, max(0, 1 − η·Vin/Vout))',
      { η: [worst.etaPath, ''], Vin: [vLow, 'V'], Vout: [vOut, 'V'] },
      worst.d,
      '',
    );
    trace.add(
      `${idPrefix}.ipk`,
      'Peak inductor current',
      'Ipk = Iout/(1 − D) + ΔIL/2',
      { Iout: [iMax, 'A'], D: [worst.d, ''], ΔIL: [worst.rippleA, 'A'] },
      worst.peakA,
      'A',
    );
  } else {
    trace.add(
      `${idPrefix}.d`,
      'Duty cycle at the lowest input (discontinuous conduction)',
      'D = min(1, √(K·M·(M − 1))), M = Vout/Vin, K = 2·L·fsw·Iout/Vout',
      {
        Vout: [vOut, 'V'],
        Vin: [vLow, 'V'],
        L: [inductor.henries, 'H'],
        fsw: [fsw, 'Hz'],
        Iout: [iMax, 'A'],
      },
      worst.d,
      '',
    );
    trace.add(
      `${idPrefix}.ipk`,
      'Peak inductor current (discontinuous conduction)',
      'Ipk = Vin·D/(fsw·L)',
      { Vin: [vLow, 'V'], D: [worst.d, ''], fsw: [fsw, 'Hz'], L: [inductor.henries, 'H'] },
      worst.peakA,
      'A',
    );
  }
  shared.traceEffectiveCout(trace, `${idPrefix}.cout`, cout);
  trace.add(
    `${idPrefix}.cout.rms`,
    'Output capacitor RMS current at the lowest input',
    'Irms = Iout·√(D/(1 − D))',
    { Iout: [iMax, 'A'], D: [worst.d, ''] },
    iMax * Math.sqrt(worst.d / Math.max(1e-3, 1 - worst.d)),
    'A',
  );
  // Iout·D/(fsw·C) + Ipk·ESR is no bound once the inductor's valley dips below the load: the
  // capacitor then keeps discharging after the switch opens. The exact waveform is used.
  const rippleStage = trace.select(
    `${idPrefix}.ripple`,
    'Converter output ripple at the lowest input and full load',
    'ΔV = max − min over one period of vC + ESR·iC, iC = −Iout while the switch conducts, then the inductor current less the load',
    {
      Iout: [iMax, 'A'],
      D: [worst.d, ''],
      fsw: [fsw, 'Hz'],
      Cout: [cout.effectiveF, 'F'],
      Ipk: [worst.peakA, 'A'],
      ΔIL: [worst.rippleA, 'A'],
      ESR: [cout.esrOhm, 'Ω'],
    },
    ripplePeakToPeak(boostSegments(worst.mode, worst.d, worst.peakA, worst.rippleA, iMax, fsw), cout.effectiveF, cout.esrOhm),
    'V',
  );
  const post = shared.stepAndFilter(ctx, refs, trace, { fsw, vOut, iMax, cout, filtered, idPrefix }, issues, fixes);

  const uRef = r.u;
  const dRef = sync ? '' : refs.next('D');
  const parts: DesignPart[] = [shared.switchPart(uRef, stage, stage.vOutMaxV), inductor.part, cin.part, cout.part, ...fb.parts];
  if (!sync) {
    parts.push(
      shared.rectifierPart(
        dRef,
        `Schottky output diode, Vf ${stage.diodeVfV} V`,
        pickFromLadder(TRANSISTOR_V, SEMICONDUCTOR_VOLTAGE_FACTOR * vOut),
        catalog,
      ),
    );
  }
  if (post) parts.push(...post.parts);
  issues.push(
    caution(
      'no-short-protection',
      `A boost stage connects the input to the output through ${inductor.part.ref}${sync ? '' : ` and ${dRef}`}; a shorted output is limited only by the source. Fit a fuse or an input current limit rated below ${inductor.isatA} A.`,
    ),
  );
  issues.push(...inputCautions(ctx, { vMax, vTrough: vLow, cin, pInW: low.pInW, ratingV: stage.vInMaxV }));

  const stressParts = { u: uRef, inductor, cin, cout, fb, stage };
  const stress = (vIn: number, iOut: number, at?: BoostPoint): Record<string, PartStress> => {
    const p = at ?? point(vIn, iOut);
    const st = shared.coreStress(stressParts, p, vIn, vOut, vOut);
    if (!sync) st[dRef] = { w: p.rectifierW, v: vOut };
    shared.postFilterStress(st, post, iOut, vOut);
    return st;
  };
  // Shorted output: the inductor current is limited by the fuse the caution asks for (≈ Isat).
  const faultA = inductor.isatA;
  const faultStress = (vIn: number): Record<string, PartStress> => {
    const st = stress(vIn, 0);
    st[inductor.part.ref] = { w: faultA * faultA * inductor.dcrOhm, v: vIn };
    st[cout.part.ref] = { w: 0, v: 0 };
    st[uRef] = { w: sync ? faultA * faultA * stage.rdsOnOhm : 0, v: vIn };
    if (!sync) st[dRef] = { w: stage.diodeVfV * faultA, v: vIn };
    return st;
  };
  const window = dutyWindow(stage, fsw);
  return {
    stage,
    fsw,
    vOut,
    inductor,
    post,
    parts,
    issues,
    fixes,
    faultA,
    rippleVpp: rippleStage * (post?.attenuation ?? 1),
    output: fb.output,
    assumptions: shared.stageAssumptions(uRef, stage, fsw, inductor, cout, false),
    operate: (vIn, iOut) => {
      const p = point(vIn, iOut);
      return operatingPoint(vIn < vOut && p.d <= window.dMax, p.pInW, p.pOutW, () => stress(vIn, iOut, p));
    },
    faultStress,
  };
}

export function designBoost(ctx: Context): Design {
  const { spec } = ctx;
  const trace = new Trace();
  const refs = new Refs();
  const b = boostStage(ctx, refs, trace, railRequest(ctx, 'boost'));
  const label = `Boost converter (${b.stage.rectification === 'sync' ? 'synchronous' : 'output diode'})`;
  return converterDesign('boost', label, b, trace, {
    regulates: false,
    pInW: spec.input.vMax * b.faultA,
    pOutW: 0,
    stress: b.faultStress(spec.input.vMax),
  });
}
