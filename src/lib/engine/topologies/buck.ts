// Step-down converter (synchronous or with a catch diode), optionally followed by an LC post-filter.
import type { SwitcherClass } from '../catalog.ts';
import type { Context } from '../context.ts';
import { forced } from '../context.ts';
import { chooseCapacitor, type ChosenCapacitor } from '../capacitors.ts';
import { Refs, blocker, info, makePart, type Design, type DesignPart, type OperatingPoint, type PartStress } from '../design.ts';
import { SEMICONDUCTOR_VOLTAGE_FACTOR, TRANSISTOR_V, pickFromLadder } from '../ratings.ts';
import { Trace } from '../trace.ts';
import type { Issue, Quantity } from '../types.ts';
import type { ToleranceModel } from '../tolerance.ts';
import {
  RIPPLE_BUDGET,
  RIPPLE_RATIO,
  chooseInductor,
  chooseOutputCapacitor,
  chooseSwitcher,
  feedbackModel,
  postFilter,
  switcherFeedback,
  switchingFrequency,
  type ChosenInductor,
  type PostFilter,
} from './switcher.ts';

export interface BuckPoint {
  d: number;
  rippleA: number;
  switchW: number;
  diodeW: number;
  dcrW: number;
  pInW: number;
  pOutW: number;
}

/**
 * Steady state in continuous conduction. D = Vout/(η·Vin) with η the power-path efficiency
 * (switch conduction, catch diode, inductor DCR): by energy balance those losses set the
 * volt-seconds on the inductor. Switching, gate-drive and controller losses come from the input
 * without changing D. While the high-side switch conducts the inductor sees the input less the
 * output and the conduction drop across that switch and its winding:
 * ΔIL = (Vin − Vout − Iout·(Rds + DCR))·D/(fsw·L).
 */
export function buckPoint(stage: SwitcherClass, vIn: number, vOut: number, iOut: number, fsw: number, henries: number, dcrOhm: number): BuckPoint {
  const sync = stage.rectification === 'sync';
  const pOut = vOut * iOut;
  let eta = 1;
  let d = 0;
  let ripple = 0;
  let hs = 0;
  let ls = 0;
  let diode = 0;
  let dcr = 0;
  for (let k = 0; k < 8; k += 1) {
    d = Math.min(1, vOut / (eta * vIn));
    ripple = (Math.max(0, vIn - vOut - iOut * (stage.rdsOnOhm + dcrOhm)) * d) / (fsw * henries);
    const irms2 = iOut * iOut + (ripple * ripple) / 12;
    hs = irms2 * stage.rdsOnOhm * d;
    ls = sync ? irms2 * stage.rdsOnOhm * (1 - d) : 0;
    diode = sync ? 0 : stage.diodeVfV * iOut * (1 - d);
    dcr = irms2 * dcrOhm;
    eta = pOut > 0 ? pOut / (pOut + hs + ls + diode + dcr) : 1;
  }
  const switching = 0.5 * vIn * iOut * (stage.riseS + stage.fallS) * fsw;
  const gate = stage.qgC * stage.vDriveV * fsw * (sync ? 2 : 1);
  const iq = stage.iqA * vIn;
  const switchW = hs + ls + switching + gate + iq;
  return { d, rippleA: ripple, switchW, diodeW: diode, dcrW: dcr, pInW: pOut + switchW + diode + dcr, pOutW: pOut };
}

/** Buck output ripple: ΔIL/(8·fsw·Cout) + ΔIL·ESR. */
export function buckRipple(rippleA: number, fsw: number, capF: number, esrOhm: number): number {
  return rippleA / (8 * fsw * capF) + rippleA * esrOhm;
}

export interface BuckStage {
  stage: SwitcherClass;
  fsw: number;
  vOut: number;
  inductor: ChosenInductor;
  cout: ChosenCapacitor;
  post: PostFilter | null;
  parts: DesignPart[];
  issues: Issue[];
  switchRef: string;
  rippleVpp: number;
  output: ToleranceModel;
  assumptions: Record<string, Quantity>;
  point(vIn: number, iOut: number): BuckPoint;
  /** Part stresses; pass the operating point when it is already computed. */
  stress(vIn: number, iOut: number, at?: BuckPoint): Record<string, PartStress>;
  faultStress(vIn: number): Record<string, PartStress>;
}

export function buckStage(
  ctx: Context,
  refs: Refs,
  trace: Trace,
  input: { vTrough: number; vMax: number },
  vTarget: number,
  load: { iMin: number; iTyp: number; iMax: number },
  rippleLimit: number,
  allowPostFilter: boolean,
  idPrefix: string,
): BuckStage {
  const { catalog, spec } = ctx;
  const { stage, issues } = chooseSwitcher(ctx, 'buck', vTarget);
  const fsw = switchingFrequency(ctx, stage, issues);
  const sync = stage.rectification === 'sync';
  const switchRef = refs.next('U');
  const fb = switcherFeedback(ctx, refs, trace, stage, vTarget, idPrefix);
  const vOut = fb.divider.vOut;

  // Inductor for the ripple ratio at the highest input, where ripple is largest.
  const d0 = Math.min(1, vOut / input.vMax);
  const lWanted = trace.add(`${idPrefix}.l`, 'Inductance for the ripple ratio at the highest input', 'L = (vInMax − Vout)·D/(fsw·r·iOutMax)', {
    vInMax: [input.vMax, 'V'], Vout: [vOut, 'V'], D: [d0, ''], fsw: [fsw, 'Hz'], r: [RIPPLE_RATIO, ''], iOutMax: [load.iMax, 'A'],
  }, (Math.max(0, input.vMax - vOut) * d0) / (fsw * RIPPLE_RATIO * load.iMax), 'H');
  const lRef = refs.next('L');
  const first = chooseInductor(lRef, catalog, lWanted, load.iMax * (1 + RIPPLE_RATIO / 2), forced(ctx, lRef));
  const worstPoint = buckPoint(stage, input.vMax, vOut, load.iMax, fsw, first.chosen.henries, first.chosen.dcrOhm);
  const peak = load.iMax + worstPoint.rippleA / 2;
  const { chosen: inductor, issue: lIssue } = chooseInductor(lRef, catalog, lWanted, peak, forced(ctx, lRef));
  if (lIssue) issues.push(lIssue);
  trace.add(`${idPrefix}.dil`, 'Inductor ripple at the highest input', 'ΔIL = (vInMax − Vout − iOutMax·(Rds + DCR))·D/(fsw·L)', {
    vInMax: [input.vMax, 'V'], Vout: [vOut, 'V'], iOutMax: [load.iMax, 'A'], Rds: [stage.rdsOnOhm, 'Ω'], DCR: [first.chosen.dcrOhm, 'Ω'], D: [worstPoint.d, ''], fsw: [fsw, 'Hz'], L: [inductor.henries, 'H'],
  }, worstPoint.rippleA, 'A');
  trace.add(`${idPrefix}.ipk`, 'Peak switch and inductor current', 'Ipk = iOutMax + ΔIL/2', { iOutMax: [load.iMax, 'A'], ΔIL: [worstPoint.rippleA, 'A'] }, peak, 'A');
  if (peak > stage.iSwitchMaxA) issues.push(blocker('current', `The peak current ${peak.toFixed(2)} A exceeds the ${stage.iSwitchMaxA} A switch of ${stage.label}.`));

  const lowPoint = buckPoint(stage, input.vTrough, vOut, load.iMax, fsw, inductor.henries, inductor.dcrOhm);
  if (lowPoint.d > stage.dMax || input.vTrough <= vOut) {
    issues.push(blocker('headroom', `At the input trough ${input.vTrough.toFixed(2)} V the duty cycle would be ${(lowPoint.d * 100).toFixed(0)} %; ${stage.label} reaches ${stage.dMax * 100} %.`));
  }

  // Output capacitor for half the ripple budget.
  const budget = RIPPLE_BUDGET * rippleLimit;
  const esrGuess = catalog.capacitors[0]!.esrOhm;
  const capRoom = budget - worstPoint.rippleA * esrGuess;
  const cWanted = capRoom > 0 ? worstPoint.rippleA / (8 * fsw * capRoom) : Number.MAX_VALUE;
  const cout = chooseOutputCapacitor(refs.next('C'), catalog, cWanted, vOut);
  if (cout.issue) issues.push(cout.issue);
  const rippleStage = trace.add(`${idPrefix}.ripple`, 'Converter output ripple', 'ΔV = ΔIL/(8·fsw·Cout) + ΔIL·ESR', {
    ΔIL: [worstPoint.rippleA, 'A'], fsw: [fsw, 'Hz'], Cout: [cout.farads, 'F'], ESR: [cout.esrOhm, 'Ω'],
  }, buckRipple(worstPoint.rippleA, fsw, cout.farads, cout.esrOhm), 'V');

  const quiet = spec.noise.class === 'precision' || spec.noise.class === 'rf';
  const post = allowPostFilter && (quiet || rippleStage > budget) ? postFilter(refs, trace, catalog, fsw, vOut, load.iMax, cout.farads, idPrefix) : null;
  if (post) issues.push(...post.issues);
  const rippleVpp = rippleStage * (post?.attenuation ?? 1);

  const cin = chooseCapacitor(refs.next('C'), 'input-capacitor', 10e-6, input.vMax, catalog);
  if (cin.issue) issues.push(cin.issue);
  const dRef = sync ? '' : refs.next('D');
  const parts: DesignPart[] = [
    makePart({
      ref: switchRef,
      role: 'switch',
      part: stage.label,
      ratingV: stage.vInMaxV,
      costCents: stage.costCents,
      thermal: { thetaJcCW: stage.thetaJaCW, thetaJaCW: stage.thetaJaCW, tjMaxC: stage.tjMaxC, heatsinkable: false, protectedInFault: true },
    }),
    inductor.part,
    cin.part,
    cout.part,
    ...fb.parts,
  ];
  if (!sync) {
    parts.push(
      makePart({
        ref: dRef,
        role: 'diode',
        part: `Schottky catch diode, Vf ${stage.diodeVfV} V`,
        ratingV: pickFromLadder(TRANSISTOR_V, SEMICONDUCTOR_VOLTAGE_FACTOR * input.vMax),
        costCents: catalog.diode.costCents * 3,
        thermal: { thetaJcCW: catalog.diode.thetaJaCW, thetaJaCW: catalog.diode.thetaJaCW, tjMaxC: catalog.diode.tjMaxC, heatsinkable: false, protectedInFault: true },
      }),
    );
  }
  if (post) parts.push(...post.parts);
  issues.push(info('fault-protected', `${stage.label} limits its switch current and shuts down when overheated; a shorted output is survived.`));

  const point = (vIn: number, iOut: number) => buckPoint(stage, vIn, vOut, iOut, fsw, inductor.henries, inductor.dcrOhm);
  const stress = (vIn: number, iOut: number, at?: BuckPoint): Record<string, PartStress> => {
    const p = at ?? point(vIn, iOut);
    const s: Record<string, PartStress> = {
      [switchRef]: { w: p.switchW, v: vIn },
      [inductor.part.ref]: { w: p.dcrW, v: vIn },
      [cin.part.ref]: { w: 0, v: vIn },
      [cout.part.ref]: { w: 0, v: vOut },
      [fb.r1Ref]: { w: stage.vFbV ** 2 / fb.divider.r1, v: stage.vFbV },
      [fb.r2Ref]: { w: (vOut - stage.vFbV) ** 2 / fb.divider.r2, v: vOut - stage.vFbV },
    };
    if (!sync) s[dRef] = { w: p.diodeW, v: vIn };
    if (post) {
      s[post.inductorRef] = { w: iOut * iOut * post.dcrOhm, v: 0 };
      s[post.capRef] = { w: 0, v: vOut };
    }
    return s;
  };
  const faultStress = (vIn: number): Record<string, PartStress> => {
    const s = stress(vIn, 0);
    const lim = stage.iSwitchMaxA;
    s[switchRef] = { w: lim * lim * stage.rdsOnOhm, v: vIn };
    s[inductor.part.ref] = { w: lim * lim * inductor.dcrOhm, v: vIn };
    s[cout.part.ref] = { w: 0, v: 0 };
    if (!sync) s[dRef] = { w: stage.diodeVfV * lim, v: vIn };
    if (post) {
      s[post.inductorRef] = { w: lim * lim * post.dcrOhm, v: 0 };
      s[post.capRef] = { w: 0, v: 0 };
    }
    return s;
  };
  const assumptions: Record<string, Quantity> = {
    [`${switchRef}.fsw`]: { value: fsw, unit: 'Hz' },
    [`${switchRef}.rdsOn`]: { value: stage.rdsOnOhm, unit: 'Ω' },
    [`${switchRef}.vFb`]: { value: stage.vFbV, unit: 'V' },
    [`${inductor.part.ref}.dcr`]: { value: inductor.dcrOhm, unit: 'Ω' },
    [`${inductor.part.ref}.isat`]: { value: inductor.isatA, unit: 'A' },
    [`${cout.part.ref}.esr`]: { value: cout.esrOhm, unit: 'Ω' },
  };
  if (!sync) assumptions[`${dRef}.vf`] = { value: stage.diodeVfV, unit: 'V' };
  if (post) {
    assumptions[`${post.inductorRef}.dcr`] = { value: post.dcrOhm, unit: 'Ω' };
    assumptions[`${post.capRef}.esr`] = { value: post.esrOhm, unit: 'Ω' };
  }
  const output = feedbackModel(stage, fb, post?.dcrOhm ?? 0, load.iMin, load.iTyp, load.iMax);
  return { stage, fsw, vOut, inductor, cout, post, parts, issues, switchRef, rippleVpp, output, assumptions, point, stress, faultStress };
}

export function designBuck(ctx: Context): Design {
  const { spec } = ctx;
  const trace = new Trace();
  const refs = new Refs();
  const b = buckStage(ctx, refs, trace, { vTrough: ctx.vInTrough, vMax: spec.input.vMax }, spec.output.v, spec.output, spec.noise.maxRippleVpp, true, 'buck');
  const nominal = b.point(spec.input.vNom, spec.output.iTyp);
  trace.add('buck.d.nom', 'Duty cycle at the nominal corner', 'D = Vout/(η·Vin)', {
    Vout: [b.vOut, 'V'], η: [nominal.pInW > 0 ? nominal.pOutW / nominal.pInW : 0, ''], Vin: [spec.input.vNom, 'V'],
  }, nominal.d, '');
  const operate = (vIn: number, iOut: number): OperatingPoint => {
    const p = b.point(vIn, iOut);
    return { regulates: p.d <= b.stage.dMax && vIn > b.vOut, pInW: p.pInW, pOutW: p.pOutW, stress: b.stress(vIn, iOut, p) };
  };
  const lim = b.stage.iSwitchMaxA;
  const fault: OperatingPoint = { regulates: false, pInW: lim * lim * (b.stage.rdsOnOhm + b.inductor.dcrOhm), pOutW: 0, stress: b.faultStress(spec.input.vMax) };
  return {
    topology: 'buck',
    label: `Buck converter (${b.stage.rectification === 'sync' ? 'synchronous' : 'catch diode'})${b.post ? ' with post-filter' : ''}`,
    parts: b.parts,
    issues: b.issues,
    trace,
    operate,
    fault,
    output: b.output,
    rippleVpp: b.rippleVpp,
    assumptions: b.assumptions,
  };
}
