// A switching pre-regulator to just above the rail, then a linear post-regulator that rejects the
// switching ripple: efficiency close to a switcher's, noise close to a linear regulator's. The
// pre-regulator is a buck where the input always stays above the intermediate rail, otherwise a
// four-switch buck-boost (a quiet rail from one Li-ion cell, for example).
import type { Context } from '../context.ts';
import { Refs, info, type Design, type OperatingPoint } from '../design.ts';
import { extremeValues } from '../tolerance.ts';
import { Trace } from '../trace.ts';
import { buckBoostStage } from './buck-boost.ts';
import { buckStage } from './buck.ts';
import { checkClass, chooseRegulatorClass, regulatorStage } from './regulator-stage.ts';

/** Headroom kept above the post-regulator's dropout (common practice: a few hundred mV). */
export const POST_REG_MARGIN_V = 0.3;
/** A buck needs the input this far above its output to keep its duty cycle in range (common practice). */
const BUCK_INPUT_MARGIN = 1.15;

export function designSwitcherLinear(ctx: Context): Design {
  const { spec } = ctx;
  const trace = new Trace();
  const refs = new Refs();
  const { iMin, iTyp, iMax, v: vTarget } = spec.output;

  // The post-regulator only has to drop its own headroom: of the classes that fit a nearby
  // intermediate rail, the lowest dropout wastes least.
  const probe = { vTrough: vTarget + 2.5, vMax: vTarget + 2.5, rippleVpp: 0, rippleIsHf: true };
  const fitting = ctx.catalog.linearRegulators
    .filter((c) => checkClass(ctx, c, probe, vTarget, iMax).length === 0 && (c.kind !== 'fixed' || Math.abs(c.vRefV - vTarget) <= 0.005 * vTarget))
    .sort((a, b) => a.dropoutV - b.dropoutV);
  const forcedCls = ctx.catalog.linearRegulators.find((c) => c.id === spec.overrides.linearClass);
  const cls = forcedCls ?? fitting[0] ?? chooseRegulatorClass(ctx, probe, vTarget, iMax, undefined).cls;
  // The bus itself is only as exact as the switcher's feedback (plus 2 % for its divider), so its
  // set point is raised until even its low extreme leaves the post-regulator its headroom.
  const busSpread = Math.max(...ctx.catalog.switchers.map((s) => s.vFbTolerance)) + 0.02;
  const vBusTarget = trace.add('hybrid.vbus', 'Intermediate rail', 'Vbus = (Vout + Vdropout + margin) / (1 − spread)', {
    Vout: [vTarget, 'V'], Vdropout: [cls.dropoutV, 'V'], margin: [POST_REG_MARGIN_V, 'V'], spread: [busSpread, ''],
  }, (vTarget + cls.dropoutV + POST_REG_MARGIN_V) / (1 - busSpread), 'V');

  // Divider current of the post-regulator loads the switcher; estimate it from the class.
  const iExtra = Math.max(cls.minLoadA, 100e-6) + cls.iAdjMaxA + cls.iqA;
  const input = { vTrough: ctx.vInTrough, vMax: spec.input.vMax };
  const load = { iMin: iMin + iExtra, iTyp: iTyp + iExtra, iMax: iMax + iExtra };
  const rippleLimit = spec.noise.maxRippleVpp * 10 ** (cls.psrrHfDb / 20);
  const stepsDown = ctx.vInTrough >= BUCK_INPUT_MARGIN * vBusTarget;
  // The bus need only stay above the post-regulator's dropout, and not far above its set point.
  const busBand = { lo: vTarget + cls.dropoutV, hi: vBusTarget * (1 + busSpread) };
  const pre = stepsDown
    ? buckStage(ctx, refs, trace, input, vBusTarget, load, rippleLimit, false, 'hybrid.buck', busBand)
    : buckBoostStage(ctx, refs, trace, input, vBusTarget, load, rippleLimit, false, 'hybrid.buckboost', busBand);
  // The bus spread is the switcher's own feedback spread, at its extremes.
  const bus = extremeValues(pre.output);
  const reg = regulatorStage(ctx, refs, trace, { vTrough: bus.min - pre.rippleVpp / 2, vMax: bus.max, rippleVpp: pre.rippleVpp, rippleIsHf: true, rippleHz: pre.fsw }, vTarget, iMax, cls.id);
  const issues = [...pre.issues, ...reg.issues.filter((i) => i.code !== 'class-unknown')];
  const kind = stepsDown ? 'buck' : 'buck-boost';
  issues.push(info('hybrid', `The ${kind} stage makes ${pre.vOut.toFixed(2)} V; ${reg.regRef} drops ${(pre.vOut - reg.vOut).toFixed(2)} V and rejects the switching ripple.`));

  const operate = (vIn: number, iOut: number): OperatingPoint => {
    const iBus = reg.inputCurrent(iOut);
    const regStress = reg.stress(pre.vOut, iOut);
    if (stepsDown) {
      const b = pre as ReturnType<typeof buckStage>;
      const p = b.point(vIn, iBus);
      return { regulates: p.d <= b.stage.dMax && vIn > b.vOut, pInW: p.pInW, pOutW: reg.vOut * iOut, stress: Object.assign(b.stress(vIn, iBus, p), regStress) };
    }
    const bb = pre as ReturnType<typeof buckBoostStage>;
    const p = bb.point(vIn, iBus);
    return { regulates: bb.regulates(p), pInW: p.pInW, pOutW: reg.vOut * iOut, stress: Object.assign(bb.stress(vIn, iBus, p), regStress) };
  };
  const faultStress = { ...pre.stress(spec.input.vMax, reg.cls.iLimitA), ...reg.faultStress(pre.vOut) };
  return {
    topology: 'buck+linear',
    label: `${stepsDown ? 'Buck converter' : 'Four-switch buck-boost converter'} with linear post-regulator (${reg.cls.label})`,
    parts: [...pre.parts, ...reg.parts],
    issues,
    fixes: pre.fixes,
    trace,
    operate,
    fault: { regulates: false, pInW: pre.point(spec.input.vMax, reg.cls.iLimitA).pInW, pOutW: 0, stress: faultStress },
    output: reg.output,
    rippleVpp: reg.rippleOutVpp,
    assumptions: {
      ...pre.assumptions,
      ...reg.assumptions,
      [`${reg.regRef}.vRef`]: { value: reg.cls.vRefV, unit: 'V' },
      [`${reg.regRef}.psrrHf`]: { value: reg.cls.psrrHfDb, unit: 'dB' },
    },
  };
}
