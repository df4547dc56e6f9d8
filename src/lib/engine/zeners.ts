// Zener choice: E24 voltages inside a series' range, power series by the twice-the-dissipation
// rule, and the dynamic impedance at the working point.
import type { Catalog, ZenerSeries } from './catalog.ts';
import { snap } from './eseries.ts';
import { RATING_FACTOR } from './ratings.ts';

/** The E24 voltage nearest the target (Zener voltages follow E24, common practice). */
export function zenerVoltage(target: number): number {
  return snap(Math.max(target, 1e-3), 'E24', 'nearest');
}

/** The E24 voltage at or above the target. */
export function zenerVoltageUp(target: number): number {
  return snap(Math.max(target, 1e-3), 'E24', 'up');
}

/** Dynamic impedance by voltage, interpolated log-log between the series' points. */
export function dynamicImpedance(series: ZenerSeries, vz: number): number {
  const pts = series.rzPoints;
  const first = pts[0]!;
  const last = pts[pts.length - 1]!;
  if (vz <= first.v) return first.ohm;
  if (vz >= last.v) return last.ohm * (vz / last.v);
  for (let i = 1; i < pts.length; i += 1) {
    const a = pts[i - 1]!;
    const b = pts[i]!;
    if (vz <= b.v) {
      if (a.ohm <= 0 || b.ohm <= 0) return a.ohm + ((b.ohm - a.ohm) * (vz - a.v)) / (b.v - a.v);
      const t = Math.log(vz / a.v) / Math.log(b.v / a.v);
      return Math.exp(Math.log(a.ohm) + t * Math.log(b.ohm / a.ohm));
    }
  }
  return last.ohm;
}

/** Test current convention of the series: a quarter of the rated power (from memory of data sheets). */
export function testCurrent(series: ZenerSeries, vz: number): number {
  return series.powerW / (4 * vz);
}

/**
 * Temperature coefficient of the Zener voltage, fraction per kelvin: negative below about 5.5 V
 * (field emission), positive above (avalanche), about +0.1 %/K at high voltages — a fit to the
 * usual data-sheet curves (from memory): TC ≈ 0.1 %/K · (1 − 5.5 V/Vz).
 */
export function zenerTempco(vz: number): number {
  return 0.001 * (1 - 5.5 / Math.max(vz, 1));
}

/** The linear Zener model Vz(I) = Vk + rz·I ends where its knee would fall below this share of Vz. */
const KNEE_FLOOR = 0.5;

/**
 * Knee and slope of the linear model through the nominal voltage at the test current. At low
 * voltages the table's rz would put the knee near or below zero; there the knee is held at half
 * the Zener voltage and rz reduced to match (the model's clamp, so no negative knee is printed).
 */
export function zenerModel(series: ZenerSeries, vz: number): { rz: number; vKnee: number; iTest: number } {
  const iTest = testCurrent(series, vz);
  const vKnee = Math.max(KNEE_FLOOR * vz, vz - dynamicImpedance(series, vz) * iTest);
  return { rz: (vz - vKnee) / iTest, vKnee, iTest };
}

/** Series that offer this voltage, smallest power first. */
export function seriesFor(catalog: Catalog, vz: number): ZenerSeries[] {
  return catalog.zenerSeries.filter((s) => vz >= s.vMinV * (1 - 1e-9) && vz <= s.vMaxV * (1 + 1e-9)).sort((a, b) => a.powerW - b.powerW);
}

/** The smallest series whose rating is at least twice the worst power; the largest when none is. */
export function seriesForPower(candidates: ZenerSeries[], worstW: number): ZenerSeries | null {
  return candidates.find((s) => s.powerW >= RATING_FACTOR * worstW) ?? candidates[candidates.length - 1] ?? null;
}
