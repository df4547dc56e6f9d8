// How much each quality counts for a given rail, apart from the rest of scoring so that a browser
// screen can show the shares without loading the schema's validator.
import type { RailSpec } from '../rail-spec.ts';

/**
 * How large a rail is for judging it, W: the geometric mean of the power it delivers and the most a
 * dissipative design of it draws (vInMax·iMax). A rail that delivers milliwatts from a high input can
 * still burn watts in a shunt or linear stage, so it is not judged as small as its output alone says.
 */
export function railSizeW(spec: Pick<RailSpec, 'input' | 'output'>): number {
  return spec.output.iMax * Math.sqrt(spec.output.v * spec.input.vMax);
}

/**
 * The brief's weights with part count and cost weighing more on a small rail (railSizeW): ×1 at 1 W
 * and above, up to ×3 at 10 mW and below (a small rail is judged by its size and price more than its
 * loss). On a battery, where the loss is the battery's life however small the rail, half as much:
 * up to ×2.
 */
export function effectiveWeights(weights: RailSpec['weights'], spec: Pick<RailSpec, 'input' | 'output'>): RailSpec['weights'] {
  const strength = spec.input.source === 'battery' ? 0.5 : 1;
  const small = 1 + strength * Math.min(2, Math.max(0, Math.log10(1 / Math.max(railSizeW(spec), 1e-12))));
  return { ...weights, partCount: weights.partCount * small, cost: weights.cost * small };
}
