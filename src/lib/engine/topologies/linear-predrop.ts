// High-voltage pass transistor ahead of a floating-reference regulator: the transistor's base or
// gate is held a Zener standoff above the output, so the regulator sees only about Vz − Vbe and
// the transistor drops the rest. A foldback limiter (sense resistor, sense transistor and a
// divider) holds the transistor inside its safe operating area on an overload or a short; where
// no foldback can, a fuse clears the short inside the device's pulsed SOA.
import type { Context } from '../context.ts';
import { forced } from '../context.ts';
import type { LinearRegulatorClass, PassDeviceClass, ZenerSeries } from '../catalog.ts';
import { chooseCapacitor } from '../capacitors.ts';
import { ES1_DC_LIMIT_V } from '../cautions.ts';
import {
  Refs,
  atLeast,
  blocker,
  caution,
  info,
  makePart,
  operatingPoint,
  resistorPart,
  type Design,
  type Fix,
  type OperatingPoint,
  type PartStress,
} from '../design.ts';
import { snap } from '../eseries.ts';
import { SEMICONDUCTOR_VOLTAGE_FACTOR } from '../ratings.ts';
import { airflowFactor, assessThermal, type ThermalPart } from '../thermal.ts';
import { Trace } from '../trace.ts';
import type { Issue } from '../types.ts';
import { formatSi, shortBy } from '../units.ts';
import { dynamicImpedance, seriesFor, seriesForPower, zenerModel, zenerVoltage, zenerVoltageUp } from '../zeners.ts';
import { COLD_AMBIENT_C } from '../tolerance.ts';
import {
  ROOM_C,
  SENSE_BETA_MIN,
  SENSE_BETA_TYP,
  SENSE_VBE_25C_V,
  SENSE_VBE_AT_A,
  SENSE_VBE_TEMPCO_V_PER_K,
  designFoldback,
  foldbackCurrent,
  minShortCurrent,
  senseVbe,
  thermalVoltage,
  type Foldback,
} from './foldback.ts';
import { CURRENT_DERATING, dividerCurrent, dropoutAt, regulatorStage } from './regulator-stage.ts';
import { SOURCE_SPREAD, resistorFeed, sourceFeed, type StandoffFeed } from './standoff-feed.ts';
import { SOA_MARGIN, fuseClearingS, pulsedSoaW, soaAllowedW, soaDeratedW } from './soa.ts';

export { soaAllowedW } from './soa.ts';

/** The current limit is set this far above the full-load path current, the roomiest first (common practice 1.2–2). */
export const LIMIT_RATIOS = [1.5, 1.3, 1.2] as const;
/** Headroom kept above the regulator's dropout at full load (common practice). */
export const HEADROOM_MARGIN_V = 0.5;
/** Bias current through the standoff Zener's resistor, A (common practice: a few mA). */
export const BIAS_MIN_A = 2e-3;
/** Input margin above Vout + Vz for the bias resistor and the pass device's saturation (common practice). */
const BIAS_HEADROOM_V = 2;
/** Foldback never folds the short-circuit current below this share of the limit, so loads that draw constant current still start (common practice). */
export const FOLDBACK_MIN_SHARE = 0.05;
/** Where the SOA allows more, the short-circuit current is folded to this share of the limit (common practice: a third to a half). */
const FOLDBACK_SHARE = 0.5;
/** Least current in the foldback divider at full output (common practice). */
const FOLDBACK_DIVIDER_A = 0.1e-3;
/**
 * The divider carries at least ten times the sense transistor's largest base current (common
 * practice); where RA·Ib still lifts the short-circuit current past the SOA, a stiffer one.
 */
const DIVIDER_TO_BASE = [10, 30] as const;
/** Insulating pad under a live tab: θCS of 1–3 K/W (from memory of pad data); 2 K/W assumed. */
export const INSULATING_PAD_CW = 2;
/** Points along the foldback line where the pass device's stress is checked against its SOA. */
const FOLDBACK_SAMPLES = 16;
/** Fuse ratings, A (R10 preferred numbers, common practice). */
const FUSE_RATINGS_A = [0.05, 0.063, 0.08, 0.1, 0.125, 0.16, 0.2, 0.25, 0.315, 0.4, 0.5, 0.63, 0.8, 1, 1.25, 1.6, 2, 2.5, 3.15, 4, 5];
/** A fuse is rated at least this much above the normal current (common practice). */
const FUSE_RATING_FACTOR = 1.5;
/** In fuse mode the limit lets this multiple of the fuse rating flow, so the fuse clears quickly. */
const FUSE_CLEAR_MULTIPLE = 4;

/** Devices rated for the input with margin, of the engineer's kind when chosen, cheapest first. */
function passDeviceCandidates(ctx: Context): PassDeviceClass[] {
  const kind = ctx.spec.overrides.passDevice;
  const passing = ctx.catalog.passDevices.filter((d) => d.kind !== 'nmos-depletion');
  const ofKind = passing.filter((d) => kind === undefined || d.kind === kind);
  const pool = (ofKind.length > 0 ? ofKind : passing).slice().sort((a, b) => a.costCents - b.costCents || a.vMaxV - b.vMaxV);
  const rated = pool.filter((d) => d.vMaxV >= SEMICONDUCTOR_VOLTAGE_FACTOR * ctx.spec.input.vMax);
  return rated.length > 0
    ? rated
    : pool
        .slice()
        .sort((a, b) => b.vMaxV - a.vMaxV)
        .slice(0, 1);
}

/** The cheapest floating (adjustable) class that carries the load with margin. */
function chooseFloatingClass(ctx: Context, iMax: number): LinearRegulatorClass {
  const adjustable = ctx.catalog.linearRegulators
    .filter((c) => c.kind === 'adjustable')
    .sort((a, b) => a.costCents - b.costCents || a.iOutMaxA - b.iOutMaxA);
  const forcedCls = adjustable.find((c) => c.id === ctx.spec.overrides.linearClass);
  return (
    forcedCls ??
    adjustable.find((c) => iMax + dividerCurrent(ctx, c, ctx.spec.output.v, iMax, true) <= CURRENT_DERATING * c.iOutMaxA) ??
    adjustable.slice().sort((a, b) => b.iOutMaxA - a.iOutMaxA)[0] ??
    ctx.catalog.linearRegulators[0]!
  );
}

/**
 * The sense transistor at the two ends of its temperature range: the hottest junction (lowest Vbe)
 * sets the knee, which must still carry the full load; the coldest (highest Vbe, least gain, the
 * bias resistor's whole current at the highest input) sets the short-circuit current, its power
 * and the SOA check.
 */
export interface SenseCorners {
  vbeHot: number;
  vbeCold: number;
  /** Base current in a short at the coldest corner, least gain. */
  ibCold: number;
}

/** Current in the foldback divider at full output: at least `multiple` times the sense transistor's base current. */
const foldbackDividerA = (ib: number, multiple: number) => Math.max(FOLDBACK_DIVIDER_A, multiple * ib);

interface Protection {
  mode: 'foldback' | 'fuse';
  foldback: Foldback;
  /** Current in the foldback divider at full output. */
  dividerA: number;
  /** Knee current at the normal sense-node voltage (hottest junction). */
  iLimit: number;
  /** Current with the output shorted (coldest junction). */
  iShort: number;
  /** Largest pass-device power along the limit line at the coldest junction (or in the short, fuse mode). */
  worstW: number;
  /** Case temperature the thermal chain gives at that power. */
  caseC: number;
  /** Fuse mode: rating and clearing time at the short-circuit current. */
  fuseA: number | null;
  clearS: number | null;
  problems: Issue[];
}

/**
 * Sizes the limit: the short-circuit current is the largest the pass device carries at every
 * point of the foldback line inside its SOA, derated to the case temperature its heatsink
 * reaches (two passes: the case temperature depends on the power it sets). Where even the
 * smallest useful foldback leaves the SOA, a fuse clears the short inside the pulsed SOA.
 */
function sizeProtection(
  ctx: Context,
  dev: PassDeviceClass,
  thermal: ThermalPart,
  iPath: number,
  vTarget: number,
  vs: number,
  sense: SenseCorners,
): Protection {
  let fallback: Protection | null = null;
  for (const ratio of LIMIT_RATIOS) {
    for (const multiple of DIVIDER_TO_BASE) {
      const p = sizeProtectionAt(ctx, dev, thermal, iPath, vTarget, vs, sense, ratio, foldbackDividerA(sense.ibCold, multiple));
      if (p.mode === 'foldback' && p.problems.length === 0) return p;
      fallback ??= p;
    }
  }
  return fallback!;
}

function sizeProtectionAt(
  ctx: Context,
  dev: PassDeviceClass,
  thermal: ThermalPart,
  iPath: number,
  vTarget: number,
  vs: number,
  sense: SenseCorners,
  ratio: number,
  dividerA: number,
): Protection {
  const { vMax } = ctx.spec.input;
  const iLimit = ratio * iPath;
  const vNormal = vTarget + vs;
  const lowest = minShortCurrent(iLimit, vNormal, vs, sense.vbeHot);
  const floor = Math.max(FOLDBACK_MIN_SHARE * iLimit, lowest + 0.02 * (iLimit - lowest));
  const airflow = airflowFactor(ctx.spec, ctx.catalog);
  // The foldback designed at the hottest junction, and its line at the coldest: lo in the short, hi at full output.
  const coldLine = (folded: number) => {
    const fb = designFoldback(iLimit, folded, vNormal, vs, sense.vbeHot);
    if (!fb) return null;
    // RA·Ib with RB = vNormal/(Idiv·(1 + k)).
    const drop = (fb.k * vNormal * sense.ibCold) / (dividerA * (1 + fb.k));
    return { fb, lo: foldbackCurrent(fb, sense.vbeCold, vs, drop), hi: foldbackCurrent(fb, sense.vbeCold, vNormal, drop) };
  };
  // Vce along the line does not depend on the currents: worked out once per sizing.
  const vces = Array.from({ length: FOLDBACK_SAMPLES + 1 }, (_, n) => Math.max(0, vMax - ((n / FOLDBACK_SAMPLES) * vTarget + vs)));
  const powerAt = (line: { lo: number; hi: number }, n: number) => vces[n]! * (line.lo + (line.hi - line.lo) * (n / FOLDBACK_SAMPLES));
  const lineWorst = (line: { lo: number; hi: number }) => {
    let worst = Number.NEGATIVE_INFINITY;
    for (let n = 0; n <= FOLDBACK_SAMPLES; n += 1) worst = Math.max(worst, powerAt(line, n));
    return worst;
  };
  // Case temperature the heatsink gives at this power; null when no heatsink holds it.
  const caseAt = (powerW: number): number | null => {
    const t = assessThermal(thermal, powerW, ctx.ambientC, airflow, ctx.catalog, ctx.spec.overrides.heatsinkThetaSaCW);
    return t.problem === 'none' || t.problem === 'impractical' ? t.tjC - powerW * thermal.thetaJcCW : null;
  };
  // A short-circuit current fits when the heatsink holds the cold line's worst power and every
  // point of that line lies inside the SOA derated to that case temperature.
  const fits = (folded: number): number | null => {
    const line = coldLine(folded);
    if (!line) return null;
    const caseC = caseAt(lineWorst(line));
    if (caseC === null) return null;
    for (let n = 0; n <= FOLDBACK_SAMPLES; n += 1) if (powerAt(line, n) > soaDeratedW(dev, vces[n]!, caseC)) return null;
    return caseC;
  };
  const problems: Issue[] = [];
  // Fold to half the limit where the SOA allows it (common practice), else as deep as needed
  // down to the floor: more current means more power, so the largest fitting current is bisected.
  let folded = Math.max(floor, FOLDBACK_SHARE * iLimit);
  let caseC = fits(folded);
  if (caseC === null && fits(floor) !== null) {
    let lo = floor;
    let hi = folded;
    for (let step = 0; step < 12; step += 1) {
      const mid = (lo + hi) / 2;
      if (fits(mid) === null) hi = mid;
      else lo = mid;
    }
    folded = lo;
    caseC = fits(lo);
  }
  const line = caseC === null ? null : coldLine(folded);
  if (line && caseC !== null)
    return {
      mode: 'foldback',
      foldback: line.fb,
      dividerA,
      iLimit,
      iShort: line.lo,
      worstW: lineWorst(line),
      caseC,
      fuseA: null,
      clearS: null,
      problems,
    };
  // No foldback holds a continuous short: a fast fuse, with the limit raised so it clears quickly.
  const fuseA = FUSE_RATINGS_A.find((r) => r >= FUSE_RATING_FACTOR * iPath) ?? FUSE_RATINGS_A[FUSE_RATINGS_A.length - 1]!;
  const iFaultHot = Math.max(iLimit, FUSE_CLEAR_MULTIPLE * fuseA);
  // A plain (unfolded) limit: the sense transistor alone across Rs, set at the hottest junction.
  const plain: Foldback = { k: 0, rs: sense.vbeHot / iFaultHot };
  const iFault = foldbackCurrent(plain, sense.vbeCold, 0);
  const clearS = fuseClearingS(iFaultHot, fuseA);
  const vceShort = vMax - vs;
  const pShort = vceShort * iFault;
  const ambientCase = ctx.ambientC;
  if (clearS === null || pShort > pulsedSoaW(dev, vceShort, ambientCase, clearS)) {
    problems.push(
      blocker(
        'soa',
        `A shorted output puts ${pShort.toFixed(0)} W into the pass device; no foldback keeps that inside its SOA continuously, and a ${formatSi(fuseA, 'A', 3)} fuse clearing at ${formatSi(iFaultHot, 'A', 3)} takes ${clearS === null ? 'too long' : formatSi(clearS, 's', 2)}, beyond its pulsed SOA.`,
      ),
    );
  }
  return {
    mode: 'fuse',
    foldback: plain,
    dividerA: 0,
    iLimit: iFaultHot,
    iShort: iFault,
    worstW: pShort,
    caseC: ambientCase,
    fuseA,
    clearS,
    problems,
  };
}

interface Candidate {
  design: Design & { fixes: Fix[] };
  blockers: number;
  costCents: number;
}

/** The Zener's feed: a bias resistor, or (`source`) a depletion MOSFET current source. */
function designWith(ctx: Context, dev: PassDeviceClass, source: PassDeviceClass | null): Candidate {
  const { spec, catalog } = ctx;
  const trace = new Trace();
  const refs = new Refs();
  const issues: Issue[] = [];
  const fixes: Fix[] = [];
  const { vMax } = spec.input;
  const { iMax, v: vTarget } = spec.output;
  const npn = dev.kind === 'npn';
  const gain = npn ? dev.gainMin : Number.POSITIVE_INFINITY;
  const vc = dev.vControlV;
  if (dev.vMaxV < SEMICONDUCTOR_VOLTAGE_FACTOR * vMax) {
    issues.push(
      blocker(
        'pass-voltage',
        `The pass device must be rated ${(SEMICONDUCTOR_VOLTAGE_FACTOR * vMax).toFixed(0)} V; the largest in the catalog is ${dev.vMaxV} V.`,
      ),
    );
  }
  const live = vMax > ES1_DC_LIMIT_V;
  const thermal: ThermalPart = {
    thetaJcCW: dev.thetaJcCW,
    thetaJaCW: dev.thetaJaCW,
    tjMaxC: dev.tjMaxC,
    heatsinkable: true,
    ...(live ? { thetaCsCW: INSULATING_PAD_CW } : {}),
  };

  const cls = chooseFloatingClass(ctx, iMax);
  const iDiv = dividerCurrent(ctx, cls, vTarget, iMax, true) * 1.5;
  const iPathMax = iMax + iDiv + cls.iAdjMaxA;

  const qRef = refs.next('Q');
  const q2Ref = refs.next('Q');
  const dzRef = refs.next('D');
  const rsRef = refs.next('R');
  const forcedVz = forced(ctx, dzRef) ?? (spec.overrides.standoffV !== undefined ? zenerVoltage(spec.overrides.standoffV) : undefined);
  const ibNormal = npn ? iPathMax / gain : 0;
  const seriesOf = (v: number) => {
    const offered = seriesFor(catalog, v);
    return offered.length > 0 ? offered : catalog.zenerSeries.slice(0, 1);
  };
  // With no headroom (a blocker below) Rb is sized from the highest input so the figures stay sane.
  const rbDropFor = (v: number, vOut: number) =>
    ctx.vInTrough - (vOut + v) > 0 ? ctx.vInTrough - (vOut + v) : Math.max(1, vMax - vOut - v);
  // Bias current through Rb: the pass device's base current with margin plus the Zener's knee. Not
  // its test current: what the Zener passes flows into the output, which at the highest input
  // cannot absorb tens of milliamperes, and Rb would burn watts from a high input. So the Zener
  // runs below its test current and its voltage is taken there, on the same line Vz(I) = Vk + rz·I
  // as the shunt's Zener (Sedra & Smith, 7th ed., §4.4.1 — from memory).
  const biasFor = (v: number) => Math.max(BIAS_MIN_A, 1.5 * ibNormal + Math.min(...seriesOf(v).map((z) => z.kneeCurrentA)));
  // The Zener's voltage at current iz: rated at or above its test current, else on its line.
  const zenerAt = (series: ZenerSeries, v: number, iz: number) => {
    const line = zenerModel(series, v);
    return iz >= line.iTest ? v : line.vKnee + line.rz * Math.max(0, iz);
  };
  // How far below its rated voltage the Zener sits at the trough, full load (the least bias it gets).
  const sagFor = (v: number) => v - zenerAt(seriesOf(v)[0]!, v, biasFor(v) - ibNormal);
  const coldC = Math.min(COLD_AMBIENT_C, ctx.ambientC);
  // Rb as it will be snapped, with the output at its target.
  const rbFor = (v: number, vOut: number) => snap(atLeast(rbDropFor(v, vOut) / biasFor(v), 1), 'E24', 'down');
  const feedFor = (v: number, vOut: number, forcedOhms?: number): StandoffFeed =>
    source ? sourceFeed(source, biasFor(v), forcedOhms) : resistorFeed(forcedOhms ?? rbFor(v, vOut));
  // The sense transistor takes the feed's whole current when it limits: at the trough (the knee, hottest) and at the highest input (the short, coldest).
  const senseFor = (v: number): SenseCorners => {
    const iShort = feedFor(v, vTarget).most(vMax - v);
    return {
      vbeHot: senseVbe(ctx.ambientC, feedFor(v, vTarget).least(rbDropFor(v, vTarget))),
      vbeCold: senseVbe(coldC, iShort),
      ibCold: iShort / SENSE_BETA_MIN,
    };
  };
  // Standoff and sense resistor together: the regulator keeps dropout + margin after the sense
  // resistor's drop, and that drop depends on the foldback the standoff allows.
  const standoffNeed = (drop: number, v: number) => zenerVoltageUp(vc + cls.dropoutV + HEADROOM_MARGIN_V + drop + sagFor(v));
  let vz = forcedVz ?? standoffNeed(SENSE_VBE_25C_V, zenerVoltageUp(vc + cls.dropoutV + HEADROOM_MARGIN_V + SENSE_VBE_25C_V));
  let prot = sizeProtection(ctx, dev, thermal, iPathMax, vTarget, vz - vc, senseFor(vz));
  let rs = forced(ctx, rsRef) ?? snap(atLeast(prot.foldback.rs, 1e-3), 'E24', 'nearest');
  for (let pass = 0; pass < 3 && forcedVz === undefined; pass += 1) {
    const next = standoffNeed(iPathMax * rs, vz);
    if (next === vz) break;
    vz = next;
    prot = sizeProtection(ctx, dev, thermal, iPathMax, vTarget, vz - vc, senseFor(vz));
    rs = forced(ctx, rsRef) ?? snap(atLeast(prot.foldback.rs, 1e-3), 'E24', 'nearest');
  }
  const vs = vz - vc;
  trace.select(
    'predrop.vz',
    'Standoff Zener voltage (E24 at or above the need)',
    'Vz ≥ Vbe + Vdropout + margin + Ipath,max·Rs + sag',
    {
      Vbe: [vc, 'V'],
      Vdropout: [cls.dropoutV, 'V'],
      margin: [HEADROOM_MARGIN_V, 'V'],
      'Ipath,max': [iPathMax, 'A'],
      Rs: [rs, 'Ω'],
      sag: [sagFor(vz), 'V'],
    },
    vz,
    'V',
  );
  issues.push(...prot.problems);

  // Foldback divider: k = RA/RB, the sized current through both from the sense node (none for a plain limit).
  const folds = prot.foldback.k > 0;
  const raRef = folds ? refs.next('R') : '';
  const rbfRef = folds ? refs.next('R') : '';
  const vNormal = vTarget + vs;
  const rbf = folds ? (forced(ctx, rbfRef) ?? snap(vNormal / (prot.dividerA * (1 + prot.foldback.k)), 'E96', 'nearest')) : 0;
  const ra = folds ? (forced(ctx, raRef) ?? snap(atLeast(prot.foldback.k * rbf, 1e-3), 'E96', 'nearest')) : 0;
  const fb: Foldback = { k: folds && rbf > 0 ? ra / rbf : 0, rs };
  if (live) {
    issues.push(
      caution(
        'live-heatsink',
        `${qRef}'s tab and heatsink sit at up to ${vMax.toFixed(0)} V: mount it on an insulating pad (θCS ${INSULATING_PAD_CW} K/W assumed, 1–3 K/W typical) with an insulating bush, keep the heatsink away from touch, and lay out clearance and creepage for basic insulation at this working voltage from the tables of IEC 62368-1 (from memory: a few millimetres at 400–500 V, pollution degree 2 — take the figures from the standard).`,
      ),
    );
  }

  // The regulator stage (divider, capacitors, protection diodes) sees only the standoff.
  const regInMax = vTarget + vs;
  const stage = regulatorStage(
    ctx,
    refs,
    trace,
    { vTrough: regInMax - iPathMax * rs, vMax: regInMax, rippleVpp: 0, rippleIsHf: false, tracksOutput: true },
    vTarget,
    iMax,
    cls.id,
  );
  issues.push(...stage.issues.filter((i) => i.code !== 'class-unknown' && i.code !== 'headroom'));
  fixes.push(...stage.fixes.filter((f) => f.code !== 'headroom'));
  const vOut = stage.vOut;
  const iDivActual = stage.divider?.iDivider ?? 0;
  const iAdj = cls.iAdjTypA;
  if (cls.vDiffMaxV !== null && vs > cls.vDiffMaxV) {
    issues.push(blocker('standoff', `The standoff puts ${vs.toFixed(1)} V across the regulator; it allows ${cls.vDiffMaxV} V.`));
  }

  // Bias resistor from the input to the base/gate.
  const rbRef = refs.next('R');
  if (seriesFor(catalog, vz).length === 0) issues.push(blocker('zener-range', `No Zener series in the catalog offers ${vz} V.`));
  const zSeries = seriesOf(vz);
  const iBias = biasFor(vz);
  const feed = feedFor(vz, vOut, forced(ctx, rbRef));
  const rb = feed.ohms;
  if (source)
    trace.select(
      'predrop.rset',
      `Current source's set resistor, snapped down to E24 (the least current, ${SOURCE_SPREAD.lo} × nominal, still meets the bias)`,
      'Rset = spread·|Vgs| / Ibias',
      { spread: [SOURCE_SPREAD.lo, ''], '|Vgs|': [source.vControlV, 'V'], Ibias: [iBias, 'A'] },
      rb,
      'Ω',
    );
  else
    trace.select(
      'predrop.rb',
      'Bias resistor, snapped down to E24',
      'Rb = (vInTrough − (Vout + Vz)) / Ibias',
      {
        vInTrough: [ctx.vInTrough, 'V'],
        Vout: [vOut, 'V'],
        Vz: [vz, 'V'],
        Ibias: [iBias, 'A'],
      },
      rb,
      'Ω',
    );
  if (ctx.vInTrough < vOut + vz + BIAS_HEADROOM_V) {
    const need = vOut + vz + BIAS_HEADROOM_V;
    issues.push(
      blocker(
        'headroom',
        `The input trough ${ctx.vInTrough.toFixed(1)} V must exceed Vout + Vz + ${BIAS_HEADROOM_V} V = ${need.toFixed(1)} V.`,
      ),
    );
    fixes.push({
      code: 'headroom',
      change: `input trough at least ${need.toFixed(1)} V`,
      message: `Needs ≥ ${need.toFixed(1)} V input at the trough; a pre-drop stage only helps well above the output.`,
    });
  }

  // The sense transistor with the chosen Rb: it takes the bias current at the trough when it
  // starts to limit (the knee) and Rb's whole current at the highest input in a short.
  const iRbShort = feed.most(vMax - vz);
  const vbeAt = (id: string, label: string, tempC: number, ic: number) =>
    trace.add(
      id,
      label,
      'Vbe = Vbe25 + TC·(T − 25) + Vt·ln(Ic/I0)',
      {
        Vbe25: [SENSE_VBE_25C_V, 'V'],
        TC: [SENSE_VBE_TEMPCO_V_PER_K, 'V/K'],
        T: [tempC, '°C'],
        Vt: [thermalVoltage(tempC), 'V'],
        Ic: [ic, 'A'],
        I0: [SENSE_VBE_AT_A, 'A'],
      },
      senseVbe(tempC, ic),
      'V',
    );
  const vbeHot = vbeAt(
    'predrop.vbe.hot',
    'Sense transistor Vbe, hottest junction, at the knee',
    ctx.ambientC,
    feed.least(rbDropFor(vz, vOut)),
  );
  const vbeCold = vbeAt('predrop.vbe.cold', 'Sense transistor Vbe, coldest junction, output shorted', coldC, iRbShort);
  const vbeRoom = vbeAt('predrop.vbe.room', `Sense transistor Vbe at ${ROOM_C} °C, output shorted`, ROOM_C, iRbShort);
  // The knee leaves out the base current (the highest gain); a short adds RA·Ic/β through RA.
  const limitAt = (id: string, label: string, vbe: number, vn: number, beta: number | null): number =>
    folds
      ? beta === null
        ? trace.add(
            id,
            `${label} (foldback line)`,
            'I = (Vbe·(1 + RA/RB) + Vn·RA/RB)/Rs',
            { Vbe: [vbe, 'V'], RA: [ra, 'Ω'], RB: [rbf, 'Ω'], Vn: [vn, 'V'], Rs: [rs, 'Ω'] },
            foldbackCurrent(fb, vbe, vn),
            'A',
          )
        : trace.add(
            id,
            `${label} (foldback line)`,
            'I = (Vbe·(1 + RA/RB) + Vn·RA/RB + RA·Ic/β)/Rs',
            { Vbe: [vbe, 'V'], RA: [ra, 'Ω'], RB: [rbf, 'Ω'], Vn: [vn, 'V'], Ic: [iRbShort, 'A'], β: [beta, ''], Rs: [rs, 'Ω'] },
            foldbackCurrent(fb, vbe, vn, (ra * iRbShort) / beta),
            'A',
          )
      : trace.add(id, `${label} (sense transistor across Rs)`, 'I = Vbe/Rs', { Vbe: [vbe, 'V'], Rs: [rs, 'Ω'] }, vbe / rs, 'A');
  const iLimit = limitAt('predrop.ilimit', 'Current limit at full output, hottest junction', vbeHot, vNormal, null);
  const iFault = limitAt('predrop.ifault', 'Short-circuit current, coldest junction, least gain', vbeCold, vs, SENSE_BETA_MIN);
  // On the bench the shorted regulator saturates: the sense node sits at its dropout, not at the standoff the worst case takes.
  const iFaultRoom = limitAt(
    'predrop.ifault.room',
    `Short-circuit current at ${ROOM_C} °C, typical gain, regulator saturated (bench check)`,
    vbeRoom,
    Math.min(vs, dropoutAt(cls, iFault)),
    SENSE_BETA_TYP,
  );
  if (iLimit < iPathMax) {
    issues.push(
      blocker(
        'current-limit',
        `The limit ${formatSi(iLimit, 'A', 3)} (from the forced parts) is below the full-load path current ${formatSi(iPathMax, 'A', 3)}.`,
      ),
    );
  }
  const vceFault = Math.max(0, vMax - vs);
  const pFault = trace.add(
    'predrop.pq.fault',
    'Pass device dissipation with the output shorted',
    'P = max(0, vInMax − (Vz − Vbe))·Ifault',
    {
      vInMax: [vMax, 'V'],
      Vz: [vz, 'V'],
      Vbe: [vc, 'V'],
      Ifault: [iFault, 'A'],
    },
    vceFault * iFault,
    'W',
  );
  const soaShort = soaDeratedW(dev, vceFault, prot.caseC);
  if (prot.mode === 'foldback') {
    issues.push(
      caution(
        'soa',
        `Foldback limit: ${formatSi(iLimit, 'A', 3)} at full output with the sense transistor at its hottest, folding into a short, where ${qRef} sees ${vceFault.toFixed(0)} V at ${(iFault * 1e3).toFixed(0)} mA (${pFault.toFixed(1)} W) with the sense transistor at ${coldC.toFixed(0)} °C and its least gain, for as long as the short lasts; a bench short at ${ROOM_C} °C draws about ${(iFaultRoom * 1e3).toFixed(0)} mA. Its SOA hint (${soaAllowedW(dev, vceFault).toFixed(1)} W at a 25 °C case) derated to the ${prot.caseC.toFixed(0)} °C case its heatsink gives, used to ${(SOA_MARGIN * 100).toFixed(0)} %, allows ${soaShort.toFixed(1)} W; the worst point of the foldback line is ${prot.worstW.toFixed(1)} W. A load that draws constant current may not start against a deep foldback. Confirm against the device's SOA curve.`,
      ),
    );
  } else if (prot.fuseA !== null) {
    const clear = prot.clearS;
    issues.push(
      caution(
        'fuse',
        `No foldback keeps a continuous short inside ${qRef}'s SOA, so a ${formatSi(prot.fuseA, 'A', 3)} fast-acting fuse in the input clears it: at the ${formatSi(iFault, 'A', 3)} limit it opens in about ${clear === null ? 'an unbounded time' : formatSi(clear, 's', 2)}, putting ${clear === null ? 'unbounded energy' : formatSi(pFault * clear, 'J', 2)} (${pFault.toFixed(0)} W) into ${qRef} — inside its pulsed SOA (√(τ/t) widening of the DC hint, τ = ${formatSi(dev.thermalTauS, 's', 2)}, from memory). Clearing time from a typical fast-acting curve (from memory): confirm against the chosen fuse; replace it after a fault.`,
      ),
    );
    fixes.push({
      code: 'soa',
      change: 'a pass device with a larger safe operating area',
      message: 'A device whose SOA carries the foldback line continuously would survive a short without the fuse.',
    });
  }
  // The Zener's current flows into the output node and bypasses the regulator; solve the path current.
  const pathCurrent = (vIn: number, iOut: number) => {
    const iRb = feed.most(vIn - vOut - vz);
    const load = iOut + iDivActual + iAdj;
    const i = npn ? (load - iRb) / (1 - 1 / gain) : load - iRb;
    const ib = npn ? Math.max(0, i) / gain : 0;
    return { i: Math.max(0, i), iRb, ib, iz: Math.max(0, iRb - ib) };
  };
  const zNormal = pathCurrent(vMax, spec.output.iMin);
  const izFault = Math.max(0, feed.most(vMax - vz) - iFault / gain);
  const pzWorst = vz * Math.max(zNormal.iz, izFault);
  const zener = seriesForPower(zSeries, pzWorst) ?? catalog.zenerSeries[0]!;
  // The Zener's least current (the trough, full load, least gain) and the voltage it holds there.
  const izMin = source
    ? trace.add(
        'predrop.iz',
        "Standoff Zener current at the trough, full load (the current source's least current)",
        'Iz = max(0, Ibias,min − Ib)',
        { 'Ibias,min': [feed.least(ctx.vInTrough - (vOut + vz)), 'A'], Ib: [ibNormal, 'A'] },
        Math.max(0, feed.least(ctx.vInTrough - (vOut + vz)) - ibNormal),
        'A',
      )
    : trace.add(
        'predrop.iz',
        'Standoff Zener current at the trough, full load',
        'Iz = max(0, max(0, vInTrough − (Vout + Vz))/Rb − Ib)',
        { vInTrough: [ctx.vInTrough, 'V'], Vout: [vOut, 'V'], Vz: [vz, 'V'], Rb: [rb, 'Ω'], Ib: [ibNormal, 'A'] },
        Math.max(0, Math.max(0, ctx.vInTrough - (vOut + vz)) / rb - ibNormal),
        'A',
      );
  const zLine = zenerModel(zener, vz);
  const vzWork =
    izMin >= zLine.iTest
      ? trace.select(
          'predrop.vz.work',
          'Standoff Zener voltage at its least current (at or above its test current: rated)',
          'Vz = Vz,rated at Iz ≥ Izt',
          { 'Vz,rated': [vz, 'V'], Iz: [izMin, 'A'], Izt: [zLine.iTest, 'A'] },
          vz,
          'V',
        )
      : trace.add(
          'predrop.vz.work',
          'Standoff Zener voltage at its least current, below its test current (linear model through Vz at Izt)',
          'Vz = Vk + rz·Iz',
          { Vk: [zLine.vKnee, 'V'], rz: [zLine.rz, 'Ω'], Iz: [izMin, 'A'] },
          zenerAt(zener, vz, izMin),
          'V',
        );
  const regHeadroom = vzWork - vc - iPathMax * rs;
  if (regHeadroom < cls.dropoutV) {
    issues.push(
      blocker(
        'standoff',
        regHeadroom < 0
          ? `The standoff leaves no headroom across the regulator at full load: it is ${shortBy(regHeadroom - cls.dropoutV)} of the ${cls.dropoutV} V the regulator needs (the Zener at ${formatSi(izMin, 'A', 2)} holds ${formatSi(vzWork, 'V', 3)}).`
          : `The standoff leaves ${regHeadroom.toFixed(2)} V across the regulator at full load (the Zener at ${formatSi(izMin, 'A', 2)} holds ${formatSi(vzWork, 'V', 3)}); it needs ${cls.dropoutV} V.`,
      ),
    );
  }
  if (source)
    trace.add(
      'predrop.pz',
      "Standoff Zener worst power (output shorted, the current source's most current)",
      'Pz = Vz·max(0, Ibias,max − Ifault/β)',
      { Vz: [vz, 'V'], 'Ibias,max': [feed.most(vMax - vz), 'A'], Ifault: [iFault, 'A'], β: [npn ? gain : 1e12, ''] },
      vz * izFault,
      'W',
    );
  else
    trace.add(
      'predrop.pz',
      'Standoff Zener worst power (output shorted)',
      'Pz = Vz·max(0, (vInMax − Vz)/Rb − Ifault/β)',
      {
        Vz: [vz, 'V'],
        vInMax: [vMax, 'V'],
        Rb: [rb, 'Ω'],
        Ifault: [iFault, 'A'],
        β: [npn ? gain : 1e12, ''],
      },
      vz * izFault,
      'W',
    );
  if (zNormal.iz > spec.output.iMin + iDivActual) {
    issues.push(
      blocker(
        'zener-feed',
        `The standoff Zener feeds ${(zNormal.iz * 1e3).toFixed(1)} mA into the output at the highest input, more than the divider and the lightest load draw; the regulator cannot sink it.`,
      ),
    );
    fixes.push({
      code: 'zener-feed',
      change: source
        ? 'a higher minimum load'
        : 'a current source feeding the Zener, a MOSFET pass device (no base current to supply) or a higher minimum load',
      message: `A lightest load of at least ${formatSi(zNormal.iz - iDivActual, 'A', 2)} would absorb the Zener's current.`,
    });
  }
  issues.push(
    caution(
      'no-potentiometer',
      'Never use a potentiometer in this high-voltage feedback path: a wiper that opens drives the output up to the input.',
    ),
  );

  const cinHv = chooseCapacitor(refs.next('C'), 'input-capacitor', 0.1e-6, vMax, catalog);
  const srcRef = source ? refs.next('Q') : '';
  if (cinHv.issue) issues.push(cinHv.issue);
  const regRef = stage.regRef;
  const parts = [
    makePart({
      ref: qRef,
      role: 'pass-transistor',
      part: dev.label,
      ratingV: dev.vMaxV,
      costCents: dev.costCents,
      thermal: { ...thermal, protectedInFault: prot.mode === 'fuse' },
    }),
    makePart({
      ref: dzRef,
      role: 'standoff-zener',
      part: `${zener.label}, biased at ${formatSi(izMin, 'A', 2)} (test current ${formatSi(zLine.iTest, 'A', 2)}), holding ${formatSi(vzWork, 'V', 3)}`,
      value: vz,
      unit: 'V',
      ratingW: zener.powerW,
      tolerance: zener.tolerance,
      costCents: zener.costCents,
      thermal: {
        thetaJcCW: zener.thetaJaCW,
        thetaJaCW: zener.thetaJaCW,
        tjMaxC: zener.tjMaxC,
        heatsinkable: false,
        protectedInFault: false,
      },
    }),
    resistorPart(rsRef, 'sense-resistor', rs, 0.05, 'E24'),
    ...stage.parts,
    resistorPart(rbRef, 'bias-resistor', rb, 0.05, 'E24'),
    makePart({
      ref: q2Ref,
      role: 'limit-transistor',
      part: 'Small-signal NPN, foldback current sense',
      ratingV: vz,
      costCents: catalog.costs.protectionDiodeCents,
    }),
    ...(folds ? [resistorPart(raRef, 'bias-resistor', ra, 0.01, 'E96'), resistorPart(rbfRef, 'bias-resistor', rbf, 0.01, 'E96')] : []),
    cinHv.part,
    // Listed after the sense transistor, so the limiter stays the first limit-transistor.
    ...(source
      ? [
          makePart({
            ref: srcRef,
            role: 'limit-transistor',
            part: `${source.label}, feeding ${dzRef} with ${formatSi(SOURCE_SPREAD.lo * (source.vControlV / rb), 'A', 2)}–${formatSi(SOURCE_SPREAD.hi * (source.vControlV / rb), 'A', 2)} set by ${rbRef}`,
            ratingV: source.vMaxV,
            costCents: source.costCents,
            thermal: {
              thetaJcCW: source.thetaJcCW,
              thetaJaCW: source.thetaJaCW,
              tjMaxC: source.tjMaxC,
              heatsinkable: false,
              protectedInFault: false,
            },
          }),
        ]
      : []),
  ];
  if (prot.mode === 'fuse' && prot.fuseA !== null) {
    issues.push(
      info('fuse-part', `Fit a ${formatSi(prot.fuseA, 'A', 3)} fast-acting fuse rated for ${vMax.toFixed(0)} V DC in the input.`),
    );
  }

  const rz = dynamicImpedance(zener, vz);
  const divW = (vn: number) => (folds ? (vn * vn) / (ra + rbf) : 0);
  const divide = (into: Record<string, PartStress>, vn: number) => {
    if (!folds) return;
    into[raRef] = { w: divW(vn) * (ra / (ra + rbf)), v: vn * (ra / (ra + rbf)) };
    into[rbfRef] = { w: divW(vn) * (rbf / (ra + rbf)), v: vn * (rbf / (ra + rbf)) };
  };
  const operate = (vIn: number, iOut: number): OperatingPoint => {
    const p = pathCurrent(vIn, iOut);
    const vReg = Math.max(0, vs - p.i * rs);
    const vRb = Math.max(0, vIn - vOut - vz);
    const iFb = folds ? regInMax / (ra + rbf) : 0;
    const stress = () => {
      const s: Record<string, PartStress> = stage.stress(regInMax - p.i * rs, iOut);
      const vce = Math.max(0, vIn - regInMax);
      s[regRef] = { w: vReg * p.i, v: vReg };
      s[qRef] = { w: vce * (p.i + iFb), v: vIn - vOut };
      s[rsRef] = { w: p.i * p.i * rs, v: p.i * rs };
      s[rbRef] = { w: feed.resistorW(vRb), v: Math.min(vRb, feed.most(vRb) * rb) };
      if (source) s[srcRef] = { w: feed.sourceW(vRb), v: vRb };
      s[dzRef] = { w: vz * p.iz, v: vz };
      divide(s, regInMax);
      s[q2Ref] = { w: 0, v: vz };
      s[cinHv.part.ref] = { w: 0, v: vIn };
      return s;
    };
    return operatingPoint(
      feed.least(vRb) >= p.ib + zener.kneeCurrentA && vReg >= cls.dropoutV && p.iz <= iOut + iDivActual,
      vIn * (p.i - p.ib + p.iRb + iFb),
      vOut * iOut,
      stress,
    );
  };
  const faultStress: Record<string, PartStress> = stage.faultStress(vs);
  const vRegFault = Math.max(0, vs - iFault * rs);
  const vRbFault = vMax - vz;
  faultStress[regRef] = { w: vRegFault * iFault, v: vRegFault };
  // Foldback: the worst point of the limit line is a state an overload can hold, so it sizes the heatsink.
  faultStress[qRef] = { w: prot.mode === 'foldback' ? prot.worstW : pFault, v: vMax };
  faultStress[rsRef] = { w: iFault * iFault * rs, v: iFault * rs };
  faultStress[rbRef] = { w: feed.resistorW(vRbFault), v: Math.min(vRbFault, feed.most(vRbFault) * rb) };
  if (source) faultStress[srcRef] = { w: feed.sourceW(vRbFault), v: vRbFault };
  faultStress[dzRef] = { w: vz * izFault, v: vz };
  divide(faultStress, vs);
  faultStress[q2Ref] = { w: 0, v: vz };
  faultStress[cinHv.part.ref] = { w: 0, v: vMax };
  const fault: OperatingPoint = { regulates: false, pInW: vMax * (iFault + izFault), pOutW: 0, stress: faultStress };

  // Input ripple reaches the regulator only through the feed and the Zener's rz; a current source
  // is taken as no stiffer than the resistor that would carry its least current at the trough.
  const rFeed = source ? rbDropFor(vz, vOut) / atLeast(feed.least(rbDropFor(vz, vOut)), 1e-9) : rb;
  const rippleAtReg = spec.input.rippleVpp * (rz / (rFeed + rz));
  const psrr = cls.psrrDb;
  const rippleVpp = trace.add(
    'predrop.ripple',
    'Output ripple',
    'ΔVout = ΔVin·rz/(Rb + rz)·10^(−PSRR/20)',
    {
      ΔVin: [spec.input.rippleVpp, 'V'],
      rz: [rz, 'Ω'],
      Rb: [rFeed, 'Ω'],
      PSRR: [psrr, 'dB'],
    },
    rippleAtReg * 10 ** (-psrr / 20),
    'V',
  );
  issues.push(
    info('pass-rating', `${qRef} is rated ${dev.vMaxV} V for a ${vMax} V input and heat-sunk for the worst point of its current limit.`),
  );

  const design: Design & { fixes: Fix[] } = {
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
      [`${qRef}.caseC`]: { value: prot.caseC, unit: '°C' },
      [`${qRef}.thetaCs`]: { value: thermal.thetaCsCW ?? catalog.thermal.thetaCsCW, unit: 'K/W' },
      [`${dzRef}.rz`]: { value: rz, unit: 'Ω' },
      [`${q2Ref}.vbeHot`]: { value: vbeHot, unit: 'V' },
      [`${q2Ref}.vbeCold`]: { value: vbeCold, unit: 'V' },
    },
    fixes,
  };
  const costCents = parts.reduce((n, p) => n + p.costCents, 0);
  return { design, blockers: issues.filter((i) => i.severity === 'blocker').length, costCents };
}

/** Each rated pass device is designed; the cheapest with no blocker wins, else the one with fewest. */
export function designLinearPredrop(ctx: Context): Design {
  // Devices come cheapest first and the first clean design is kept: a dearer device might need a
  // smaller heatsink, but designing every device costs more time than that rare saving is worth.
  const candidates: Candidate[] = [];
  // A current source feeds the standoff Zener where a resistor would push more into the output than it sinks.
  const source =
    ctx.catalog.passDevices.find((d) => d.kind === 'nmos-depletion' && d.vMaxV >= SEMICONDUCTOR_VOLTAGE_FACTOR * ctx.spec.input.vMax) ??
    null;
  for (const dev of passDeviceCandidates(ctx)) {
    const plain = designWith(ctx, dev, null);
    const overfed = plain.design.issues.some((i) => i.code === 'zener-feed');
    const c = overfed && source ? [plain, designWith(ctx, dev, source)].sort((a, b) => a.blockers - b.blockers)[0]! : plain;
    candidates.push(c);
    // Too little input for any standoff is the same for every device.
    if (c.blockers === 0 || c.design.issues.some((i) => i.code === 'headroom' && i.severity === 'blocker')) break;
  }
  return candidates.sort((a, b) => a.blockers - b.blockers || a.costCents - b.costCents)[0]!.design;
}
