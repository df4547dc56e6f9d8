// Safe operating area of a high-voltage pass device: the catalog's DC hint at a 25 °C case,
// derated to the case temperature, widened for single pulses shorter than the package's thermal
// time constant, and used with a stated margin.
import type { PassDeviceClass } from '../catalog.ts';

/** Case temperature at which data-sheet SOA curves are drawn, °C. */
export const SOA_CASE_C = 25;
/** Share of the derated SOA a design may use (common practice: 80 %). */
export const SOA_MARGIN = 0.8;

/** DC SOA hint at a 25 °C case: full power to the knee, then a log-log fall to the power allowed at Vmax. */
export function soaAllowedW(dev: PassDeviceClass, vce: number): number {
  if (vce <= dev.soaKneeV) return dev.soaPowerW;
  const slope = Math.log(dev.soaPowerAtVMaxW / dev.soaPowerW) / Math.log(dev.vMaxV / dev.soaKneeV);
  return dev.soaPowerW * (Math.min(vce, dev.vMaxV) / dev.soaKneeV) ** slope;
}

/**
 * SOA derated linearly to nothing at Tj,max as the case warms (the usual data-sheet derating
 * line), times the design margin. Clamped at zero: a case at Tj,max carries nothing.
 */
export function soaDeratedW(dev: PassDeviceClass, vce: number, caseC: number): number {
  const factor = Math.min(1, Math.max(0, (dev.tjMaxC - caseC) / (dev.tjMaxC - SOA_CASE_C)));
  return SOA_MARGIN * soaAllowedW(dev, vce) * factor;
}

/**
 * Single-pulse SOA: the junction-to-case transient impedance grows about as √t until the
 * package's thermal time constant (from memory of data-sheet Zth curves), so a pulse of length
 * t < τ may carry √(τ/t) times the DC power.
 */
export function pulsedSoaW(dev: PassDeviceClass, vce: number, caseC: number, seconds: number): number {
  const widen = seconds > 0 && seconds < dev.thermalTauS ? Math.sqrt(dev.thermalTauS / seconds) : 1;
  return soaDeratedW(dev, vce, caseC) * widen;
}

/** Fast-acting fuse: clears in about this time at ten times its rating (from memory of fuse curves). */
export const FUSE_T10_S = 0.005;
/** Below about twice its rating a fuse may carry the current indefinitely (from memory). */
export const FUSE_MIN_OVERLOAD = 2;

/** Clearing time of a fast-acting fuse in its adiabatic region, t = t10·(10·In/I)²; null where it may never clear. */
export function fuseClearingS(currentA: number, ratingA: number): number | null {
  if (!(ratingA > 0) || currentA < FUSE_MIN_OVERLOAD * ratingA) return null;
  return FUSE_T10_S * ((10 * ratingA) / currentA) ** 2;
}
