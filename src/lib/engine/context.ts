// Figures every designer derives from the brief in the same way.
import type { Brief } from './brief.ts';
import type { Catalog } from './catalog.ts';

export interface Context {
  brief: Brief;
  catalog: Catalog;
  /** Lowest instantaneous input: the trough vMin − rippleVpp/2, what headroom checks use. */
  vInTrough: number;
  ambientC: number;
}

export function makeContext(brief: Brief, catalog: Catalog): Context {
  return {
    brief,
    catalog,
    vInTrough: brief.input.vMin - brief.input.rippleVpp / 2,
    ambientC: brief.overrides.ambientC ?? brief.thermal.ambientMaxC,
  };
}

/** A part value the engineer forced by reference designator, if any. */
export function forced(ctx: Context, ref: string): number | undefined {
  return ctx.brief.overrides.parts?.[ref];
}
