// Three-terminal linear regulator straight from the input.
import type { Context } from '../context.ts';
import { Refs, info, operatingPoint, type Design, type OperatingPoint } from '../design.ts';
import { Trace } from '../trace.ts';
import { inputRippleHz } from './regulator-noise.ts';
import { dropoutAt, regulatorStage } from './regulator-stage.ts';

export function designLinear(ctx: Context): Design {
  const { spec } = ctx;
  const trace = new Trace();
  const refs = new Refs();
  const { vMax } = spec.input;
  const rippleHz = inputRippleHz(spec.input.source);
  const stage = regulatorStage(
    ctx,
    refs,
    trace,
    { vTrough: ctx.vInTrough, vMax, rippleVpp: spec.input.rippleVpp, rippleIsHf: false, ...(rippleHz !== undefined ? { rippleHz } : {}) },
    spec.output.v,
    spec.output.iMax,
    spec.overrides.linearClass,
  );
  const issues = [...stage.issues];
  trace.add(
    `${stage.regRef}.pmax`,
    'Regulator worst dissipation',
    'P = max(0, vInMax − Vout)·(iOutMax + Idivider + Iadj) + vInMax·Iq',
    {
      vInMax: [vMax, 'V'],
      Vout: [stage.vOut, 'V'],
      iOutMax: [spec.output.iMax, 'A'],
      Idivider: [stage.divider?.iDivider ?? 0, 'A'],
      Iadj: [stage.divider ? stage.cls.iAdjTypA : 0, 'A'],
      Iq: [stage.cls.iqA, 'A'],
    },
    stage.stress(vMax, spec.output.iMax)[stage.regRef]!.w,
    'W',
  );
  if (stage.cls.kind === 'adjustable') {
    issues.push(
      info(
        'min-load',
        `The divider draws ${((stage.divider?.iDivider ?? 0) * 1e3).toFixed(1)} mA so the regulator always has its minimum load.`,
      ),
    );
  }
  issues.push(
    info(
      'fault-protected',
      `${stage.regRef} limits current and shuts down when overheated, so a shorted output is survived; the heatsink is sized for normal operation.`,
    ),
  );

  const operate = (vIn: number, iOut: number): OperatingPoint => {
    const iIn = stage.inputCurrent(iOut);
    return operatingPoint(vIn >= stage.vOut + dropoutAt(stage.cls, iIn - stage.cls.iqA), vIn * iIn, stage.vOut * iOut, () =>
      stage.stress(vIn, iOut),
    );
  };
  const fault: OperatingPoint = {
    regulates: false,
    pInW: vMax * stage.cls.iLimitA,
    pOutW: 0,
    stress: stage.faultStress(vMax),
  };
  return {
    topology: 'linear',
    label: `Linear regulator (${stage.cls.label})`,
    parts: stage.parts,
    issues,
    trace,
    operate,
    fault,
    output: stage.output,
    rippleVpp: stage.rippleOutVpp,
    assumptions: stage.assumptions,
    fixes: stage.fixes,
  };
}
