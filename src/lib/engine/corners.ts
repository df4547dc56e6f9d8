// Worst-case corners: input {min, nom, max} × load {min, typ, max} at the highest ambient.
import type { RailSpec } from './rail-spec.ts';

export interface Corner {
  vIn: number;
  iOut: number;
}

export function normalCorners(spec: RailSpec): Corner[] {
  const { vMin, vNom, vMax } = spec.input;
  const { iMin, iTyp, iMax } = spec.output;
  const out: Corner[] = [];
  for (const vIn of [vMin, vNom, vMax]) for (const iOut of [iMin, iTyp, iMax]) out.push({ vIn, iOut });
  return out;
}

export const CURVE_POINTS = 20;

/** Input voltages for the charts: CURVE_POINTS evenly spaced from vMin to vMax. */
export function curveInputs(spec: RailSpec): number[] {
  const { vMin, vMax } = spec.input;
  return Array.from({ length: CURVE_POINTS }, (_, k) => vMin + ((vMax - vMin) * k) / (CURVE_POINTS - 1));
}
