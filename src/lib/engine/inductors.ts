// Power inductor choice: value, saturation rating, winding resistance, price and core loss from
// the catalog's size laws for shielded parts.
import type { Catalog } from './catalog.ts';
import { atLeast, blocker, makePart, type DesignPart } from './design.ts';
import { snap } from './eseries.ts';
import { pickFromLadder } from './ratings.ts';
import type { Issue } from './types.ts';

/** Saturation current margin over the peak inductor current (common practice). */
export const ISAT_MARGIN = 1.3;

export interface ChosenInductor {
  part: DesignPart;
  henries: number;
  isatA: number;
  dcrOhm: number;
  /** True when Isat reaches the converter's current limit, so a shorted output does not saturate it. */
  survivesLimit: boolean;
}

/** DCR ≈ k·√(L/1 µH)/Isat: bigger inductance or smaller core means more copper resistance (catalog fit). */
export function inductorDcr(catalog: Catalog, henries: number, isatA: number): number {
  return (catalog.inductors.dcrCoefficient * Math.sqrt(henries / 1e-6)) / isatA;
}

/** Price grows with the saturation current and the energy the core holds, ½·L·Isat². */
export function inductorCost(catalog: Catalog, henries: number, isatA: number): number {
  const i = catalog.inductors;
  return Math.round(i.costCentsBase + i.costCentsPerA * isatA + i.costCentsPerMicrojoule * 0.5 * henries * isatA * isatA * 1e6);
}

/** The catalog value nearest the wanted inductance, inside the family's range. */
export function snapInductance(catalog: Catalog, wantedH: number): number {
  const i = catalog.inductors;
  return Math.min(i.lMaxH, Math.max(i.lMinH, snap(atLeast(wantedH, 1e-9), i.series, 'nearest')));
}

/**
 * Core loss in Steinmetz form Pv = k·f^α·B^β over the core volume. The flux swing follows the
 * current ripple (B = Bsat·(ΔIL/2)/Isat) and the volume the energy at saturation (size law).
 */
export function coreLossW(catalog: Catalog, henries: number, isatA: number, rippleA: number, fsw: number): number {
  const i = catalog.inductors;
  const bPeak = Math.min(i.bSatT, (i.bSatT * rippleA) / 2 / isatA);
  const volume = i.coreVolumePerJouleM3 * 0.5 * henries * isatA * isatA;
  return i.steinmetzK * fsw ** i.steinmetzAlpha * bPeak ** i.steinmetzBeta * volume;
}

/**
 * Inductance as given (forced) or snapped; saturation current at least ISAT_MARGIN over the
 * peak, raised to the converter's current limit when the ladder allows, so a short that drives
 * the switch to its limit leaves the inductor unsaturated.
 */
export function chooseInductor(
  ref: string,
  catalog: Catalog,
  wantedH: number,
  peakA: number,
  limitA: number,
  forcedH: number | undefined,
): { chosen: ChosenInductor; issue: Issue | null } {
  const ladder = catalog.inductors.isatStepsA;
  const henries = forcedH ?? snapInductance(catalog, wantedH);
  const forLimit = pickFromLadder(ladder, Math.max(ISAT_MARGIN * peakA, limitA));
  const forPeak = pickFromLadder(ladder, ISAT_MARGIN * peakA);
  const isatA = forLimit ?? forPeak ?? ladder[ladder.length - 1]!;
  const part = makePart({
    ref,
    role: 'inductor',
    part: `Power inductor, shielded, Isat ${isatA} A`,
    value: henries,
    unit: 'H',
    tolerance: 0.2,
    costCents: inductorCost(catalog, henries, isatA),
  });
  const issue =
    forPeak === null
      ? blocker(
          'inductor',
          `The peak inductor current ${peakA.toFixed(2)} A needs a saturation rating of ${(ISAT_MARGIN * peakA).toFixed(1)} A, beyond the catalog.`,
        )
      : null;
  return { chosen: { part, henries, isatA, dcrOhm: inductorDcr(catalog, henries, isatA), survivesLimit: isatA >= limitA }, issue };
}
