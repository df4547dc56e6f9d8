// What feeds the pre-drop's standoff Zener and the pass device's base or gate from the input: a
// resistor, whose current grows with the input, or a depletion-mode MOSFET with a source resistor,
// a current source whose current barely moves with it. Whatever the Zener passes flows into the
// output, which sinks only the divider and the lightest load.
import type { PassDeviceClass } from '../catalog.ts';
import { atLeast } from '../design.ts';
import { snap } from '../eseries.ts';

/**
 * A depletion MOSFET's set current I = |Vgs|/Rset spreads with its pinch-off voltage and
 * temperature: taken as 0.6–1.6 × nominal (from memory: pinch-off spreads of about −1.5 to −3.5 V).
 */
export const SOURCE_SPREAD = { lo: 0.6, hi: 1.6 } as const;

export interface StandoffFeed {
  /** The bias resistor, or the current source's set resistor. */
  ohms: number;
  /** The depletion MOSFET, when the feed is a current source. */
  source: PassDeviceClass | null;
  /** Least and most current with `drop` volts across the feed. */
  least(drop: number): number;
  most(drop: number): number;
  /** Dissipation of the resistor and of the MOSFET (0 for a resistor feed) at the most current. */
  resistorW(drop: number): number;
  sourceW(drop: number): number;
}

export function resistorFeed(rb: number): StandoffFeed {
  const i = (drop: number) => Math.max(0, drop) / rb;
  return { ohms: rb, source: null, least: i, most: i, resistorW: (drop) => Math.max(0, drop) ** 2 / rb, sourceW: () => 0 };
}

/**
 * Rset = SOURCE_SPREAD.lo·|Vgs|/Ibias, snapped down to E24, so the least current still meets the
 * bias the Zener and the base need. With less than the set voltage across it the MOSFET is fully
 * on and the current is what Rset alone passes.
 */
export function sourceFeed(dev: PassDeviceClass, biasA: number, rsetForced: number | undefined): StandoffFeed {
  const rset = rsetForced ?? snap(atLeast((SOURCE_SPREAD.lo * dev.vControlV) / atLeast(biasA, 1e-9), 1), 'E24', 'down');
  const nominal = dev.vControlV / rset;
  const least = (drop: number) => Math.min(SOURCE_SPREAD.lo * nominal, Math.max(0, drop) / rset);
  const most = (drop: number) => Math.min(SOURCE_SPREAD.hi * nominal, Math.max(0, drop) / rset);
  return {
    ohms: rset,
    source: dev,
    least,
    most,
    resistorW: (drop) => most(drop) ** 2 * rset,
    sourceW: (drop) => Math.max(0, drop - most(drop) * rset) * most(drop),
  };
}
