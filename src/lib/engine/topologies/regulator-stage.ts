// A three-terminal linear regulator stage (class, reference grade, divider pair and resistor
// grade searched for the cheapest that meets the rail; capacitors and protection diodes), shared
// by the plain linear option, the pre-drop option and the switcher + linear post-regulator.
import type { LinearRegulatorClass } from '../catalog.ts';
import type { Context } from '../context.ts';
import { forced } from '../context.ts';
import { chooseCapacitor } from '../capacitors.ts';
import {
  Refs,
  blocker,
  caution,
  info,
  makePart,
  resistorCents,
  resistorPart,
  type DesignPart,
  type Fix,
  type PartStress,
} from '../design.ts';
import { snap } from '../eseries.ts';
import { RESISTOR_POWER_W, ratingFor } from '../ratings.ts';
import { junctionTemperature } from '../thermal.ts';
import {
  analyseTolerance,
  temperatureSwingK,
  toleranceVerdict,
  type ToleranceModel,
  type ToleranceParam,
  type ToleranceSummary,
} from '../tolerance.ts';
import type { Trace } from '../trace.ts';
import type { Issue, Quantity } from '../types.ts';
import { classPhrase, formatSi } from '../units.ts';
import { dividerOutputModel, searchDivider, type DividerDesign } from './feedback.ts';
import { LOSS_CENTS_PER_W } from './switcher.ts';
import { MAINS_RIPPLE_HZ, NOISE_BAND_HZ, NOISE_CREST_FACTOR, outputNoiseRms, rippleRejectionDb } from './regulator-noise.ts';

/** A divider current of about 100 µA keeps the feedback-pin bias error small (common practice). */
export const DIVIDER_MIN_A = 100e-6;
/** The divider carries at least this multiple of the worst feedback-pin current (its error then stays near 0.1 %). */
const DIVIDER_BIAS_RATIO = 1000;
/** On a light load the divider takes no more than this share of the load current (battery practice). */
const DIVIDER_LOAD_SHARE = 0.05;
/**
 * A divider that would dissipate more than this carrying the class's whole minimum load is a
 * high-voltage divider, sized by its power and the adjust-pin error instead (common practice: a
 * quarter-watt is what a divider of ordinary resistors carries without a power rating of its own).
 */
export const DIVIDER_POWER_W = 0.25;
/** Share of the output band the adjust-pin current's spread may take in a high-voltage divider (common practice: error budget). */
export const ADJUST_ERROR_SHARE = 0.25;
/** The divider's current is searched up to this multiple of its minimum (more would only waste power). */
const DIVIDER_SPAN = 1.5;
/** A regulator is loaded to at most 90 % of its rated current, leaving room for the current limit's spread (common practice). */
export const CURRENT_DERATING = 0.9;

/** Above about 25 V out, or with large output capacitance, a diode protects the regulator when the input is shorted (common practice). */
const PROTECTION_DIODE_V = 25;

export interface StageInput {
  vTrough: number;
  vMax: number;
  rippleVpp: number;
  /** True when the ripple is at switching frequency, where rejection is much lower. */
  rippleIsHf: boolean;
  /** Ripple frequency, when known: the rejection is then read off the class's roll-off. */
  rippleHz?: number;
  /** The input rides on the output (a floating pre-drop stage): headroom does not grow with the output's spread. */
  tracksOutput?: boolean;
}

export interface ClassCheck {
  cls: LinearRegulatorClass;
  failures: Issue[];
}

function isFixedMatch(cls: LinearRegulatorClass, vOut: number): boolean {
  return cls.kind === 'fixed' && Math.abs(cls.vRefV - vOut) <= 0.005 * vOut;
}

/** Dropout at this pass current: a resistive (PMOS/PNP) pass device scales it from the rated figure down to its floor; others hold it. */
export function dropoutAt(cls: LinearRegulatorClass, iPass: number): number {
  const scaling = cls.dropoutWithLoad;
  if (!scaling) return cls.dropoutV;
  return Math.min(cls.dropoutV, Math.max(scaling.floorV, (cls.dropoutV * iPass) / cls.iOutMaxA));
}

/**
 * Least divider current for an output of vOut: enough to swamp the feedback-pin current, never
 * much of a light load, and the class's minimum load, so the regulator holds its output with the
 * load disconnected (common practice). Where carrying that minimum load would dissipate more than
 * DIVIDER_POWER_W (a high-voltage output), the rail's own least load counts towards it and the
 * divider carries only the rest, but enough that the adjust pin's current spread moves the output
 * by no more than ADJUST_ERROR_SHARE of the band: with Vout ≈ Vref·R2/R1 + Iadj·R2 and R2 ≈ Vout/I,
 * a spread ΔIadj moves it by ±(ΔIadj/2)/I of itself (the adjust-pin term of the regulator's
 * output equation, as in the classic adjustable regulator's application notes — from memory).
 * A floating stage (a pre-drop's) keeps the whole minimum load in its divider: its standoff
 * Zener's feed also flows into the output and must be absorbed there.
 */
export function dividerCurrent(ctx: Context, cls: LinearRegulatorClass, vOut: number, iLoadMax: number, floating = false): number {
  const bias = Math.min(DIVIDER_MIN_A, DIVIDER_BIAS_RATIO * cls.iAdjMaxA, Math.max(1e-6, DIVIDER_LOAD_SHARE * iLoadMax));
  if (floating || vOut * cls.minLoadA <= DIVIDER_POWER_W) return Math.max(cls.minLoadA, bias);
  const { iMin, tolerance } = ctx.spec.output;
  const adjust = cls.iAdjMaxA / (2 * ADJUST_ERROR_SHARE * Math.max(tolerance, 1e-6));
  return Math.max(bias, cls.minLoadA - iMin, adjust);
}

/**
 * Blockers a class would meet on this rail (empty when it fits). Headroom is checked at vOutHigh,
 * the highest output the design's tolerance allows (the nominal output when not yet known).
 */
export function checkClass(
  ctx: Context,
  cls: LinearRegulatorClass,
  input: StageInput,
  vOut: number,
  iMax: number,
  vOutHigh = vOut,
): Issue[] {
  const out: Issue[] = [];
  const iDiv = cls.kind === 'fixed' ? 0 : dividerCurrent(ctx, cls, vOut, iMax, input.tracksOutput);
  if (iMax + iDiv > CURRENT_DERATING * cls.iOutMaxA) {
    out.push(
      blocker(
        'current',
        `${classPhrase(cls.label, true)} delivers at most ${cls.iOutMaxA} A; the load and divider need ${formatSi(iMax + iDiv, 'A', 3)}, more than the ${CURRENT_DERATING * 100} % of rating used in practice.`,
      ),
    );
  }
  const dropout = dropoutAt(cls, iMax + iDiv);
  if (input.vTrough < vOutHigh + dropout) {
    out.push(
      blocker(
        'headroom',
        `${classPhrase(cls.label, true)} needs ${formatSi(dropout, 'V', 3)} of headroom at ${formatSi(iMax + iDiv, 'A', 3)} above its highest output ${vOutHigh.toFixed(3)} V, so at least ${(vOutHigh + dropout).toFixed(2)} V in; the input trough is ${input.vTrough.toFixed(2)} V.`,
      ),
    );
  }
  if (cls.vDiffMaxV !== null && input.vMax - vOut > cls.vDiffMaxV) {
    out.push(
      blocker(
        'differential',
        `The input-output differential reaches ${(input.vMax - vOut).toFixed(1)} V; ${classPhrase(cls.label)} allows ${cls.vDiffMaxV} V.`,
      ),
    );
  } else if (cls.vDiffMaxV !== null && !input.tracksOutput && input.vMax > cls.vDiffMaxV) {
    // A three-terminal regulator's differential is an absolute limit: a shorted output, or a
    // discharged output capacitor at switch-on, puts the whole input across it (common practice).
    out.push(
      blocker(
        'differential-short',
        `With the output shorted, or while a discharged output capacitor charges at switch-on, the whole ${formatSi(input.vMax, 'V', 3)} input stands across ${classPhrase(cls.label)}, which allows ${cls.vDiffMaxV} V: a pre-drop stage must take the rest.`,
      ),
    );
  }
  if (cls.vInMaxV !== null && input.vMax > cls.vInMaxV) {
    out.push(blocker('input-max', `The input reaches ${input.vMax} V; ${classPhrase(cls.label)} allows ${cls.vInMaxV} V.`));
  }
  if (cls.kind !== 'fixed' && vOut < cls.vRefV) {
    out.push(blocker('below-reference', `${classPhrase(cls.label, true)} cannot regulate below its ${cls.vRefV} V reference.`));
  }
  if (!cls.heatsinkable) {
    const p = (input.vMax - vOut) * (iMax + Math.max(cls.minLoadA, iDiv)) + input.vMax * cls.iqA;
    const tj = junctionTemperature(ctx.ambientC, p, [cls.thetaJaCW * ctx.catalog.thermal.airflowFactor[ctx.spec.thermal.airflow]]);
    if (tj > cls.tjMaxC - ctx.catalog.thermal.tjMarginK) {
      out.push(
        blocker(
          'thermal',
          `${classPhrase(cls.label, true)} cannot take a heatsink and would pass its ${cls.tjMaxC - ctx.catalog.thermal.tjMarginK} °C design limit at ${p.toFixed(2)} W.`,
        ),
      );
    }
  }
  return out;
}

/** Classes that may set this output: adjustable ones, and fixed ones of this voltage. */
function eligible(ctx: Context, vOut: number): LinearRegulatorClass[] {
  return ctx.catalog.linearRegulators.filter((c) => c.kind !== 'fixed' || isFixedMatch(c, vOut));
}

/**
 * Quick class choice without the tolerance search (for callers that only need a class to size
 * around): the cheapest class that fits, otherwise the one with the fewest blockers.
 */
export function chooseRegulatorClass(
  ctx: Context,
  input: StageInput,
  vOut: number,
  iMax: number,
  forcedId: string | undefined,
): ClassCheck {
  const all = ctx.catalog.linearRegulators;
  const wanted = forcedId === undefined ? undefined : all.find((c) => c.id === forcedId);
  if (wanted) return { cls: wanted, failures: checkClass(ctx, wanted, input, vOut, iMax) };
  let best: ClassCheck | null = null;
  for (const cls of eligible(ctx, vOut)
    .slice()
    .sort((a, b) => a.costCents - b.costCents)) {
    const failures = checkClass(ctx, cls, input, vOut, iMax);
    if (failures.length === 0) return { cls, failures };
    if (best === null || failures.length < best.failures.length) best = { cls, failures };
  }
  return best ?? { cls: all[0]!, failures: [blocker('no-class', 'The catalog has no linear regulator class.')] };
}

/** One class with its searched reference grade, divider and resistor grade. */
interface ClassDesign {
  cls: LinearRegulatorClass;
  failures: Issue[];
  divider: DividerDesign | null;
  refTolerance: number;
  output: ToleranceModel;
  summary: ToleranceSummary;
  verdict: 'worst-case' | 'statistical' | 'fails';
  psrrDb: number;
  bypass: boolean;
  /** Dropout at the highest pass current. */
  dropoutV: number;
  rippleOutVpp: number;
  /** The ripple let through exceeds the rail's limit: the class's rejection falls short. */
  rippleFails: boolean;
  /** Class price plus the grades' extra cost. */
  costCents: number;
  extraCents: number;
  /** What the stage draws besides the load: divider, adjust-pin and quiescent current. */
  standingA: number;
  /** Parts plus LOSS_CENTS_PER_W per watt of standing loss at the highest input: what classes are ranked on. */
  rankCents: number;
  /**
   * The stage's own draw outweighs its load: on a battery more than DIVIDER_LOAD_SHARE of the
   * typical load, elsewhere more than the typical load itself.
   */
  outweighsLoad: boolean;
}

function regulationSpread(cls: LinearRegulatorClass, input: StageInput, iMin: number, iMax: number): ToleranceParam[] {
  const line = (cls.lineRegulationPerV * Math.max(0, input.vMax - input.vTrough)) / 2;
  const load = (cls.loadRegulation * Math.min(1, Math.max(0, iMax - iMin) / cls.iOutMaxA)) / 2;
  return [
    { name: 'Line regulation', nominal: 1, lo: 1 - line, hi: 1 + line },
    { name: 'Load regulation', nominal: 1, lo: 1 - load, hi: 1 + load },
  ];
}

function designClass(
  ctx: Context,
  cls: LinearRegulatorClass,
  input: StageInput,
  vTarget: number,
  iMax: number,
  forcedR: { r1?: number; r2?: number },
): ClassDesign {
  const { spec } = ctx;
  const band = { lo: spec.output.v * (1 - spec.output.tolerance), hi: spec.output.v * (1 + spec.output.tolerance) };
  const rule = spec.overrides.toleranceRule ?? 'statistical';
  const quiet = spec.noise.class === 'precision' || spec.noise.class === 'rf';
  // The adjust-pin bypass also keeps the reference's noise from being multiplied by Vout/Vref.
  const noisy = NOISE_CREST_FACTOR * outputNoiseRms(cls, vTarget, false) > spec.noise.maxRippleVpp;
  const bypass = cls.kind === 'adjustable' && (input.rippleVpp > 0 || quiet || noisy);
  const psrrDb =
    input.rippleHz !== undefined
      ? rippleRejectionDb(cls, input.rippleHz, bypass)
      : input.rippleIsHf
        ? cls.psrrHfDb
        : bypass
          ? cls.psrrBypassDb
          : cls.psrrDb;
  const rippleOutVpp = input.rippleVpp * 10 ** (-psrrDb / 20);
  const tempSwingK = temperatureSwingK(ctx.ambientC);
  const extra = regulationSpread(cls, input, spec.output.iMin, iMax);
  const refGrades = [{ tolerance: cls.vRefTolerance, extraCents: 0 }, ...cls.refGrades];
  let divider: DividerDesign | null = null;
  let output: ToleranceModel;
  let summary: ToleranceSummary;
  let verdict: ClassDesign['verdict'];
  let refTolerance = cls.vRefTolerance;
  let extraCents = 0;
  if (cls.kind === 'fixed') {
    // A preset output is a divider with R2 = 0: only the reference grade is chosen.
    let chosen: { output: ToleranceModel; summary: ToleranceSummary; verdict: ClassDesign['verdict']; tol: number; cents: number } | null =
      null;
    for (const g of refGrades) {
      const model = dividerOutputModel(
        cls.vRefV,
        { r1: 1, r2: 0, vOut: cls.vRefV, iDivider: 0 },
        {
          vRefTolerance: g.tolerance,
          vRefDrift: cls.vRefDriftPpmK * 1e-6 * tempSwingK,
          resistor: 0,
          iAdjMin: 0,
          iAdjMax: 0,
          iAdjTyp: 0,
          extra,
        },
      );
      const s = analyseTolerance(model);
      const v = toleranceVerdict(s, band, rule, rippleOutVpp / 2);
      chosen = { output: model, summary: s, verdict: v, tol: g.tolerance, cents: g.extraCents };
      if (v !== 'fails') break;
    }
    output = chosen!.output;
    summary = chosen!.summary;
    verdict = chosen!.verdict;
    refTolerance = chosen!.tol;
    extraCents = chosen!.cents;
  } else {
    const iDivMin = dividerCurrent(ctx, cls, vTarget, iMax, input.tracksOutput);
    const series = spec.overrides.resistorSeries;
    const search = searchDivider({
      vTarget,
      vRef: cls.vRefV,
      refGrades,
      vRefDriftPpmK: cls.vRefDriftPpmK,
      iAdjTyp: cls.iAdjTypA,
      iAdjMin: 0,
      iAdjMax: cls.iAdjMaxA,
      iDividerMin: iDivMin,
      iDividerMax: DIVIDER_SPAN * iDivMin,
      band,
      rule,
      tempSwingK,
      extra,
      grades: ctx.catalog.resistorGrades,
      marginV: rippleOutVpp / 2,
      ...(forcedR.r1 !== undefined ? { r1Forced: forcedR.r1 } : {}),
      ...(forcedR.r2 !== undefined ? { r2Forced: forcedR.r2 } : {}),
      ...(series !== undefined ? { series } : {}),
    });
    divider = search.pick;
    output = divider.model;
    summary = divider.summary;
    verdict = divider.verdict;
    refTolerance = divider.refTolerance;
    extraCents = divider.extraCents;
  }
  const vOutHigh = input.tracksOutput ? vTarget : summary.worstCase.max + rippleOutVpp / 2;
  const failures = checkClass(ctx, cls, input, vTarget, iMax, vOutHigh);
  const dropoutV = dropoutAt(cls, iMax + (divider?.iDivider ?? 0));
  const costCents = cls.costCents + extraCents + fittingCents(ctx, divider !== null, bypass, vTarget - cls.vRefV);
  const standingA = (divider?.iDivider ?? 0) + (divider ? cls.iAdjTypA : 0) + cls.iqA;
  return {
    cls,
    failures,
    divider,
    refTolerance,
    output,
    summary,
    verdict,
    psrrDb,
    bypass,
    dropoutV,
    rippleOutVpp,
    rippleFails: rippleOutVpp > spec.noise.maxRippleVpp,
    costCents,
    extraCents,
    standingA,
    rankCents: costCents + LOSS_CENTS_PER_W * input.vMax * standingA,
    outweighsLoad: standingA > (spec.input.source === 'battery' ? DIVIDER_LOAD_SHARE : 1) * spec.output.iTyp,
  };
}

/**
 * What a class brings with it beyond its own price, so classes compare on the parts they need:
 * the divider's two resistors and the adjust-pin bypass capacitor.
 */
function fittingCents(ctx: Context, hasDivider: boolean, bypass: boolean, vAcrossBypass: number): number {
  const resistor = ctx.catalog.costs.resistorCentsByW[0]?.cents ?? 0;
  const cap = bypass ? chooseCapacitor('C', 'bypass-capacitor', 10e-6, Math.max(0, vAcrossBypass), ctx.catalog).part.costCents : 0;
  return (hasDivider ? 2 * resistor : 0) + cap;
}

const kindRank = (c: LinearRegulatorClass) => (c.kind === 'fixed' ? 0 : c.kind === 'adjustable' ? 1 : 2);
// The ripple limit is a blocker the assembly raises on the finished design; the search counts it here so it picks a class whose rejection meets it.
const blockerCount = (d: ClassDesign) => d.failures.length + (d.verdict === 'fails' ? 1 : 0) + (d.rippleFails ? 1 : 0);

/**
 * The cheapest class design with no blocker, its standing loss priced in, and first one whose own
 * draw does not outweigh its load (a regulator's quiescent current is kept small beside its load,
 * common practice); otherwise the one with the fewest blockers, cheapest first.
 */
function pickDesign(designs: ClassDesign[]): ClassDesign {
  return designs
    .map((d, index) => ({ d, index }))
    .sort(
      (a, b) =>
        blockerCount(a.d) - blockerCount(b.d) ||
        Number(a.d.outweighsLoad) - Number(b.d.outweighsLoad) ||
        // Among stages that all outweigh their load, the one that draws least wastes least.
        (a.d.outweighsLoad ? a.d.standingA - b.d.standingA : 0) ||
        a.d.rankCents - b.d.rankCents ||
        kindRank(a.d.cls) - kindRank(b.d.cls) ||
        a.d.cls.iOutMaxA - b.d.cls.iOutMaxA ||
        a.index - b.index,
    )[0]!.d;
}

const pct = (x: number) => `±${Number((x * 100).toPrecision(2))} %`;

/** Highest output plus dropout: the input trough a design needs. */
const inputNeeded = (d: ClassDesign) => d.summary.worstCase.max + d.rippleOutVpp / 2 + d.dropoutV;

/**
 * An RC low-pass ahead of the regulator for the ripple its rejection leaves over: R as large as the
 * spare headroom allows at full load, C for the rest, |H| = 1/√(1 + (2π·f·R·C)²) (first-order
 * low-pass). Sized at the lowest frequency the ripple may have, where it attenuates least.
 * Null when there is no headroom to spare or the catalog has no such capacitor.
 */
function inputFilterFix(ctx: Context, chosen: ClassDesign, input: StageInput, iMax: number): Fix | null {
  const k = chosen.rippleOutVpp / ctx.spec.noise.maxRippleVpp;
  const iIn = iMax + (chosen.divider?.iDivider ?? 0) + chosen.cls.iqA;
  const spare = input.vTrough - inputNeeded(chosen);
  if (!(k > 1) || !(spare > 0) || !(iIn > 0)) return null;
  const fHz = input.rippleHz !== undefined && input.rippleHz > MAINS_RIPPLE_HZ.hi ? input.rippleHz : MAINS_RIPPLE_HZ.lo;
  const rOhm = snap(spare / iIn, 'E24', 'down');
  if (!(rOhm > 0) || rOhm * iIn > spare) return null;
  const cF = Math.sqrt(k * k - 1) / (2 * Math.PI * fHz * rOhm);
  const cap = chooseCapacitor('C', 'input-capacitor', cF, input.vMax, ctx.catalog);
  const rW = ratingFor(RESISTOR_POWER_W, iIn * iIn * rOhm);
  if (cap.issue?.severity === 'blocker' || rW === null) return null;
  return {
    code: 'ripple',
    change: `input RC filter ${formatSi(rOhm, 'Ω', 2)} + ${formatSi(cap.farads, 'F', 2)}`,
    costCents: cap.part.costCents + resistorCents(ctx.catalog, rW),
    message: `${classPhrase(chosen.cls.label, true)} rejects ${chosen.psrrDb.toFixed(0)} dB of the input ripple, leaving ${formatSi(chosen.rippleOutVpp, 'V', 2)} p-p against the ${formatSi(ctx.spec.noise.maxRippleVpp, 'V', 2)} limit. A ${formatSi(rOhm, 'Ω', 2)} resistor (${rW} W, dropping ${formatSi(rOhm * iIn, 'V', 2)} at full load) and ${formatSi(cap.farads, 'F', 2)} ahead of it take a further ${(20 * Math.log10(k)).toFixed(0)} dB off the ${fHz} Hz ripple.`,
  };
}

/** What would clear each blocker of the chosen design, from the other designs searched. */
function fixesFor(ctx: Context, chosen: ClassDesign, all: ClassDesign[], input: StageInput, iMax: number): Fix[] {
  const fixes: Fix[] = [];
  const clean = all.filter((d) => blockerCount(d) === 0);
  if (chosen.rippleFails && clean.length === 0) {
    const filter = inputFilterFix(ctx, chosen, input, iMax);
    if (filter) fixes.push(filter);
  }
  if (chosen.failures.some((f) => f.code === 'headroom')) {
    // The class needing the least input among those whose only trouble is headroom.
    const onlyHeadroom = all.filter((d) => d.verdict !== 'fails' && d.failures.every((f) => f.code === 'headroom'));
    const best = onlyHeadroom.sort((a, b) => inputNeeded(a) - inputNeeded(b))[0] ?? chosen;
    const need = inputNeeded(best);
    fixes.push({
      code: 'headroom',
      change: `input trough at least ${need.toFixed(2)} V`,
      costCents: best.costCents - chosen.costCents,
      message: `Needs ≥ ${need.toFixed(2)} V input at the trough with ${classPhrase(best.cls.label)} (highest output ${(need - best.dropoutV).toFixed(3)} V + ${formatSi(best.dropoutV, 'V', 3)} dropout at full load); the trough is ${input.vTrough.toFixed(2)} V.`,
    });
  }
  if (chosen.verdict === 'fails') {
    const rule = ctx.spec.overrides.toleranceRule ?? 'statistical';
    const reach = (d: ClassDesign) => {
      const r = rule === 'statistical' ? d.summary.statistical : d.summary.worstCase;
      return Math.max(ctx.spec.output.v - r.min, r.max - ctx.spec.output.v) / ctx.spec.output.v;
    };
    const tightest = all.filter((d) => d.failures.length === 0).sort((a, b) => reach(a) - reach(b))[0] ?? chosen;
    const grade = tightest.divider ? ` with ${tightest.divider.grade.label} resistors` : '';
    fixes.push({
      code: 'tolerance',
      change: `tolerance ${pct(Math.ceil(reach(tightest) * 1000) / 1000)}`,
      costCents: tightest.costCents - chosen.costCents,
      message: `The tightest output reachable is ${pct(reach(tightest))} (${classPhrase(tightest.cls.label)}, the ${pct(tightest.refTolerance)} reference${grade}); relax the tolerance to that, or fit a reference outside the catalog.`,
    });
  }
  if (clean.length > 0 && blockerCount(chosen) > 0) {
    const alt = clean.slice().sort((a, b) => a.costCents - b.costCents)[0]!;
    fixes.push({
      code: 'class',
      change: `regulator class ${alt.cls.id}`,
      costCents: alt.costCents - chosen.costCents,
      message: `${classPhrase(alt.cls.label, true)} meets the rail${alt.extraCents > 0 ? ' with its dearer grades' : ''}.`,
    });
  }
  return fixes;
}

export interface RegulatorStage {
  cls: LinearRegulatorClass;
  regRef: string;
  parts: DesignPart[];
  issues: Issue[];
  fixes: Fix[];
  divider: DividerDesign | null;
  vOut: number;
  output: ToleranceModel;
  rippleOutVpp: number;
  assumptions: Record<string, Quantity>;
  /** Current the stage draws from its input at load current iOut. */
  inputCurrent(iOut: number): number;
  stress(vIn: number, iOut: number): Record<string, PartStress>;
  faultStress(vIn: number): Record<string, PartStress>;
}

export function regulatorStage(
  ctx: Context,
  refs: Refs,
  trace: Trace,
  input: StageInput,
  vTarget: number,
  iMax: number,
  forcedClassId: string | undefined,
): RegulatorStage {
  const { spec, catalog } = ctx;
  const regRef = refs.next('U');
  const adjustable = eligible(ctx, vTarget).some((c) => c.kind !== 'fixed');
  const r1Ref = adjustable ? refs.next('R') : '';
  const r2Ref = adjustable ? refs.next('R') : '';
  const forcedR = { r1: spec.overrides.r1Ohm ?? (r1Ref ? forced(ctx, r1Ref) : undefined), r2: r2Ref ? forced(ctx, r2Ref) : undefined };
  const wanted = forcedClassId === undefined ? undefined : catalog.linearRegulators.find((c) => c.id === forcedClassId);
  const pool = wanted ? [wanted] : eligible(ctx, vTarget);
  // Cheapest class first: once a clean design exists, a class whose bare price is no lower than its
  // ranked cost cannot beat it (one whose own draw outweighs its load does not end the search).
  const designs: ClassDesign[] = [];
  let cleanCents = Number.POSITIVE_INFINITY;
  for (const cls of (pool.length > 0 ? pool : catalog.linearRegulators.slice(0, 1)).slice().sort((a, b) => a.costCents - b.costCents)) {
    if (cls.costCents >= cleanCents) continue;
    const d = designClass(
      ctx,
      cls,
      input,
      vTarget,
      iMax,
      cls.kind === 'fixed'
        ? {}
        : { ...(forcedR.r1 !== undefined ? { r1: forcedR.r1 } : {}), ...(forcedR.r2 !== undefined ? { r2: forcedR.r2 } : {}) },
    );
    designs.push(d);
    if (blockerCount(d) === 0 && !d.outweighsLoad) cleanCents = Math.min(cleanCents, d.rankCents);
  }
  const d = pickDesign(designs);
  const cls = d.cls;
  const issues: Issue[] = [...d.failures];
  const fixes = fixesFor(ctx, d, designs, input, iMax);
  if (forcedClassId !== undefined && !wanted) {
    issues.push(
      info('class-unknown', `The catalog has no regulator class "${forcedClassId}"; the engine chose ${classPhrase(cls.label)}.`),
    );
  }
  const refCents = d.extraCents - (d.divider ? 2 * d.divider.grade.extraCents : 0);
  const parts: DesignPart[] = [
    makePart({
      ref: regRef,
      role: 'regulator',
      part: d.refTolerance < cls.vRefTolerance ? `${cls.label}, ${pct(d.refTolerance)} reference grade` : cls.label,
      ratingV: cls.vDiffMaxV ?? cls.vInMaxV,
      tolerance: d.refTolerance,
      costCents: cls.costCents + refCents,
      thermal: {
        thetaJcCW: cls.thetaJcCW,
        thetaJaCW: cls.thetaJaCW,
        tjMaxC: cls.tjMaxC,
        heatsinkable: cls.heatsinkable,
        protectedInFault: true,
      },
    }),
  ];
  const divider = d.divider;
  if (divider) {
    trace.add(
      `${regRef}.idiv`,
      'Divider current (the divider alone carries the minimum load; it swamps the adjust-pin current)',
      'Idiv = Vref / R1',
      { Vref: [cls.vRefV, 'V'], R1: [divider.r1, 'Ω'] },
      divider.iDivider,
      'A',
    );
    trace.add(
      `${regRef}.vout`,
      `Output with the searched pair (${divider.series}, ${divider.grade.label})`,
      'Vout = Vref·(1 + R2/R1) + Iadj·R2',
      { Vref: [cls.vRefV, 'V'], R1: [divider.r1, 'Ω'], R2: [divider.r2, 'Ω'], Iadj: [cls.iAdjTypA, 'A'] },
      divider.vOut,
      'V',
    );
    parts.push(
      resistorPart(r1Ref, 'feedback-lower', divider.r1, divider.grade.tolerance, divider.series, divider.grade.extraCents),
      resistorPart(r2Ref, 'feedback-upper', divider.r2, divider.grade.tolerance, divider.series, divider.grade.extraCents),
    );
    issues.push(info('divider-search', divider.why));
  } else if (r1Ref) {
    issues.push(info('divider-unused', `${classPhrase(cls.label, true)} presets the output; ${r1Ref} and ${r2Ref} are not fitted.`));
  }
  if ((forcedR.r1 !== undefined || forcedR.r2 !== undefined) && !divider) {
    issues.push(
      info('forced-unused', `The forced divider value is not used: ${classPhrase(cls.label)} presets its output and has no divider.`),
    );
  }
  trace.select(
    `${regRef}.sigma`,
    'Output sigma (root-sum-square of the parts’ uniform bands)',
    'σ = √Σ(a_i²/3)',
    Object.fromEntries(d.summary.contributions.map((c) => [c.name, [c.halfSwing, 'V'] as const])),
    d.summary.sigma,
    'V',
  );
  const vOut = divider?.vOut ?? cls.vRefV;
  const iPass = iMax + (divider?.iDivider ?? 0);
  if (cls.dropoutWithLoad) {
    trace.add(
      `${regRef}.dropout`,
      'Dropout at the highest pass current (resistive pass device: it scales with current, down to its floor)',
      'Vdo = min(Vdo,rated, max(Vdo,floor, Vdo,rated·Ipass/Irated))',
      {
        'Vdo,rated': [cls.dropoutV, 'V'],
        'Vdo,floor': [cls.dropoutWithLoad.floorV, 'V'],
        Ipass: [iPass, 'A'],
        Irated: [cls.iOutMaxA, 'A'],
      },
      d.dropoutV,
      'V',
    );
  } else {
    trace.add(
      `${regRef}.dropout`,
      'Dropout (junction-limited pass device: the rated figure at every load)',
      'Vdo = Vdo,rated',
      { 'Vdo,rated': [cls.dropoutV, 'V'] },
      d.dropoutV,
      'V',
    );
  }

  const rippleOutVpp = trace.add(
    `${regRef}.ripple`,
    'Output ripple through the regulator’s ripple rejection',
    'ΔVout = ΔVin · 10^(−PSRR/20)',
    { ΔVin: [input.rippleVpp, 'V'], PSRR: [d.psrrDb, 'dB'] },
    d.rippleOutVpp,
    'V',
  );
  const noiseRms = trace.add(
    `${regRef}.noise`,
    `Output noise over ${NOISE_BAND_HZ.lo} Hz–${NOISE_BAND_HZ.hi / 1e3} kHz`,
    'Vn = en·G·√(fhi − flo)',
    {
      en: [cls.noiseDensityVrtHz, 'V/√Hz'],
      G: [cls.kind === 'fixed' || d.bypass ? 1 : Math.max(1, vOut / cls.vRefV), ''],
      fhi: [NOISE_BAND_HZ.hi, 'Hz'],
      flo: [NOISE_BAND_HZ.lo, 'Hz'],
    },
    outputNoiseRms(cls, vOut, d.bypass),
    'V',
  );
  if (NOISE_CREST_FACTOR * noiseRms + rippleOutVpp > spec.noise.maxRippleVpp) {
    issues.push(
      caution(
        'noise',
        `${regRef}'s own noise is about ${formatSi(noiseRms, 'V', 2)} RMS (${formatSi(NOISE_CREST_FACTOR * noiseRms, 'V', 2)} p-p) over ${NOISE_BAND_HZ.lo} Hz–${NOISE_BAND_HZ.hi / 1e3} kHz, beside the ${formatSi(spec.noise.maxRippleVpp, 'V', 2)} p-p limit; a low-noise class or a filtered reference would lower it.`,
      ),
    );
  }

  const cin = chooseCapacitor(refs.next('C'), 'input-capacitor', 0.1e-6, input.vMax, catalog);
  const coutRef = refs.next('C');
  const coutWanted = forced(ctx, coutRef) ?? Math.max(cls.coutMinF, cls.kind === 'ldo' ? 4.7e-6 : 1e-6);
  const cout = chooseCapacitor(coutRef, 'output-capacitor', coutWanted, vOut, catalog);
  parts.push(cin.part, cout.part);
  for (const c of [cin, cout]) if (c.issue) issues.push(c.issue);
  // Stability: the loop needs its minimum capacitance and, for some classes, ESR inside a window.
  let esrRef = '';
  if (cout.farads < cls.coutMinF) {
    issues.push(
      caution(
        'cout-min',
        `${classPhrase(cls.label, true)} needs at least ${formatSi(cls.coutMinF, 'F', 2)} on its output for stability; the forced ${formatSi(cout.farads, 'F', 2)} is below it.`,
      ),
    );
  }
  if (cls.esrMinOhm > 0 && cout.esrOhm < cls.esrMinOhm) {
    // A resistor in series with a ceramic output capacitor supplies the missing ESR; it carries only the capacitor's AC current.
    esrRef = refs.next('R');
    const esr = snap(Math.sqrt(cls.esrMinOhm * (cls.esrMaxOhm ?? 10 * cls.esrMinOhm)) / 3, 'E24', 'nearest');
    const rEsr = Math.min(Math.max(esr, cls.esrMinOhm * 1.5), cls.esrMaxOhm ?? Number.POSITIVE_INFINITY);
    parts.push(resistorPart(esrRef, 'series-resistor', rEsr, 0.05, 'E24', 0));
    issues.push(
      info(
        'esr-resistor',
        `${classPhrase(cls.label, true)} is stable only with ${cls.esrMinOhm}–${cls.esrMaxOhm ?? '∞'} Ω of output ESR; ${cout.part.ref} has about ${cout.esrOhm.toFixed(3)} Ω, so ${esrRef} (${rEsr} Ω) is placed in series with it. It carries only the capacitor's AC current: its DC loss is nil.`,
      ),
    );
  } else if (cls.esrMaxOhm !== null && cout.esrOhm > cls.esrMaxOhm) {
    issues.push(
      caution(
        'esr-high',
        `${cout.part.ref}'s ESR of about ${cout.esrOhm.toFixed(2)} Ω exceeds the ${cls.esrMaxOhm} Ω that ${classPhrase(cls.label)} stays stable with; use a lower-ESR capacitor.`,
      ),
    );
  }
  let cadjRef = '';
  if (d.bypass) {
    const cadj = chooseCapacitor(refs.next('C'), 'bypass-capacitor', 10e-6, Math.max(0, vOut - cls.vRefV), catalog);
    cadjRef = cadj.part.ref;
    parts.push(cadj.part);
    if (cadj.issue) issues.push(cadj.issue);
  }
  const diodes: string[] = [];
  if (vOut >= PROTECTION_DIODE_V || cout.farads >= 25e-6) {
    const dRef = refs.next('D');
    diodes.push(dRef);
    parts.push(
      makePart({
        ref: dRef,
        role: 'protection-diode',
        part: 'Rectifier diode, output to input',
        ratingV: input.vMax,
        costCents: catalog.costs.protectionDiodeCents,
      }),
    );
    if (d.bypass) {
      const d2 = refs.next('D');
      diodes.push(d2);
      parts.push(
        makePart({
          ref: d2,
          role: 'protection-diode',
          part: 'Rectifier diode, adjust to output',
          ratingV: vOut,
          costCents: catalog.costs.protectionDiodeCents,
        }),
      );
    }
  }

  const iDiv = divider?.iDivider ?? 0;
  const iAdj = cls.kind === 'fixed' ? 0 : cls.iAdjTypA;
  const inputCurrent = (iOut: number) => iOut + iDiv + iAdj + cls.iqA;
  const stress = (vIn: number, iOut: number): Record<string, PartStress> => {
    const s: Record<string, PartStress> = {
      // (Vin − Vout)·(Iout + Idivider) + Vin·Iq
      [regRef]: { w: Math.max(0, vIn - vOut) * (iOut + iDiv + iAdj) + vIn * cls.iqA, v: Math.max(0, vIn - vOut) },
      [cin.part.ref]: { w: 0, v: vIn },
      [cout.part.ref]: { w: 0, v: vOut },
    };
    if (divider) {
      s[r1Ref] = { w: (cls.vRefV * cls.vRefV) / divider.r1, v: cls.vRefV };
      const vr2 = vOut - cls.vRefV;
      s[r2Ref] = { w: (vr2 * vr2) / divider.r2, v: vr2 };
    }
    if (esrRef) s[esrRef] = { w: 0, v: 0 };
    if (cadjRef) s[cadjRef] = { w: 0, v: vOut - cls.vRefV };
    for (const dRef of diodes) s[dRef] = { w: 0, v: vIn };
    return s;
  };
  const faultStress = (vIn: number): Record<string, PartStress> => {
    const s = stress(vIn, 0);
    // Output shorted: the regulator sits at its current limit with the whole input across it.
    s[regRef] = { w: cls.iLimitA * vIn, v: vIn };
    for (const ref of [r1Ref, r2Ref, cadjRef, cout.part.ref]) if (ref && s[ref]) s[ref] = { w: 0, v: 0 };
    return s;
  };

  const assumptions: Record<string, Quantity> = {
    [`${regRef}.vRef`]: { value: cls.vRefV, unit: 'V' },
    [`${regRef}.vRefTolerance`]: { value: d.refTolerance, unit: '' },
    [`${regRef}.iAdj`]: { value: iAdj, unit: 'A' },
    [`${regRef}.iq`]: { value: cls.iqA, unit: 'A' },
    [`${regRef}.dropout`]: { value: d.dropoutV, unit: 'V' },
    [`${regRef}.iLimit`]: { value: cls.iLimitA, unit: 'A' },
  };
  return {
    cls,
    regRef,
    parts,
    issues,
    fixes,
    divider,
    vOut,
    output: d.output,
    rippleOutVpp,
    assumptions,
    inputCurrent,
    stress,
    faultStress,
  };
}
