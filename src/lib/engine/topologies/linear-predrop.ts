// High-voltage pass transistor ahead of a floating-reference regulator: the transistor's base or
// gate is held a Zener standoff above the output, so the regulator sees only about Vz − Vbe and
// the transistor drops the rest. A sense resistor between the transistor and the regulator
// limits the short-circuit current to about (Vz − Vbe)/Rs, because the regulator's input cannot
// fall below its output.
import type { Context } from '../context.ts';
import { forced } from '../context.ts';
import type { PassDeviceClass } from '../catalog.ts';
import { chooseCapacitor } from '../capacitors.ts';
import { Refs, atLeast, blocker, caution, info, makePart, resistorPart, type Design, type OperatingPoint, type PartStress } from '../design.ts';
import { snap } from '../eseries.ts';
import { SEMICONDUCTOR_VOLTAGE_FACTOR } from '../ratings.ts';
import { Trace } from '../trace.ts';
import type { Issue } from '../types.ts';
import { dynamicImpedance, seriesFor, seriesForPower, zenerVoltage, zenerVoltageUp } from '../zeners.ts';
import { DIVIDER_MIN_A, regulatorStage } from './regulator-stage.ts';

/** The short-circuit current is set this far above the full-load path current (common practice 1.3–2). */
export const LIMIT_RATIO = 1.5;
/** Headroom kept above the regulator's dropout at full load (common practice). */
export const HEADROOM_MARGIN_V = 0.5;
/** Bias current through the standoff Zener's resistor, A (common practice: a few mA). */
export const BIAS_MIN_A = 2e-3;
/** Input margin above Vout + Vz for the bias resistor and the pass device's saturation (common practice). */
const BIAS_HEADROOM_V = 2;

/** Safe-operating-area hint: full power to the knee, then a log-log fall to the power allowed at Vmax. */
export function soaAllowedW(dev: PassDeviceClass, vce: number): number {
  if (vce <= dev.soaKneeV) return dev.soaPowerW;
  const slope = Math.log(dev.soaPowerAtVMaxW / dev.soaPowerW) / Math.log(dev.vMaxV / dev.soaKneeV);
  return dev.soaPowerW * (vce / dev.soaKneeV) ** slope;
}

/**
 * The cheapest device (of the engineer's kind, if chosen) rated for the input with margin whose
 * safe-operating-area hint carries a sustained short: about vInMax at the limit current.
 */
export function choosePassDevice(ctx: Context, faultA: number): { dev: PassDeviceClass; issue: Issue | null } {
  const kind = ctx.spec.overrides.passDevice;
  const { vMax } = ctx.spec.input;
  const needV = SEMICONDUCTOR_VOLTAGE_FACTOR * vMax;
  const ofKind = ctx.catalog.passDevices.filter((d) => kind === undefined || d.kind === kind);
  const pool = (ofKind.length > 0 ? ofKind : ctx.catalog.passDevices).slice().sort((a, b) => a.costCents - b.costCents || a.vMaxV - b.vMaxV);
  const rated = pool.filter((d) => d.vMaxV >= needV && d.iMaxA >= faultA);
  const fit = rated.find((d) => soaAllowedW(d, vMax) >= vMax * faultA) ?? rated[0];
  if (fit) return { dev: fit, issue: null };
  const biggest = pool.slice().sort((a, b) => b.vMaxV - a.vMaxV)[0]!;
  return {
    dev: biggest,
    issue: blocker('pass-voltage', `The pass device must be rated ${needV.toFixed(0)} V and ${faultA.toFixed(2)} A; the largest in the catalog is ${biggest.vMaxV} V, ${biggest.iMaxA} A.`),
  };
}

export function designLinearPredrop(ctx: Context): Design {
  const { spec, catalog } = ctx;
  const trace = new Trace();
  const refs = new Refs();
  const issues: Issue[] = [];
  const { vMax } = spec.input;
  const { iMax, v: vTarget } = spec.output;
  const series = spec.overrides.resistorSeries ?? 'E96';

  const qRef = refs.next('Q');
  const adjustable = catalog.linearRegulators
    .filter((c) => c.kind === 'adjustable')
    .sort((a, b) => a.iOutMaxA - b.iOutMaxA || (a.vDiffMaxV ?? 0) - (b.vDiffMaxV ?? 0));
  const forcedCls = adjustable.find((c) => c.id === spec.overrides.linearClass);
  const cls = forcedCls ?? adjustable.find((c) => c.iOutMaxA >= iMax) ?? adjustable[adjustable.length - 1] ?? catalog.linearRegulators[0]!;
  const r1 = spec.overrides.r1Ohm ?? snap(cls.vRefV / Math.max(cls.minLoadA, DIVIDER_MIN_A), series, 'down');
  const iPathMax = iMax + cls.vRefV / r1 + cls.iAdjTypA;
  const { dev, issue: devIssue } = choosePassDevice(ctx, LIMIT_RATIO * iPathMax);
  if (devIssue) issues.push(devIssue);
  const npn = dev.kind === 'npn';
  const gain = npn ? dev.gainMin : Number.POSITIVE_INFINITY;
  const vc = dev.vControlV;

  // Standoff: the regulator keeps dropout + margin at full load after the sense resistor takes
  // its share, with the limit LIMIT_RATIO above the full-load current.
  const need = (cls.dropoutV + HEADROOM_MARGIN_V) * (LIMIT_RATIO / (LIMIT_RATIO - 1)) + vc;
  const dzRef = refs.next('D');
  const vz = forced(ctx, dzRef) ?? (spec.overrides.standoffV !== undefined ? zenerVoltage(spec.overrides.standoffV) : zenerVoltageUp(need));
  trace.add('predrop.vz', 'Standoff Zener voltage', 'Vz ≥ (Vdropout + margin)·k/(k − 1) + Vbe', {
    Vdropout: [cls.dropoutV, 'V'],
    margin: [HEADROOM_MARGIN_V, 'V'],
    k: [LIMIT_RATIO, ''],
    Vbe: [vc, 'V'],
  }, vz, 'V');

  const rsRef = refs.next('R');
  const rsIdeal = (vz - vc - (cls.dropoutV + HEADROOM_MARGIN_V)) / iPathMax;
  const rs = forced(ctx, rsRef) ?? snap(atLeast(rsIdeal, 1e-3), 'E24', 'down');
  trace.add('predrop.rs', 'Sense resistor (snapped down: more headroom)', 'Rs = (Vz − Vbe − Vdropout − margin) / Ipath,max', {
    Vz: [vz, 'V'], Vbe: [vc, 'V'], Vdropout: [cls.dropoutV, 'V'], margin: [HEADROOM_MARGIN_V, 'V'], 'Ipath,max': [iPathMax, 'A'],
  }, rs, 'Ω');
  const iFault = trace.add('predrop.ifault', 'Short-circuit current', 'Ifault = min(Ilimit, (Vz − Vbe)/Rs)', {
    Ilimit: [cls.iLimitA, 'A'], Vz: [vz, 'V'], Vbe: [vc, 'V'], Rs: [rs, 'Ω'],
  }, Math.min(cls.iLimitA, (vz - vc) / rs), 'A');
  const regHeadroom = vz - vc - iPathMax * rs;
  if (rsIdeal <= 0 || regHeadroom < cls.dropoutV) {
    issues.push(blocker('standoff', `The standoff leaves ${regHeadroom.toFixed(2)} V across the regulator at full load; it needs ${cls.dropoutV} V.`));
  }
  if (cls.vDiffMaxV !== null && vz - vc > cls.vDiffMaxV) {
    issues.push(blocker('standoff', `The standoff puts ${(vz - vc).toFixed(1)} V across the regulator; it allows ${cls.vDiffMaxV} V.`));
  }

  // The regulator stage (divider, capacitors, protection diodes) sees only the standoff.
  const regInMax = vTarget + vz - vc;
  const stage = regulatorStage(
    ctx,
    refs,
    trace,
    { vTrough: regInMax - iPathMax * rs, vMax: regInMax, rippleVpp: 0, rippleIsHf: false, tracksOutput: true },
    vTarget,
    iMax,
    cls.id,
  );
  issues.push(...stage.issues.filter((i) => i.code !== 'class-unknown'));
  const vOut = stage.vOut;
  const iDiv = stage.divider?.iDivider ?? 0;
  const iAdj = cls.iAdjTypA;

  // Bias resistor from the input to the base/gate.
  const rbRef = refs.next('R');
  const ibNormal = npn ? iPathMax / gain : 0;
  let zSeries = seriesFor(catalog, vz);
  if (zSeries.length === 0) {
    issues.push(blocker('zener-range', `No Zener series in the catalog offers ${vz} V.`));
    zSeries = catalog.zenerSeries.slice(0, 1);
  }
  const knee = Math.min(...zSeries.map((s) => s.kneeCurrentA));
  const iBias = Math.max(BIAS_MIN_A, 1.5 * ibNormal + knee);
  // With no headroom (a blocker below) Rb is sized from the highest input so the figures stay sane.
  const rbDrop = ctx.vInTrough - (vOut + vz) > 0 ? ctx.vInTrough - (vOut + vz) : Math.max(1, vMax - vOut - vz);
  const rbIdeal = rbDrop / iBias;
  const rb = forced(ctx, rbRef) ?? snap(atLeast(rbIdeal, 1), 'E24', 'down');
  trace.add('predrop.rb', 'Bias resistor', 'Rb = (vInTrough − (Vout + Vz)) / Ibias', {
    vInTrough: [ctx.vInTrough, 'V'], Vout: [vOut, 'V'], Vz: [vz, 'V'], Ibias: [iBias, 'A'],
  }, rb, 'Ω');
  if (ctx.vInTrough < vOut + vz + BIAS_HEADROOM_V) {
    issues.push(blocker('headroom', `The input trough ${ctx.vInTrough.toFixed(1)} V must exceed Vout + Vz + ${BIAS_HEADROOM_V} V = ${(vOut + vz + BIAS_HEADROOM_V).toFixed(1)} V.`));
  }

  // The Zener's current flows into the output node and bypasses the regulator; solve the path current.
  const pathCurrent = (vIn: number, iOut: number) => {
    const iRb = Math.max(0, vIn - vOut - vz) / rb;
    const load = iOut + iDiv + iAdj;
    const i = npn ? (load - iRb) / (1 - 1 / gain) : load - iRb;
    const ib = npn ? Math.max(0, i) / gain : 0;
    return { i: Math.max(0, i), iRb, ib, iz: Math.max(0, iRb - ib) };
  };
  const zNormal = pathCurrent(vMax, spec.output.iMin);
  const izFault = Math.max(0, (vMax - vz) / rb - iFault / gain);
  const pzWorst = vz * Math.max(zNormal.iz, izFault);
  const zener = seriesForPower(zSeries, pzWorst) ?? catalog.zenerSeries[0]!;
  trace.add('predrop.pz', 'Standoff Zener worst power (output shorted)', 'Pz = Vz·(vInMax − Vz)/Rb', {
    Vz: [vz, 'V'], vInMax: [vMax, 'V'], Rb: [rb, 'Ω'],
  }, vz * izFault, 'W');
  if (zNormal.iz > spec.output.iMin + iDiv) {
    issues.push(blocker('zener-feed', `The standoff Zener feeds ${(zNormal.iz * 1e3).toFixed(1)} mA into the output at the highest input, more than the divider and the lightest load draw; the regulator cannot sink it.`));
  }

  const vceFault = Math.max(0, vMax - (vz - vc));
  const pFault = trace.add('predrop.pq.fault', 'Pass device dissipation with the output shorted', 'P = (vInMax − (Vz − Vbe))·Ifault', {
    vInMax: [vMax, 'V'], Vz: [vz, 'V'], Vbe: [vc, 'V'], Ifault: [iFault, 'A'],
  }, vceFault * iFault, 'W');
  const soa = soaAllowedW(dev, vceFault);
  const soaText = `${qRef} sees ${vceFault.toFixed(0)} V at ${(iFault * 1e3).toFixed(0)} mA (${pFault.toFixed(1)} W) for as long as the short lasts (DC); the safe-operating-area hint of ${dev.label} allows about ${soa.toFixed(1)} W at that voltage.`;
  issues.push(pFault > soa ? blocker('soa', `${soaText} Choose a device with a larger safe operating area or a foldback limit.`) : caution('soa', `${soaText} Confirm against the device's SOA curve.`));
  issues.push(caution('no-potentiometer', 'Never use a potentiometer in this high-voltage feedback path: a wiper that opens drives the output up to the input.'));

  const cinHv = chooseCapacitor(refs.next('C'), 'input-capacitor', 0.1e-6, vMax, catalog);
  if (cinHv.issue) issues.push(cinHv.issue);
  const regRef = stage.regRef;
  const parts = [
    makePart({
      ref: qRef,
      role: 'pass-transistor',
      part: dev.label,
      ratingV: dev.vMaxV,
      costCents: dev.costCents,
      thermal: { thetaJcCW: dev.thetaJcCW, thetaJaCW: dev.thetaJaCW, tjMaxC: dev.tjMaxC, heatsinkable: true, protectedInFault: false },
    }),
    makePart({
      ref: dzRef,
      role: 'standoff-zener',
      part: zener.label,
      value: vz,
      unit: 'V',
      ratingW: zener.powerW,
      tolerance: zener.tolerance,
      costCents: zener.costCents,
      thermal: { thetaJcCW: zener.thetaJaCW, thetaJaCW: zener.thetaJaCW, tjMaxC: zener.tjMaxC, heatsinkable: false, protectedInFault: false },
    }),
    resistorPart(rsRef, 'sense-resistor', rs, 0.05, 'E24'),
    ...stage.parts,
    resistorPart(rbRef, 'bias-resistor', rb, 0.05, 'E24'),
    cinHv.part,
  ];

  const rz = dynamicImpedance(zener, vz);
  const operate = (vIn: number, iOut: number): OperatingPoint => {
    const p = pathCurrent(vIn, iOut);
    const s: Record<string, PartStress> = stage.stress(regInMax - p.i * rs, iOut);
    const vReg = Math.max(0, vz - vc - p.i * rs);
    const vce = Math.max(0, vIn - regInMax);
    const vRb = Math.max(0, vIn - vOut - vz);
    s[regRef] = { w: vReg * p.i, v: vReg };
    s[qRef] = { w: vce * p.i, v: vIn - vOut };
    s[rsRef] = { w: p.i * p.i * rs, v: p.i * rs };
    s[rbRef] = { w: (vRb * vRb) / rb, v: vRb };
    s[dzRef] = { w: vz * p.iz, v: vz };
    s[cinHv.part.ref] = { w: 0, v: vIn };
    return {
      regulates: vRb / rb >= p.ib + zener.kneeCurrentA && vReg >= cls.dropoutV && p.iz <= iOut + iDiv,
      pInW: vIn * (p.i - p.ib + p.iRb),
      pOutW: vOut * iOut,
      stress: s,
    };
  };
  const faultStress: Record<string, PartStress> = stage.faultStress(vz - vc);
  const vRegFault = Math.max(0, vz - vc - iFault * rs);
  const vRbFault = vMax - vz;
  faultStress[regRef] = { w: vRegFault * iFault, v: vRegFault };
  faultStress[qRef] = { w: pFault, v: vMax };
  faultStress[rsRef] = { w: iFault * iFault * rs, v: iFault * rs };
  faultStress[rbRef] = { w: (vRbFault * vRbFault) / rb, v: vRbFault };
  faultStress[dzRef] = { w: vz * izFault, v: vz };
  faultStress[cinHv.part.ref] = { w: 0, v: vMax };
  const fault: OperatingPoint = { regulates: false, pInW: vMax * (iFault + izFault), pOutW: 0, stress: faultStress };

  // Input ripple reaches the regulator only through Rb and the Zener's rz.
  const rippleAtReg = spec.input.rippleVpp * (rz / (rb + rz));
  const psrr = cls.psrrDb;
  const rippleVpp = trace.add('predrop.ripple', 'Output ripple', 'ΔVout = ΔVin·rz/(Rb + rz)·10^(−PSRR/20)', {
    ΔVin: [spec.input.rippleVpp, 'V'], rz: [rz, 'Ω'], Rb: [rb, 'Ω'], PSRR: [psrr, 'dB'],
  }, rippleAtReg * 10 ** (-psrr / 20), 'V');
  issues.push(info('pass-rating', `${qRef} is rated ${dev.vMaxV} V for a ${vMax} V input and heat-sunk for the shorted-output case.`));

  return {
    topology: 'linear-predrop',
    label: `Linear regulator with ${npn ? 'NPN' : 'N-MOSFET'} pre-drop`,
    parts,
    issues,
    trace,
    operate,
    fault,
    output: stage.output,
    rippleVpp,
    assumptions: {
      ...stage.assumptions,
      [`${qRef}.vControl`]: { value: vc, unit: 'V' },
      [`${qRef}.gainMin`]: { value: npn ? dev.gainMin : 0, unit: '' },
      [`${dzRef}.rz`]: { value: rz, unit: 'Ω' },
    },
  };
}
