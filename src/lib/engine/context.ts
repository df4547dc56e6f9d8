// Figures every designer derives from the spec in the same way.
import type { RailSpec } from './rail-spec.ts';
import type { Catalog } from './catalog.ts';

export interface Context {
  spec: RailSpec;
  catalog: Catalog;
  /** Lowest instantaneous input: the trough vMin − rippleVpp/2, what headroom checks use. */
  vInTrough: number;
  ambientC: number;
}

export function makeContext(spec: RailSpec, catalog: Catalog): Context {
  return {
    spec,
    catalog,
    vInTrough: spec.input.vMin - spec.input.rippleVpp / 2,
    ambientC: spec.overrides.ambientC ?? spec.thermal.ambientMaxC,
  };
}

/** A part value the engineer forced by reference designator, if any. */
export function forced(ctx: Context, ref: string): number | undefined {
  return ctx.spec.overrides.parts?.[ref];
}
