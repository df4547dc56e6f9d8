// Turns a topology's design into a scored option: corners and fault, ratings, thermal, output
// spread, cautions, curves and sub-scores — the same way for every topology.
import type { Context } from './context.ts';
import { CURVE_POINTS, curveInputs, normalCorners } from './corners.ts';
import { blocker, caution, makePart, type Design, type DesignPart, type OperatingPoint } from './design.ts';
import { hazardousVoltage, hotSurfaces, mainsScope, storedEnergy, HOT_RESISTOR_W, type HotPart } from './cautions.ts';
import { RATING_FACTOR, SEMICONDUCTOR_VOLTAGE_FACTOR, ZENER_POWER_W, rateResistor, ratingFor } from './ratings.ts';
import { subScores, weightedScore } from './scoring.ts';
import { airflowFactor, assessThermal } from './thermal.ts';
import { analyseTolerance, monteCarlo, toleranceVerdict } from './tolerance.ts';
import type { Caution, Component, Fix, Issue, Junction, Option, PartDissipation } from './types.ts';
import { formatSi } from './units.ts';

const ZENER_ROLES = new Set(['zener', 'standoff-zener']);

function efficiencyOf(p: OperatingPoint): number {
  return p.pInW > 0 ? Math.min(1, Math.max(0, p.pOutW / p.pInW)) : 0;
}

function resistorCents(ctx: Context, ratingW: number): number {
  const row = ctx.catalog.costs.resistorCentsByW.find((r) => r.w >= ratingW);
  return (row ?? ctx.catalog.costs.resistorCentsByW[ctx.catalog.costs.resistorCentsByW.length - 1]!).cents;
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

export function assemble(design: Design, ctx: Context, seed: number): Option {
  const { spec, catalog } = ctx;
  const issues: Issue[] = [...design.issues];
  const fixes: Fix[] = [...(design.fixes ?? [])];
  const trace = design.trace;
  const corners = normalCorners(spec);
  const points = corners.map((c) => design.operate(c.vIn, c.iOut));
  const parts = design.parts.map((p) => ({ ...p }));

  // Worst normal and fault stress of every part.
  const stressOf = (ref: string) => {
    let w = 0;
    let v = 0;
    for (const p of points) {
      const s = p.stress[ref];
      if (s) {
        w = Math.max(w, s.w);
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
        issues.push(blocker('rating', `${p.ref} would dissipate ${Math.max(s.maxW, s.faultW).toFixed(1)} W at ${Math.max(s.maxV, s.faultV).toFixed(0)} V; no resistor string in the ratings ladder carries that.`));
        p.ratingW = null;
      } else {
        p.ratingW = r.ratingW;
        p.ratingV = r.ratingV;
        p.quantity = r.count;
        // A designer's costCents on a resistor is its grade's extra cost per part.
        p.costCents = (resistorCents(ctx, r.ratingW) + p.costCents) * r.count;
        if (r.count > 1) {
          issues.push(caution('resistor-string', `${p.ref} is a string of ${r.count} equal resistors (${((p.value ?? 0) / r.count).toPrecision(3)} Ω each) so no single resistor exceeds its limiting voltage.`));
        }
      }
    } else if (ZENER_ROLES.has(p.role) && p.ratingW !== null) {
      const worst = Math.max(s.maxW, s.faultW);
      if (p.ratingW < RATING_FACTOR * worst) {
        const needed = ratingFor(ZENER_POWER_W, worst);
        issues.push(
          blocker('rating', `${p.ref} would dissipate ${worst.toFixed(2)} W and needs a ${needed === null ? `${(2 * worst).toFixed(1)} W` : `${needed} W`} Zener; the catalog's largest fitting series is ${p.ratingW} W.`),
        );
      }
    } else if (p.role === 'pass-transistor' && p.ratingV !== null && p.ratingV < SEMICONDUCTOR_VOLTAGE_FACTOR * Math.max(s.maxV, s.faultV)) {
      issues.push(blocker('rating', `${p.ref} is rated ${p.ratingV} V but sees up to ${Math.max(s.maxV, s.faultV).toFixed(0)} V.`));
    }
  }

  // Thermal: each part with a junction, at its worst normal dissipation, or the fault one when
  // nothing protects it in a short.
  const airflow = airflowFactor(spec, catalog);
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
    const t = assessThermal(p.thermal, power, ctx.ambientC, airflow, catalog, p.thermal.heatsinkable ? forcedSink : undefined);
    trace.add(`${p.ref}.tj`, `${p.ref} junction temperature`, t.sinkThetaCW === null ? 'Tj = Ta + P·θJA' : 'Tj = Ta + P·(θJC + θCS + θSA)', {
      Ta: [ctx.ambientC, '°C'], P: [power, 'W'], θJA: [p.thermal.thetaJaCW * airflow, 'K/W'], θJC: [p.thermal.thetaJcCW, 'K/W'], θSA: [(t.sinkThetaCW ?? 0) * airflow, 'K/W'],
    }, t.tjC, '°C');
    junctions.push({ ref: p.ref, tjC: t.tjC, tjMaxC: p.thermal.tjMaxC, heatsink: t.sinkThetaCW !== null });
    surfaces.push({ ref: t.sinkThetaCW === null ? p.ref : `heatsink of ${p.ref}`, surfaceC: t.surfaceC });
    margin = Math.min(margin, (p.thermal.tjMaxC - t.tjC) / Math.max(1, p.thermal.tjMaxC - ctx.ambientC));
    if (t.maxThetaSaCW !== null) {
      maxThetaSa = maxThetaSa === null ? t.maxThetaSaCW : Math.min(maxThetaSa, t.maxThetaSaCW);
      trace.add(`${p.ref}.thetasa`, `Largest heatsink θSA for ${p.ref}`, 'θSA,max = (Tj,max − margin − Ta)/P − θJC − θCS', {
        'Tj,max': [p.thermal.tjMaxC, '°C'], margin: [catalog.thermal.tjMarginK, 'K'], Ta: [ctx.ambientC, '°C'], P: [power, 'W'], θJC: [p.thermal.thetaJcCW, 'K/W'], θCS: [catalog.thermal.thetaCsCW, 'K/W'],
      }, t.maxThetaSaCW, 'K/W');
    }
    if (t.sinkThetaCW !== null) {
      heatsinkRequired = true;
      sinks.push(makePart({ ref: `HS${sinks.length + 1}`, role: 'heatsink', part: `Heatsink for ${p.ref}`, value: t.sinkThetaCW, unit: 'K/W', costCents: t.sinkCostCents }));
    }
    if (t.problem === 'too-hot') issues.push(blocker('thermal', `${p.ref} would reach ${t.tjC.toFixed(0)} °C (limit ${p.thermal.tjMaxC} °C)${p.thermal.heatsinkable ? '' : ' and cannot take a heatsink'}.`));
    if (t.problem === 'no-sink-fits') {
      issues.push(blocker('heatsink', `${p.ref} dissipates ${power.toFixed(1)} W and needs θSA ≤ ${(t.maxThetaSaCW ?? 0).toFixed(2)} K/W, beyond any heatsink in the catalog.`));
    }
    if (t.problem === 'impractical') {
      impractical = true;
      issues.push(caution('heatsink-impractical', `${p.ref} needs a heatsink of θSA ≤ ${(t.maxThetaSaCW ?? 0).toFixed(2)} K/W: impractical heatsink (large, costly or fan-cooled).`));
    }
  }

  // Efficiency and dissipation.
  const nominal = design.operate(spec.input.vNom, spec.output.iTyp);
  const effNominal = efficiencyOf(nominal);
  let effWorst = 1;
  let totalMaxW = 0;
  points.forEach((p, k) => {
    if (corners[k]!.iOut > 0) effWorst = Math.min(effWorst, efficiencyOf(p));
    totalMaxW = Math.max(totalMaxW, p.pInW - p.pOutW);
  });
  trace.add('efficiency.nominal', 'Efficiency at the nominal corner', 'η = Pout / Pin', { Pout: [nominal.pOutW, 'W'], Pin: [nominal.pInW, 'W'] }, effNominal, '');
  trace.add('efficiency.worst', 'Lowest efficiency over the loaded corners', 'η = min(Pout / Pin)', {}, effWorst, '');
  trace.add('dissipation.total', 'Largest total dissipation over the corners', 'P = max(Pin − Pout)', {}, totalMaxW, 'W');
  const failing = corners.find((_corner, k) => !points[k]!.regulates);
  if (failing && !issues.some((i) => i.severity === 'blocker')) {
    issues.push(blocker('corner', `The design does not regulate at ${failing.vIn} V in and ${failing.iOut} A out.`));
  }

  // Output spread: extreme values over the tolerance box, Monte Carlo inside it, ripple on top.
  const band = { lo: spec.output.v * (1 - spec.output.tolerance), hi: spec.output.v * (1 + spec.output.tolerance) };
  const spread = analyseTolerance(design.output);
  const eva = spread.worstCase;
  const half = design.rippleVpp / 2;
  const vOutRange = { min: eva.min - half, max: eva.max + half };
  trace.add('vout.min', 'Lowest output (extreme values, less half the ripple)', 'Vmin = min over tolerance corners − ΔV/2', { ΔV: [design.rippleVpp, 'V'] }, vOutRange.min, 'V');
  trace.add('vout.max', 'Highest output (extreme values, plus half the ripple)', 'Vmax = max over tolerance corners + ΔV/2', { ΔV: [design.rippleVpp, 'V'] }, vOutRange.max, 'V');
  const draws = spec.overrides.mcDraws ?? 10_000;
  // The ripple rides on every draw, so the draw itself must sit half the ripple inside the band.
  const mc = monteCarlo(design.output, draws, seed, { lo: band.lo + half, hi: band.hi - half }, eva);
  const rule = spec.overrides.toleranceRule ?? 'statistical';
  const verdict = toleranceVerdict(spread, band, rule, half);
  const tolerance = {
    worstCase: vOutRange,
    statistical: { sigma: spread.sigma, yield: mc.fractionInTolerance },
    rule: verdict === 'worst-case' ? ('worst-case' as const) : rule,
  };
  const bandText = `${band.lo.toFixed(3)}–${band.hi.toFixed(3)} V`;
  const worstText = `${vOutRange.min.toFixed(3)}–${vOutRange.max.toFixed(3)} V`;
  const sigmaText = `mean ${spread.mean.toFixed(3)} V ± 3σ (σ = ${formatSi(spread.sigma, 'V', 3)})`;
  if (verdict === 'statistical') {
    issues.push(
      caution('tolerance-statistical', `The worst-case output ${worstText} leaves the rail's ${bandText}; the statistical spread, ${sigmaText} plus half the ripple, stays inside (Monte Carlo yield ${(mc.fractionInTolerance * 100).toFixed(2)} %). A few units in a large batch may fall outside: test each, or require the worst-case rule.`),
    );
  } else if (verdict === 'fails') {
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
    issues.push(blocker('ripple', `The output ripple ${(design.rippleVpp * 1e3).toFixed(2)} mV exceeds the rail's ${(spec.noise.maxRippleVpp * 1e3).toFixed(2)} mV limit.`));
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
    const typ = design.operate(vIn, curveLoad);
    const max = design.operate(vIn, spec.output.iMax);
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
    efficiencyNominal: effNominal,
    efficiencyWorst: effWorst,
    totalMaxW,
    thermalMargin: margin,
    heatsinkRequired,
    heatsinkImpractical: impractical,
    partCount,
    rippleVpp: design.rippleVpp,
    rippleLimitVpp: spec.noise.maxRippleVpp,
    costCents,
  });

  const feasible = !issues.some((i) => i.severity === 'blocker');
  return {
    topology: design.topology,
    label: design.label,
    feasible,
    score: feasible ? weightedScore(sub, spec.weights) : null,
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
