// A series resistor feeding an adjustable precision shunt reference: the reference's cathode is
// the rail, its reference input sits on a divider, so Vout = Vref·(1 + R2/R1) + Iref·R2 — the same
// divider search as a regulator's, which lets a shunt rail be tight.
import type { ShuntReference } from '../catalog.ts';
import type { Context } from '../context.ts';
import { forced } from '../context.ts';
import {
  Refs,
  atLeast,
  blocker,
  info,
  makePart,
  operatingPoint,
  resistorPart,
  type Design,
  type Fix,
  type OperatingPoint,
} from '../design.ts';
import { snap } from '../eseries.ts';
import { RATING_FACTOR } from '../ratings.ts';
import { temperatureSwingK } from '../tolerance.ts';
import { Trace } from '../trace.ts';
import type { Issue } from '../types.ts';
import { classPhrase, formatSi } from '../units.ts';
import { searchDivider } from './feedback.ts';

/** Divider current: a hundred times the reference-input current keeps its error near 1 % of R2's (common practice). */
const DIVIDER_BIAS_RATIO = 100;
/** The divider grade every design can have at no extra cost: 1 % thick film (common practice). */
const COARSE_DIVIDER_TOLERANCE = 0.01;

export function designShuntReference(ctx: Context, ref: ShuntReference): Design & { fixes: Fix[] } {
  const { spec } = ctx;
  const trace = new Trace();
  const refs = new Refs();
  const issues: Issue[] = [];
  const fixes: Fix[] = [];
  const { vMax } = spec.input;
  const { iMin, iMax, v: vTarget } = spec.output;
  const rsRef = refs.next('R');
  const uRef = refs.next('U');
  const r1Ref = refs.next('R');
  const r2Ref = refs.next('R');

  if (vTarget < ref.vRefV)
    issues.push(blocker('below-reference', `${classPhrase(ref.label, true)} cannot hold a rail below its ${ref.vRefV} V reference.`));
  if (vTarget > ref.vKaMaxV / 1.25)
    issues.push(
      blocker(
        'input-max',
        `${classPhrase(ref.label, true)} allows ${ref.vKaMaxV} V on its cathode; a ${vTarget} V rail needs ${(1.25 * vTarget).toFixed(0)} V with margin.`,
      ),
    );

  // Rs and the output depend on each other only weakly: size Rs at the target, then check at the spread.
  const iDiv = DIVIDER_BIAS_RATIO * ref.iRefA;
  const band = { lo: vTarget * (1 - spec.output.tolerance), hi: vTarget * (1 + spec.output.tolerance) };
  // The highest output Rs must feed: what the reference's widest grade and a 1 % divider (ratio
  // within ±2 %) can reach, or the band's top when that is lower. A looser tolerance then never
  // makes Rs smaller and dearer.
  const vHigh = Math.min(band.hi, vTarget * (1 + ref.vRefTolerance + 2 * COARSE_DIVIDER_TOLERANCE));
  const rsIdeal = (ctx.vInTrough - vHigh) / (iMax + ref.iKMinA + 1.5 * iDiv);
  // Without headroom (a blocker below) Rs is sized from the highest input, or the rail, so the figures stay sane.
  const rsDrop = rsIdeal > 0 ? ctx.vInTrough - vHigh : vMax > vHigh ? vMax - vHigh : vTarget;
  const rs = forced(ctx, rsRef) ?? snap(atLeast(rsDrop / (iMax + ref.iKMinA + 1.5 * iDiv), 1e-3), 'E24', 'down');
  trace.select(
    'shunt.rs',
    'Series resistor, snapped down so the reference never starves at the highest output',
    'Rs = (vInTrough − Vout,max) / (iOutMax + IKmin + Idiv)',
    {
      vInTrough: [ctx.vInTrough, 'V'],
      'Vout,max': [vHigh, 'V'],
      iOutMax: [iMax, 'A'],
      IKmin: [ref.iKMinA, 'A'],
      Idiv: [1.5 * iDiv, 'A'],
    },
    rs,
    'Ω',
  );
  if (rsIdeal <= 0)
    issues.push(
      blocker('headroom', `The lowest input ${ctx.vInTrough.toFixed(2)} V must exceed the rail's highest ${band.hi.toFixed(3)} V.`),
    );

  // Cathode current from its extremes: closed-loop output impedance zKa·(1 + R2/R1) turns it into output spread.
  const ikMax = (vMax - band.lo) / rs - iMin - iDiv;
  const ikMin = (ctx.vInTrough - band.hi) / rs - iMax - 1.5 * iDiv;
  const gain = vTarget / ref.vRefV;
  const zOut = ref.zKaOhm * gain;
  const spread = (zOut * Math.max(0, ikMax - Math.max(0, ikMin))) / 2 / vTarget;
  const search = searchDivider({
    vTarget,
    vRef: ref.vRefV,
    refGrades: [{ tolerance: ref.vRefTolerance, extraCents: 0 }, ...ref.refGrades],
    vRefDriftPpmK: ref.vRefDriftPpmK,
    iAdjTyp: ref.iRefA / 2,
    iAdjMin: 0,
    iAdjMax: ref.iRefA,
    iDividerMin: iDiv,
    iDividerMax: 1.5 * iDiv,
    band,
    rule: spec.overrides.toleranceRule ?? 'statistical',
    tempSwingK: temperatureSwingK(ctx.ambientC, ikMax * vTarget * ref.thetaJaCW),
    extra: [{ name: 'Cathode current through zKa', nominal: 1, lo: 1 - spread, hi: 1 + spread }],
    grades: ctx.catalog.resistorGrades,
    ...(forced(ctx, r1Ref) !== undefined ? { r1Forced: forced(ctx, r1Ref)! } : {}),
    ...(forced(ctx, r2Ref) !== undefined ? { r2Forced: forced(ctx, r2Ref)! } : {}),
  });
  const d = search.pick;
  issues.push(info('divider-search', d.why));
  trace.add(
    'shunt.vout',
    `Output with the searched pair (${d.series}, ${d.grade.label})`,
    'Vout = Vref·(1 + R2/R1) + Iref·R2',
    {
      Vref: [ref.vRefV, 'V'],
      R1: [d.r1, 'Ω'],
      R2: [d.r2, 'Ω'],
      Iref: [ref.iRefA / 2, 'A'],
    },
    d.vOut,
    'V',
  );
  const ikWorst = trace.add(
    'shunt.ik',
    'Reference cathode current, highest input and lightest load',
    'Ik = max(0, (vInMax − Vout)/Rs − iOutMin − Vout/(R1 + R2))',
    {
      vInMax: [vMax, 'V'],
      Vout: [d.vOut, 'V'],
      Rs: [rs, 'Ω'],
      iOutMin: [iMin, 'A'],
      R1: [d.r1, 'Ω'],
      R2: [d.r2, 'Ω'],
    },
    Math.max(0, (vMax - d.vOut) / rs - iMin - d.vOut / (d.r1 + d.r2)),
    'A',
  );
  const pRef = ikWorst * d.vOut;
  if (ikWorst > ref.iKMaxA)
    issues.push(
      blocker(
        'reference-current',
        `${classPhrase(ref.label, true)} would sink ${formatSi(ikWorst, 'A', 3)} at the highest input and lightest load; it allows ${formatSi(ref.iKMaxA, 'A', 3)}.`,
      ),
    );
  if (pRef * RATING_FACTOR > ref.powerW)
    issues.push(
      blocker('rating', `${uRef} would dissipate ${formatSi(pRef, 'W', 2)}; its ${ref.powerW} W package needs twice that in margin.`),
    );
  const starved = (ctx.vInTrough - d.vOut) / rs - iMax - d.vOut / (d.r1 + d.r2);
  if (starved < ref.iKMinA * 0.999)
    issues.push(
      blocker(
        'reference-starved',
        `At the lowest input and highest load ${uRef} carries only ${formatSi(Math.max(0, starved), 'A', 2)}, below the ${formatSi(ref.iKMinA, 'A', 2)} it needs to regulate.`,
      ),
    );
  if (d.verdict === 'fails')
    fixes.push({
      code: 'tolerance',
      change: 'a series reference or a looser tolerance',
      message: `The tightest this reference reaches: ${d.why}`,
    });

  const refCents = d.refTolerance < ref.vRefTolerance ? (ref.refGrades.find((g) => g.tolerance === d.refTolerance)?.extraCents ?? 0) : 0;
  const parts = [
    resistorPart(rsRef, 'series-resistor', rs, 0.05, 'E24'),
    makePart({
      ref: uRef,
      role: 'regulator',
      part: d.refTolerance < ref.vRefTolerance ? `${ref.label}, ±${d.refTolerance * 100} % grade` : ref.label,
      ratingV: ref.vKaMaxV,
      ratingW: ref.powerW,
      tolerance: d.refTolerance,
      costCents: ref.costCents + refCents,
      thermal: { thetaJcCW: ref.thetaJaCW, thetaJaCW: ref.thetaJaCW, tjMaxC: ref.tjMaxC, heatsinkable: false, protectedInFault: false },
    }),
    resistorPart(r1Ref, 'feedback-lower', d.r1, d.grade.tolerance, d.series, d.grade.extraCents),
    resistorPart(r2Ref, 'feedback-upper', d.r2, d.grade.tolerance, d.series, d.grade.extraCents),
  ];

  // Regulating, the rail sits at Vout and the reference takes the rest; starved, the rail sags to
  // what Rs delivers into the load and the divider.
  const solve = (vIn: number, iOut: number) => {
    const rDiv = d.r1 + d.r2;
    const ik = (vIn - d.vOut) / rs - iOut - d.vOut / rDiv;
    const vOut = ik >= 0 ? d.vOut : Math.max(0, ((vIn - iOut * rs) * rDiv) / (rDiv + rs));
    return { vOut, iSeries: Math.max(0, (vIn - vOut) / rs), ik };
  };
  const operate = (vIn: number, iOut: number): OperatingPoint => {
    const s = solve(vIn, iOut);
    const vRs = Math.max(0, vIn - s.vOut);
    return operatingPoint(s.ik >= ref.iKMinA * 0.999, vIn * s.iSeries, s.vOut * iOut, () => ({
      [rsRef]: { w: vRs * s.iSeries, v: vRs },
      [uRef]: { w: Math.max(0, s.ik) * s.vOut, v: s.vOut },
      [r1Ref]: { w: (ref.vRefV * ref.vRefV) / d.r1, v: ref.vRefV },
      [r2Ref]: { w: Math.max(0, d.vOut - ref.vRefV) ** 2 / d.r2, v: Math.max(0, d.vOut - ref.vRefV) },
    }));
  };
  const fault: OperatingPoint = {
    regulates: false,
    pInW: (vMax * vMax) / rs,
    pOutW: 0,
    stress: { [rsRef]: { w: (vMax * vMax) / rs, v: vMax }, [uRef]: { w: 0, v: 0 }, [r1Ref]: { w: 0, v: 0 }, [r2Ref]: { w: 0, v: 0 } },
  };
  // Input ripple divides between Rs and the closed-loop output impedance.
  const rippleVpp = trace.add(
    'shunt.ripple',
    'Output ripple (input ripple through Rs and the loop’s output impedance)',
    'ΔVout = ΔVin · Zout/(Rs + Zout)',
    {
      ΔVin: [spec.input.rippleVpp, 'V'],
      Zout: [zOut, 'Ω'],
      Rs: [rs, 'Ω'],
    },
    (spec.input.rippleVpp * zOut) / (rs + zOut),
    'V',
  );
  issues.push(
    info('light-load', 'A shunt regulator draws the same input current at every load; the reference absorbs what the load does not take.'),
  );
  return {
    topology: 'shunt',
    label: `Shunt regulator (${ref.label})`,
    parts,
    issues,
    trace,
    operate,
    fault,
    output: d.model,
    rippleVpp,
    assumptions: {
      [`${uRef}.vRef`]: { value: ref.vRefV, unit: 'V' },
      [`${uRef}.iRef`]: { value: ref.iRefA, unit: 'A' },
      [`${uRef}.zKa`]: { value: ref.zKaOhm, unit: 'Ω' },
      [`${uRef}.iKMin`]: { value: ref.iKMinA, unit: 'A' },
    },
    fixes,
  };
}
