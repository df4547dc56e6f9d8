// Figures every designer derives from the spec in the same way.
import type { RailSpec } from './rail-spec.ts';
import type { Catalog } from './catalog.ts';
import { enclosureRise } from './thermal.ts';
import type { DividerDesign } from './topologies/feedback.ts';
import { TupleMemo } from './topologies/tuple-memo.ts';

export interface Context {
  spec: RailSpec;
  catalog: Catalog;
  /** Lowest instantaneous input: the trough vMin − rippleVpp/2, what headroom checks use. */
  vInTrough: number;
  /** The room's air: the brief's highest ambient, or the engineer's override. */
  roomC: number;
  /**
   * The air around the parts before this supply's own loss: the room, plus what the enclosure's
   * other dissipation adds (the assembly adds the supply's own share per option).
   */
  ambientC: number;
  /**
   * Divider searches already done in this evaluation, by question: a converter's class search asks
   * the same one for every frequency and again when pricing and settling a candidate.
   */
  dividerSearches: TupleMemo<DividerDesign>;
}

export function makeContext(spec: RailSpec, catalog: Catalog): Context {
  const roomC = spec.overrides.ambientC ?? spec.thermal.ambientMaxC;
  return {
    spec,
    catalog,
    vInTrough: spec.input.vMin - spec.input.rippleVpp / 2,
    roomC,
    ambientC: roomC + (enclosureRise(spec, 0)?.riseK ?? 0),
    dividerSearches: new TupleMemo(),
  };
}

/** A part value the engineer forced by reference designator, if any. */
export function forced(ctx: Context, ref: string): number | undefined {
  return ctx.spec.overrides.parts?.[ref];
}
