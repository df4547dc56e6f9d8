// Entry point: design every topology for a spec and rank the options.
import type { RailSpec } from './rail-spec.ts';
import { defaultCatalog, offeredCatalog, type Catalog } from './catalog.ts';
import { makeContext, type Context } from './context.ts';
import { assemble } from './assemble.ts';
import type { Design } from './design.ts';
import { effectiveWeights, pickReason, rankOptions } from './scoring.ts';
import { topologyIds, type Evaluation, type TopologyId } from './types.ts';
import { designShunt } from './topologies/shunt.ts';
import { designLinear } from './topologies/linear.ts';
import { designLinearPredrop } from './topologies/linear-predrop.ts';
import { designBuck } from './topologies/buck.ts';
import { designBoost } from './topologies/boost.ts';
import { designBuckBoost } from './topologies/buck-boost.ts';
import { designSwitcherLinear } from './topologies/switcher-linear.ts';

export const DEFAULT_SEED = 0x5eed2026;

const designers: Record<TopologyId, (ctx: Context) => Design> = {
  shunt: designShunt,
  linear: designLinear,
  'linear-predrop': designLinearPredrop,
  buck: designBuck,
  boost: designBoost,
  'buck-boost': designBuckBoost,
  'buck+linear': designSwitcherLinear,
};

const GOLDEN_STEP = 0x9e3779b9;
const TWO_32 = 2 ** 32;

/**
 * Each topology gets its own stream so its Monte Carlo does not depend on which others ran:
 * seed + (index + 1)·0x9e3779b9 mod 2³², in exact double arithmetic (every term stays below
 * 2⁵³), so no 32-bit multiply is involved and every thread and tier computes the same seeds.
 */
export function topologySeed(seed: number, index: number): number {
  return ((seed >>> 0) + (index + 1) * GOLDEN_STEP) % TWO_32;
}

export function evaluate(spec: RailSpec, catalog: Catalog = defaultCatalog): Evaluation {
  const ctx = makeContext(spec, offeredCatalog(catalog));
  const seed = spec.overrides.seed ?? DEFAULT_SEED;
  const options = topologyIds.map((id, index) => assemble(designers[id](ctx), ctx, topologySeed(seed, index)));
  const ranked = rankOptions(options, spec);
  const best = ranked[0];
  const weights = effectiveWeights(spec.weights, spec);
  return { recommended: best && best.feasible ? best.topology : null, reason: pickReason(ranked, weights, spec), options: ranked };
}
