// Pieces shared by the switching converters: stage choice, frequency, inductor, capacitors,
// feedback divider and the optional LC post-filter.
import type { Catalog, SwitcherClass } from '../catalog.ts';
import type { Context } from '../context.ts';
import { forced } from '../context.ts';
import { chooseCapacitor, type ChosenCapacitor } from '../capacitors.ts';
import { Refs, atLeast, blocker, info, makePart, resistorPart, type DesignPart } from '../design.ts';
import { snap } from '../eseries.ts';
import { pickFromLadder } from '../ratings.ts';
import type { ToleranceModel } from '../tolerance.ts';
import type { Trace } from '../trace.ts';
import type { Issue } from '../types.ts';
import { designDivider, type Divider } from './feedback.ts';

/** Inductor ripple current as a fraction of the full-load inductor current (common practice 0.2–0.4). */
export const RIPPLE_RATIO = 0.3;
/** Saturation current margin over the peak inductor current (common practice). */
export const ISAT_MARGIN = 1.3;
/** The converter's own ripple is designed to half the rail's limit, leaving room for noise. */
export const RIPPLE_BUDGET = 0.5;
/** Smallest output capacitance for loop stability of the class (common practice). */
const COUT_MIN_F = 10e-6;
/** Lower feedback resistor of ground-referenced controllers (common practice 10 kΩ). */
const FB_LOWER_OHM = 10e3;

export function chooseSwitcher(ctx: Context, converter: SwitcherClass['converter'], vOut: number): { stage: SwitcherClass; issues: Issue[] } {
  const pool = ctx.catalog.switchers.filter((s) => s.converter === converter);
  const { vMax } = ctx.spec.input;
  const fits = (s: SwitcherClass) => vMax <= s.vInMaxV && ctx.vInTrough >= s.vInMinV && vOut <= s.vOutMaxV;
  const stage = pool.find(fits) ?? [...pool].sort((a, b) => b.vInMaxV - a.vInMaxV)[0];
  if (!stage) return { stage: ctx.catalog.switchers[0]!, issues: [blocker('no-class', `The catalog has no ${converter} stage.`)] };
  const issues: Issue[] = [];
  if (vMax > stage.vInMaxV) issues.push(blocker('input-max', `The input reaches ${vMax} V; ${stage.label} allows ${stage.vInMaxV} V.`));
  if (ctx.vInTrough < stage.vInMinV) issues.push(blocker('input-min', `The input trough ${ctx.vInTrough.toFixed(2)} V is below the ${stage.vInMinV} V ${stage.label} needs.`));
  if (vOut > stage.vOutMaxV) issues.push(blocker('output-max', `${stage.label} regulates up to ${stage.vOutMaxV} V.`));
  return { stage, issues };
}

export function switchingFrequency(ctx: Context, stage: SwitcherClass, issues: Issue[]): number {
  const wanted = ctx.spec.overrides.fswHz ?? stage.fswDefaultHz;
  const fsw = Math.min(stage.fswMaxHz, Math.max(stage.fswMinHz, wanted));
  if (fsw !== wanted) issues.push(info('fsw-clamped', `${stage.label} runs between ${stage.fswMinHz} and ${stage.fswMaxHz} Hz; the engine used ${fsw} Hz.`));
  return fsw;
}

export interface ChosenInductor {
  part: DesignPart;
  henries: number;
  isatA: number;
  dcrOhm: number;
}

/** DCR ≈ k·√(L/1 µH)/Isat: bigger inductance or smaller core means more copper resistance (catalog fit). */
export function inductorDcr(catalog: Catalog, henries: number, isatA: number): number {
  return (catalog.inductors.dcrCoefficient * Math.sqrt(henries / 1e-6)) / isatA;
}

export function chooseInductor(ref: string, catalog: Catalog, wantedH: number, peakA: number, forcedH: number | undefined): { chosen: ChosenInductor; issue: Issue | null } {
  const inductors = catalog.inductors;
  const henries = forcedH ?? Math.min(inductors.lMaxH, Math.max(inductors.lMinH, snap(atLeast(wantedH, 1e-9), inductors.series, 'nearest')));
  const isat = pickFromLadder(inductors.isatStepsA, ISAT_MARGIN * peakA);
  const isatA = isat ?? inductors.isatStepsA[inductors.isatStepsA.length - 1]!;
  const dcrOhm = inductorDcr(catalog, henries, isatA);
  const part = makePart({
    ref,
    role: 'inductor',
    part: `Power inductor, shielded, Isat ${isatA} A`,
    value: henries,
    unit: 'H',
    tolerance: 0.2,
    costCents: inductors.costCentsBase + Math.round(inductors.costCentsPerA * isatA),
  });
  const issue = isat === null ? blocker('inductor', `The peak inductor current ${peakA.toFixed(2)} A needs a saturation rating of ${(ISAT_MARGIN * peakA).toFixed(1)} A, beyond the catalog.`) : null;
  return { chosen: { part, henries, isatA, dcrOhm }, issue };
}

/** Output capacitance for a ripple target, at least the stability minimum and at most the ceramic range. */
export function chooseOutputCapacitor(ref: string, catalog: Catalog, wantedF: number, vOut: number): ChosenCapacitor {
  const ceramicMax = Math.max(...catalog.capacitors.map((c) => c.cMaxF));
  const wanted = Math.min(Math.max(COUT_MIN_F, wantedF), ceramicMax);
  return chooseCapacitor(ref, 'output-capacitor', wanted, vOut, catalog);
}

export interface FeedbackParts {
  divider: Divider;
  parts: DesignPart[];
  r1Ref: string;
  r2Ref: string;
  tolerance: number;
}

export function switcherFeedback(ctx: Context, refs: Refs, trace: Trace, stage: SwitcherClass, vTarget: number, idPrefix: string): FeedbackParts {
  const series = ctx.spec.overrides.resistorSeries ?? 'E96';
  const tolerance = series === 'E96' ? 0.01 : 0.05;
  const r1Ref = refs.next('R');
  const r2Ref = refs.next('R');
  const r1 = forced(ctx, r1Ref) ?? snap(FB_LOWER_OHM, series, 'nearest');
  const divider = designDivider(vTarget, stage.vFbV, 0, stage.vFbV / r1, series, r1, forced(ctx, r2Ref));
  trace.add(`${idPrefix}.fb`, 'Feedback divider output with snapped values', 'Vout = Vfb·(1 + R2/R1)', {
    Vfb: [stage.vFbV, 'V'], R1: [divider.r1, 'Ω'], R2: [divider.r2, 'Ω'],
  }, divider.vOut, 'V');
  return {
    divider,
    parts: [resistorPart(r1Ref, 'feedback-lower', divider.r1, tolerance, series), resistorPart(r2Ref, 'feedback-upper', divider.r2, tolerance, series)],
    r1Ref,
    r2Ref,
    tolerance,
  };
}

/** Output model of a ground-referenced feedback loop; dcrAfterFb is any resistance outside the loop. */
export function feedbackModel(stage: SwitcherClass, fb: FeedbackParts, dcrAfterFb: number, iMin: number, iTyp: number, iMax: number): ToleranceModel {
  const { r1, r2 } = fb.divider;
  const t = fb.tolerance;
  return {
    params: [
      { name: 'Vfb', nominal: stage.vFbV, lo: stage.vFbV * (1 - stage.vFbTolerance), hi: stage.vFbV * (1 + stage.vFbTolerance) },
      { name: 'R1', nominal: r1, lo: r1 * (1 - t), hi: r1 * (1 + t) },
      { name: 'R2', nominal: r2, lo: r2 * (1 - t), hi: r2 * (1 + t) },
      { name: 'iOut', nominal: iTyp, lo: iMin, hi: iMax },
    ],
    f: (x: Float64Array) => x[0]! * (1 + x[2]! / x[1]!) - x[3]! * dcrAfterFb,
    batch: (c, out) => {
      const [vr, a, b, io] = c as [Float64Array, Float64Array, Float64Array, Float64Array];
      for (let i = 0; i < out.length; i += 1) out[i] = vr[i]! * (1 + b[i]! / a[i]!) - io[i]! * dcrAfterFb;
    },
  };
}

export interface PostFilter {
  parts: DesignPart[];
  inductorRef: string;
  capRef: string;
  dcrOhm: number;
  esrOhm: number;
  attenuation: number;
  issues: Issue[];
}

/** Post-filter inductance (common practice: about 1 µH, or a ferrite bead, after the output capacitor). */
const POST_FILTER_H = 1e-6;

/** Second-order LC after the output capacitor: |H| = |Zc| / |ZL + Zc| at the switching frequency. */
export function postFilter(refs: Refs, trace: Trace, catalog: Catalog, fsw: number, vOut: number, iMax: number, capF: number, idPrefix: string): PostFilter {
  const issues: Issue[] = [];
  const lRef = refs.next('L');
  const { chosen, issue } = chooseInductor(lRef, catalog, POST_FILTER_H, iMax, undefined);
  if (issue) issues.push(issue);
  const cap = chooseOutputCapacitor(refs.next('C'), catalog, capF, vOut);
  if (cap.issue) issues.push(cap.issue);
  const w = 2 * Math.PI * fsw;
  const xc = 1 / (w * cap.farads);
  const xl = w * chosen.henries;
  const attenuation = trace.add(`${idPrefix}.postfilter`, 'Post-filter attenuation at the switching frequency', '|H| = √(ESR² + Xc²) / √(ESR² + (XL − Xc)²)', {
    L: [chosen.henries, 'H'], C: [cap.farads, 'F'], ESR: [cap.esrOhm, 'Ω'], fsw: [fsw, 'Hz'],
  }, Math.sqrt(cap.esrOhm ** 2 + xc * xc) / Math.sqrt(cap.esrOhm ** 2 + (xl - xc) ** 2), '');
  issues.push(info('post-filter', `An LC post-filter (${lRef}, ${cap.part.ref}) attenuates the switching ripple by ${(20 * Math.log10(1 / attenuation)).toFixed(0)} dB for this quiet rail.`));
  return { parts: [chosen.part, cap.part], inductorRef: lRef, capRef: cap.part.ref, dcrOhm: chosen.dcrOhm, esrOhm: cap.esrOhm, attenuation, issues };
}
