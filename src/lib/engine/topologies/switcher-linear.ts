// Buck converter to just above the rail, then a linear post-regulator that rejects the
// switching ripple: efficiency close to a switcher's, noise close to a linear regulator's.
import type { Context } from '../context.ts';
import { Refs, info, type Design, type OperatingPoint } from '../design.ts';
import { Trace } from '../trace.ts';
import { buckStage } from './buck.ts';
import { checkClass, chooseRegulatorClass, regulatorStage } from './regulator-stage.ts';

/** Headroom kept above the post-regulator's dropout (common practice: a few hundred mV). */
export const POST_REG_MARGIN_V = 0.3;

export function designBuckLinear(ctx: Context): Design {
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
  // The bus itself is only as exact as the buck's feedback (plus 2 % for its divider), so its
  // set point is raised until even its low extreme leaves the post-regulator its headroom.
  const busSpread = Math.max(...ctx.catalog.switchers.map((s) => s.vFbTolerance)) + 0.02;
  const vBusTarget = trace.add('hybrid.vbus', 'Intermediate rail', 'Vbus = (Vout + Vdropout + margin) / (1 − spread)', {
    Vout: [vTarget, 'V'], Vdropout: [cls.dropoutV, 'V'], margin: [POST_REG_MARGIN_V, 'V'], spread: [busSpread, ''],
  }, (vTarget + cls.dropoutV + POST_REG_MARGIN_V) / (1 - busSpread), 'V');

  // Divider current of the post-regulator loads the buck; estimate it from the class.
  const iExtra = Math.max(cls.minLoadA, 100e-6) + cls.iAdjMaxA + cls.iqA;
  const buck = buckStage(ctx, refs, trace, { vTrough: ctx.vInTrough, vMax: spec.input.vMax }, vBusTarget, { iMin: iMin + iExtra, iTyp: iTyp + iExtra, iMax: iMax + iExtra }, spec.noise.maxRippleVpp * 10 ** (cls.psrrHfDb / 20), false, 'hybrid.buck');
  // The bus tolerance comes from the buck's own feedback spread.
  const busLow = buck.vOut * (1 - buck.stage.vFbTolerance - 0.02);
  const busHigh = buck.vOut * (1 + buck.stage.vFbTolerance + 0.02);
  const reg = regulatorStage(ctx, refs, trace, { vTrough: busLow - buck.rippleVpp / 2, vMax: busHigh, rippleVpp: buck.rippleVpp, rippleIsHf: true }, vTarget, iMax, cls.id);
  const issues = [...buck.issues, ...reg.issues.filter((i) => i.code !== 'class-unknown')];
  issues.push(info('hybrid', `The buck stage makes ${buck.vOut.toFixed(2)} V; ${reg.regRef} drops ${(buck.vOut - reg.vOut).toFixed(2)} V and rejects the switching ripple.`));

  const operate = (vIn: number, iOut: number): OperatingPoint => {
    const iBus = reg.inputCurrent(iOut);
    const p = buck.point(vIn, iBus);
    return {
      regulates: p.d <= buck.stage.dMax && vIn > buck.vOut,
      pInW: p.pInW,
      pOutW: reg.vOut * iOut,
      stress: Object.assign(buck.stress(vIn, iBus, p), reg.stress(buck.vOut, iOut)),
    };
  };
  const faultStress = { ...buck.stress(spec.input.vMax, reg.cls.iLimitA), ...reg.faultStress(buck.vOut) };
  return {
    topology: 'buck+linear',
    label: `Buck converter with linear post-regulator (${reg.cls.label})`,
    parts: [...buck.parts, ...reg.parts],
    issues,
    trace,
    operate,
    fault: { regulates: false, pInW: buck.point(spec.input.vMax, reg.cls.iLimitA).pInW, pOutW: 0, stress: faultStress },
    output: reg.output,
    rippleVpp: reg.rippleOutVpp,
    assumptions: {
      ...buck.assumptions,
      ...reg.assumptions,
      [`${reg.regRef}.vRef`]: { value: reg.cls.vRefV, unit: 'V' },
      [`${reg.regRef}.psrrHf`]: { value: reg.cls.psrrHfDb, unit: 'dB' },
    },
  };
}
