// How much each quality counts for a given rail, apart from the rest of scoring so that a browser
// screen can show the shares without loading the schema's validator.
import type { RailSpec } from '../rail-spec.ts';

/**
 * The brief's weights with part count and cost weighing more on a small rail: ×1 at 1 W and above,
 * up to ×3 at 10 mW and below (a small rail is judged by its size and price more than its loss).
 * On a battery, where the loss is the battery's life however small the rail, half as much: up to ×2.
 */
export function effectiveWeights(weights: RailSpec['weights'], spec: Pick<RailSpec, 'input' | 'output'>): RailSpec['weights'] {
  const pOutMaxW = spec.output.v * spec.output.iMax;
  const strength = spec.input.source === 'battery' ? 0.5 : 1;
  const small = 1 + strength * Math.min(2, Math.max(0, Math.log10(1 / Math.max(pOutMaxW, 1e-12))));
  return { ...weights, partCount: weights.partCount * small, cost: weights.cost * small };
}
