// Capacitor choice from the catalog's voltage × capacitance envelope: the cheapest family, case
// and number in parallel whose capacitance left at the working DC bias, ripple-current rating,
// ESR and (for electrolytics) life meet the need.
import type { Catalog, CapacitorFamily } from './catalog.ts';
import type { ComponentRole, Issue } from './types.ts';
import { makePart, blocker, caution, type DesignPart } from './design.ts';
import { SEMICONDUCTOR_VOLTAGE_FACTOR } from './ratings.ts';
import { snap } from './eseries.ts';
import { formatSi } from './units.ts';

/** Common practice: a capacitor works at no more than 80 % of its rated voltage (MLCC bias loss is counted separately). */
export const CAPACITOR_VOLTAGE_FACTOR = SEMICONDUCTOR_VOLTAGE_FACTOR;
/** More parts in parallel than this is a layout problem, not a design. */
const MAX_PARALLEL = 6;
/** Electrolytic life wanted at the highest ambient: about 6 years of continuous use (common practice for equipment). */
export const LIFE_TARGET_H = 50_000;
/** The rated ripple current heats an electrolytic's core by about 5 K (from memory of data-sheet notes). */
const RATED_RIPPLE_RISE_K = 5;
/** Retained capacitance never modelled below a fifth: the linear bias law ends there. */
const MIN_RETENTION = 0.2;

type Case = CapacitorFamily['cases'][number];

export interface CapacitorNeed {
  /** Capacitance needed at the working bias, after tolerance and DC-bias loss. */
  effectiveF: number;
  workingV: number;
  /** RMS ripple current through the bank. */
  rmsA: number;
  /** Largest ESR of the bank the ripple budget allows (Infinity when it does not matter). */
  esrMaxOhm: number;
  ambientC: number;
  /** Engineer's forced total capacitance, used as given. */
  forcedF?: number | undefined;
}

export interface ChosenCapacitor {
  part: DesignPart;
  family: CapacitorFamily;
  /** Nominal capacitance of the bank. */
  farads: number;
  /** Capacitance left at the working bias after the lower tolerance and the DC-bias loss. */
  effectiveF: number;
  esrOhm: number;
  count: number;
  rippleRatingA: number;
  /** Electrolytic life at the highest ambient with the ripple's self-heating; null where not modelled. */
  lifeHours: number | null;
  issue: Issue | null;
}

/** MLCC capacitance left at DC bias V on a part rated Vr: 1 − loss·V/Vr (linear fit, from memory). */
export function biasRetention(family: CapacitorFamily, workingV: number, ratedV: number): number {
  return Math.max(MIN_RETENTION, 1 - family.biasLossAtRated * Math.min(1, Math.max(0, workingV) / ratedV));
}

/** Electrolytic life: L = L0 · 2^((Trated − Ta − ΔT)/10), halving per 10 K (common practice); ΔT = 5 K·(I/Irated)². */
export function electrolyticLife(family: CapacitorFamily, ambientC: number, rmsA: number, ratedRippleA: number): number | null {
  if (family.kind !== 'electrolytic' || family.lifeHours <= 0) return null;
  const rise = RATED_RIPPLE_RISE_K * (rmsA / ratedRippleA) ** 2;
  return family.lifeHours * 2 ** (Math.min(60, family.ratedTempC - ambientC - rise) / 10);
}

interface Fit {
  family: CapacitorFamily;
  row: Case;
  perPartF: number;
  count: number;
  effectiveF: number;
  lifeHours: number | null;
  costCents: number;
}

/** E6 value at or above the wanted one; null when the case cannot hold it. */
function valueIn(row: Case, wanted: number): number {
  const v = snap(Math.max(wanted, 1e-12), 'E6', 'up');
  return v <= row.cMaxF * (1 + 1e-9) ? v : row.cMaxF;
}

function fitCase(family: CapacitorFamily, row: Case, need: CapacitorNeed): Fit | null {
  if (row.vRatedV < CAPACITOR_VOLTAGE_FACTOR * need.workingV) return null;
  const keep = (1 - family.tolerance) * biasRetention(family, need.workingV, row.vRatedV);
  let count: number;
  let perPartF: number;
  if (need.forcedF !== undefined) {
    const forcedF = need.forcedF;
    // A forced total is built from equal standard values; none of them in this case means no fit.
    const n = [1, 2, 3, 4, 5, 6].find((k) => forcedF / k <= row.cMaxF * (1 + 1e-9) && Math.abs(snap(forcedF / k, 'E12') / (forcedF / k) - 1) < 0.01);
    if (n === undefined) return null;
    count = n;
    perPartF = forcedF / n;
  } else {
    const byC = Math.ceil(need.effectiveF / (row.cMaxF * keep) - 1e-9);
    const byRms = Math.ceil(need.rmsA / row.rippleA - 1e-9);
    const byEsr = Number.isFinite(need.esrMaxOhm) && need.esrMaxOhm > 0 ? Math.ceil(row.esrOhm / need.esrMaxOhm - 1e-9) : 1;
    count = Math.max(1, byC, byRms, byEsr);
    perPartF = valueIn(row, need.effectiveF / (count * keep));
  }
  if (count > MAX_PARALLEL) return null;
  const lifeHours = electrolyticLife(family, need.ambientC, need.rmsA / count, row.rippleA);
  return { family, row, perPartF, count, effectiveF: perPartF * count * keep, lifeHours, costCents: row.costCents * count };
}

/** Cheapest fit; electrolytics short of the life target only when nothing else fits. */
function bestFit(catalog: Catalog, need: CapacitorNeed): Fit | null {
  let best: Fit | null = null;
  let bestShortLived: Fit | null = null;
  for (const family of catalog.capacitors) {
    for (const row of family.cases) {
      const fit = fitCase(family, row, need);
      if (!fit) continue;
      const shortLived = fit.lifeHours !== null && fit.lifeHours < LIFE_TARGET_H;
      const better = (a: Fit | null) => a === null || fit.costCents < a.costCents || (fit.costCents === a.costCents && fit.count < a.count);
      if (shortLived) {
        if (better(bestShortLived)) bestShortLived = fit;
      } else if (better(best)) best = fit;
    }
  }
  return best ?? bestShortLived;
}

function describe(fit: Fit): string {
  const each = `${formatSi(fit.perPartF, 'F')} ${fit.row.vRatedV} V, ${fit.row.name}`;
  return fit.count > 1 ? `${fit.count} × ${each} in parallel` : each;
}

/** The bank for a need; when nothing in the catalog fits, the largest-voltage case with a blocker. */
export function chooseCapacitorBank(ref: string, role: ComponentRole, need: CapacitorNeed, catalog: Catalog): ChosenCapacitor {
  const fit = bestFit(catalog, need);
  const chosen: Fit =
    fit ??
    (() => {
      const family = [...catalog.capacitors].sort((a, b) => Math.max(...b.cases.map((c) => c.vRatedV)) - Math.max(...a.cases.map((c) => c.vRatedV)))[0]!;
      const row = [...family.cases].sort((a, b) => b.vRatedV - a.vRatedV || b.cMaxF - a.cMaxF)[0]!;
      return { family, row, perPartF: row.cMaxF, count: 1, effectiveF: row.cMaxF, lifeHours: null, costCents: row.costCents };
    })();
  const farads = chosen.perPartF * chosen.count;
  const part = makePart({
    ref,
    role,
    part: `Capacitor, ${chosen.family.label}, ${describe(chosen)}`,
    value: farads,
    unit: 'F',
    ratingV: chosen.row.vRatedV,
    tolerance: chosen.family.tolerance,
    costCents: chosen.costCents,
  });
  part.quantity = chosen.count;
  let issue: Issue | null = null;
  if (fit === null) {
    const what = need.forcedF !== undefined ? `the forced ${formatSi(need.forcedF, 'F')}` : `${formatSi(need.effectiveF, 'F')} effective`;
    issue = blocker('capacitor', `${ref} needs ${what} at ${need.workingV.toFixed(1)} V working (rating ≥ ${(CAPACITOR_VOLTAGE_FACTOR * need.workingV).toFixed(0)} V) carrying ${need.rmsA.toFixed(2)} A RMS; no family and case in the catalog offers that in ${MAX_PARALLEL} parts or fewer.`);
  } else if (chosen.lifeHours !== null && chosen.lifeHours < LIFE_TARGET_H) {
    issue = caution('capacitor-life', `${ref} (${chosen.family.label}) lasts about ${Math.round(chosen.lifeHours).toLocaleString('en-GB')} h at ${need.ambientC} °C with ${need.rmsA.toFixed(2)} A RMS, short of ${LIFE_TARGET_H.toLocaleString('en-GB')} h; plan its replacement or choose a longer-life series.`);
  }
  return {
    part,
    family: chosen.family,
    farads,
    effectiveF: chosen.effectiveF,
    esrOhm: chosen.row.esrOhm / chosen.count,
    count: chosen.count,
    rippleRatingA: chosen.row.rippleA * chosen.count,
    lifeHours: chosen.lifeHours,
    issue,
  };
}

/** A single capacitor of about the wanted nominal value (bypass, decoupling, regulator input and output). */
export function chooseCapacitor(ref: string, role: ComponentRole, wantedF: number, worstV: number, catalog: Catalog): ChosenCapacitor {
  const nominal = snap(Math.max(wantedF, 1e-12), 'E6', 'up');
  return chooseCapacitorBank(ref, role, { effectiveF: 0, forcedF: nominal, workingV: worstV, rmsA: 0, esrMaxOhm: Infinity, ambientC: 25 }, catalog);
}

/** Largest single capacitor value the catalog offers (for limits on what a search may ask). */
export function largestCapacitance(catalog: Catalog): number {
  return Math.max(...catalog.capacitors.flatMap((f) => f.cases.map((c) => c.cMaxF)));
}
