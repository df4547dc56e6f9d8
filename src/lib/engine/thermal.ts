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

/** θSA,max = (Tj,design − Ta)/P − θJC − θCS; Infinity-free: null when the part dissipates nothing. */
export function maxSinkTheta(tjDesignC: number, ambientC: number, powerW: number, thetaJcCW: number, thetaCsCW: number): number | null {
  if (!(powerW > 0)) return null;
  return (tjDesignC - ambientC) / powerW - thetaJcCW - thetaCsCW;
}

/** Below about 1 K/W a heatsink is large, costly or needs a fan (common practice). */
export const IMPRACTICAL_SINK_CW = 1;

export interface ThermalPart {
  thetaJcCW: number;
  thetaJaCW: number;
  tjMaxC: number;
  heatsinkable: boolean;
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
  const thetaCs = catalog.thermal.thetaCsCW;
  const bare = junctionTemperature(ambientC, powerW, [part.thetaJaCW * airflow]);
  const withSink = (sink: number) => junctionTemperature(ambientC, powerW, [part.thetaJcCW, thetaCs, sink * airflow]);
  const sinkSurface = (sink: number) => ambientC + powerW * sink * airflow;
  if (forcedSinkCW !== undefined && part.heatsinkable && powerW > 0) {
    const tj = withSink(forcedSinkCW);
    const limit = maxSinkTheta(tjDesign, ambientC, powerW, part.thetaJcCW, thetaCs);
    return {
      tjC: tj,
      sinkThetaCW: forcedSinkCW,
      sinkCostCents: sinkCost(catalog, forcedSinkCW),
      maxThetaSaCW: limit === null ? null : limit / airflow,
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
  const limit = (maxSinkTheta(tjDesign, ambientC, powerW, part.thetaJcCW, thetaCs) ?? 0) / airflow;
  // The catalog lists heatsinks from small to large; the first that meets the limit is the cheapest.
  const sink = catalog.heatsinks.find((h) => h.thetaSaCW <= limit);
  if (!sink) {
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
