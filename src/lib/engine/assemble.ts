// Turns a topology's design into a scored option: corners and fault, ratings, thermal, output
// spread, cautions, curves and sub-scores — the same way for every topology.
import type { Context } from './context.ts';
import { CURVE_POINTS, curveInputs, normalCorners } from './corners.ts';
import { blocker, caution, info, makePart, resistorCents, type Design, type DesignPart, type OperatingPoint } from './design.ts';
import { hazardousVoltage, hotSurfaces, mainsScope, storedEnergy, HOT_RESISTOR_W, type HotPart } from './cautions.ts';
import { RATING_FACTOR, SEMICONDUCTOR_VOLTAGE_FACTOR, ZENER_POWER_W, rateResistor, ratingFor } from './ratings.ts';
import { effectiveWeights, subScores, weightedScore } from './scoring.ts';
import { airflowFactor, assessThermal, enclosureRise, junctionTemperature, powerAtLimit, type ThermalPart } from './thermal.ts';
import type { Trace } from './trace.ts';
import { analyseTolerance, monteCarlo, toleranceVerdict } from './tolerance.ts';
import type { Caution, Component, Fix, Issue, Junction, Option, PartDissipation, TopologyId } from './types.ts';
import type { NoiseClass } from './rail-spec.ts';
import { formatKPerW, formatSi } from './units.ts';

const ZENER_ROLES = new Set(['zener', 'standoff-zener']);
/** Monte Carlo draws for an option that can be built, and for one that is blocked (its histogram is a sketch). */
export const DEFAULT_DRAWS = 10_000;
export const SKETCH_DRAWS = 1_000;
/** Topologies whose output is taken from a switching stage, and the loads that mind it beyond ripple. */
const SWITCHING_OUTPUT = new Set<TopologyId>(['buck', 'boost', 'buck-boost']);
const QUIET_CLASSES = new Set<NoiseClass>(['rf', 'precision']);

function efficiencyOf(p: OperatingPoint): number {
  return p.pInW > 0 ? Math.min(1, Math.max(0, p.pOutW / p.pInW)) : 0;
}

function toComponent(p: DesignPart): Component {
  return {
    ref: p.ref,
    role: p.role,
    value: p.value,
    unit: p.unit,
    ratingW: p.ratingW,
    ratingV: p.ratingV,
    tolerance: p.tolerance,
    part: p.part,
    quantity: p.quantity,
    costCents: p.costCents,
  };
}

/** The cheapest catalog heatsink that fits a thermal budget (K/W, before the airflow factor) once air is forced over it. */
function forcedAirSink(budgetCW: number, ctx: Context): { thetaSaCW: number; costCents: number } | null {
  const limit = budgetCW / ctx.catalog.thermal.airflowFactor['forced-air'];
  return ctx.catalog.heatsinks.find((h) => h.thetaSaCW <= limit) ?? null;
}

interface JunctionFigures {
  ambientC: number;
  power: number;
  airflow: number;
  thetaCs: number;
  beyond: boolean;
}

/** The junction temperature, or past the limit the dissipation the part could carry: never a temperature beyond it. */
function traceJunction(trace: Trace, ref: string, part: ThermalPart, sinkCW: number | null, f: JunctionFigures): void {
  const Ta = [f.ambientC, '°C'] as const;
  const kair = [f.airflow, ''] as const;
  // Only the inputs of the path taken are built.
  const thetas =
    sinkCW === null
      ? { Ta, kair, θJA: [part.thetaJaCW, 'K/W'] as const }
      : { Ta, kair, θJC: [part.thetaJcCW, 'K/W'] as const, θCS: [f.thetaCs, 'K/W'] as const, θSA: [sinkCW, 'K/W'] as const };
  if (f.beyond) {
    const label = `Largest dissipation ${ref} carries within its ${part.tjMaxC} °C limit (it would dissipate ${formatSi(f.power, 'W', 3)})`;
    const theta = sinkCW === null ? part.thetaJaCW * f.airflow : part.thetaJcCW + f.thetaCs + sinkCW * f.airflow;
    const equation =
      sinkCW === null ? 'Plimit = max(0, (Tj,max − Ta)/(θJA·kair))' : 'Plimit = max(0, (Tj,max − Ta)/(θJC + θCS + θSA·kair))';
    trace.add(
      `${ref}.plimit`,
      label,
      equation,
      { ...thetas, 'Tj,max': [part.tjMaxC, '°C'] },
      powerAtLimit(part.tjMaxC, f.ambientC, theta),
      'W',
    );
  } else if (sinkCW === null) {
    trace.add(
      `${ref}.tj`,
      `${ref} junction temperature`,
      'Tj = Ta + P·θJA·kair',
      { ...thetas, P: [f.power, 'W'] },
      junctionTemperature(f.ambientC, f.power, [part.thetaJaCW * f.airflow]),
      '°C',
    );
  } else {
    trace.add(
      `${ref}.tj`,
      `${ref} junction temperature`,
      'Tj = Ta + P·(θJC + θCS + θSA·kair)',
      { ...thetas, P: [f.power, 'W'] },
      junctionTemperature(f.ambientC, f.power, [part.thetaJcCW, f.thetaCs, sinkCW * f.airflow]),
      '°C',
    );
  }
}

export function assemble(design: Design, ctx: Context, seed: number): Option {
  const { spec, catalog } = ctx;
  const issues: Issue[] = [...design.issues];
  const fixes: Fix[] = [...(design.fixes ?? [])];
  const trace = design.trace;
  const corners = normalCorners(spec);
  // The nominal point and the curves' end points repeat corners: each operating point is worked out once.
  const solved = new Map<number, Map<number, OperatingPoint>>();
  const operate = (vIn: number, iOut: number): OperatingPoint => {
    let atVin = solved.get(vIn);
    if (!atVin) {
      atVin = new Map();
      solved.set(vIn, atVin);
    }
    let p = atVin.get(iOut);
    if (!p) {
      p = design.operate(vIn, iOut);
      atVin.set(iOut, p);
    }
    return p;
  };
  const points = corners.map((c) => operate(c.vIn, c.iOut));
  const parts = design.parts.map((p) => ({ ...p }));

  // Worst normal and fault stress of every part. Power comes only from corners where the design
  // regulates: where it does not, the output has collapsed and the currents its model assumes do
  // not flow (such a corner blocks the option below). Voltages are those of every corner.
  const stressOf = (ref: string) => {
    let w = 0;
    let v = 0;
    for (const p of points) {
      const s = p.stress[ref];
      if (s) {
        if (p.regulates) w = Math.max(w, s.w);
        v = Math.max(v, s.v);
      }
    }
    const f = design.fault.stress[ref];
    return { maxW: w, maxV: v, faultW: f?.w ?? 0, faultV: f?.v ?? 0 };
  };
  const stresses = new Map(parts.map((p) => [p.ref, stressOf(p.ref)]));

  // Ratings: twice the worst of normal and fault (common practice).
  for (const p of parts) {
    const s = stresses.get(p.ref)!;
    if (p.rateAsResistor) {
      const r = rateResistor(Math.max(s.maxW, s.faultW), Math.max(s.maxV, s.faultV));
      if (r === null) {
        issues.push(
          blocker(
            'rating',
            `${p.ref} would dissipate ${Math.max(s.maxW, s.faultW).toFixed(1)} W at ${Math.max(s.maxV, s.faultV).toFixed(0)} V; no resistor string in the ratings ladder carries that.`,
          ),
        );
        p.ratingW = null;
      } else {
        p.ratingW = r.ratingW;
        p.ratingV = r.ratingV;
        p.quantity = r.count;
        // A designer's costCents on a resistor is its grade's extra cost per part.
        p.costCents = (resistorCents(ctx.catalog, r.ratingW) + p.costCents) * r.count;
        if (r.count > 1) {
          issues.push(
            caution(
              'resistor-string',
              `${p.ref} is a string of ${r.count} equal resistors (${formatSi((p.value ?? 0) / r.count, 'Ω', 3)} each) so no single resistor exceeds its limiting voltage.`,
            ),
          );
        }
      }
    } else if (ZENER_ROLES.has(p.role) && p.ratingW !== null) {
      const worst = Math.max(s.maxW, s.faultW);
      if (p.ratingW < RATING_FACTOR * worst) {
        const needed = ratingFor(ZENER_POWER_W, worst);
        issues.push(
          blocker(
            'rating',
            `${p.ref} would dissipate ${worst.toFixed(2)} W and needs a ${needed === null ? `${(2 * worst).toFixed(1)} W` : `${needed} W`} Zener; the catalog's largest fitting series is ${p.ratingW} W.`,
          ),
        );
      }
    } else if (
      p.role === 'pass-transistor' &&
      p.ratingV !== null &&
      p.ratingV < SEMICONDUCTOR_VOLTAGE_FACTOR * Math.max(s.maxV, s.faultV)
    ) {
      issues.push(blocker('rating', `${p.ref} is rated ${p.ratingV} V but sees up to ${Math.max(s.maxV, s.faultV).toFixed(0)} V.`));
    }
  }

  // Efficiency and dissipation.
  const nominal = operate(spec.input.vNom, spec.output.iTyp);
  const effNominal = efficiencyOf(nominal);
  let effWorst = 1;
  let totalMaxW = 0;
  points.forEach((p, k) => {
    if (corners[k]!.iOut > 0) effWorst = Math.min(effWorst, efficiencyOf(p));
    totalMaxW = Math.max(totalMaxW, p.pInW - p.pOutW);
  });
  if (nominal.pInW > 0) {
    trace.add(
      'efficiency.nominal',
      'Efficiency at the nominal corner',
      'η = min(1, max(0, Pout/Pin))',
      { Pout: [nominal.pOutW, 'W'], Pin: [nominal.pInW, 'W'] },
      effNominal,
      '',
    );
  } else {
    trace.select(
      'efficiency.nominal',
      'Efficiency at the nominal corner (the design draws no input power there)',
      'η = 0',
      {},
      effNominal,
      '',
    );
  }
  trace.select('efficiency.worst', 'Lowest efficiency over the loaded corners', 'η = min(Pout / Pin)', {}, effWorst, '');
  trace.select('dissipation.total', 'Largest total dissipation over the corners', 'P = max(Pin − Pout)', {}, totalMaxW, 'W');

  // Thermal: each part with a junction, at its worst normal dissipation, or the fault one when
  // nothing protects it in a short; inside an enclosure its ambient is the box's inside air.
  const airflow = airflowFactor(spec, catalog);
  const box = enclosureRise(spec, totalMaxW);
  const ambientC = box === null ? ctx.ambientC : ctx.roomC + box.riseK;
  if (box !== null) {
    const { P, Pother, k, A, ρcp, V̇ } = box.inputs;
    trace.add(
      'enclosure.rise',
      'Inside air rise of the enclosure (steady heat balance: surface k·A after IEC TR 60890, plus the fan’s air ρ·cp·V̇)',
      'ΔT = (P + Pother)/(k·A + ρcp·V̇)',
      {
        P: [P, 'W'],
        Pother: [Pother, 'W'],
        k: [k, 'W/(m²·K)'],
        A: [A, 'm²'],
        ρcp: [ρcp, 'J/(m³·K)'],
        V̇: [V̇, 'm³/s'],
      },
      box.riseK,
      'K',
    );
    issues.push(
      info(
        'enclosure',
        `Inside the enclosure the air runs ${box.riseK.toFixed(1)} K above the room with ${(P + Pother).toFixed(2)} W dissipated in it: every part is rated at ${ambientC.toFixed(1)} °C ambient.`,
      ),
    );
  }
  const junctions: Junction[] = [];
  const surfaces: HotPart[] = [];
  const sinks: DesignPart[] = [];
  let heatsinkRequired = false;
  let impractical = false;
  let maxThetaSa: number | null = null;
  let margin = 1;
  for (const p of parts) {
    if (!p.thermal) continue;
    const s = stresses.get(p.ref)!;
    const power = Math.max(s.maxW, p.thermal.protectedInFault ? 0 : s.faultW);
    const forcedSink = spec.overrides.heatsinkThetaSaCW;
    const t = assessThermal(p.thermal, power, ambientC, airflow, catalog, p.thermal.heatsinkable ? forcedSink : undefined);
    const limitC = p.thermal.tjMaxC;
    const beyond = t.tjC > limitC;
    traceJunction(trace, p.ref, p.thermal, t.sinkThetaCW, {
      ambientC,
      power,
      airflow,
      thetaCs: p.thermal.thetaCsCW ?? catalog.thermal.thetaCsCW,
      beyond,
    });
    junctions.push({ ref: p.ref, tjC: Math.min(t.tjC, limitC), tjMaxC: limitC, heatsink: t.sinkThetaCW !== null, beyondLimit: beyond });
    surfaces.push({
      ref: t.sinkThetaCW === null ? p.ref : `heatsink of ${p.ref}`,
      surfaceC: Math.min(t.surfaceC, limitC),
      beyondLimitC: t.surfaceC > limitC ? limitC : null,
    });
    margin = Math.min(margin, (limitC - t.tjC) / Math.max(1, limitC - ambientC));
    if (t.maxThetaSaCW !== null) {
      maxThetaSa = maxThetaSa === null ? t.maxThetaSaCW : Math.min(maxThetaSa, t.maxThetaSaCW);
      trace.add(
        `${p.ref}.thetasa`,
        `Largest heatsink θSA for ${p.ref} (the sink's θSA scales with the airflow factor kair)`,
        'θSA,max = ((Tj,max − margin − Ta)/P − θJC − θCS)/kair',
        {
          'Tj,max': [limitC, '°C'],
          margin: [catalog.thermal.tjMarginK, 'K'],
          Ta: [ambientC, '°C'],
          P: [power, 'W'],
          θJC: [p.thermal.thetaJcCW, 'K/W'],
          θCS: [p.thermal.thetaCsCW ?? catalog.thermal.thetaCsCW, 'K/W'],
          kair: [airflow, ''],
        },
        t.maxThetaSaCW,
        'K/W',
      );
    }
    if (t.sinkThetaCW !== null) {
      heatsinkRequired = true;
      sinks.push(
        makePart({
          ref: `HS${sinks.length + 1}`,
          role: 'heatsink',
          part: `Heatsink for ${p.ref}`,
          value: t.sinkThetaCW,
          unit: 'K/W',
          costCents: t.sinkCostCents,
        }),
      );
    }
    // Text only for a part with a problem to report.
    const at = t.problem === 'too-hot' || t.problem === 'no-sink-fits' ? formatSi(power, 'W', 3) : '';
    if (t.problem === 'too-hot') {
      const why =
        t.sinkThetaCW !== null ? ` even on the ${t.sinkThetaCW} K/W heatsink` : p.thermal.heatsinkable ? '' : ' and cannot take a heatsink';
      issues.push(blocker('thermal', `${p.ref} would be beyond its ${limitC} °C limit at ${at}${why}.`));
    }
    if (t.problem === 'no-sink-fits') {
      issues.push(
        blocker(
          'heatsink',
          t.maxThetaSaCW === null
            ? `${p.ref} dissipates ${at}: no heatsink is good enough (needs < 0 K/W: its own θJC and the interface θCS already take it past ${limitC - catalog.thermal.tjMarginK} °C).`
            : `${p.ref} dissipates ${at} and needs θSA ≤ ${formatKPerW(t.maxThetaSaCW)}, beyond any heatsink in the catalog.`,
        ),
      );
      const fan = t.maxThetaSaCW === null ? null : forcedAirSink(t.maxThetaSaCW * airflow, ctx);
      if (fan !== null && spec.thermal.airflow !== 'forced-air') {
        fixes.push({
          code: 'heatsink',
          change: `forced air over ${p.ref}'s heatsink`,
          costCents: fan.costCents,
          message: `With forced air the ${fan.thetaSaCW} K/W catalog heatsink keeps ${p.ref} within its design limit (the sink's θSA counts ×${catalog.thermal.airflowFactor['forced-air']}); the fan itself is not priced.`,
        });
      }
    }
    if (t.problem === 'impractical') {
      impractical = true;
      issues.push(
        caution(
          'heatsink-impractical',
          `${p.ref} needs a heatsink of θSA ≤ ${formatKPerW(t.maxThetaSaCW ?? 0)}: impractical heatsink (large, costly or fan-cooled).`,
        ),
      );
    }
  }

  const failing = corners.find((_corner, k) => !points[k]!.regulates);
  if (failing && !issues.some((i) => i.severity === 'blocker')) {
    issues.push(blocker('corner', `The design does not regulate at ${failing.vIn} V in and ${failing.iOut} A out.`));
  }

  // Output spread: extreme values over the tolerance box, Monte Carlo inside it, ripple on top.
  const band = { lo: spec.output.v * (1 - spec.output.tolerance), hi: spec.output.v * (1 + spec.output.tolerance) };
  const spread = analyseTolerance(design.output);
  const eva = spread.worstCase;
  const half = design.rippleVpp / 2;
  // A positive rail collapses to 0 V at worst; it never reverses.
  const vOutRange = { min: Math.max(0, eva.min - half), max: Math.max(0, eva.max + half) };
  trace.select(
    'vout.min',
    'Lowest output (extreme values, less half the ripple; never below 0 V)',
    'Vmin = max(0, min over tolerance corners − ΔV/2)',
    { ΔV: [design.rippleVpp, 'V'] },
    vOutRange.min,
    'V',
  );
  trace.select(
    'vout.max',
    'Highest output (extreme values, plus half the ripple)',
    'Vmax = max over tolerance corners + ΔV/2',
    { ΔV: [design.rippleVpp, 'V'] },
    vOutRange.max,
    'V',
  );
  const rule = spec.overrides.toleranceRule ?? 'statistical';
  const verdict = toleranceVerdict(spread, band, rule, half);
  const bandText = `${band.lo.toFixed(3)}–${band.hi.toFixed(3)} V`;
  const worstText = `${vOutRange.min.toFixed(3)}–${vOutRange.max.toFixed(3)} V`;
  const sigmaText = verdict === 'worst-case' ? '' : `mean ${spread.mean.toFixed(3)} V ± 3σ (σ = ${formatSi(spread.sigma, 'V', 3)})`;
  if (verdict === 'fails') {
    issues.push(blocker('tolerance', `The worst-case output ${worstText} leaves the rail's ${bandText}.`));
    if (rule === 'worst-case' && toleranceVerdict(spread, band, 'statistical', half) === 'statistical') {
      fixes.push({
        code: 'tolerance',
        change: 'accept the statistical rule (±3σ)',
        message: `The statistical spread, ${sigmaText}, fits the rail's ${bandText}: with the statistical rule the option is feasible with a caution.`,
      });
    }
  }
  if (design.rippleVpp > spec.noise.maxRippleVpp) {
    issues.push(
      blocker(
        'ripple',
        `The output ripple ${(design.rippleVpp * 1e3).toFixed(2)} mV exceeds the rail's ${(spec.noise.maxRippleVpp * 1e3).toFixed(2)} mV limit.`,
      ),
    );
  }

  // Cautions.
  const components = [...parts, ...sinks];
  const caps = parts
    .filter((p) => p.unit === 'F' && p.value !== null)
    .map((p) => {
      const s = stresses.get(p.ref)!;
      return { ref: p.ref, farads: p.value ?? 0, volts: Math.max(s.maxV, s.faultV) };
    });
  const hotResistors = parts.filter((p) => p.rateAsResistor && stresses.get(p.ref)!.maxW > HOT_RESISTOR_W).map((p) => p.ref);
  const cautions: Caution[] = [
    hazardousVoltage(spec, vOutRange.max),
    ...storedEnergy(caps),
    hotSurfaces(surfaces, hotResistors),
    mainsScope(spec),
  ].filter((c): c is Caution => c !== null);
  for (const c of cautions) issues.push({ code: c.code, severity: 'caution', message: c.message });

  // Curves for the charts.
  const curveLoad = spec.output.iTyp > 0 ? spec.output.iTyp : spec.output.iMax;
  const vIns = curveInputs(spec);
  const efficiency: (number | null)[] = new Array<number | null>(CURVE_POINTS);
  const dissipationW: (number | null)[] = new Array<number | null>(CURVE_POINTS);
  vIns.forEach((vIn, k) => {
    const typ = operate(vIn, curveLoad);
    const max = operate(vIn, spec.output.iMax);
    efficiency[k] = typ.regulates ? efficiencyOf(typ) : null;
    dissipationW[k] = max.regulates ? max.pInW - max.pOutW : null;
  });

  const dissipation: PartDissipation[] = parts.map((p) => {
    const s = stresses.get(p.ref)!;
    return { ref: p.ref, role: p.role, maxW: s.maxW, faultW: s.faultW };
  });
  const partCount = components.reduce((n, p) => n + p.quantity, 0);
  const costCents = components.reduce((n, p) => n + p.costCents, 0);
  const sub = subScores({
    pOutNominalW: nominal.pOutW,
    lossNominalW: nominal.pInW - nominal.pOutW,
    pOutMaxW: spec.output.v * spec.output.iMax,
    lossMaxW: totalMaxW,
    source: spec.input.source,
    thermalMargin: margin,
    heatsinkRequired,
    heatsinkImpractical: impractical,
    partCount,
    rippleVpp: design.rippleVpp,
    rippleLimitVpp: spec.noise.maxRippleVpp,
    switchingOutputOnQuietRail: SWITCHING_OUTPUT.has(design.topology) && QUIET_CLASSES.has(spec.noise.class),
    costCents,
  });

  // The Monte Carlo decides nothing (the analytic spread does), so a blocked option gets a sketch.
  const feasible = !issues.some((i) => i.severity === 'blocker');
  const requested = spec.overrides.mcDraws ?? DEFAULT_DRAWS;
  const draws = feasible ? requested : Math.min(requested, SKETCH_DRAWS);
  // The ripple rides on every draw, so the draw itself must sit half the ripple inside the band.
  const mc = monteCarlo(design.output, draws, seed, { lo: band.lo + half, hi: band.hi - half }, eva);
  const tolerance = {
    worstCase: vOutRange,
    statistical: { sigma: spread.sigma, yield: mc.fractionInTolerance },
    rule: verdict === 'worst-case' ? ('worst-case' as const) : rule,
  };
  if (verdict === 'statistical') {
    issues.push(
      caution(
        'tolerance-statistical',
        `The worst-case output ${worstText} leaves the rail's ${bandText}; the statistical spread, ${sigmaText} plus half the ripple, stays inside (Monte Carlo yield ${(mc.fractionInTolerance * 100).toFixed(2)} %). A few units in a large batch may fall outside: test each, or require the worst-case rule.`,
      ),
    );
  }
  return {
    topology: design.topology,
    label: design.label,
    feasible,
    score: feasible ? weightedScore(sub, effectiveWeights(spec.weights, spec)) : null,
    subScores: sub,
    issues,
    fixes,
    efficiency: { nominal: effNominal, worst: effWorst },
    dissipation: { totalMaxW, parts: dissipation },
    heatsink: { required: heatsinkRequired, maxThetaSaCW: maxThetaSa },
    junctions,
    partCount,
    costCents,
    outputRippleVpp: design.rippleVpp,
    vOutRange,
    tolerance,
    monteCarlo: mc,
    components: components.map(toComponent),
    curves: { vIn: vIns, efficiency, dissipationW },
    cautions,
    assumptions: design.assumptions,
    trace: trace.entries,
  };
}
