// Four-switch buck-boost: steps down when the input is above the output and up when below, so it
// regulates an input range that straddles the output.
import type { SwitcherClass } from '../catalog.ts';
import type { Context } from '../context.ts';
import { forced } from '../context.ts';
import { chooseCapacitor } from '../capacitors.ts';
import { Refs, blocker, makePart, type Design, type OperatingPoint, type PartStress } from '../design.ts';
import { Trace } from '../trace.ts';
import { boostPoint, boostRipple } from './boost.ts';
import { buckPoint, buckRipple } from './buck.ts';
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
} from './switcher.ts';

export interface BuckBoostPoint {
  d: number;
  /** Average inductor current. */
  il: number;
  rippleA: number;
  switchW: number;
  dcrW: number;
  pInW: number;
  pOutW: number;
  /** True when the boost leg switches (input at or below the output). */
  boost: boolean;
}

/**
 * Above the output the buck leg switches while the boost leg's top switch stays on; at or below
 * it the boost leg switches while the buck leg's top switch stays on: two switches always carry
 * the inductor current.
 */
export function buckBoostPoint(stage: SwitcherClass, vIn: number, vOut: number, iOut: number, fsw: number, henries: number, dcrOhm: number): BuckBoostPoint {
  if (vIn > vOut) {
    const p = buckPoint({ ...stage, rdsOnOhm: 2 * stage.rdsOnOhm }, vIn, vOut, iOut, fsw, henries, dcrOhm);
    return { d: p.d, il: iOut, rippleA: p.rippleA, switchW: p.switchW, dcrW: p.dcrW, pInW: p.pInW, pOutW: p.pOutW, boost: false };
  }
  const p = boostPoint(stage, vIn, vOut, iOut, fsw, henries, dcrOhm, 2);
  return { d: p.d, il: p.inductorA, rippleA: p.rippleA, switchW: p.switchW, dcrW: p.dcrW, pInW: p.pInW, pOutW: p.pOutW, boost: true };
}

export function designBuckBoost(ctx: Context): Design {
  const { spec, catalog } = ctx;
  const trace = new Trace();
  const refs = new Refs();
  const { vMax } = spec.input;
  const { iMax } = spec.output;
  const { stage, issues } = chooseSwitcher(ctx, 'buck-boost', spec.output.v);
  const fsw = switchingFrequency(ctx, stage, issues);
  const uRef = refs.next('U');
  const fb = switcherFeedback(ctx, refs, trace, stage, spec.output.v, 'buckboost');
  const vOut = fb.divider.vOut;
  const vLow = ctx.vInTrough;

  const dBuck = Math.min(1, vOut / vMax);
  const lBuck = (Math.max(0, vMax - vOut) * dBuck) / (fsw * RIPPLE_RATIO * iMax);
  const dBoost = Math.max(0, 1 - vLow / vOut);
  const ilBoost = iMax / (1 - Math.min(0.99, dBoost));
  const lBoost = (vLow * dBoost) / (fsw * RIPPLE_RATIO * ilBoost);
  const lWanted = trace.add('buckboost.l', 'Inductance for the ripple ratio at the worse end of the input range', 'L = max((vInMax − Vout)·D/(fsw·r·Iout), Vin,min·D/(fsw·r·IL))', {
    vInMax: [vMax, 'V'], 'Vin,min': [vLow, 'V'], Vout: [vOut, 'V'], fsw: [fsw, 'Hz'], r: [RIPPLE_RATIO, ''],
  }, Math.max(lBuck, lBoost, 1e-9), 'H');
  const lRef = refs.next('L');
  const provisional = chooseInductor(lRef, catalog, lWanted, ilBoost * 1.15, forced(ctx, lRef)).chosen;
  const pointWith = (henries: number, dcr: number) => (vIn: number, iOut: number) => buckBoostPoint(stage, vIn, vOut, iOut, fsw, henries, dcr);
  const pre = pointWith(provisional.henries, provisional.dcrOhm);
  const peakAt = (p: BuckBoostPoint) => p.il + p.rippleA / 2;
  const peak = Math.max(peakAt(pre(vLow, iMax)), peakAt(pre(vMax, iMax)));
  const { chosen: inductor, issue: lIssue } = chooseInductor(lRef, catalog, lWanted, peak, forced(ctx, lRef));
  if (lIssue) issues.push(lIssue);
  const point = pointWith(inductor.henries, inductor.dcrOhm);
  const lowEnd = point(vLow, iMax);
  if (lowEnd.boost && lowEnd.d > stage.dMax) {
    issues.push(blocker('duty', `At the input trough ${vLow.toFixed(2)} V the boost duty cycle would be ${(lowEnd.d * 100).toFixed(0)} %; ${stage.label} reaches ${stage.dMax * 100} %.`));
  }
  trace.add('buckboost.ipk', 'Peak inductor current', 'Ipk = IL + ΔIL/2 (worst end of the range)', { IL: [pre(vLow, iMax).il, 'A'] }, peak, 'A');

  const budget = RIPPLE_BUDGET * spec.noise.maxRippleVpp;
  const lowP = point(vLow, iMax);
  const highP = point(vMax, iMax);
  const esrGuess = catalog.capacitors[0]!.esrOhm;
  const room = budget - peak * esrGuess;
  const cNeed = room > 0 ? Math.max((iMax * (lowP.boost ? lowP.d : 0)) / (fsw * room), highP.rippleA / (8 * fsw * room)) : Number.MAX_VALUE;
  const cout = chooseOutputCapacitor(refs.next('C'), catalog, cNeed, vOut);
  if (cout.issue) issues.push(cout.issue);
  const rippleOf = (p: BuckBoostPoint) =>
    p.boost ? boostRipple(iMax, p.d, p.il + p.rippleA / 2, fsw, cout.farads, cout.esrOhm) : buckRipple(p.rippleA, fsw, cout.farads, cout.esrOhm);
  const rippleStage = trace.add('buckboost.ripple', 'Converter output ripple (worse end of the input range)', 'boost: Iout·D/(fsw·C) + Ipk·ESR; buck: ΔIL/(8·fsw·C) + ΔIL·ESR', {
    Cout: [cout.farads, 'F'], ESR: [cout.esrOhm, 'Ω'], fsw: [fsw, 'Hz'],
  }, Math.max(rippleOf(lowP), rippleOf(highP)), 'V');
  const quiet = spec.noise.class === 'precision' || spec.noise.class === 'rf';
  const post = quiet || rippleStage > budget ? postFilter(refs, trace, catalog, fsw, vOut, iMax, cout.farads, 'buckboost') : null;
  if (post) issues.push(...post.issues);
  const cin = chooseCapacitor(refs.next('C'), 'input-capacitor', 10e-6, vMax, catalog);
  if (cin.issue) issues.push(cin.issue);

  const parts = [
    makePart({
      ref: uRef,
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
    ...(post?.parts ?? []),
  ];
  const stress = (vIn: number, iOut: number, at?: BuckBoostPoint): Record<string, PartStress> => {
    const p = at ?? point(vIn, iOut);
    const s: Record<string, PartStress> = {
      [uRef]: { w: p.switchW, v: Math.max(vIn, vOut) },
      [inductor.part.ref]: { w: p.dcrW, v: Math.max(vIn, vOut) },
      [cin.part.ref]: { w: 0, v: vIn },
      [cout.part.ref]: { w: 0, v: vOut },
      [fb.r1Ref]: { w: stage.vFbV ** 2 / fb.divider.r1, v: stage.vFbV },
      [fb.r2Ref]: { w: (vOut - stage.vFbV) ** 2 / fb.divider.r2, v: vOut - stage.vFbV },
    };
    if (post) {
      s[post.inductorRef] = { w: iOut * iOut * post.dcrOhm, v: 0 };
      s[post.capRef] = { w: 0, v: vOut };
    }
    return s;
  };
  const lim = stage.iSwitchMaxA;
  const faultStress = stress(vMax, 0);
  faultStress[uRef] = { w: lim * lim * 2 * stage.rdsOnOhm, v: vMax };
  faultStress[inductor.part.ref] = { w: lim * lim * inductor.dcrOhm, v: vMax };
  faultStress[cout.part.ref] = { w: 0, v: 0 };
  if (post) faultStress[post.capRef] = { w: 0, v: 0 };

  return {
    topology: 'buck-boost',
    label: `Four-switch buck-boost converter${post ? ' with post-filter' : ''}`,
    parts,
    issues,
    trace,
    operate: (vIn, iOut): OperatingPoint => {
      const p = point(vIn, iOut);
      return { regulates: !p.boost || p.d <= stage.dMax, pInW: p.pInW, pOutW: p.pOutW, stress: stress(vIn, iOut, p) };
    },
    fault: { regulates: false, pInW: lim * lim * (2 * stage.rdsOnOhm + inductor.dcrOhm), pOutW: 0, stress: faultStress },
    output: feedbackModel(stage, fb, post?.dcrOhm ?? 0, spec.output.iMin, spec.output.iTyp, iMax),
    rippleVpp: rippleStage * (post?.attenuation ?? 1),
    assumptions: {
      [`${uRef}.fsw`]: { value: fsw, unit: 'Hz' },
      [`${uRef}.rdsOn`]: { value: stage.rdsOnOhm, unit: 'Ω' },
      [`${inductor.part.ref}.dcr`]: { value: inductor.dcrOhm, unit: 'Ω' },
      [`${cout.part.ref}.esr`]: { value: cout.esrOhm, unit: 'Ω' },
    },
  };
}
