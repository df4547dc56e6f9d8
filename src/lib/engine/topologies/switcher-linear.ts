// A switching pre-regulator to just above the rail, then a linear post-regulator that rejects the
// switching ripple: efficiency close to a switcher's, noise close to a linear regulator's. The
// pre-regulator is whichever converter fits the input: a buck where the input always stays above
// the intermediate rail, a boost where it always stays below (a quiet 12 V rail from 5 V), a
// four-switch buck-boost where it straddles it (a quiet rail from one Li-ion cell).
import type { LinearRegulatorClass } from '../catalog.ts';
import type { Context } from '../context.ts';
import { Refs, info, operatingPoint, type Design, type OperatingPoint } from '../design.ts';
import { analyseTolerance, extremeValues, toleranceVerdict, type ToleranceModel } from '../tolerance.ts';
import { SEMICONDUCTOR_VOLTAGE_FACTOR } from '../ratings.ts';
import { Trace } from '../trace.ts';
import { boostStage } from './boost.ts';
import { buckBoostStage } from './buck-boost.ts';
import { buckStage } from './buck.ts';
import { checkClass, chooseRegulatorClass, dropoutAt, regulatorStage, type StageInput } from './regulator-stage.ts';
import { rippleRejectionDb } from './regulator-noise.ts';
import { railBand, type ConverterStage, type StageRequest } from './switcher.ts';

/** Headroom kept above the post-regulator's dropout (common practice: a few hundred mV). */
export const POST_REG_MARGIN_V = 0.3;
/** A buck needs the input this far above its output, a boost its output this far above the input, to keep the duty cycle in range (common practice). */
const STEP_MARGIN = 1.15;

export type PreRegulatorKind = 'buck' | 'boost' | 'buck-boost';

/** The converter that fits the input against the intermediate rail. */
export function preRegulatorKind(vTrough: number, vMax: number, vBus: number): PreRegulatorKind {
  if (vTrough >= STEP_MARGIN * vBus) return 'buck';
  if (STEP_MARGIN * vMax <= vBus) return 'boost';
  return 'buck-boost';
}

/**
 * The bus is only as exact as the switcher's feedback (plus 2 % for its divider): the loosest
 * feedback among the classes of the kind that will make it and can take this input.
 */
function busSpread(ctx: Context, vTarget: number): number {
  const { vMax } = ctx.spec.input;
  const kind = preRegulatorKind(ctx.vInTrough, vMax, vTarget + 1);
  const fitting = ctx.catalog.switchers.filter((s) => s.converter === kind && s.vInMinV <= ctx.vInTrough && s.vInMaxV >= vMax);
  return Math.max(...(fitting.length > 0 ? fitting : ctx.catalog.switchers).map((s) => s.vFbTolerance)) + 0.02;
}

/** The post-regulator's dropout at the rail's full load (a resistive pass device drops less than its rated figure). */
const postDropout = (cls: LinearRegulatorClass, iMax: number) => dropoutAt(cls, iMax);

/**
 * Price of each watt a post-regulator's dropout burns at full load, ¢/W: the larger package,
 * copper and heat it brings (our weighting). Its dropout sets how far above the rail the bus sits.
 */
const POST_LOSS_CENTS_PER_W = 500;

/**
 * What a post-regulator class costs the design, ¢: its price and its dropout's loss at full load.
 * A fixed order, so relaxing the rail can only move the choice to a class that costs less.
 */
const postRank = (cls: LinearRegulatorClass, iMax: number) => cls.costCents + POST_LOSS_CENTS_PER_W * postDropout(cls, iMax) * iMax;

/** Headroom kept above the shortest on-time's lowest output (common practice: 20 %). */
const ON_TIME_MARGIN = 1.2;

/**
 * The lowest bus a buck pre-regulator can make from the highest input within its shortest on-time,
 * D = Vbus/Vin ≥ tOn,min·fsw (the continuous-conduction buck relation, Erickson & Maksimović,
 * Fundamentals of Power Electronics, 2nd ed., §2.3), with margin: the easiest of the buck classes
 * that take this input. It matters off rectified mains, where a 3.3 V bus would need a
 * 100 ns pulse; the post-regulator then drops the rest.
 */
function busFloor(ctx: Context): number {
  const { vMax } = ctx.spec.input;
  const bucks = ctx.catalog.switchers.filter(
    (s) => s.converter === 'buck' && s.vInMinV <= ctx.vInTrough && s.vInMaxV >= SEMICONDUCTOR_VOLTAGE_FACTOR * vMax,
  );
  return bucks.length === 0 ? 0 : ON_TIME_MARGIN * vMax * Math.min(...bucks.map((s) => s.tOnMinS * s.fswMinHz));
}

/**
 * Bus set point: raised until even its low extreme leaves the post-regulator, at the highest output
 * its grades allow (the set point plus aboveV), its dropout and margin; never below the floor a
 * buck's shortest on-time sets.
 */
function busTarget(ctx: Context, aboveV: number, cls: LinearRegulatorClass, iMax: number): number {
  const { v } = ctx.spec.output;
  return Math.max((v + aboveV + postDropout(cls, iMax) + POST_REG_MARGIN_V) / (1 - busSpread(ctx, v)), busFloor(ctx));
}

/** A tolerance loose enough that the post-regulator's cheapest grades meet it. */
const LOOSEST_TOLERANCE = 0.5;

/**
 * The post-regulator classes to try, best first: of the classes that fit a nearby intermediate rail, the lowest dropout
 * at full load (it wastes least) whose searched reference grade and divider hold the rail's
 * tolerance from that bus; the lowest dropout when none does. Also the highest output the class gives with its
 * cheapest grades, which the bus must clear by the dropout: a bound that tighter grades only
 * lower, so the bus does not get dearer when the rail's tolerance is relaxed.
 */
function postRegulators(ctx: Context, vTarget: number, iMax: number): PostChoice[] {
  const { spec, catalog } = ctx;
  // A nearby bus, never below the floor a buck's shortest on-time sets (off rectified mains it is well above the rail).
  const vNear = Math.max(vTarget + 2.5, busFloor(ctx));
  const probe: StageInput = { vTrough: vNear, vMax: vNear, rippleVpp: 0, rippleIsHf: true };
  const band = railBand(spec);
  const rule = spec.overrides.toleranceRule ?? 'statistical';
  const spread = busSpread(ctx, vTarget);
  const busRange = (cls: LinearRegulatorClass): StageInput => {
    // Before the class's own spread is known, the rail's upper limit bounds its highest output.
    const vBus = busTarget(ctx, band.hi - vTarget, cls, iMax);
    return { ...probe, vTrough: vBus * (1 - spread), vMax: vBus * (1 + spread) };
  };
  const forcedCls = catalog.linearRegulators.find((c) => c.id === spec.overrides.linearClass);
  const fitting = forcedCls
    ? [forcedCls]
    : catalog.linearRegulators
        .filter(
          (c) =>
            checkClass(ctx, c, probe, vTarget, iMax).length === 0 && (c.kind !== 'fixed' || Math.abs(c.vRefV - vTarget) <= 0.005 * vTarget),
        )
        .sort((a, b) => postRank(a, iMax) - postRank(b, iMax));
  const loose = { ...ctx, spec: { ...spec, output: { ...spec.output, tolerance: LOOSEST_TOLERANCE } } };
  const holds = (output: ToleranceModel) => toleranceVerdict(analyseTolerance(output), band, rule, 0) !== 'fails';
  let first: PostChoice | null = null;
  const held: { choice: PostChoice; rank: number }[] = [];
  let bound = Number.POSITIVE_INFINITY;
  for (const cls of fitting) {
    // In rank order a class's bare price and dropout bound what its finished stage can rank at.
    if (postRank(cls, iMax) >= bound) break;
    // The cheapest grades often hold the rail already; only then is the graded search skipped.
    const cheapest = regulatorStage(loose, new Refs(), new Trace(), busRange(cls), vTarget, iMax, cls.id);
    const found = { cls, vOutHigh: extremeValues(cheapest.output).max };
    first ??= found;
    const graded = holds(cheapest.output) ? cheapest : regulatorStage(ctx, new Refs(), new Trace(), busRange(cls), vTarget, iMax, cls.id);
    if (graded !== cheapest && !holds(graded.output)) continue;
    const cents = graded.parts.reduce((sum, p) => sum + p.costCents, 0);
    const rank = postRank({ ...cls, costCents: cents }, iMax);
    held.push({ choice: found, rank });
    bound = Math.min(bound, rank);
  }
  if (held.length === 0) return [first ?? { cls: chooseRegulatorClass(ctx, probe, vTarget, iMax, undefined).cls, vOutHigh: band.hi }];
  return held.sort((a, b) => a.rank - b.rank).map((h) => h.choice);
}

interface PostChoice {
  cls: LinearRegulatorClass;
  vOutHigh: number;
}

/**
 * Post-regulator classes tried in turn: a class is chosen on an estimate of the bus, and the bus
 * the switcher then makes (its ripple, its spread) can still push the rail past its band.
 */
const POST_REGULATOR_TRIES = 3;

export function designSwitcherLinear(ctx: Context): Design {
  const { spec } = ctx;
  let first: Design | null = null;
  let tries = 0;
  for (const choice of postRegulators(ctx, spec.output.v, spec.output.iMax)) {
    const built = buildHybrid(ctx, choice);
    if (built.holds) return built.design;
    first ??= built.design;
    tries += 1;
    if (tries >= POST_REGULATOR_TRIES) break;
  }
  return first!;
}

/** The whole design around one post-regulator class, and whether its output holds the rail's band. */
function buildHybrid(ctx: Context, { cls, vOutHigh }: PostChoice): { design: Design; holds: boolean } {
  const { spec } = ctx;
  const trace = new Trace();
  const refs = new Refs();
  const { iMin, iTyp, iMax, v: vTarget } = spec.output;
  const spread = busSpread(ctx, vTarget);
  const aboveV = Math.max(0, vOutHigh - vTarget);
  const vBusTarget = trace.add(
    'hybrid.vbus',
    'Intermediate rail (ΔVhigh: how far above the set point the post-regulator’s grades may put the output)',
    'Vbus = max((Vout + ΔVhigh + Vdropout + margin) / (1 − spread), Vbus,min)',
    {
      Vout: [vTarget, 'V'],
      ΔVhigh: [aboveV, 'V'],
      Vdropout: [postDropout(cls, iMax), 'V'],
      margin: [POST_REG_MARGIN_V, 'V'],
      spread: [spread, ''],
      'Vbus,min': [busFloor(ctx), 'V'],
    },
    busTarget(ctx, aboveV, cls, iMax),
    'V',
  );

  // Divider current of the post-regulator loads the switcher; estimate it from the class.
  const iExtra = Math.max(cls.minLoadA, 100e-6) + cls.iAdjMaxA + cls.iqA;
  const input = { vTrough: ctx.vInTrough, vMax: spec.input.vMax };
  const load = { iMin: iMin + iExtra, iTyp: iTyp + iExtra, iMax: iMax + iExtra };
  // The bus may ripple as much as the post-regulator rejects at the switching frequency (its
  // rejection falls with frequency; the adjust-pin bypass is fitted on an adjustable class).
  const bypass = cls.kind === 'adjustable';
  const rippleLimit = (fsw: number) => spec.noise.maxRippleVpp * 10 ** (rippleRejectionDb(cls, fsw, bypass) / 20);
  // The bus must stay above the post-regulator's highest output plus its dropout, in the worst case,
  // and not far above its set point: its spread, and the same margin again for its ripple (the
  // post-regulator drops the excess).
  const busBand = { lo: vOutHigh + postDropout(cls, iMax), hi: vBusTarget * (1 + spread) + POST_REG_MARGIN_V };
  const kind = preRegulatorKind(input.vTrough, input.vMax, vBusTarget);
  const request = (idPrefix: string): StageRequest => ({
    input,
    vTarget: vBusTarget,
    load,
    rippleLimit,
    allowPostFilter: false,
    idPrefix,
    band: busBand,
    rule: 'worst-case',
  });
  const stageOf: Record<PreRegulatorKind, () => ConverterStage> = {
    buck: () => buckStage(ctx, refs, trace, request('hybrid.buck')),
    boost: () => boostStage(ctx, refs, trace, request('hybrid.boost')),
    'buck-boost': () => buckBoostStage(ctx, refs, trace, request('hybrid.buckboost')),
  };
  const pre = stageOf[kind]();
  // The bus spread is the switcher's own feedback spread, at its extremes; a stage that fails can
  // ripple more than its whole output, and the bus never dips below ground.
  const bus = extremeValues(pre.output);
  const reg = regulatorStage(
    ctx,
    refs,
    trace,
    { vTrough: Math.max(0, bus.min - pre.rippleVpp / 2), vMax: bus.max, rippleVpp: pre.rippleVpp, rippleIsHf: true, rippleHz: pre.fsw },
    vTarget,
    iMax,
    cls.id,
  );
  const issues = [...pre.issues, ...reg.issues.filter((i) => i.code !== 'class-unknown')];
  issues.push(
    info(
      'hybrid',
      `The ${kind} stage makes ${pre.vOut.toFixed(2)} V; ${reg.regRef} drops ${(pre.vOut - reg.vOut).toFixed(2)} V and rejects the switching ripple.`,
    ),
  );

  const operate = (vIn: number, iOut: number): OperatingPoint => {
    const p = pre.operate(vIn, reg.inputCurrent(iOut));
    return operatingPoint(p.regulates, p.pInW, reg.vOut * iOut, () => Object.assign(p.stress, reg.stress(pre.vOut, iOut)));
  };
  const shorted = pre.operate(spec.input.vMax, reg.cls.iLimitA);
  const names: Record<PreRegulatorKind, string> = {
    buck: 'Buck converter',
    boost: 'Boost converter',
    'buck-boost': 'Four-switch buck-boost converter',
  };
  const design: Design = {
    topology: 'buck+linear',
    label: `${names[kind]} with linear post-regulator (${reg.cls.label})`,
    parts: [...pre.parts, ...reg.parts],
    issues,
    fixes: pre.fixes,
    trace,
    operate,
    fault: { regulates: false, pInW: shorted.pInW, pOutW: 0, stress: { ...shorted.stress, ...reg.faultStress(pre.vOut) } },
    output: reg.output,
    rippleVpp: reg.rippleOutVpp,
    assumptions: {
      ...pre.assumptions,
      ...reg.assumptions,
      [`${reg.regRef}.vRef`]: { value: reg.cls.vRefV, unit: 'V' },
      [`${reg.regRef}.psrrHf`]: { value: reg.cls.psrrHfDb, unit: 'dB' },
    },
  };
  const band = railBand(spec);
  const holds =
    toleranceVerdict(analyseTolerance(reg.output), band, spec.overrides.toleranceRule ?? 'statistical', reg.rippleOutVpp / 2) !== 'fails';
  return { design, holds };
}
