/**
 * The weights as an engineer sets them: a few named steps on the engine's own scale. The engine
 * reads weights as relative (each quality counts in proportion to the sum), with defaults of 1–3;
 * the steps are those values, so a saved revision and the API keep one meaning for a number.
 */
import type { RailSpec } from '../engine/rail-spec';
import { effectiveWeights } from '../engine/scoring/weights';
import type { WeightKey } from '../review/words';

export const WEIGHT_STEPS = [
  { value: 0, word: 'Ignore' },
  { value: 1, word: 'A little' },
  { value: 2, word: 'Matters' },
  { value: 3, word: 'Matters most' },
] as const;

/** The step's word for a weight, or null for a value set another way (the API accepts 0–100). */
export function stepWord(weight: number): string | null {
  return WEIGHT_STEPS.find((s) => s.value === weight)?.word ?? null;
}

/**
 * Each quality's share of the score, as the engine weighs it for this rail (on a small rail part
 * count and cost weigh more); null when nothing counts.
 */
export function scoreShares(weights: RailSpec['weights'], spec: Pick<RailSpec, 'input' | 'output'>): Record<WeightKey, number> | null {
  const effective = effectiveWeights(weights, spec);
  const total = Object.values(effective).reduce((sum, w) => sum + w, 0);
  if (!(total > 0)) return null;
  return Object.fromEntries(Object.entries(effective).map(([k, w]) => [k, w / total])) as Record<WeightKey, number>;
}
