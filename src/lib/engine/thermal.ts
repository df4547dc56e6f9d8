// Thermal resistance chain after the JEDEC JESD51 definitions: θJA junction-to-ambient,
// θJC junction-to-case, θCS case-to-sink (interface), θSA sink-to-ambient.
import type { Catalog } from './catalog.ts';
import type { RailSpec } from './rail-spec.ts';

/** Tj = Ta + P·Σθ. */
export function junctionTemperature(ambientC: number, powerW: number, thetasCW: readonly number[]): number {
  let sum = 0;
  for (const t of thetasCW) sum += t;
  return ambientC + powerW * sum;
}

/**
 * θSA,max = ((Tj,design − Ta)/P − θJC − θCS)/k, k the airflow factor the sink's θSA is scaled by.
 * Null when the part dissipates nothing, or when no heatsink can work (the budget is spent before
 * the sink: a θSA at or below zero does not exist).
 */
export function maxSinkTheta(
  tjDesignC: number,
  ambientC: number,
  powerW: number,
  thetaJcCW: number,
  thetaCsCW: number,
  airflow: number,
): number | null {
  if (!(powerW > 0)) return null;
  const theta = ((tjDesignC - ambientC) / powerW - thetaJcCW - thetaCsCW) / airflow;
  return theta > 0 ? theta : null;
}

/** The dissipation at which a junction reaches its limit through the thermal resistance θ, W (never negative). */
export function powerAtLimit(tjMaxC: number, ambientC: number, thetaCW: number): number {
  return Math.max(0, (tjMaxC - ambientC) / thetaCW);
}

/**
 * Heat-transfer coefficient of an enclosure's outer surface to still room air (convection and
 * radiation together), W/(m²·K): about 5.5 for painted sheet metal as IEC TR 60890 takes it, and
 * lower for plastic (from memory).
 */
export const ENCLOSURE_K_W_M2K = { metal: 5.5, plastic: 3.5 } as const;
/** Volumetric heat capacity of air near room temperature, ρ·cp ≈ 1.2 kg/m³ × 1005 J/(kg·K) (common practice). */
export const AIR_RHO_CP_J_M3K = 1206;

export interface EnclosureRise {
  riseK: number;
  /** The figures of ΔT = (P + Pother)/(k·A + ρcp·V̇), in SI units. */
  inputs: { P: number; Pother: number; k: number; A: number; ρcp: number; V̇: number };
}

/**
 * Inside air rise of the box the supply sits in, from a steady heat balance: everything dissipated
 * inside leaves through the surface (k·A·ΔT) and with the fan's air (ρ·cp·V̇·ΔT). Null without an
 * enclosure in the spec.
 */
export function enclosureRise(spec: RailSpec, dissipationW: number): EnclosureRise | null {
  const box = spec.thermal.enclosure;
  if (!box) return null;
  const inputs = {
    P: Math.max(0, dissipationW),
    Pother: box.otherW,
    k: ENCLOSURE_K_W_M2K[box.material],
    A: box.surfaceCm2 * 1e-4,
    ρcp: AIR_RHO_CP_J_M3K,
    V̇: spec.thermal.airflow === 'forced-air' && box.fanFlowM3h !== undefined ? box.fanFlowM3h / 3600 : 0,
  };
  return { riseK: (inputs.P + inputs.Pother) / (inputs.k * inputs.A + inputs.ρcp * inputs.V̇), inputs };
}

/** Below about 1 K/W a heatsink is large, costly or needs a fan (common practice). */
export const IMPRACTICAL_SINK_CW = 1;

export interface ThermalPart {
  thetaJcCW: number;
  thetaJaCW: number;
  tjMaxC: number;
  heatsinkable: boolean;
  /** Case-to-sink interface when it is not the catalog's greased one (an insulating pad under a live tab). */
  thetaCsCW?: number;
}

export interface ThermalResult {
  tjC: number;
  /** Heatsink fitted (catalog θSA, K/W) or null. */
  sinkThetaCW: number | null;
  sinkCostCents: number;
  /** Largest θSA that keeps Tj at the design limit, when a heatsink is needed. */
  maxThetaSaCW: number | null;
  /** Surface temperature a hand could touch: the heatsink, or the part itself. */
  surfaceC: number;
  problem: 'none' | 'too-hot' | 'impractical' | 'no-sink-fits';
}

/** Air and enclosure change the convective part of θJA and θSA (typical factors from the catalog). */
export function airflowFactor(spec: RailSpec, catalog: Catalog): number {
  return catalog.thermal.airflowFactor[spec.thermal.airflow];
}

/**
 * Junction temperature of one part, fitting the smallest adequate heatsink when the part would
 * pass Tj,design = Tj,max − margin (common practice 25 K) on its own.
 */
export function assessThermal(
  part: ThermalPart,
  powerW: number,
  ambientC: number,
  airflow: number,
  catalog: Catalog,
  forcedSinkCW: number | undefined,
): ThermalResult {
  const tjDesign = part.tjMaxC - catalog.thermal.tjMarginK;
  const thetaCs = part.thetaCsCW ?? catalog.thermal.thetaCsCW;
  const bare = junctionTemperature(ambientC, powerW, [part.thetaJaCW * airflow]);
  const withSink = (sink: number) => junctionTemperature(ambientC, powerW, [part.thetaJcCW, thetaCs, sink * airflow]);
  const sinkSurface = (sink: number) => ambientC + powerW * sink * airflow;
  const limit = maxSinkTheta(tjDesign, ambientC, powerW, part.thetaJcCW, thetaCs, airflow);
  if (forcedSinkCW !== undefined && part.heatsinkable && powerW > 0) {
    const tj = withSink(forcedSinkCW);
    return {
      tjC: tj,
      sinkThetaCW: forcedSinkCW,
      sinkCostCents: sinkCost(catalog, forcedSinkCW),
      maxThetaSaCW: limit,
      surfaceC: sinkSurface(forcedSinkCW),
      problem: tj > part.tjMaxC ? 'too-hot' : 'none',
    };
  }
  if (bare <= tjDesign) {
    return { tjC: bare, sinkThetaCW: null, sinkCostCents: 0, maxThetaSaCW: null, surfaceC: bare, problem: 'none' };
  }
  if (!part.heatsinkable) {
    return { tjC: bare, sinkThetaCW: null, sinkCostCents: 0, maxThetaSaCW: null, surfaceC: bare, problem: 'too-hot' };
  }
  // The catalog lists heatsinks from small to large; the first that meets the limit is the cheapest.
  const sink = limit === null ? undefined : catalog.heatsinks.find((h) => h.thetaSaCW <= limit);
  if (!sink || limit === null) {
    return { tjC: bare, sinkThetaCW: null, sinkCostCents: 0, maxThetaSaCW: limit, surfaceC: bare, problem: 'no-sink-fits' };
  }
  return {
    tjC: withSink(sink.thetaSaCW),
    sinkThetaCW: sink.thetaSaCW,
    sinkCostCents: sink.costCents,
    maxThetaSaCW: limit,
    surfaceC: sinkSurface(sink.thetaSaCW),
    problem: limit < IMPRACTICAL_SINK_CW ? 'impractical' : 'none',
  };
}

function sinkCost(catalog: Catalog, thetaCW: number): number {
  const fitting = catalog.heatsinks.find((h) => h.thetaSaCW <= thetaCW);
  return (fitting ?? catalog.heatsinks[catalog.heatsinks.length - 1]!).costCents;
}
