// Pieces shared by the switching converters: the class × frequency search, voltage derating,
// on-/off-time limits, capacitor sizing, feedback divider and the optional LC post-filter.
import type { Catalog, SwitcherClass } from '../catalog.ts';
import type { Context } from '../context.ts';
import { forced } from '../context.ts';
import { chooseCapacitorBank, type ChosenCapacitor } from '../capacitors.ts';
import {
  blocker,
  info,
  resistorPart,
  type Design,
  type DesignPart,
  type Fix,
  type OperatingPoint,
  type PartStress,
  type Refs,
} from '../design.ts';
import { chooseInductor, type ChosenInductor } from '../inductors.ts';
import { SEMICONDUCTOR_VOLTAGE_FACTOR } from '../ratings.ts';
import { rdsAt } from './switcher-losses.ts';
import { temperatureSwingK, type ToleranceModel, type ToleranceParam, type ToleranceRule } from '../tolerance.ts';
import type { Trace } from '../trace.ts';
import type { Issue, Quantity } from '../types.ts';
import { searchDivider, type DividerDesign } from './feedback.ts';
import { classPhrase } from '../units.ts';

/** Inductor ripple current as a fraction of the reference current (common practice 0.2–0.4). */
export const RIPPLE_RATIO = 0.3;
/**
 * Ripple is sized to the load but not below a fifth of the class's current limit (common practice:
 * ripple relative to the part's rating keeps the current-mode ramp measurable and the inductor
 * small); light loads then run in discontinuous conduction or bursts.
 */
export const RIPPLE_FLOOR_OF_LIMIT = 0.2;
/** The converter's own ripple is designed to half the rail's limit, leaving room for noise. */
export const RIPPLE_BUDGET = 0.5;
/** Peak switch current kept below 85 % of the typical current limit, which spreads about ±15 % (common practice). */
export const LIMIT_HEADROOM = 0.85;
/** Smallest effective output capacitance for loop stability (common practice for integrated converters). */
export const COUT_MIN_EFFECTIVE_F = 4.7e-6;
/** Smallest effective input capacitance, the local decoupling of the switching loop (common practice). */
export const CIN_MIN_EFFECTIVE_F = 1e-6;
/**
 * Ripple the converter itself is sized for when an LC post-filter follows on a quiet rail: 0.5 % of
 * the output (common practice); the filter's 40 dB/decade above its corner does the rest.
 */
export const PRE_FILTER_RIPPLE_FRACTION = 0.005;
/** Input ripple allowed on the input capacitor, as a fraction of the lowest input (common practice 1–2 %). */
export const INPUT_RIPPLE_FRACTION = 0.02;
/** Loop crossover of a current-mode converter, about a tenth of the switching frequency (common practice). */
export const CROSSOVER_FRACTION = 0.1;
/** Search objective: parts cost plus this many cents per watt lost at the nominal corner (our weighting of heat). */
export const LOSS_CENTS_PER_W = 100;
/** Frequencies tried between a class's limits (geometric steps, plus its default). */
const FSW_STEPS = 3;

/** A blocker and what would clear it. */
export interface Finding {
  issue: Issue;
  fix: Fix | null;
}

/** The fix says what to change, not the blocker again. */
export function finding(code: string, message: string, change: string | null): Finding {
  return { issue: blocker(code, message), fix: change === null ? null : { code, change, message: `Would clear with ${change}.` } };
}

/** Frequencies to try: the forced one (clamped to the class), else steps across the class's range. */
export function fswCandidates(ctx: Context, stage: SwitcherClass): number[] {
  const wanted = ctx.spec.overrides.fswHz;
  if (wanted !== undefined) return [Math.min(stage.fswMaxHz, Math.max(stage.fswMinHz, wanted))];
  const out = [stage.fswDefaultHz];
  const ratio = stage.fswMaxHz / stage.fswMinHz;
  for (let k = 0; k < FSW_STEPS; k += 1) {
    // Rounded to two figures for a tidy value, and kept inside the class's range.
    const f = Math.min(stage.fswMaxHz, Number((stage.fswMinHz * ratio ** (k / (FSW_STEPS - 1))).toPrecision(2)));
    if (!out.includes(f)) out.push(f);
  }
  return out.sort((a, b) => a - b);
}

/** Duty-cycle window the class can make at fsw: D ≥ tON,min·fsw and D ≤ min(Dmax, 1 − tOFF,min·fsw). */
export function dutyWindow(stage: SwitcherClass, fsw: number): { dMin: number; dMax: number } {
  return { dMin: stage.tOnMinS * fsw, dMax: Math.min(stage.dMax, 1 - stage.tOffMinS * fsw) };
}

/** Highest frequency at which duty d still gives the minimum on-time (D·Ts ≥ tON,min). */
export function fswForOnTime(stage: SwitcherClass, d: number): number {
  return d / stage.tOnMinS;
}

/** Voltage an IC pin may see: its rating divided by the semiconductor factor (common practice: 80 % of rating). */
export function deratedLimit(ratedV: number): number {
  return ratedV / SEMICONDUCTOR_VOLTAGE_FACTOR;
}

/** Blockers from the class's voltage ratings (derated), its input range and output range. */
export function classVoltageFindings(
  stage: SwitcherClass,
  vInMax: number,
  vTrough: number,
  vOut: number,
  switchNodeV: number,
  switchRatingV: number,
): Finding[] {
  const out: Finding[] = [];
  const f = SEMICONDUCTOR_VOLTAGE_FACTOR;
  if (vInMax > deratedLimit(stage.vInMaxV)) {
    out.push(
      finding(
        'input-max',
        `The input reaches ${vInMax} V; ${classPhrase(stage.label)} has a ${stage.vInMaxV} V input rating, so with the ${f}× voltage derating it takes at most ${deratedLimit(stage.vInMaxV).toFixed(1)} V.`,
        `a ${stage.converter} class rated ≥ ${Math.ceil(f * vInMax)} V input`,
      ),
    );
  }
  if (switchNodeV > deratedLimit(switchRatingV)) {
    out.push(
      finding(
        'switch-voltage',
        `The switch sees ${switchNodeV.toFixed(1)} V; the ${switchRatingV} V switch of ${classPhrase(stage.label)} takes at most ${deratedLimit(switchRatingV).toFixed(1)} V with the ${f}× derating.`,
        `a ${stage.converter} class with a switch rated ≥ ${Math.ceil(f * switchNodeV)} V`,
      ),
    );
  }
  if (vTrough < stage.vInMinV)
    out.push(
      finding(
        'input-min',
        `The input trough ${vTrough.toFixed(2)} V is below the ${stage.vInMinV} V that ${classPhrase(stage.label)} needs.`,
        `input ≥ ${stage.vInMinV} V`,
      ),
    );
  if (vOut > stage.vOutMaxV)
    out.push(
      finding(
        'output-max',
        `${classPhrase(stage.label, true)} regulates up to ${stage.vOutMaxV} V.`,
        `a ${stage.converter} class regulating ${vOut.toFixed(2)} V`,
      ),
    );
  if (vOut < stage.vFbV)
    out.push(
      finding(
        'output-min',
        `${classPhrase(stage.label, true)} cannot regulate below its ${stage.vFbV} V feedback reference.`,
        `a ${stage.converter} class with a feedback reference ≤ ${vOut.toFixed(2)} V`,
      ),
    );
  return out;
}

/** True when the class's derated input and switch ratings take these voltages (the search's prefilter). */
export function voltageFits(stage: SwitcherClass, vInMax: number, switchNodeV: number): boolean {
  return vInMax <= deratedLimit(stage.vInMaxV) && switchNodeV <= deratedLimit(stage.converter === 'buck' ? stage.vInMaxV : stage.vOutMaxV);
}

export function peakFinding(stage: SwitcherClass, peakA: number): Finding | null {
  if (peakA <= LIMIT_HEADROOM * stage.iSwitchMaxA) return null;
  return finding(
    'current',
    `The peak current ${peakA.toFixed(2)} A exceeds ${LIMIT_HEADROOM * 100} % of the ${stage.iSwitchMaxA} A current limit of ${classPhrase(stage.label)}.`,
    `a class with a current limit ≥ ${(peakA / LIMIT_HEADROOM).toFixed(1)} A`,
  );
}

export function onTimeFinding(stage: SwitcherClass, fsw: number, d: number, where: string): Finding | null {
  if (d / fsw >= stage.tOnMinS) return null;
  const fMax = fswForOnTime(stage, d);
  const can = fMax >= stage.fswMinHz;
  return finding(
    'min-on-time',
    `${where} the on-time D/fsw = ${((d / fsw) * 1e9).toFixed(0)} ns is below the ${(stage.tOnMinS * 1e9).toFixed(0)} ns minimum of ${classPhrase(stage.label)}; the converter would skip pulses.`,
    can ? `fsw ≤ ${(fMax / 1e3).toFixed(0)} kHz` : 'a class with a shorter minimum on-time, or a two-stage design',
  );
}

/** Ripple reference current: the load, floored at a fraction of the class's current limit. */
export function rippleReference(stage: SwitcherClass, iMax: number): number {
  return Math.max(iMax, RIPPLE_FLOOR_OF_LIMIT * stage.iSwitchMaxA);
}

/** Rds(on) at the junction temperature the full-load dissipation gives: Tj = Ta + P·θJA. */
export function hotStage(ctx: Context, stage: SwitcherClass, icLossW: number): { stage: SwitcherClass; tjC: number } {
  const theta = stage.thetaJaCW * ctx.catalog.thermal.airflowFactor[ctx.spec.thermal.airflow];
  const tjC = Math.min(stage.tjMaxC, ctx.ambientC + icLossW * theta);
  return { stage: { ...stage, rdsOnOhm: rdsAt(stage.rdsOnOhm, tjC) }, tjC };
}

/** The class's junction at the full-load loss against its limit less the design margin (as the thermal check applies it). */
export function thermalFinding(ctx: Context, stage: SwitcherClass, tjC: number): Finding | null {
  const limit = stage.tjMaxC - ctx.catalog.thermal.tjMarginK;
  if (tjC <= limit) return null;
  return finding(
    'thermal',
    `${classPhrase(stage.label, true)} would reach about ${tjC >= stage.tjMaxC ? `its ${stage.tjMaxC} °C limit` : `${tjC.toFixed(0)} °C`} at full load, above the ${limit} °C design limit.`,
    'a larger class (lower θJA), a lower switching frequency, or more airflow',
  );
}

export function traceRds(trace: Trace, id: string, rds25: number, tjC: number, rdsHot: number): void {
  trace.add(
    id,
    'Switch on-resistance at the full-load junction temperature',
    'Rds = Rds25·(1 + α·(Tj − 25))',
    {
      Rds25: [rds25, 'Ω'],
      α: [0.004, '1/K'],
      Tj: [tjC, '°C'],
    },
    rdsHot,
    'Ω',
  );
}

/** Reference designators of a switching stage, handed out before the search so forced values apply. */
export interface StageRefs {
  u: string;
  r1: string;
  r2: string;
  l: string;
  cout: string;
  cin: string;
}

export function stageRefs(refs: Refs): StageRefs {
  return { u: refs.next('U'), r1: refs.next('R'), r2: refs.next('R'), l: refs.next('L'), cout: refs.next('C'), cin: refs.next('C') };
}

/** Output capacitance for a ripple budget and an optional load step, with its RMS current. */
export function outputBank(ctx: Context, ref: string, effectiveF: number, vOut: number, rmsA: number, esrMaxOhm: number): ChosenCapacitor {
  return chooseCapacitorBank(
    ref,
    'output-capacitor',
    {
      effectiveF: Math.max(COUT_MIN_EFFECTIVE_F, effectiveF),
      workingV: vOut,
      rmsA,
      esrMaxOhm,
      ambientC: ctx.ambientC,
      forcedF: forced(ctx, ref),
    },
    ctx.catalog,
  );
}

/** Input capacitor: RMS current Iout·√(D(1 − D)) (buck-type input) and ripple ≤ INPUT_RIPPLE_FRACTION of the trough. */
export function inputBank(
  ctx: Context,
  ref: string,
  vMax: number,
  vTrough: number,
  chargeA: number,
  rmsA: number,
  fsw: number,
): ChosenCapacitor {
  return chooseCapacitorBank(
    ref,
    'input-capacitor',
    {
      effectiveF: Math.max(CIN_MIN_EFFECTIVE_F, chargeA / (fsw * INPUT_RIPPLE_FRACTION * Math.max(vTrough, 0.1))),
      workingV: vMax,
      rmsA,
      esrMaxOhm: Infinity,
      ambientC: ctx.ambientC,
      forcedF: forced(ctx, ref),
    },
    ctx.catalog,
  );
}

/**
 * Ripple a converter stage may leave at its output, by switching frequency: the rail's limit for a
 * converter alone, more behind a post-regulator whose rejection depends on the frequency.
 */
export type RippleLimit = (fsw: number) => number;

/** What a converter stage is asked to make. */
export interface StageRequest {
  input: { vTrough: number; vMax: number };
  vTarget: number;
  load: { iMin: number; iTyp: number; iMax: number };
  rippleLimit: RippleLimit;
  /** An LC post-filter may follow (a converter alone, not one behind a post-regulator). */
  allowPostFilter: boolean;
  idPrefix: string;
  /** Band the output must hold (the rail's, or a looser one for an intermediate rail). */
  band: { lo: number; hi: number };
  /** Tolerance rule, when not the rail's (worst case for a rail another stage relies on). */
  rule?: ToleranceRule;
}

/** The rail itself as a converter's request: its input range, output, load, ripple limit and band. */
export function railRequest(ctx: Context, idPrefix: string): StageRequest {
  const { spec } = ctx;
  return {
    input: { vTrough: ctx.vInTrough, vMax: spec.input.vMax },
    vTarget: spec.output.v,
    load: spec.output,
    rippleLimit: () => spec.noise.maxRippleVpp,
    allowPostFilter: true,
    idPrefix,
    band: railBand(spec),
  };
}

export function quietRail(ctx: Context): boolean {
  return ctx.spec.noise.class === 'precision' || ctx.spec.noise.class === 'rf';
}

/** The feedback requirement of a stage, with or without a post-filter's winding after it. */
export function feedbackNeed(ctx: Context, req: StageRequest): (filtered: boolean, marginV: number) => FeedbackNeed {
  const { vTarget, band, load, input, rule } = req;
  return (filtered, marginV) => ({
    vTarget,
    band,
    load,
    input,
    dcrAfterFb: filtered ? postFilterDcr(ctx, load.iMax) : 0,
    marginV,
    ...(rule ? { rule } : {}),
  });
}

/** Ripple limit the converter stage is sized for: the rail's, or a looser one when a post-filter will follow. */
export function stageRippleLimit(ctx: Context, rippleLimit: number, allowPostFilter: boolean, vOut: number): number {
  const quiet = ctx.spec.noise.class === 'precision' || ctx.spec.noise.class === 'rf';
  return allowPostFilter && quiet ? Math.max(rippleLimit, (PRE_FILTER_RIPPLE_FRACTION * vOut) / RIPPLE_BUDGET) : rippleLimit;
}

/** A stretch of the capacitor current: it runs linearly from i0 to i1 over t seconds. */
export interface CurrentSegment {
  t: number;
  i0: number;
  i1: number;
}

/**
 * Exact peak-to-peak of the output v = vC + ESR·iC over one period of a piecewise-linear capacitor
 * current: on each stretch v is quadratic in time, so its extremes lie at the ends or where
 * dv/dt = iC/C + ESR·diC/dt = 0. (The textbook ΔIL/(8·fsw·C) + ΔIL·ESR adds the two peaks as if
 * they coincided, an upper bound.)
 */
export function ripplePeakToPeak(segments: readonly CurrentSegment[], capF: number, esrOhm: number): number {
  let vc = 0;
  let lo = Number.POSITIVE_INFINITY;
  let hi = Number.NEGATIVE_INFINITY;
  for (const { t, i0, i1 } of segments) {
    if (!(t > 0)) continue;
    const slope = (i1 - i0) / t;
    const at = (tau: number) => vc + (i0 * tau + (slope * tau * tau) / 2) / capF + esrOhm * (i0 + slope * tau);
    const candidates = [0, t];
    if (slope !== 0) {
      const turn = (-esrOhm * slope * capF - i0) / slope;
      if (turn > 0 && turn < t) candidates.push(turn);
    }
    for (const tau of candidates) {
      const v = at(tau);
      lo = Math.min(lo, v);
      hi = Math.max(hi, v);
    }
    vc += (((i0 + i1) / 2) * t) / capF;
  }
  return Number.isFinite(hi - lo) ? hi - lo : 0;
}

/** Buck capacitor current: the inductor's triangle less the load (CCM), or its pulse and the idle gap (DCM). */
export function buckSegments(mode: 'ccm' | 'dcm' | 'burst', d: number, rippleA: number, iOut: number, fsw: number): CurrentSegment[] {
  const period = 1 / fsw;
  if (mode !== 'dcm')
    return [
      { t: d * period, i0: -rippleA / 2, i1: rippleA / 2 },
      { t: (1 - d) * period, i0: rippleA / 2, i1: -rippleA / 2 },
    ];
  // DCM: the inductor current averages Iout over its triangle, so the fall lasts 2·Iout/Ipk − D.
  const d2 = Math.min(1 - d, Math.max(0, (2 * iOut) / Math.max(rippleA, 1e-12) - d));
  return [
    { t: d * period, i0: -iOut, i1: rippleA - iOut },
    { t: d2 * period, i0: rippleA - iOut, i1: -iOut },
    { t: (1 - d - d2) * period, i0: -iOut, i1: -iOut },
  ];
}

/** Boost capacitor current: −Iout while the switch conducts, then the falling inductor current less the load. */
export function boostSegments(
  mode: 'ccm' | 'dcm' | 'burst',
  d: number,
  peakA: number,
  rippleA: number,
  iOut: number,
  fsw: number,
): CurrentSegment[] {
  const period = 1 / fsw;
  if (mode !== 'dcm')
    return [
      { t: d * period, i0: -iOut, i1: -iOut },
      { t: (1 - d) * period, i0: peakA - iOut, i1: peakA - rippleA - iOut },
    ];
  // DCM: the rectifier passes the whole triangle's fall, whose charge is Iout·Ts: it lasts 2·Iout/Ipk.
  const d2 = Math.min(1 - d, (2 * iOut) / Math.max(peakA, 1e-12));
  return [
    { t: d * period, i0: -iOut, i1: -iOut },
    { t: d2 * period, i0: peakA - iOut, i1: -iOut },
    { t: (1 - d - d2) * period, i0: -iOut, i1: -iOut },
  ];
}

/** Load-step deviation: ΔV = ΔI/(2π·fc·C) + ΔI·ESR with fc = fsw/10 (current-mode, common practice). */
export function stepDeviation(stepA: number, fsw: number, capF: number, esrOhm: number): number {
  return stepA / (2 * Math.PI * CROSSOVER_FRACTION * fsw * capF) + stepA * esrOhm;
}

/** Capacitance the load step asks for: C ≥ ΔI/(2π·fc·ΔVmax), with half the deviation left for ESR. */
export function stepCapacitance(ctx: Context, fsw: number): number {
  const { loadStep, maxStepDeviation } = ctx.spec.output;
  if (!loadStep || !maxStepDeviation) return 0;
  return loadStep / (2 * Math.PI * CROSSOVER_FRACTION * fsw * 0.5 * maxStepDeviation);
}

export function traceStep(ctx: Context, trace: Trace, id: string, fsw: number, cout: ChosenCapacitor): Finding | null {
  const { loadStep, maxStepDeviation } = ctx.spec.output;
  if (!loadStep) return null;
  const dv = trace.add(
    id,
    'Output deviation for the load step (loop crossover fc = fsw/10)',
    'ΔV = ΔI/(2π·fc·Cout) + ΔI·ESR',
    {
      ΔI: [loadStep, 'A'],
      fc: [CROSSOVER_FRACTION * fsw, 'Hz'],
      Cout: [cout.effectiveF, 'F'],
      ESR: [cout.esrOhm, 'Ω'],
    },
    stepDeviation(loadStep, fsw, cout.effectiveF, cout.esrOhm),
    'V',
  );
  if (!maxStepDeviation || dv <= maxStepDeviation) return null;
  return finding(
    'load-step',
    `A ${loadStep} A load step moves the output by ${(dv * 1e3).toFixed(0)} mV, beyond the ${(maxStepDeviation * 1e3).toFixed(0)} mV allowed.`,
    `more output capacitance (about ${((loadStep / (2 * Math.PI * CROSSOVER_FRACTION * fsw * maxStepDeviation)) * 1e6).toFixed(0)} µF effective) or a faster loop`,
  );
}

export interface FeedbackParts {
  divider: DividerDesign;
  parts: DesignPart[];
  r1Ref: string;
  r2Ref: string;
  /** Output model: the divider, the feedback reference and any drop outside the loop. */
  output: ToleranceModel;
}

/** Feedback-pin bias current of switching controllers, either sign (common practice: tens of nA). */
export const FB_BIAS_A = 50e-9;
/** Divider current window: some 400× the pin's bias current, little against light-load quiescent budgets (common practice 10–100 µA). */
const FB_DIVIDER_A = { min: 25e-6, max: 40e-6 } as const;
/**
 * Load regulation of an integrated current-mode converter over its rated current, and line
 * regulation per volt of input swing: the loop's finite DC gain (from memory: typical data-sheet
 * figures of ±0.2 % over the load range and 0.02 %/V).
 */
export const SWITCHER_LOAD_REGULATION = 0.004;
export const SWITCHER_LINE_REGULATION_PER_V = 0.0002;

export interface FeedbackNeed {
  vTarget: number;
  /** Band the output must hold (the rail's, or a looser one for an intermediate rail). */
  band: { lo: number; hi: number };
  load: { iMin: number; iTyp: number; iMax: number };
  /** Input range the converter runs over (line regulation). */
  input: { vTrough: number; vMax: number };
  /** Resistance outside the loop (an LC post-filter's winding). */
  dcrAfterFb: number;
  /** Half the output ripple, kept clear of the band's edges. */
  marginV: number;
  /** Tolerance rule: the rail's, or worst case for an intermediate rail another stage relies on. */
  rule?: ToleranceRule;
}

/** Line and load regulation of the converter's loop as multiplicative spreads about the nominal output. */
export function switcherRegulation(stage: SwitcherClass, need: FeedbackNeed): ToleranceParam[] {
  const line = (SWITCHER_LINE_REGULATION_PER_V * Math.max(0, need.input.vMax - need.input.vTrough)) / 2;
  const load = (SWITCHER_LOAD_REGULATION * Math.min(1, Math.max(0, need.load.iMax - need.load.iMin) / stage.iSwitchMaxA)) / 2;
  return [
    { name: 'Line regulation', nominal: 1, lo: 1 - line, hi: 1 + line },
    { name: 'Load regulation', nominal: 1, lo: 1 - load, hi: 1 + load },
  ];
}

/** The shared divider search for a class: its Vfb tolerance, the pin's bias current, regulation and the post-filter's drop. */
function feedbackSearch(ctx: Context, stage: SwitcherClass, need: FeedbackNeed, forcedR: { r1?: number; r2?: number }): DividerDesign {
  const { vTarget, band, load, input, dcrAfterFb, marginV } = need;
  const rule = need.rule ?? ctx.spec.overrides.toleranceRule ?? 'statistical';
  const key = [
    stage.id,
    vTarget,
    band.lo,
    band.hi,
    load.iMin,
    load.iTyp,
    load.iMax,
    input.vTrough,
    input.vMax,
    dcrAfterFb,
    marginV,
    rule,
    ctx.ambientC,
    forcedR.r1,
    forcedR.r2,
  ];
  return ctx.dividerSearches.get(key, () => searchFeedback(ctx, stage, need, rule, forcedR));
}

function searchFeedback(
  ctx: Context,
  stage: SwitcherClass,
  need: FeedbackNeed,
  rule: ToleranceRule,
  forcedR: { r1?: number; r2?: number },
): DividerDesign {
  const { vTarget, load, dcrAfterFb } = need;
  const drop = (i: number) => 1 - (i * dcrAfterFb) / vTarget;
  const extra = [
    ...switcherRegulation(stage, need),
    ...(dcrAfterFb > 0 ? [{ name: 'post-filter drop', nominal: drop(load.iTyp), lo: drop(load.iMax), hi: drop(load.iMin) }] : []),
  ];
  const series = ctx.spec.overrides.resistorSeries;
  return searchDivider({
    vTarget,
    vRef: stage.vFbV,
    refGrades: [{ tolerance: stage.vFbTolerance, extraCents: 0 }],
    vRefDriftPpmK: 0,
    iAdjTyp: 0,
    iAdjMin: -FB_BIAS_A,
    iAdjMax: FB_BIAS_A,
    iDividerMin: FB_DIVIDER_A.min,
    iDividerMax: FB_DIVIDER_A.max,
    band: need.band,
    rule,
    tempSwingK: temperatureSwingK(ctx.ambientC),
    extra,
    grades: ctx.catalog.resistorGrades,
    marginV: need.marginV,
    ...(forcedR.r1 !== undefined ? { r1Forced: forcedR.r1 } : {}),
    ...(forcedR.r2 !== undefined ? { r2Forced: forcedR.r2 } : {}),
    ...(series !== undefined ? { series } : {}),
  }).pick;
}

/** 1 when no resistor grade lets this class's feedback hold the band (a blocker the class search counts), else 0. */
export function feedbackPenalty(ctx: Context, stage: SwitcherClass, need: FeedbackNeed): number {
  return feedbackSearch(ctx, stage, need, {}).verdict === 'fails' ? 1 : 0;
}

/**
 * Divider pair, resistor grade and feedback-reference figure from the shared divider search: the
 * class's Vfb tolerance (specified over temperature by the part, so no separate drift), the pin's
 * bias current, line and load regulation, and the post-filter's drop as a load-dependent spread.
 */
export function switcherFeedback(
  ctx: Context,
  r: StageRefs,
  trace: Trace,
  stage: SwitcherClass,
  need: FeedbackNeed,
  idPrefix: string,
): FeedbackParts {
  const r1 = forced(ctx, r.r1);
  const r2 = forced(ctx, r.r2);
  const pick = feedbackSearch(ctx, stage, need, { ...(r1 !== undefined ? { r1 } : {}), ...(r2 !== undefined ? { r2 } : {}) });
  trace.add(
    `${idPrefix}.fb`,
    'Feedback divider output with the chosen pair',
    'Vout = Vfb·(1 + R2/R1)',
    {
      Vfb: [stage.vFbV, 'V'],
      R1: [pick.r1, 'Ω'],
      R2: [pick.r2, 'Ω'],
    },
    pick.vOut,
    'V',
  );
  return {
    divider: pick,
    parts: [
      resistorPart(r.r1, 'feedback-lower', pick.r1, pick.grade.tolerance, pick.series, pick.grade.extraCents),
      resistorPart(r.r2, 'feedback-upper', pick.r2, pick.grade.tolerance, pick.series, pick.grade.extraCents),
    ],
    r1Ref: r.r1,
    r2Ref: r.r2,
    output: pick.model,
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

/** Winding resistance of the post-filter inductor a load needs (known before the filter is placed). */
export function postFilterDcr(ctx: Context, iMax: number): number {
  return chooseInductor('L0', ctx.catalog, POST_FILTER_H, iMax, 0, undefined).chosen.dcrOhm;
}

/** Second-order LC after the output capacitor: |H| = |Zc| / |ZL + Zc| at the switching frequency. */
export function postFilter(
  ctx: Context,
  refs: Refs,
  trace: Trace,
  fsw: number,
  vOut: number,
  iMax: number,
  capF: number,
  idPrefix: string,
): PostFilter {
  const { catalog } = ctx;
  const issues: Issue[] = [];
  const lRef = refs.next('L');
  const { chosen, issue } = chooseInductor(lRef, catalog, POST_FILTER_H, iMax, 0, forced(ctx, lRef));
  if (issue) issues.push(issue);
  const cap = outputBank(ctx, refs.next('C'), capF, vOut, 0, Infinity);
  if (cap.issue) issues.push(cap.issue);
  const w = 2 * Math.PI * fsw;
  const xc = 1 / (w * cap.effectiveF);
  const xl = w * chosen.henries;
  const attenuation = trace.add(
    `${idPrefix}.postfilter`,
    'Post-filter attenuation at the switching frequency',
    '|H| = √(ESR² + Xc²) / √(ESR² + (XL − Xc)²), Xc = 1/(2π·fsw·C), XL = 2π·fsw·L',
    {
      L: [chosen.henries, 'H'],
      C: [cap.effectiveF, 'F'],
      ESR: [cap.esrOhm, 'Ω'],
      fsw: [fsw, 'Hz'],
    },
    Math.sqrt(cap.esrOhm ** 2 + xc * xc) / Math.sqrt(cap.esrOhm ** 2 + (xl - xc) ** 2),
    '',
  );
  issues.push(
    info(
      'post-filter',
      `An LC post-filter (${lRef}, ${cap.part.ref}) attenuates the switching ripple by ${(20 * Math.log10(1 / attenuation)).toFixed(0)} dB for this quiet rail.`,
    ),
  );
  return {
    parts: [chosen.part, cap.part],
    inductorRef: lRef,
    capRef: cap.part.ref,
    dcrOhm: chosen.dcrOhm,
    esrOhm: cap.esrOhm,
    attenuation,
    issues,
  };
}

/** The band the rail's output must hold. */
export function railBand(spec: Context['spec']): { lo: number; hi: number } {
  return { lo: spec.output.v * (1 - spec.output.tolerance), hi: spec.output.v * (1 + spec.output.tolerance) };
}

/** What a converter stage hands to the design around it, whatever its kind. */
export interface ConverterStage {
  stage: SwitcherClass;
  fsw: number;
  vOut: number;
  post: PostFilter | null;
  parts: DesignPart[];
  issues: Issue[];
  fixes: Fix[];
  rippleVpp: number;
  output: ToleranceModel;
  assumptions: Record<string, Quantity>;
  /** Whether it regulates, its input power and its parts' stresses at one input and load. */
  operate(vIn: number, iOut: number): OperatingPoint;
  faultStress(vIn: number): Record<string, PartStress>;
}

/** A converter alone as a design option; its label gains the post-filter when one follows. */
export function converterDesign(
  topology: Design['topology'],
  label: string,
  b: ConverterStage,
  trace: Trace,
  fault: OperatingPoint,
): Design {
  return {
    topology,
    label: `${label}${b.post ? ' with post-filter' : ''}`,
    parts: b.parts,
    issues: b.issues,
    fixes: b.fixes,
    trace,
    operate: b.operate,
    fault,
    output: b.output,
    rippleVpp: b.rippleVpp,
    assumptions: b.assumptions,
  };
}

/** Catalog classes of a converter kind. */
export function classesOf(catalog: Catalog, converter: SwitcherClass['converter']): SwitcherClass[] {
  return catalog.switchers.filter((s) => s.converter === converter);
}

/** Fewest blockers first, then parts cost plus LOSS_CENTS_PER_W per watt lost at the nominal corner. */
function searchKey(s: SizingBase): number[] {
  return [s.findings.length + (s.missesBand ? 1 : 0), s.costCents + LOSS_CENTS_PER_W * s.nominalLossW];
}

/** What sizing one class at one frequency yields, common to every converter. */
export interface SizingBase {
  stage: SwitcherClass;
  rds25: number;
  tjC: number;
  fsw: number;
  lWanted: number;
  inductor: ChosenInductor;
  cout: ChosenCapacitor;
  cin: ChosenCapacitor;
  findings: Finding[];
  /** Parts cost; once the search has priced the feedback, its resistor grade's premium too. */
  costCents: number;
  /** Loss at the nominal corner, W. */
  nominalLossW: number;
  /** Once priced: no resistor grade holds the band beside this candidate's own ripple (a blocker the search counts). */
  missesBand?: boolean;
}

/** What the search knows of a class before sizing it. */
export interface ClassScreen {
  /** Whether its derated voltage ratings take the rail. */
  fits(stage: SwitcherClass): boolean;
  /** Findings it has at every frequency (its ratings and ranges against the rail): the least any of its candidates has. */
  fixedFindings(stage: SwitcherClass): number;
}

/**
 * Every class of the converter kind at every frequency it allows: the candidate with the fewest
 * blockers (a class whose feedback cannot hold the band counts one more), then the lowest parts
 * cost plus LOSS_CENTS_PER_W per watt lost; ties keep the first. Classes are tried cheapest
 * first; a class is not sized when its fixed findings and its own price already lose to the best
 * so far (no candidate has fewer findings, none costs less than the class, losses are never negative).
 */
export function searchClasses<T extends SizingBase>(
  ctx: Context,
  converter: SwitcherClass['converter'],
  size: (stage: SwitcherClass, fsw: number) => T,
  screen: ClassScreen,
  penalty: (stage: SwitcherClass) => number = () => 0,
  settle: (raw: T, stage: SwitcherClass, fsw: number) => T = (raw) => raw,
): T {
  let best: T | null = null;
  let bestKey = [Infinity, Infinity];
  // Classes whose voltage ratings already fail are sized only when no class passes them.
  const all = classesOf(ctx.catalog, converter);
  const rated = all.filter((stage) => screen.fits(stage));
  const pool = (rated.length > 0 ? rated : all).slice().sort((a, b) => a.costCents - b.costCents);
  const better = (key: number[]) => key[0]! < bestKey[0]! || (key[0] === bestKey[0] && key[1]! < bestKey[1]!);
  // Classes where only the frequency stood in the way: too low for the capacitors, too high for the heat.
  const retry: SwitcherClass[] = [];
  const consider = (stage: SwitcherClass, fsw: number, extra: { value: number | null }): T => {
    const raw = size(stage, fsw);
    // What settling adds (the feedback grade, a tighter capacitor) never undercuts the raw sizing's figure.
    if (!better(searchKey(raw))) return raw;
    const s = settle(raw, stage, fsw);
    const key = searchKey(s);
    if (!better(key)) return s;
    extra.value ??= penalty(stage);
    key[0] = key[0]! + extra.value;
    if (better(key)) {
      best = s;
      bestKey = key;
    }
    return s;
  };
  for (const stage of pool) {
    if (bestKey[0] === 0 && stage.costCents >= bestKey[1]!) break;
    if (best !== null && !better([screen.fixedFindings(stage), stage.costCents])) continue;
    // The feedback check is worked out only for a candidate that would otherwise win.
    const extra = { value: null as number | null };
    let frequencyBound = true;
    for (const fsw of fswCandidates(ctx, stage)) {
      const s = consider(stage, fsw, extra);
      frequencyBound &&= s.findings.length > 0 && s.findings.every((f) => FREQUENCY_BOUND.has(f.issue.code));
    }
    if (frequencyBound) retry.push(stage);
  }
  // No clean design on the coarse steps: a window between two of them may still hold one.
  if (bestKey[0]! > 0 && ctx.spec.overrides.fswHz === undefined) {
    for (const stage of retry) {
      const extra = { value: null as number | null };
      for (const fsw of fswBetween(fswCandidates(ctx, stage))) consider(stage, fsw, extra);
    }
  }
  return best!;
}

/** Findings a different switching frequency can clear: capacitor size, heat, on- and off-times, duty, ripple current. */
const FREQUENCY_BOUND = new Set(['capacitor', 'thermal', 'min-on-time', 'duty', 'headroom', 'load-step', 'current']);

/** Geometric midpoints of neighbouring frequencies, rounded to two figures like the steps. */
export function fswBetween(steps: readonly number[]): number[] {
  const out: number[] = [];
  for (let k = 1; k < steps.length; k += 1) {
    const f = Number(Math.sqrt(steps[k - 1]! * steps[k]!).toPrecision(2));
    if (!steps.includes(f) && !out.includes(f)) out.push(f);
  }
  return out;
}

/**
 * Whether an LC post-filter follows a stage whose own ripple is `estimate` (a quiet rail, or ripple
 * past the budget), and what its feedback must then hold: half the ripple clear of the band's edges.
 */
export function stageFeedback(ctx: Context, req: StageRequest, fsw: number, estimate: number): { filtered: boolean; need: FeedbackNeed } {
  const filtered = req.allowPostFilter && (quietRail(ctx) || estimate > RIPPLE_BUDGET * req.rippleLimit(fsw));
  return { filtered, need: feedbackNeed(ctx, req)(filtered, filtered ? 0 : estimate / 2) };
}

/**
 * The cheapest resistor grade that holds the band with no ripple, and the ripple (peak to peak) it
 * leaves room for: twice the distance from its output range to the nearer edge of the band.
 */
function rippleRoom(ctx: Context, stage: SwitcherClass, need: FeedbackNeed): { cents: number; rippleV: number } | null {
  const pick = feedbackSearch(ctx, stage, { ...need, marginV: 0 }, {});
  if (pick.verdict === 'fails') return null;
  const room = (r: { min: number; max: number }) => Math.min(r.min - need.band.lo, need.band.hi - r.max);
  const rule = need.rule ?? ctx.spec.overrides.toleranceRule ?? 'statistical';
  const margin = Math.max(room(pick.summary.worstCase), rule === 'statistical' ? room(pick.summary.statistical) : -Infinity);
  return { cents: pick.extraCents, rippleV: 2 * margin };
}

/**
 * The class search for a stage request: each candidate sized for the ripple its frequency allows,
 * its feedback checked against the band. The output capacitor and the feedback grade share the
 * band (ripple uses up what the resistors need), so each candidate is priced with the grade its
 * ripple leaves, and also sized for the ripple the cheapest grade leaves room for; the cheaper stays.
 */
export function searchStage<T extends SizingBase>(
  ctx: Context,
  req: StageRequest,
  converter: SwitcherClass['converter'],
  size: (stage: SwitcherClass, fsw: number, rippleLimit: number) => T,
  screen: ClassScreen,
  estimateOf: (s: T) => number,
): T {
  const need = feedbackNeed(ctx, req)(req.allowPostFilter && quietRail(ctx), 0);
  const limitAt = (fsw: number) => stageRippleLimit(ctx, req.rippleLimit(fsw), req.allowPostFilter, req.vTarget);
  const priced = (s: T): T => {
    const grade = feedbackSearch(ctx, s.stage, stageFeedback(ctx, req, s.fsw, estimateOf(s)).need, {});
    return { ...s, costCents: s.costCents + grade.extraCents, missesBand: grade.verdict === 'fails' };
  };
  const settle = (raw: T, stage: SwitcherClass, fsw: number): T => {
    const first = priced(raw);
    const bare = stageFeedback(ctx, req, fsw, 0);
    if (bare.filtered) return first;
    const room = rippleRoom(ctx, stage, bare.need);
    if (room === null || room.cents >= first.costCents - raw.costCents || room.rippleV <= 0) return first;
    // The sizing designs its ripple to RIPPLE_BUDGET of the limit it is given.
    const limit = room.rippleV / RIPPLE_BUDGET;
    if (limit >= limitAt(fsw)) return first;
    const second = priced(size(stage, fsw, limit));
    const [a, b] = [searchKey(second), searchKey(first)];
    return a[0]! < b[0]! || (a[0] === b[0] && a[1]! < b[1]!) ? second : first;
  };
  return searchClasses(
    ctx,
    converter,
    (stage, fsw) => size(stage, fsw, limitAt(fsw)),
    screen,
    (stage) => feedbackPenalty(ctx, stage, need),
    settle,
  );
}

/** The chosen candidate's blockers, fixes and capacitor cautions, and why it was chosen. */
export function sizingIssues(s: SizingBase): { issues: Issue[]; fixes: Fix[] } {
  const issues = s.findings.map((f) => f.issue);
  for (const c of [s.cout, s.cin]) if (c.issue && c.issue.severity !== 'blocker') issues.push(c.issue);
  issues.push(
    info(
      'switcher-class',
      `${classPhrase(s.stage.label, true)}, at ${(s.fsw / 1e3).toFixed(0)} kHz: the cheapest class and frequency meeting the requirements (parts plus ${LOSS_CENTS_PER_W} ¢ per watt lost). Figures ${s.stage.source}.`,
    ),
  );
  return { issues, fixes: s.findings.flatMap((f) => (f.fix ? [f.fix] : [])) };
}

/** Capacitor blockers join the findings; cautions stay with the capacitor. */
export function capacitorFindings(...caps: ChosenCapacitor[]): Finding[] {
  return caps.flatMap((c) => (c.issue && c.issue.severity === 'blocker' ? [{ issue: c.issue, fix: null }] : []));
}
