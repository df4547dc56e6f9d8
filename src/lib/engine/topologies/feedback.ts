// Output-setting divider of a regulator: Vout = Vref·(1 + R2/R1) + Iadj·R2.
// R1 sits across the reference (role feedback-lower), R2 carries Vout − Vref (role feedback-upper).
import type { SeriesName } from '../eseries.ts';
import { snap } from '../eseries.ts';
import { atLeast } from '../design.ts';
import type { ToleranceModel } from '../tolerance.ts';

export interface Divider {
  r1: number;
  r2: number;
  /** Output with the snapped values and typical reference and adjust current. */
  vOut: number;
  /** Current through R1 (Vref / R1). */
  iDivider: number;
}

export function dividerVout(vRef: number, r1: number, r2: number, iAdj: number): number {
  return vRef * (1 + r2 / r1) + iAdj * r2;
}

/**
 * R1 is the largest series value not above Vref / iDivider (so the divider alone carries at least
 * that current), R2 solves the equation for the target, both snapped, then Vout is recomputed.
 */
export function designDivider(
  vTarget: number,
  vRef: number,
  iAdj: number,
  iDividerMin: number,
  series: SeriesName,
  r1Forced: number | undefined,
  r2Forced: number | undefined,
): Divider {
  const r1 = r1Forced ?? snap(atLeast(vRef / atLeast(iDividerMin, 1e-9), 1e-3), series, 'down');
  const r2Ideal = (vTarget - vRef) / (vRef / r1 + iAdj);
  const r2 = r2Forced ?? snap(atLeast(r2Ideal, 1e-3), series, 'nearest');
  return { r1, r2, vOut: dividerVout(vRef, r1, r2, iAdj), iDivider: vRef / r1 };
}

/** Extreme-value / Monte Carlo model over the reference, both resistors and the adjust current. */
export function dividerModel(
  vRef: number,
  vRefTolerance: number,
  divider: Divider,
  resistorTolerance: number,
  iAdjMin: number,
  iAdjMax: number,
  iAdjTyp: number,
): ToleranceModel {
  const { r1, r2 } = divider;
  return {
    params: [
      { name: 'Vref', nominal: vRef, lo: vRef * (1 - vRefTolerance), hi: vRef * (1 + vRefTolerance) },
      { name: 'R1', nominal: r1, lo: r1 * (1 - resistorTolerance), hi: r1 * (1 + resistorTolerance) },
      { name: 'R2', nominal: r2, lo: r2 * (1 - resistorTolerance), hi: r2 * (1 + resistorTolerance) },
      { name: 'Iadj', nominal: iAdjTyp, lo: iAdjMin, hi: iAdjMax },
    ],
    f: (x: Float64Array) => x[0]! * (1 + x[2]! / x[1]!) + x[3]! * x[2]!,
    batch: (c, out) => {
      const [vr, a, b, ia] = c as [Float64Array, Float64Array, Float64Array, Float64Array];
      for (let i = 0; i < out.length; i += 1) out[i] = vr[i]! * (1 + b[i]! / a[i]!) + ia[i]! * b[i]!;
    },
  };
}
