// Step-down converter (synchronous or with a catch diode), optionally followed by an LC post-filter.
// The class and switching frequency are searched; inductor and capacitors are sized for each.
import type { SwitcherClass } from '../catalog.ts';
import type { Context } from '../context.ts';
import type { ChosenCapacitor } from '../capacitors.ts';
import { Refs, info, caution, operatingPoint, type Design, type DesignPart, type OperatingPoint, type PartStress } from '../design.ts';
import { coreLossW, type ChosenInductor } from '../inductors.ts';
import { SEMICONDUCTOR_VOLTAGE_FACTOR, TRANSISTOR_V, pickFromLadder } from '../ratings.ts';
import { buckDcmDuty, burstShare, conductionMode, cycleLosses, sumCycle, type ConductionMode } from './switcher-losses.ts';
import { Trace } from '../trace.ts';
import type { Quantity } from '../types.ts';
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
  rippleReference,
  stepCapacitance,
  converterDesign,
  railRequest,
  buckSegments,
  ripplePeakToPeak,
  voltageFits,
  type ConverterStage,
  type Finding,
  type StageRequest,
  type SizingBase,
  type StageRefs,
} from './switcher.ts';
import { classPhrase } from '../units.ts';

export interface BuckPoint {
  mode: ConductionMode;
  d: number;
  /** Power-path efficiency that sets D in continuous conduction (conduction losses only). */
  etaPath: number;
  /** Inductor ripple ΔIL in continuous conduction; the peak (valley at zero) in DCM and bursts. */
  rippleA: number;
  peakA: number;
  switchW: number;
  diodeW: number;
  dcrW: number;
  coreW: number;
  pInW: number;
  pOutW: number;
}

/**
 * Steady state. In continuous conduction D = Vout/(η·Vin) with η the power-path efficiency of
 * the DC current (switch and winding drops, catch diode): by energy balance those losses set the
 * volt-seconds on the inductor; ΔIL = (Vin − Vout − Iout·(Rds + DCR))·D/(fsw·L). Below the
 * boundary (Iout < ΔIL/2) a diode stage runs in DCM (Erickson & Maksimović ch. 5); a burst-mode
 * class switches only a share Iout/(ΔIL/2) of the time, so its per-cycle losses scale with the load;
 * a forced-PWM synchronous stage stays continuous.
 * Switching, Coss, dead-time, gate, quiescent and core losses come from the input without
 * changing D.
 */
export function buckPoint(
  stage: SwitcherClass,
  vIn: number,
  vOut: number,
  iOut: number,
  fsw: number,
  henries: number,
  dcrOhm: number,
  coreLoss?: (rippleA: number) => number,
): BuckPoint {
  const sync = stage.rectification === 'sync';
  const switches = sync ? 2 : 1;
  const pOut = vOut * iOut;
  let eta = 1;
  let etaUsed = 1;
  let d = 0;
  let ripple = 0;
  let conduction = 0;
  let diode = 0;
  let dcr = 0;
  for (let k = 0; k < 8; k += 1) {
    etaUsed = eta;
    d = Math.min(1, vOut / (eta * vIn));
    ripple = (Math.max(0, vIn - vOut - iOut * (stage.rdsOnOhm + dcrOhm)) * d) / (fsw * henries);
    const irms2 = iOut * iOut + (ripple * ripple) / 12;
    conduction = irms2 * stage.rdsOnOhm * (sync ? 1 : d);
    diode = sync ? 0 : stage.diodeVfV * iOut * (1 - d);
    dcr = irms2 * dcrOhm;
    // Only the DC current's drop costs volt-seconds; the ripple's RMS heats without shifting D.
    const dcDrop = iOut * iOut * (stage.rdsOnOhm * (sync ? 1 : d) + dcrOhm);
    eta = pOut > 0 ? pOut / (pOut + dcDrop + diode) : 1;
  }
  const mode = vIn > vOut ? conductionMode(stage, iOut, ripple / 2) : 'ccm';
  const share = burstShare(stage, iOut, ripple / 2);
  let peak = iOut + ripple / 2;
  if (mode === 'dcm') {
    d = buckDcmDuty(vIn, vOut, iOut, fsw, henries);
    peak = ((vIn - vOut) * d) / (fsw * henries);
    const d2 = Math.min(1 - d, (peak * henries * fsw) / vOut);
    conduction = ((peak * peak) / 3) * stage.rdsOnOhm * d;
    diode = stage.diodeVfV * iOut;
    dcr = ((peak * peak) / 3) * (d + d2) * dcrOhm;
    ripple = peak;
  } else if (mode === 'burst') {
    // Packets of ordinary cycles: the circulating ripple current flows only while switching.
    const irms2 = iOut * iOut + (share * ripple * ripple) / 12;
    conduction = irms2 * stage.rdsOnOhm;
    dcr = irms2 * dcrOhm;
  }
  const cycle = cycleLosses(stage, vIn, mode === 'dcm' ? peak / 2 : iOut, fsw, switches);
  const coreW = (coreLoss?.(ripple) ?? 0) * share;
  const switchW = conduction + share * sumCycle(cycle) + stage.iqA * vIn;
  return {
    mode,
    d,
    etaPath: etaUsed,
    rippleA: ripple,
    peakA: peak,
    switchW,
    diodeW: diode,
    dcrW: dcr,
    coreW,
    pInW: pOut + switchW + diode + dcr + coreW,
    pOutW: pOut,
  };
}

/** Buck output ripple: ΔIL/(8·fsw·Cout) + ΔIL·ESR (Cout the capacitance left at the working bias). */
export function buckRipple(rippleA: number, fsw: number, capF: number, esrOhm: number): number {
  return rippleA / (8 * fsw * capF) + rippleA * esrOhm;
}

/** Largest D·(1 − D) over a duty range: the input capacitor's RMS factor peaks at D = 0.5. */
function dutyStress(dA: number, dB: number): number {
  const lo = Math.min(dA, dB);
  const hi = Math.max(dA, dB);
  return lo <= 0.5 && hi >= 0.5 ? 0.25 : Math.max(lo * (1 - lo), hi * (1 - hi));
}

interface Load {
  iMin: number;
  iTyp: number;
  iMax: number;
}

export interface BuckSizing extends SizingBase {
  high: BuckPoint;
  low: BuckPoint;
  point(vIn: number, iOut: number): BuckPoint;
}

/** The class's ratings and ranges against the rail: the same at every frequency. */
function buckClassFindings(stage: SwitcherClass, input: { vTrough: number; vMax: number }, vOut: number): Finding[] {
  return classVoltageFindings(stage, input.vMax, input.vTrough, vOut, input.vMax, stage.vInMaxV);
}

/** Sizes one class at one frequency: inductor for the ripple, capacitors, and every limit check. */
export function sizeBuck(
  ctx: Context,
  r: StageRefs,
  base: SwitcherClass,
  fsw: number,
  input: { vTrough: number; vMax: number },
  vOut: number,
  load: Load,
  rippleLimit: number,
): BuckSizing {
  const { catalog } = ctx;
  const d0 = Math.min(1, vOut / input.vMax);
  const lWanted = (Math.max(0, input.vMax - vOut) * d0) / (fsw * RIPPLE_RATIO * rippleReference(base, load.iMax));
  const { stage, tjC, inductor, issue, core } = shared.sizeInductor(ctx, r, base, fsw, lWanted, (henries, dcrOhm) => [
    buckPoint(base, input.vMax, vOut, load.iMax, fsw, henries, dcrOhm),
  ]);
  const point = (vIn: number, iOut: number) => buckPoint(stage, vIn, vOut, iOut, fsw, inductor.henries, inductor.dcrOhm, core);
  const high = point(input.vMax, load.iMax);
  const low = point(input.vTrough, load.iMax);

  const findings: Finding[] = [
    ...buckClassFindings(stage, input, vOut),
    ...shared.commonFindings(
      ctx,
      base,
      stage,
      high.peakA,
      { switchW: Math.max(high.switchW, low.switchW), rectifierW: Math.max(high.diodeW, low.diodeW) },
      issue,
    ),
  ];
  if (high.mode === 'ccm' || stage.lightLoad === 'forced-pwm') {
    const onTime = onTimeFinding(stage, fsw, high.d, `At ${input.vMax} V in`);
    if (onTime) findings.push(onTime);
  }
  const window = dutyWindow(stage, fsw);
  if (low.d > window.dMax || input.vTrough <= vOut) {
    const need = vOut / (low.etaPath * window.dMax);
    findings.push(
      finding(
        'headroom',
        `At the input trough ${input.vTrough.toFixed(2)} V the duty cycle would be ${(low.d * 100).toFixed(0)} %; ${classPhrase(stage.label)} reaches ${(window.dMax * 100).toFixed(0)} % at ${(fsw / 1e3).toFixed(0)} kHz (Dmax and the ${(stage.tOffMinS * 1e9).toFixed(0)} ns minimum off-time).`,
        `input ≥ ${need.toFixed(2)} V`,
      ),
    );
  }

  const budget = RIPPLE_BUDGET * rippleLimit;
  const cNeed = Math.max(high.rippleA / (8 * fsw * (budget / 2)), stepCapacitance(ctx, fsw));
  const cout = outputBank(ctx, r.cout, cNeed, vOut, high.rippleA / Math.sqrt(12), budget / (2 * Math.max(high.rippleA, 1e-9)));
  const stressFactor = dutyStress(low.d, high.d);
  const cin = inputBank(ctx, r.cin, input.vMax, input.vTrough, load.iMax * stressFactor, load.iMax * Math.sqrt(stressFactor), fsw);
  findings.push(...capacitorFindings(cout, cin));
  const costCents = shared.stageCostCents(catalog, stage, [inductor.part, cout.part, cin.part], true);
  const vNominal = Math.min(Math.max(ctx.spec.input.vNom, input.vTrough), input.vMax);
  const nominal = point(vNominal, load.iTyp);
  return {
    stage,
    rds25: base.rdsOnOhm,
    tjC,
    fsw,
    lWanted,
    inductor,
    cout,
    cin,
    high,
    low,
    findings,
    costCents,
    nominalLossW: nominal.pInW - nominal.pOutW,
    point,
  };
}

export interface BuckStage extends ConverterStage {
  inductor: ChosenInductor;
  cout: ChosenCapacitor;
  switchRef: string;
  point(vIn: number, iOut: number): BuckPoint;
  /** Part stresses; pass the operating point when it is already computed. */
  stress(vIn: number, iOut: number, at?: BuckPoint): Record<string, PartStress>;
}

export function buckStage(ctx: Context, refs: Refs, trace: Trace, req: StageRequest): BuckStage {
  const { spec, catalog } = ctx;
  const { input, vTarget, load, idPrefix } = req;
  const { r, s, fb, vOut, filtered, issues, fixes } = shared.setupStage(
    ctx,
    refs,
    trace,
    req,
    'buck',
    (r, stage, fsw, limit) => sizeBuck(ctx, r, stage, fsw, input, vTarget, load, limit),
    {
      fits: (stage) => voltageFits(stage, input.vMax, input.vMax),
      fixedFindings: (stage) => buckClassFindings(stage, input, vTarget).length,
    },
    (sized) => buckRipple(sized.high.rippleA, sized.fsw, sized.cout.effectiveF, sized.cout.esrOhm),
  );
  const { stage, fsw, inductor, cout, cin, high } = s;
  const sync = stage.rectification === 'sync';
  if (spec.overrides.fswHz !== undefined && spec.overrides.fswHz !== fsw) {
    issues.push(
      info(
        'fsw-clamped',
        `${classPhrase(stage.label, true)} runs between ${stage.fswMinHz} and ${stage.fswMaxHz} Hz; the engine used ${fsw} Hz.`,
      ),
    );
  }

  trace.add(
    `${idPrefix}.l`,
    'Inductance for the ripple ratio at the highest input',
    'L = max(0, vInMax − Vout)·D/(fsw·r·Iref)',
    {
      vInMax: [input.vMax, 'V'],
      Vout: [vTarget, 'V'],
      D: [Math.min(1, vTarget / input.vMax), ''],
      fsw: [fsw, 'Hz'],
      r: [RIPPLE_RATIO, ''],
      Iref: [rippleReference(stage, load.iMax), 'A'],
    },
    s.lWanted,
    'H',
  );
  const point = (vIn: number, iOut: number) =>
    buckPoint(stage, vIn, vOut, iOut, fsw, inductor.henries, inductor.dcrOhm, (ripple) =>
      coreLossW(catalog, inductor.henries, inductor.isatA, ripple, fsw),
    );
  const worst = point(input.vMax, load.iMax);
  if (worst.mode !== 'dcm') {
    trace.add(
      `${idPrefix}.dil`,
      'Inductor ripple at the highest input',
      'ΔIL = max(0, vInMax − Vout − iOutMax·(Rds + DCR))·D/(fsw·L)',
      {
        vInMax: [input.vMax, 'V'],
        Vout: [vOut, 'V'],
        iOutMax: [load.iMax, 'A'],
        Rds: [stage.rdsOnOhm, 'Ω'],
        DCR: [inductor.dcrOhm, 'Ω'],
        D: [worst.d, ''],
        fsw: [fsw, 'Hz'],
        L: [inductor.henries, 'H'],
      },
      worst.rippleA,
      'A',
    );
    trace.add(
      `${idPrefix}.ipk`,
      'Peak switch and inductor current',
      'Ipk = iOutMax + ΔIL/2',
      { iOutMax: [load.iMax, 'A'], ΔIL: [worst.rippleA, 'A'] },
      worst.peakA,
      'A',
    );
  } else {
    trace.add(
      `${idPrefix}.dil`,
      'Inductor peak current at the highest input (discontinuous conduction)',
      'Ipk = (vInMax − Vout)·D/(fsw·L)',
      {
        vInMax: [input.vMax, 'V'],
        Vout: [vOut, 'V'],
        D: [worst.d, ''],
        fsw: [fsw, 'Hz'],
        L: [inductor.henries, 'H'],
      },
      worst.rippleA,
      'A',
    );
  }
  trace.add(
    `${idPrefix}.ton`,
    'On-time at the highest input and full load',
    'tON = D/fsw',
    { D: [worst.d, ''], fsw: [fsw, 'Hz'] },
    worst.d / fsw,
    's',
  );
  shared.traceEffectiveCout(trace, `${idPrefix}.cout`, cout);
  // The textbook ΔIL/(8·fsw·C) + ΔIL·ESR adds two peaks that do not coincide (it sized the
  // capacitor, as a bound); the figure stated is the exact waveform's.
  const rippleStage = trace.select(
    `${idPrefix}.ripple`,
    'Converter output ripple at the highest input and full load',
    'ΔV = max − min over one period of vC + ESR·iC, iC = the inductor current less the load',
    {
      ΔIL: [worst.rippleA, 'A'],
      D: [worst.d, ''],
      Iout: [load.iMax, 'A'],
      fsw: [fsw, 'Hz'],
      Cout: [cout.effectiveF, 'F'],
      ESR: [cout.esrOhm, 'Ω'],
    },
    ripplePeakToPeak(buckSegments(worst.mode, worst.d, worst.rippleA, load.iMax, fsw), cout.effectiveF, cout.esrOhm),
    'V',
  );
  const stressFactor = dutyStress(s.low.d, high.d);
  trace.add(
    `${idPrefix}.cin.rms`,
    'Input capacitor RMS current (worst duty over the input range)',
    'Irms = iOutMax·√(D·(1 − D))',
    {
      iOutMax: [load.iMax, 'A'],
      'D·(1 − D)': [stressFactor, ''],
    },
    load.iMax * Math.sqrt(stressFactor),
    'A',
  );
  const post = shared.stepAndFilter(ctx, refs, trace, { fsw, vOut, iMax: load.iMax, cout, filtered, idPrefix }, issues, fixes);
  const rippleVpp = rippleStage * (post?.attenuation ?? 1);

  const dRef = sync ? '' : refs.next('D');
  const parts: DesignPart[] = [shared.switchPart(r.u, stage, stage.vInMaxV), inductor.part, cin.part, cout.part, ...fb.parts];
  if (!sync) {
    const ratingV = pickFromLadder(TRANSISTOR_V, SEMICONDUCTOR_VOLTAGE_FACTOR * input.vMax);
    const label =
      (ratingV ?? Infinity) > 200 ? `Ultrafast catch diode, Vf ${stage.diodeVfV} V` : `Schottky catch diode, Vf ${stage.diodeVfV} V`;
    parts.push(shared.rectifierPart(dRef, label, ratingV, catalog));
  }
  if (post) parts.push(...post.parts);
  const lim = stage.iSwitchMaxA;
  if (inductor.survivesLimit) {
    issues.push(
      info(
        'fault-protected',
        `${classPhrase(stage.label, true)} limits its switch current to about ${lim} A and shuts down when overheated; ${inductor.part.ref} (Isat ${inductor.isatA} A) stays out of saturation, so a shorted output is survived.`,
      ),
    );
  } else {
    issues.push(
      caution(
        'short-saturates',
        `A shorted output drives the switch to its ${lim} A limit, beyond ${inductor.part.ref}'s ${inductor.isatA} A saturation current: the short is not survived without an upstream fuse or a larger inductor.`,
      ),
    );
  }
  issues.push(...inputCautions(ctx, { vMax: input.vMax, vTrough: input.vTrough, cin, pInW: high.pInW, ratingV: stage.vInMaxV }));

  const stressParts = { u: r.u, inductor, cin, cout, fb, stage };
  const stress = (vIn: number, iOut: number, at?: BuckPoint): Record<string, PartStress> => {
    const p = at ?? point(vIn, iOut);
    const st = shared.coreStress(stressParts, p, vIn, vOut, vIn);
    if (!sync) st[dRef] = { w: p.diodeW, v: vIn };
    shared.postFilterStress(st, post, iOut, vOut);
    return st;
  };
  // Shorted output: the switch runs at its current limit; the inductor carries it (saturated when Isat is lower).
  const faultStress = (vIn: number): Record<string, PartStress> => {
    const st = stress(vIn, 0);
    st[r.u] = { w: lim * lim * stage.rdsOnOhm, v: vIn };
    st[inductor.part.ref] = { w: lim * lim * inductor.dcrOhm, v: vIn };
    st[cout.part.ref] = { w: 0, v: 0 };
    if (!sync) st[dRef] = { w: stage.diodeVfV * lim, v: vIn };
    if (post) {
      st[post.inductorRef] = { w: lim * lim * post.dcrOhm, v: 0 };
      st[post.capRef] = { w: 0, v: 0 };
    }
    return st;
  };
  const assumptions: Record<string, Quantity> = shared.stageAssumptions(r.u, stage, fsw, inductor, cout, true);
  if (!sync) assumptions[`${dRef}.vf`] = { value: stage.diodeVfV, unit: 'V' };
  if (post) {
    assumptions[`${post.inductorRef}.dcr`] = { value: post.dcrOhm, unit: 'Ω' };
    assumptions[`${post.capRef}.esr`] = { value: post.esrOhm, unit: 'Ω' };
  }
  const window = dutyWindow(stage, fsw);
  const operate = (vIn: number, iOut: number): OperatingPoint => {
    const p = point(vIn, iOut);
    return operatingPoint(p.d <= window.dMax && vIn > vOut, p.pInW, p.pOutW, () => stress(vIn, iOut, p));
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
    rippleVpp,
    output: fb.output,
    assumptions,
    point,
    operate,
    stress,
    faultStress,
  };
}

/** Trace of the duty cycle at a corner, in the form that recomputes from its own inputs. */
export function traceBuckDuty(
  trace: Trace,
  id: string,
  label: string,
  p: BuckPoint,
  vIn: number,
  vOut: number,
  iOut: number,
  fsw: number,
  henries: number,
): void {
  if (p.mode !== 'dcm') {
    trace.add(id, label, 'D = min(1, Vout/(η·Vin))', { Vout: [vOut, 'V'], η: [p.etaPath, ''], Vin: [vIn, 'V'] }, p.d, '');
  } else {
    trace.add(
      id,
      `${label} (discontinuous conduction)`,
      'D = min(1, M·√(K/(1 − M))), M = min(0.999, Vout/Vin), K = 2·L·fsw·Iout/Vout',
      {
        Vout: [vOut, 'V'],
        Vin: [vIn, 'V'],
        L: [henries, 'H'],
        fsw: [fsw, 'Hz'],
        Iout: [iOut, 'A'],
      },
      p.d,
      '',
    );
  }
}

export function designBuck(ctx: Context): Design {
  const { spec } = ctx;
  const trace = new Trace();
  const refs = new Refs();
  const b = buckStage(ctx, refs, trace, railRequest(ctx, 'buck'));
  const nominal = b.point(spec.input.vNom, spec.output.iTyp);
  traceBuckDuty(
    trace,
    'buck.d.nom',
    'Duty cycle at the nominal corner',
    nominal,
    spec.input.vNom,
    b.vOut,
    spec.output.iTyp,
    b.fsw,
    b.inductor.henries,
  );
  const lim = b.stage.iSwitchMaxA;
  const fault: OperatingPoint = {
    regulates: false,
    pInW: lim * lim * (b.stage.rdsOnOhm + b.inductor.dcrOhm),
    pOutW: 0,
    stress: b.faultStress(spec.input.vMax),
  };
  return converterDesign('buck', `Buck converter (${b.stage.rectification === 'sync' ? 'synchronous' : 'catch diode'})`, b, trace, fault);
}
