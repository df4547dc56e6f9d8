// Step-up converter (synchronous or with an output diode).
import type { SwitcherClass } from '../catalog.ts';
import type { Context } from '../context.ts';
import { forced } from '../context.ts';
import { chooseCapacitor } from '../capacitors.ts';
import { Refs, blocker, caution, makePart, type Design, type DesignPart, type OperatingPoint, type PartStress } from '../design.ts';
import { SEMICONDUCTOR_VOLTAGE_FACTOR, TRANSISTOR_V, pickFromLadder } from '../ratings.ts';
import { Trace } from '../trace.ts';
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

export interface BoostPoint {
  d: number;
  inductorA: number;
  rippleA: number;
  switchW: number;
  rectifierW: number;
  dcrW: number;
  pInW: number;
  pOutW: number;
}

/**
 * Continuous conduction. D = 1 − η·Vin/Vout with η the power-path efficiency (by energy balance),
 * IL = Iout/(1 − D). While the low-side switch conducts the inductor sees the input less the drop
 * across the n = pathSwitches switches in its path and its winding: ΔIL = (Vin − IL·(n·Rds + DCR))·D/(fsw·L).
 */
export function boostPoint(stage: SwitcherClass, vIn: number, vOut: number, iOut: number, fsw: number, henries: number, dcrOhm: number, pathSwitches = 1): BoostPoint {
  const sync = stage.rectification === 'sync';
  const pOut = vOut * iOut;
  let eta = 1;
  let d = 0;
  let il = iOut;
  let ripple = 0;
  let sw = 0;
  let rect = 0;
  let dcr = 0;
  for (let k = 0; k < 8; k += 1) {
    d = Math.min(0.99, Math.max(0, 1 - (eta * vIn) / vOut));
    il = iOut / (1 - d);
    ripple = (Math.max(0, vIn - il * (pathSwitches * stage.rdsOnOhm + dcrOhm)) * d) / (fsw * henries);
    const irms2 = il * il + (ripple * ripple) / 12;
    sw = irms2 * stage.rdsOnOhm * (d + (pathSwitches - 1));
    rect = sync ? irms2 * stage.rdsOnOhm * (1 - d) : stage.diodeVfV * iOut;
    dcr = irms2 * dcrOhm;
    eta = pOut > 0 ? pOut / (pOut + sw + rect + dcr) : 1;
  }
  const switching = 0.5 * vOut * il * (stage.riseS + stage.fallS) * fsw;
  const gate = stage.qgC * stage.vDriveV * fsw * (sync ? 2 : 1);
  const switchW = sw + (sync ? rect : 0) + switching + gate + stage.iqA * vIn;
  const rectifierW = sync ? 0 : rect;
  return { d, inductorA: il, rippleA: ripple, switchW, rectifierW, dcrW: dcr, pInW: pOut + switchW + rectifierW + dcr, pOutW: pOut };
}

/** Boost output ripple: Iout·D/(fsw·Cout) + Ipk·ESR. */
export function boostRipple(iOut: number, d: number, peakA: number, fsw: number, capF: number, esrOhm: number): number {
  return (iOut * d) / (fsw * capF) + peakA * esrOhm;
}

export function designBoost(ctx: Context): Design {
  const { spec, catalog } = ctx;
  const trace = new Trace();
  const refs = new Refs();
  const { vMax } = spec.input;
  const { iMax } = spec.output;
  const { stage, issues } = chooseSwitcher(ctx, 'boost', spec.output.v);
  const fsw = switchingFrequency(ctx, stage, issues);
  const sync = stage.rectification === 'sync';
  const uRef = refs.next('U');
  const fb = switcherFeedback(ctx, refs, trace, stage, spec.output.v, 'boost');
  const vOut = fb.divider.vOut;
  if (vMax >= vOut) {
    issues.push(blocker('step-up-only', `A boost stage cannot regulate when the input (up to ${vMax} V) reaches the output ${vOut.toFixed(2)} V.`));
  }

  const vLow = ctx.vInTrough;
  const dLow = Math.min(0.99, Math.max(0, 1 - vLow / vOut));
  const ilMax = iMax / (1 - dLow);
  const lWanted = trace.add('boost.l', 'Inductance for the ripple ratio at the lowest input', 'L = Vin·D/(fsw·r·IL)', {
    Vin: [vLow, 'V'], D: [dLow, ''], fsw: [fsw, 'Hz'], r: [RIPPLE_RATIO, ''], IL: [ilMax, 'A'],
  }, Math.max(1e-9, (vLow * dLow) / (fsw * RIPPLE_RATIO * ilMax)), 'H');
  const lRef = refs.next('L');
  const first = chooseInductor(lRef, catalog, lWanted, ilMax * 1.15, forced(ctx, lRef));
  const at = (vIn: number, iOut: number) => boostPoint(stage, vIn, vOut, iOut, fsw, first.chosen.henries, first.chosen.dcrOhm);
  const low = at(vLow, iMax);
  const peak = low.inductorA + low.rippleA / 2;
  const { chosen: inductor, issue: lIssue } = chooseInductor(lRef, catalog, lWanted, peak, forced(ctx, lRef));
  if (lIssue) issues.push(lIssue);
  const point = (vIn: number, iOut: number) => boostPoint(stage, vIn, vOut, iOut, fsw, inductor.henries, inductor.dcrOhm);
  trace.add('boost.d', 'Duty cycle at the lowest input', 'D = 1 − η·Vin/Vout', { Vin: [vLow, 'V'], Vout: [vOut, 'V'] }, low.d, '');
  trace.add('boost.ipk', 'Peak inductor current', 'Ipk = Iout/(1 − D) + ΔIL/2', { Iout: [iMax, 'A'], D: [low.d, ''], ΔIL: [low.rippleA, 'A'] }, peak, 'A');
  if (low.d > stage.dMax) issues.push(blocker('duty', `The duty cycle at the lowest input would be ${(low.d * 100).toFixed(0)} %; ${stage.label} reaches ${stage.dMax * 100} %.`));
  if (peak > stage.iSwitchMaxA) issues.push(blocker('current', `The peak current ${peak.toFixed(2)} A exceeds the ${stage.iSwitchMaxA} A switch of ${stage.label}.`));

  const budget = RIPPLE_BUDGET * spec.noise.maxRippleVpp;
  const esrGuess = catalog.capacitors[0]!.esrOhm;
  const room = budget - peak * esrGuess;
  const cout = chooseOutputCapacitor(refs.next('C'), catalog, room > 0 ? (iMax * low.d) / (fsw * room) : Number.MAX_VALUE, vOut);
  if (cout.issue) issues.push(cout.issue);
  const rippleStage = trace.add('boost.ripple', 'Converter output ripple', 'ΔV = Iout·D/(fsw·Cout) + Ipk·ESR', {
    Iout: [iMax, 'A'], D: [low.d, ''], fsw: [fsw, 'Hz'], Cout: [cout.farads, 'F'], Ipk: [peak, 'A'], ESR: [cout.esrOhm, 'Ω'],
  }, boostRipple(iMax, low.d, peak, fsw, cout.farads, cout.esrOhm), 'V');
  const quiet = spec.noise.class === 'precision' || spec.noise.class === 'rf';
  const post = quiet || rippleStage > budget ? postFilter(refs, trace, catalog, fsw, vOut, iMax, cout.farads, 'boost') : null;
  if (post) issues.push(...post.issues);

  const cin = chooseCapacitor(refs.next('C'), 'input-capacitor', 10e-6, vMax, catalog);
  if (cin.issue) issues.push(cin.issue);
  const dRef = sync ? '' : refs.next('D');
  const parts: DesignPart[] = [
    makePart({
      ref: uRef,
      role: 'switch',
      part: stage.label,
      ratingV: stage.vOutMaxV,
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
        part: `Schottky output diode, Vf ${stage.diodeVfV} V`,
        ratingV: pickFromLadder(TRANSISTOR_V, SEMICONDUCTOR_VOLTAGE_FACTOR * vOut),
        costCents: catalog.diode.costCents * 3,
        thermal: { thetaJcCW: catalog.diode.thetaJaCW, thetaJaCW: catalog.diode.thetaJaCW, tjMaxC: catalog.diode.tjMaxC, heatsinkable: false, protectedInFault: true },
      }),
    );
  }
  if (post) parts.push(...post.parts);
  issues.push(caution('no-short-protection', `A boost stage connects the input to the output through ${inductor.part.ref}${sync ? '' : ` and ${dRef}`}; a shorted output is limited only by the source. Fit a fuse or an input current limit rated below ${inductor.isatA} A.`));

  const stress = (vIn: number, iOut: number, at?: BoostPoint): Record<string, PartStress> => {
    const p = at ?? point(vIn, iOut);
    const s: Record<string, PartStress> = {
      [uRef]: { w: p.switchW, v: vOut },
      [inductor.part.ref]: { w: p.dcrW, v: vOut },
      [cin.part.ref]: { w: 0, v: vIn },
      [cout.part.ref]: { w: 0, v: vOut },
      [fb.r1Ref]: { w: stage.vFbV ** 2 / fb.divider.r1, v: stage.vFbV },
      [fb.r2Ref]: { w: (vOut - stage.vFbV) ** 2 / fb.divider.r2, v: vOut - stage.vFbV },
    };
    if (!sync) s[dRef] = { w: p.rectifierW, v: vOut };
    if (post) {
      s[post.inductorRef] = { w: iOut * iOut * post.dcrOhm, v: 0 };
      s[post.capRef] = { w: 0, v: vOut };
    }
    return s;
  };
  // Shorted output: the inductor current is limited by the fuse the caution asks for (≈ Isat).
  const faultA = inductor.isatA;
  const faultStress = stress(vMax, 0);
  faultStress[inductor.part.ref] = { w: faultA * faultA * inductor.dcrOhm, v: vMax };
  faultStress[cout.part.ref] = { w: 0, v: 0 };
  faultStress[uRef] = { w: sync ? faultA * faultA * stage.rdsOnOhm : 0, v: vMax };
  if (!sync) faultStress[dRef] = { w: stage.diodeVfV * faultA, v: vMax };

  return {
    topology: 'boost',
    label: `Boost converter (${sync ? 'synchronous' : 'output diode'})${post ? ' with post-filter' : ''}`,
    parts,
    issues,
    trace,
    operate: (vIn, iOut): OperatingPoint => {
      const p = point(vIn, iOut);
      return { regulates: vIn < vOut && p.d <= stage.dMax, pInW: p.pInW, pOutW: p.pOutW, stress: stress(vIn, iOut, p) };
    },
    fault: { regulates: false, pInW: vMax * faultA, pOutW: 0, stress: faultStress },
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
