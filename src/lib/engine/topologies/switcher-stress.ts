// What the buck, boost and buck-boost stages share once a class and frequency are chosen: the
// search and feedback setup, the inductor sized at the cool junction, the common findings, the
// part list's converter and rectifier, the part stresses and the assumptions a netlist reads.
import type { ChosenCapacitor } from '../capacitors.ts';
import type { Catalog, SwitcherClass } from '../catalog.ts';
import type { Context } from '../context.ts';
import { forced } from '../context.ts';
import { makePart, type DesignPart, type Fix, type PartStress, type Refs } from '../design.ts';
import { chooseInductor, coreLossW, inductorDcr, snapInductance, type ChosenInductor } from '../inductors.ts';
import type { Trace } from '../trace.ts';
import type { Issue, Quantity } from '../types.ts';
import {
  finding,
  peakFinding,
  postFilter,
  searchStage,
  stageFeedback,
  sizingIssues,
  switcherFeedback,
  thermalFinding,
  hotStage,
  traceRds,
  traceStep,
  stageRefs,
  type ClassScreen,
  type FeedbackParts,
  type Finding,
  type PostFilter,
  type SizingBase,
  type StageRefs,
  type StageRequest,
} from './switcher.ts';
import { classPhrase } from '../units.ts';

/** Losses of a corner that load the converter IC and the inductor. */
interface CornerLosses {
  switchW: number;
  dcrW: number;
  coreW: number;
}

export interface StageSetup<T extends SizingBase> {
  r: StageRefs;
  s: T;
  fb: FeedbackParts;
  vOut: number;
  filtered: boolean;
  issues: Issue[];
  fixes: Fix[];
}

/**
 * Searches the classes of one converter, then sets the feedback for the output the search allows:
 * an LC post-filter where the rail is quiet or the stage's estimated ripple passes the budget.
 */
export function setupStage<T extends SizingBase>(
  ctx: Context,
  refs: Refs,
  trace: Trace,
  req: StageRequest,
  converter: SwitcherClass['converter'],
  size: (r: StageRefs, stage: SwitcherClass, fsw: number, rippleLimit: number) => T,
  screen: ClassScreen,
  estimateOf: (s: T) => number,
): StageSetup<T> {
  const r = stageRefs(refs);
  const s = searchStage(ctx, req, converter, (stage, fsw, limit) => size(r, stage, fsw, limit), screen, estimateOf);
  const { filtered, need } = stageFeedback(ctx, req, s.fsw, estimateOf(s));
  const fb = switcherFeedback(ctx, r, trace, s.stage, need, req.idPrefix);
  const { issues, fixes } = sizingIssues(s);
  traceRds(trace, `${req.idPrefix}.rds`, s.rds25, s.tjC, s.stage.rdsOnOhm);
  return { r, s, fb, vOut: fb.divider.vOut, filtered, issues, fixes };
}

/**
 * The inductor for lWanted (or the engineer's), with the class's Rds(on) at the junction the
 * cool-start losses give; `cold` returns the corners that size the peak and the heat.
 */
export function sizeInductor(
  ctx: Context,
  r: StageRefs,
  base: SwitcherClass,
  fsw: number,
  lWanted: number,
  cold: (henries: number, dcrOhm: number) => { switchW: number; peakA: number }[],
) {
  const { catalog } = ctx;
  const forcedL = forced(ctx, r.l);
  const lGuess = forcedL ?? snapInductance(catalog, lWanted);
  const corners = cold(lGuess, inductorDcr(catalog, lGuess, base.iSwitchMaxA));
  const { stage, tjC } = hotStage(ctx, base, Math.max(...corners.map((c) => c.switchW)));
  const { chosen: inductor, issue } = chooseInductor(
    r.l,
    catalog,
    lWanted,
    Math.max(...corners.map((c) => c.peakA)),
    base.iSwitchMaxA,
    forcedL,
  );
  const core = (ripple: number) => coreLossW(catalog, inductor.henries, inductor.isatA, ripple, fsw);
  return { stage, tjC, inductor, issue, core };
}

/**
 * A diode-rectified stage's rectifier at its worst-corner conduction loss (Vf·Iout·(1 − D) in a
 * buck, Vf·Iout in a boost) against its design limit: Tj = Ta + P·θJA·kair (JESD51 chain), as the
 * assembly's thermal check applies it. The catalog has one diode and it cannot take a heatsink.
 */
export function rectifierFinding(ctx: Context, stage: SwitcherClass, rectifierW: number): Finding | null {
  if (stage.rectification === 'sync') return null;
  const { diode, thermal } = ctx.catalog;
  const tjC = ctx.ambientC + rectifierW * diode.thetaJaCW * thermal.airflowFactor[ctx.spec.thermal.airflow];
  const limit = diode.tjMaxC - thermal.tjMarginK;
  if (tjC <= limit) return null;
  return finding(
    'thermal',
    `The diode of ${classPhrase(stage.label)} would reach ${tjC > diode.tjMaxC ? `beyond its ${diode.tjMaxC} °C limit` : `about ${tjC.toFixed(0)} °C`} at its ${rectifierW.toFixed(2)} W full-load loss, above the ${limit} °C design limit.`,
    'a synchronous class (no diode to heat), a lower load, or more airflow',
  );
}

/** Findings every stage checks: the peak against the class's limit, the junctions of IC and diode at full load, the inductor's own issue. */
export function commonFindings(
  ctx: Context,
  base: SwitcherClass,
  stage: SwitcherClass,
  peakA: number,
  losses: { switchW: number; rectifierW: number },
  inductorIssue: Issue | null,
): Finding[] {
  const findings: Finding[] = [];
  const peak = peakFinding(stage, peakA);
  if (peak) findings.push(peak);
  const hot = thermalFinding(ctx, stage, hotStage(ctx, base, losses.switchW).tjC);
  if (hot) findings.push(hot);
  const rectifier = rectifierFinding(ctx, stage, losses.rectifierW);
  if (rectifier) findings.push(rectifier);
  if (inductorIssue) findings.push({ issue: inductorIssue, fix: null });
  return findings;
}

/** Parts cost of a sized stage; a diode-rectified class adds its rectifier. */
export function stageCostCents(catalog: Catalog, stage: SwitcherClass, parts: DesignPart[], withRectifier: boolean): number {
  const diodeCents = withRectifier && stage.rectification !== 'sync' ? catalog.diode.costCents * 3 : 0;
  return parts.reduce((n, p) => n + p.costCents, stage.costCents) + diodeCents;
}

/** The load-step check and, where the setup asked for it, the LC post-filter; their issues join the stage's. */
export function stepAndFilter(
  ctx: Context,
  refs: Refs,
  trace: Trace,
  setup: { fsw: number; vOut: number; iMax: number; cout: ChosenCapacitor; filtered: boolean; idPrefix: string },
  issues: Issue[],
  fixes: Fix[],
): PostFilter | null {
  const { fsw, vOut, iMax, cout, filtered, idPrefix } = setup;
  const step = traceStep(ctx, trace, `${idPrefix}.step`, fsw, cout);
  if (step) {
    issues.push(step.issue);
    if (step.fix) fixes.push(step.fix);
  }
  const post = filtered ? postFilter(ctx, refs, trace, fsw, vOut, iMax, cout.effectiveF, idPrefix) : null;
  if (post) issues.push(...post.issues);
  return post;
}

/** Trace of the output capacitance left at the working bias. */
export function traceEffectiveCout(trace: Trace, id: string, cout: ChosenCapacitor): void {
  trace.add(
    id,
    'Output capacitance left at the working bias',
    'Ceff = C·(1 − tol)·max(0.2, 1 − k·V/Vrated)',
    {
      C: [cout.farads, 'F'],
      tol: [cout.family.tolerance, ''],
      k: [cout.family.biasLossAtRated, ''],
      V: [cout.workingV, 'V'],
      Vrated: [cout.part.ratingV ?? 0, 'V'],
    },
    cout.effectiveF,
    'F',
  );
}

/** The converter IC in the part list; it limits its own current and shuts down hot. */
export function switchPart(ref: string, stage: SwitcherClass, ratingV: number): DesignPart {
  return makePart({
    ref,
    role: 'switch',
    part: stage.label,
    ratingV,
    costCents: stage.costCents,
    thermal: {
      thetaJcCW: stage.thetaJaCW,
      thetaJaCW: stage.thetaJaCW,
      tjMaxC: stage.tjMaxC,
      heatsinkable: false,
      protectedInFault: true,
    },
  });
}

/** A diode-rectified stage's catch or output diode. */
export function rectifierPart(ref: string, label: string, ratingV: number | null, catalog: Catalog): DesignPart {
  return makePart({
    ref,
    role: 'diode',
    part: label,
    ratingV,
    costCents: catalog.diode.costCents * 3,
    thermal: {
      thetaJcCW: catalog.diode.thetaJaCW,
      thetaJaCW: catalog.diode.thetaJaCW,
      tjMaxC: catalog.diode.tjMaxC,
      heatsinkable: false,
      protectedInFault: true,
    },
  });
}

export interface StressParts {
  u: string;
  inductor: ChosenInductor;
  cin: ChosenCapacitor;
  cout: ChosenCapacitor;
  fb: FeedbackParts;
  stage: SwitcherClass;
}

/** Stresses of the parts every stage has, the IC and the inductor at the switch node's voltage vNode. */
export function coreStress(parts: StressParts, p: CornerLosses, vIn: number, vOut: number, vNode: number): Record<string, PartStress> {
  const { u, inductor, cin, cout, fb, stage } = parts;
  return {
    [u]: { w: p.switchW, v: vNode },
    [inductor.part.ref]: { w: p.dcrW + p.coreW, v: vNode },
    [cin.part.ref]: { w: 0, v: vIn },
    [cout.part.ref]: { w: 0, v: vOut },
    [fb.r1Ref]: { w: stage.vFbV ** 2 / fb.divider.r1, v: stage.vFbV },
    [fb.r2Ref]: { w: (vOut - stage.vFbV) ** 2 / fb.divider.r2, v: vOut - stage.vFbV },
  };
}

/** The post-filter's inductor and capacitor at load iOut (into `st`). */
export function postFilterStress(st: Record<string, PartStress>, post: PostFilter | null, iOut: number, vOut: number): void {
  if (!post) return;
  st[post.inductorRef] = { w: iOut * iOut * post.dcrOhm, v: 0 };
  st[post.capRef] = { w: 0, v: vOut };
}

/** What a netlist and the review read of a stage: frequency, Rds(on), limits, the inductor's and capacitor's figures. */
export function stageAssumptions(
  u: string,
  stage: SwitcherClass,
  fsw: number,
  inductor: ChosenInductor,
  cout: ChosenCapacitor,
  withFeedbackV: boolean,
): Record<string, Quantity> {
  return {
    [`${u}.fsw`]: { value: fsw, unit: 'Hz' },
    [`${u}.rdsOn`]: { value: stage.rdsOnOhm, unit: 'Ω' },
    ...(withFeedbackV ? { [`${u}.vFb`]: { value: stage.vFbV, unit: 'V' } } : {}),
    [`${u}.tOnMin`]: { value: stage.tOnMinS, unit: 's' },
    [`${u}.iLimit`]: { value: stage.iSwitchMaxA, unit: 'A' },
    [`${inductor.part.ref}.dcr`]: { value: inductor.dcrOhm, unit: 'Ω' },
    [`${inductor.part.ref}.isat`]: { value: inductor.isatA, unit: 'A' },
    [`${cout.part.ref}.esr`]: { value: cout.esrOhm, unit: 'Ω' },
    [`${cout.part.ref}.cEff`]: { value: cout.effectiveF, unit: 'F' },
  };
}
