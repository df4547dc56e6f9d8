// Capacitor choice: the family that can carry the voltage (twice the worst, common practice), the
// value snapped to E6, and its ESR for ripple figures.
import type { Catalog, CapacitorFamily } from './catalog.ts';
import type { ComponentRole, Issue } from './types.ts';
import { makePart, blocker, type DesignPart } from './design.ts';
import { CAPACITOR_V, ratingFor } from './ratings.ts';
import { snap } from './eseries.ts';

export interface ChosenCapacitor {
  part: DesignPart;
  family: CapacitorFamily;
  farads: number;
  esrOhm: number;
  issue: Issue | null;
}

/**
 * Picks the first catalog family (ceramic, then electrolytic, then film in the default catalog)
 * whose voltage and capacitance range fit; bulk values above the ceramic range fall to the next family.
 */
export function chooseCapacitor(
  ref: string,
  role: ComponentRole,
  wantedF: number,
  worstV: number,
  catalog: Catalog,
): ChosenCapacitor {
  const farads = snap(Math.max(wantedF, 1e-12), 'E6', 'up');
  const ratingV = ratingFor(CAPACITOR_V, worstV);
  const family =
    catalog.capacitors.find((f) => ratingV !== null && ratingV <= f.vMaxV && farads >= f.cMinF && farads <= f.cMaxF) ??
    null;
  const fallback = family ?? [...catalog.capacitors].sort((a, b) => b.vMaxV - a.vMaxV)[0]!;
  const value = Math.min(Math.max(farads, fallback.cMinF), fallback.cMaxF);
  // Bigger and higher-voltage capacitors cost more, roughly with stored energy.
  const scale = Math.max(1, Math.sqrt((value * (ratingV ?? fallback.vMaxV) ** 2) / (10e-6 * 25 ** 2)));
  const part = makePart({
    ref,
    role,
    part: `Capacitor, ${fallback.label}`,
    value,
    unit: 'F',
    ratingV: ratingV ?? fallback.vMaxV,
    tolerance: fallback.tolerance,
    costCents: Math.round(fallback.costCents * scale),
  });
  const issue =
    family === null
      ? blocker('capacitor', `${ref} needs a ${Math.ceil(2 * worstV)} V rating and about ${value} F, which no capacitor family in the catalog offers.`)
      : null;
  return { part, family: fallback, farads: value, esrOhm: fallback.esrOhm, issue };
}
