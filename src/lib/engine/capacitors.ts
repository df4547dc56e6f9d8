// Capacitor choice from the catalog's voltage × capacitance envelope: the cheapest family, case
// and number in parallel whose capacitance left at the working DC bias, ripple-current rating,
// ESR and (for electrolytics) life meet the need.
import type { Catalog, CapacitorFamily } from './catalog.ts';
import type { ComponentRole, Issue } from './types.ts';
import { makePart, blocker, caution, type DesignPart } from './design.ts';
import { SEMICONDUCTOR_VOLTAGE_FACTOR } from './ratings.ts';
import { snap } from './eseries.ts';
import { formatSi, lowerFirst } from './units.ts';

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
  /** The DC bias the bank was sized at. */
  workingV: number;
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

/** The smallest value the family makes at this rating: an electrolytic series starts near 1 µF. */
const smallest = (row: Case) => row.cMinF ?? 0;

/** E6 value at or above the wanted one (and the family's smallest), capped at the case's largest. */
function valueIn(row: Case, wanted: number): number {
  const v = snap(Math.max(wanted, smallest(row), 1e-12), 'E6', 'up');
  return v <= row.cMaxF * (1 + 1e-9) ? v : row.cMaxF;
}

/** Parts a forced total needs in this case: equal standard values (E12) inside its envelope, or 0 when none fits. */
function forcedCount(forcedF: number, row: Case): number {
  for (let k = 1; k <= MAX_PARALLEL; k += 1) {
    const each = forcedF / k;
    if (each < smallest(row) * (1 - 1e-9)) break;
    if (each <= row.cMaxF * (1 + 1e-9) && Math.abs(snap(each, 'E12') / each - 1) < 0.01) return k;
  }
  return 0;
}

/** Fraction of the nominal capacitance left: the lower tolerance and the DC-bias loss. */
function retained(family: CapacitorFamily, row: Case, workingV: number): number {
  return (1 - family.tolerance) * biasRetention(family, workingV, row.vRatedV);
}

/** Parts in parallel this case needs for capacitance, ripple current and ESR (0 when it cannot). */
function countFor(family: CapacitorFamily, row: Case, need: CapacitorNeed): number {
  if (row.vRatedV < CAPACITOR_VOLTAGE_FACTOR * need.workingV) return 0;
  if (need.forcedF !== undefined) return forcedCount(need.forcedF, row);
  const byC = Math.ceil(need.effectiveF / (row.cMaxF * retained(family, row, need.workingV)) - 1e-9);
  const byRms = Math.ceil(need.rmsA / row.rippleA - 1e-9);
  const byEsr = Number.isFinite(need.esrMaxOhm) && need.esrMaxOhm > 0 ? Math.ceil(row.esrOhm / need.esrMaxOhm - 1e-9) : 1;
  const count = Math.max(1, byC, byRms, byEsr);
  return count > MAX_PARALLEL ? 0 : count;
}

/** A need this many times the largest bank is reported as beyond any bank, not as a part value. */
const FAR_BEYOND = 100;

/** Effective capacitance of the largest bank the catalog builds for a working voltage (MAX_PARALLEL of its largest case). */
function largestBankF(catalog: Catalog, workingV: number): number {
  let most = 0;
  for (const { family, row } of casesByPrice(catalog))
    if (row.vRatedV >= CAPACITOR_VOLTAGE_FACTOR * workingV)
      most = Math.max(most, MAX_PARALLEL * row.cMaxF * retained(family, row, workingV));
  return most;
}

/** Every family's cases by ascending unit price (stable), so a search can stop at the first too dear. */
const byPrice = new WeakMap<Catalog, { family: CapacitorFamily; row: Case }[]>();
function casesByPrice(catalog: Catalog): { family: CapacitorFamily; row: Case }[] {
  let list = byPrice.get(catalog);
  if (!list) {
    list = catalog.capacitors
      .flatMap((family) => family.cases.map((row) => ({ family, row })))
      .sort((a, b) => a.row.costCents - b.row.costCents);
    byPrice.set(catalog, list);
  }
  return list;
}

/**
 * Cheapest case (fewer parts at equal cost); electrolytics short of the life target only when
 * nothing else fits. Only the winner's value is worked out.
 */
function bestFit(catalog: Catalog, need: CapacitorNeed): Fit | null {
  type Pick = { family: CapacitorFamily; row: Case; count: number; life: number | null };
  let best: Pick | null = null;
  let bestShort: Pick | null = null;
  for (const { family, row } of casesByPrice(catalog)) {
    // Every later case costs at least this much for one part.
    if (best !== null && row.costCents > best.row.costCents * best.count) break;
    const count = countFor(family, row, need);
    if (count === 0) continue;
    const life = electrolyticLife(family, need.ambientC, need.rmsA / count, row.rippleA);
    const cost = row.costCents * count;
    const short = life !== null && life < LIFE_TARGET_H;
    const than = short ? bestShort : best;
    if (than !== null && !(cost < than.row.costCents * than.count || (cost === than.row.costCents * than.count && count < than.count)))
      continue;
    if (short) bestShort = { family, row, count, life };
    else best = { family, row, count, life };
  }
  const chosen = best ?? bestShort;
  if (chosen === null) return null;
  const { family, row, count, life } = chosen;
  const keep = retained(family, row, need.workingV);
  const perPartF = need.forcedF !== undefined ? snap(need.forcedF / count, 'E12') : valueIn(row, need.effectiveF / (count * keep));
  return { family, row, perPartF, count, effectiveF: perPartF * count * keep, lifeHours: life, costCents: row.costCents * count };
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
      const family = [...catalog.capacitors].sort(
        (a, b) => Math.max(...b.cases.map((c) => c.vRatedV)) - Math.max(...a.cases.map((c) => c.vRatedV)),
      )[0]!;
      const row = [...family.cases].sort((a, b) => b.vRatedV - a.vRatedV || b.cMaxF - a.cMaxF)[0]!;
      return {
        family,
        row,
        perPartF: row.cMaxF,
        count: 1,
        effectiveF: row.cMaxF * retained(family, row, need.workingV),
        lifeHours: null,
        costCents: row.costCents,
      };
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
    const largest = largestBankF(catalog, need.workingV);
    const what = need.forcedF !== undefined ? `the forced ${formatSi(need.forcedF, 'F')}` : `${formatSi(need.effectiveF, 'F')} effective`;
    // A need far past every bank the catalog can build is no part value: say what sets it instead.
    if (need.forcedF === undefined && largest > 0 && need.effectiveF > FAR_BEYOND * largest)
      issue = blocker(
        'capacitor',
        `No capacitor bank can do this: the requirements would ask ${ref} for about ${formatSi(need.effectiveF, 'F', 3)}, more than ${FAR_BEYOND} times the largest bank the catalog builds at ${need.workingV.toFixed(1)} V working (${formatSi(largest, 'F', 2)} in ${MAX_PARALLEL} parts). Loosen the ripple limit, the load step or the hold-up that sets it.`,
      );
    else
      issue = blocker(
        'capacitor',
        `${ref} needs ${what} at ${need.workingV.toFixed(1)} V working (rating ≥ ${(CAPACITOR_VOLTAGE_FACTOR * need.workingV).toFixed(0)} V) carrying ${need.rmsA.toFixed(2)} A RMS${Number.isFinite(need.esrMaxOhm) && need.esrMaxOhm > 0 ? ` with an ESR of at most ${formatSi(need.esrMaxOhm, 'Ω', 2)}` : ''}; no family and case in the catalog offers that in ${MAX_PARALLEL} parts or fewer.`,
      );
  } else if (chosen.lifeHours !== null && chosen.lifeHours < LIFE_TARGET_H) {
    issue = caution(
      'capacitor-life',
      `${ref} (${lowerFirst(chosen.family.label)}) lasts about ${Math.round(chosen.lifeHours).toLocaleString('en-GB')} h at ${need.ambientC} °C with ${need.rmsA.toFixed(2)} A RMS, short of ${LIFE_TARGET_H.toLocaleString('en-GB')} h; plan its replacement or choose a longer-life series.`,
    );
  }
  return {
    part,
    family: chosen.family,
    farads,
    effectiveF: chosen.effectiveF,
    workingV: need.workingV,
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
  return chooseCapacitorBank(
    ref,
    role,
    { effectiveF: 0, forcedF: nominal, workingV: worstV, rmsA: 0, esrMaxOhm: Infinity, ambientC: 25 },
    catalog,
  );
}

/** Largest single capacitor value the catalog offers (for limits on what a search may ask). */
export function largestCapacitance(catalog: Catalog): number {
  return Math.max(...catalog.capacitors.flatMap((f) => f.cases.map((c) => c.cMaxF)));
}
